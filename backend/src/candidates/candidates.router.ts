import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { candidateListQuerySchema } from '@shared/schemas/runs';
import { compareCandidates, getCandidate, getCandidateCurve, listCandidates, setShortlisted } from './candidates.service';
import './candidates.openapi';

export const compareQuerySchema = z.object({
  ids: z
    .string({ error: 'is required: 2 to 4 candidate ids separated by commas' })
    .transform((s) => s.split(',').map((x) => Number(x.trim())))
    .pipe(z.array(z.number().int('must be whole numbers').positive('must be positive ids')).min(2, 'give 2 to 4 candidate ids').max(4, 'give 2 to 4 candidate ids')),
});
export const shortlistBodySchema = z.object({ shortlisted: z.boolean({ error: 'must be true or false' }).default(true) });

export const candidatesRouter = Router();
candidatesRouter.use(requireAuth);

candidatesRouter.get('/', validate({ query: candidateListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: candidateListQuerySchema });
  res.json(await listCandidates(req.user!.workspaceId, query));
});

candidatesRouter.get('/compare', validate({ query: compareQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: compareQuerySchema });
  res.json({ candidates: await compareCandidates(req.user!.workspaceId, query.ids) });
});

candidatesRouter.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await getCandidate(req.user!.workspaceId, params.id));
});

candidatesRouter.get('/:id/curve', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await getCandidateCurve(req.user!.workspaceId, params.id));
});

candidatesRouter.post('/:id/shortlist', requireRole('designer', 'admin'), validate({ params: idParamsSchema, body: shortlistBodySchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: shortlistBodySchema });
  res.json({ candidate: await setShortlisted(req.user!, params.id, body.shortlisted) });
});
