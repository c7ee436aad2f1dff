import { idParamsSchema, updateUserRequestSchema, userListQuerySchema, userListResponseSchema, userSchema } from '@shared/schemas';
import { z } from 'zod';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/users', summary: 'Members of the workspace, paged (search, role and disabled filters, sort)', tag: 'users', roles: ['admin'], query: userListQuerySchema, response: userListResponseSchema });
documentRoute({ method: 'patch', path: '/users/:id', summary: 'Change a member\'s role or disable them (409 on a stale version)', tag: 'users', roles: ['admin'], params: idParamsSchema, body: updateUserRequestSchema, response: z.object({ user: userSchema }) });
