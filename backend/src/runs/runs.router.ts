import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { cancelRun, getRun } from './runs.service';
import './runs.openapi';

export const runsRouter = Router();
runsRouter.use(requireAuth);

runsRouter.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await getRun(req.user!.workspaceId, params.id));
});

runsRouter.post('/:id/cancel', requireRole('designer', 'admin'), validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json({ run: await cancelRun(req.user!, params.id) });
});
