import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { runDetailSchema, runSummarySchema } from '@shared/schemas/runs';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/runs/:id', summary: 'A run: status, progress, ranked candidates, infeasible sets with their reasons', tag: 'runs', roles: 'any', params: idParamsSchema, response: runDetailSchema });
documentRoute({ method: 'post', path: '/runs/:id/cancel', summary: 'Cancel a queued or running run', tag: 'runs', roles: ['designer', 'admin'], params: idParamsSchema, response: z.object({ run: runSummarySchema }) });
