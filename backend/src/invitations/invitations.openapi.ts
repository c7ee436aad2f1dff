import { acceptInvitationRequestSchema, createInvitationRequestSchema, createInvitationResponseSchema, idParamsSchema, invitationListQuerySchema, invitationListResponseSchema, invitationLookupResponseSchema, invitationTokenQuerySchema, loginResponseSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/invitations', summary: 'Invitations of the workspace, paged (status filter, sort)', tag: 'invitations', roles: ['admin'], query: invitationListQuerySchema, response: invitationListResponseSchema });
documentRoute({ method: 'post', path: '/invitations', summary: 'Invite someone by e-mail (one-time link valid 72 h); `resent` when it replaced a pending invitation to the same address; 409 already_member for a member of this workspace', tag: 'invitations', roles: ['admin'], body: createInvitationRequestSchema, response: createInvitationResponseSchema, status: 201 });
documentRoute({ method: 'delete', path: '/invitations/:id', summary: 'Revoke a pending invitation', tag: 'invitations', roles: ['admin'], params: idParamsSchema, status: 204 });
documentRoute({ method: 'get', path: '/invitations/lookup', summary: 'What an invitation link is for', tag: 'invitations', query: invitationTokenQuerySchema, response: invitationLookupResponseSchema });
documentRoute({ method: 'post', path: '/invitations/accept', summary: 'Accept an invitation: set name and password, then signed in', tag: 'invitations', body: acceptInvitationRequestSchema, response: loginResponseSchema, status: 201 });
