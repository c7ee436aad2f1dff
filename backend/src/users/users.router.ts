import { Router } from 'express';
import { idParamsSchema, updateUserRequestSchema, userListQuerySchema } from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { listUsers, updateUser } from './users.service';
import './users.openapi';

export const usersRouter = Router();
usersRouter.use(requireAuth, requireRole('admin'));

usersRouter.get('/', validate({ query: userListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: userListQuerySchema });
  res.json(await listUsers(req.user!.workspaceId, query));
});

usersRouter.patch('/:id', validate({ params: idParamsSchema, body: updateUserRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: updateUserRequestSchema });
  res.json({ user: await updateUser(req.user!, params.id, body) });
});
