import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { dossierSchema, reviewDecisionRequestSchema, reviewHistoryResponseSchema, reviewQueueResponseSchema, reviewRecordSchema, reviseRequestSchema, submitRequestSchema, transitionResponseSchema } from '@shared/schemas/reviews';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/reviews', summary: 'Candidates waiting for the signed-in role, and those in or past review', tag: 'reviews', roles: 'any', response: reviewQueueResponseSchema });
documentRoute({ method: 'post', path: '/candidates/:id/submit', summary: 'Submit a shortlisted candidate for chemistry review (freezes its composition; 409 from any other state)', tag: 'reviews', roles: ['designer', 'admin'], params: idParamsSchema, body: submitRequestSchema, response: transitionResponseSchema });
documentRoute({ method: 'post', path: '/candidates/:id/reviews', summary: 'A review decision: chemists in chemistry review, reviewers in regulatory review (comment unless approved; checklist to approve)', tag: 'reviews', roles: ['chemist', 'reviewer'], params: idParamsSchema, body: reviewDecisionRequestSchema, response: transitionResponseSchema.extend({ review: reviewRecordSchema }) });
documentRoute({ method: 'get', path: '/candidates/:id/reviews', summary: 'Review state, decisions and history of a candidate and its earlier versions', tag: 'reviews', roles: 'any', params: idParamsSchema, response: reviewHistoryResponseSchema });
documentRoute({ method: 'post', path: '/candidates/:id/revise', summary: 'After changes were requested: a new version with an edited composition, re-checked by the time model, shortlisted', tag: 'reviews', roles: ['designer', 'admin'], params: idParamsSchema, body: reviseRequestSchema, response: transitionResponseSchema });
documentRoute({ method: 'get', path: '/candidates/:id/dossier', summary: 'Everything the dossier page shows (in or past review; 409 before)', tag: 'reviews', roles: 'any', params: idParamsSchema, response: dossierSchema });
documentRoute({ method: 'get', path: '/candidates/:id/dossier.pdf', summary: 'The dossier as a PDF (A4; ?paper=letter for US Letter)', tag: 'reviews', roles: 'any', params: idParamsSchema, query: z.object({ paper: z.enum(['a4', 'letter']).optional() }) });
