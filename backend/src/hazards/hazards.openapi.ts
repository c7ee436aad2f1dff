import { idParamsSchema } from '@shared/schemas';
import { hStatementsResponseSchema, ingredientHazardsResponseSchema, updateIngredientHazardsRequestSchema } from '@shared/schemas/reviews';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/ingredients/:id/hazards', summary: "An ingredient's hazard data (GHS classification, ATE, incompatibility groups, regulatory flags, source)", tag: 'hazards', roles: 'any', params: idParamsSchema, response: ingredientHazardsResponseSchema });
documentRoute({ method: 'put', path: '/ingredients/:id/hazards', summary: "Replace an ingredient's hazard data (409 on a stale hazard version; audited)", tag: 'hazards', roles: ['chemist', 'admin'], params: idParamsSchema, body: updateIngredientHazardsRequestSchema, response: ingredientHazardsResponseSchema });
documentRoute({ method: 'get', path: '/hazards/h-statements', summary: 'GHS H-statement texts by code', tag: 'hazards', roles: 'any', response: hStatementsResponseSchema });
