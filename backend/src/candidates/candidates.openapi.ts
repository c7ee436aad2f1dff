import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { candidateCurveSchema, candidateListQuerySchema, candidateListResponseSchema, candidateRecordSchema, candidateResponseSchema } from '@shared/schemas/runs';
import { documentRoute } from '../openapi/registry';

const list = z.object({ candidates: z.array(candidateRecordSchema) });
documentRoute({ method: 'get', path: '/candidates', summary: 'Candidates of the workspace in one state (shortlisted unless ?state= names another), paged', tag: 'candidates', roles: 'any', query: candidateListQuerySchema, response: candidateListResponseSchema });
documentRoute({ method: 'get', path: '/candidates/compare', summary: '2–4 candidates side by side (ids=1,2,3)', tag: 'candidates', roles: 'any', query: z.object({ ids: z.string() }), response: list });
documentRoute({ method: 'get', path: '/candidates/:id', summary: 'One candidate with its brief', tag: 'candidates', roles: 'any', params: idParamsSchema, response: candidateResponseSchema });
documentRoute({ method: 'get', path: '/candidates/:id/curve', summary: "The candidate's temperature curve under its brief, replayed with its run's data snapshot and calibrations", tag: 'candidates', roles: 'any', params: idParamsSchema, response: candidateCurveSchema });
documentRoute({ method: 'post', path: '/candidates/:id/shortlist', summary: 'Shortlist a candidate (or take it off with shortlisted: false)', tag: 'candidates', roles: ['designer', 'admin'], params: idParamsSchema, body: z.object({ shortlisted: z.boolean().optional() }), response: z.object({ candidate: candidateRecordSchema }) });
