import { Router } from 'express';
import { acceptInvitationRequestSchema, createInvitationRequestSchema, idParamsSchema, invitationListQuerySchema, invitationTokenQuerySchema } from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { issueSessionToken, setSessionCookie } from '../auth/session-token';
import { toAuthUser, toSessionUser } from '../auth/session-user';
import { validate, validated } from '../http/validate';
import { UserRecord } from '../users/user.model';
import { Workspace } from '../workspaces/workspace.model';
import { acceptInvitation, createInvitation, listInvitations, lookupInvitation, revokeInvitation } from './invitations.service';
import './invitations.openapi';

export const invitationsRouter = Router();

// Public: the invitee has no account yet; the one-time token is the credential.
invitationsRouter.get('/lookup', validate({ query: invitationTokenQuerySchema }), async (_req, res) => {
  const { query } = validated(res, { query: invitationTokenQuerySchema });
  res.json(await lookupInvitation(query.token));
});

invitationsRouter.post('/accept', validate({ body: acceptInvitationRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: acceptInvitationRequestSchema });
  const userId = await acceptInvitation(body);
  const user = await UserRecord.findByPk(userId, { include: [{ model: Workspace, as: 'workspace' }] });
  const token = issueSessionToken(user!);
  setSessionCookie(req, res, token);
  res.status(201).json({ user: toSessionUser(toAuthUser(user!)), token });
});

invitationsRouter.get('/', requireAuth, requireRole('admin'), validate({ query: invitationListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: invitationListQuerySchema });
  res.json(await listInvitations(req.user!.workspaceId, query));
});

invitationsRouter.post('/', requireAuth, requireRole('admin'), validate({ body: createInvitationRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: createInvitationRequestSchema });
  res.status(201).json(await createInvitation(req.user!, body));
});

invitationsRouter.delete('/:id', requireAuth, requireRole('admin'), validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  await revokeInvitation(req.user!, params.id);
  res.status(204).end();
});
