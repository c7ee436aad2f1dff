import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/attachments/:id/download', summary: 'Download an attachment (members of its workspace only; sent as an attachment with nosniff)', tag: 'ingredients', roles: 'any', params: idParamsSchema, response: z.string().meta({ format: 'binary' }), contentType: 'application/pdf' });
