import { mailMessageListQuerySchema, mailMessageListResponseSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/mail-messages', summary: 'Messages the local mail sink received for this workspace, paged, newest first', tag: 'mail', roles: ['admin'], query: mailMessageListQuerySchema, response: mailMessageListResponseSchema });
