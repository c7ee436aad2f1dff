import { homeResponseSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/home', summary: 'What is waiting for the signed-in member', tag: 'home', roles: 'any', response: homeResponseSchema });
