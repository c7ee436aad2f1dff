import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { reviewDecisionRequestSchema, reviewQueueQuerySchema, reviseRequestSchema, submitRequestSchema } from '@shared/schemas/reviews';
import { reviewAction, rolesFor, REVIEW_STAGES, type ReviewStage } from '@shared/reviews/state-machine';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { AppError } from '../http/errors';
import { validate, validated } from '../http/validate';
import { decideReview, reviewHistory, reviewQueue, reviseCandidate, submitCandidate } from './reviews.service';
import { buildDossier, candidateHazardsView } from './dossier.service';
import { candidateConfidence } from '../lab-logs/lab-logs.service';
import { renderDossierPdf } from './dossier-pdf';
import './reviews.openapi';

const paperQuerySchema = z.object({ paper: z.enum(['a4', 'letter'], { error: 'must be a4 or letter' }).default('a4') });

/** A role that can never decide this stage is refused before the body is read (403, not 400). */
const stageRole: RequestHandler = (req, _res, next) => {
  const stage = (req.body as { stage?: unknown } | undefined)?.stage;
  if (typeof stage === 'string' && (REVIEW_STAGES as readonly string[]).includes(stage)) {
    if (!rolesFor(reviewAction(stage as ReviewStage, 'approved')).includes(req.user!.role)) {
      next(AppError.forbidden(`Only ${stage === 'chemistry' ? 'chemists' : 'regulatory reviewers'} decide a ${stage} review.`));
      return;
    }
  }
  next();
};

/** Mounted at /api/candidates beside the candidates router. */
export const candidateReviewsRouter = Router();
candidateReviewsRouter.use('/:id', requireAuth);

candidateReviewsRouter.post('/:id/submit', requireRole('designer', 'admin'), validate({ params: idParamsSchema, body: submitRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: submitRequestSchema });
  res.json(await submitCandidate(req.user!, params.id, body.comment));
});

candidateReviewsRouter.post('/:id/reviews', requireRole('chemist', 'reviewer'), stageRole, validate({ params: idParamsSchema, body: reviewDecisionRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: reviewDecisionRequestSchema });
  res.status(201).json(await decideReview(req.user!, params.id, body));
});

candidateReviewsRouter.get('/:id/reviews', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await reviewHistory(req.user!.workspaceId, params.id));
});

candidateReviewsRouter.post('/:id/revise', requireRole('designer', 'admin'), validate({ params: idParamsSchema, body: reviseRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: reviseRequestSchema });
  res.status(201).json(await reviseCandidate(req.user!, params.id, body));
});

candidateReviewsRouter.get('/:id/hazards', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await candidateHazardsView(req.user!.workspaceId, params.id));
});

candidateReviewsRouter.get('/:id/dossier', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.set('Cache-Control', 'private, no-store');
  res.json(await buildDossier(req.user!.workspaceId, params.id));
});

candidateReviewsRouter.get('/:id/dossier.pdf', validate({ params: z.object({ id: z.coerce.number().int().positive() }), query: paperQuerySchema }), async (req, res) => {
  const { params, query } = validated(res, { params: z.object({ id: z.coerce.number().int().positive() }), query: paperQuerySchema });
  const dossier = await buildDossier(req.user!.workspaceId, params.id);
  // The uncertainty band as the dossier page shows it; the PDF prints without it if it cannot be computed.
  const confidence = await candidateConfidence(req.user!.workspaceId, params.id).catch(() => null);
  const pdf = await renderDossierPdf(dossier, query.paper, confidence);
  res.set({ 'Content-Type': 'application/pdf', 'Cache-Control': 'private, no-store', 'Content-Disposition': `attachment; filename="dossier-candidate-${params.id}-rev${dossier.status.revision}-${query.paper}.pdf"` });
  res.send(pdf);
});

/** Mounted at /api/reviews: what waits for the signed-in role. */
export const reviewsRouter = Router();
reviewsRouter.use(requireAuth);
reviewsRouter.get('/', validate({ query: reviewQueueQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: reviewQueueQuerySchema });
  res.json(await reviewQueue(req.user!, query));
});
