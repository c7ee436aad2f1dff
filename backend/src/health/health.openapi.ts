import { healthResponseSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/health', summary: 'Liveness and database status (503 while the database is down)', tag: 'health', response: healthResponseSchema });
