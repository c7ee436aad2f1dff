import { Router } from 'express';
import { createBriefRequestSchema, updateBriefRequestSchema } from '@shared/schemas/briefs';
import { briefIdParamsSchema, briefListQuerySchema, runListQuerySchema } from '@shared/schemas/runs';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { createRun, listRuns } from '../runs/runs.service';
import { createBrief, deleteBrief, duplicateBrief, getBrief, listBriefs, setBriefArchived, updateBrief } from './briefs.service';
import './briefs.openapi';

export const briefsRouter = Router();
briefsRouter.use(requireAuth);
const writers = requireRole('designer', 'admin');

briefsRouter.get('/', validate({ query: briefListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: briefListQuerySchema });
  res.json(await listBriefs(req.user!.workspaceId, query));
});

briefsRouter.post('/', writers, validate({ body: createBriefRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: createBriefRequestSchema });
  res.status(201).json({ brief: await createBrief(req.user!, body) });
});

briefsRouter.get('/:id', validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  res.json({ brief: await getBrief(req.user!.workspaceId, params.id) });
});

briefsRouter.patch('/:id', writers, validate({ params: briefIdParamsSchema, body: updateBriefRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: briefIdParamsSchema, body: updateBriefRequestSchema });
  res.json({ brief: await updateBrief(req.user!, params.id, body) });
});

briefsRouter.post('/:id/duplicate', writers, validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  res.status(201).json({ brief: await duplicateBrief(req.user!, params.id) });
});

briefsRouter.delete('/:id', writers, validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  await deleteBrief(req.user!, params.id);
  res.status(204).end();
});

briefsRouter.post('/:id/archive', writers, validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  res.json({ brief: await setBriefArchived(req.user!, params.id, true) });
});

briefsRouter.post('/:id/unarchive', writers, validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  res.json({ brief: await setBriefArchived(req.user!, params.id, false) });
});

briefsRouter.get('/:id/runs', validate({ params: briefIdParamsSchema, query: runListQuerySchema }), async (req, res) => {
  const { params, query } = validated(res, { params: briefIdParamsSchema, query: runListQuerySchema });
  res.json(await listRuns(req.user!.workspaceId, params.id, query));
});

/** Queues an optimisation run: 202 with the run's id; progress and results at GET /api/runs/:id. */
briefsRouter.post('/:id/runs', writers, validate({ params: briefIdParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: briefIdParamsSchema });
  const runId = await createRun(req.user!, params.id);
  res.status(202).location(`/api/runs/${runId}`).json({ runId });
});
