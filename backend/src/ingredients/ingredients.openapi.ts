import { z } from 'zod';
import {
  attachmentListQuerySchema,
  attachmentListResponseSchema,
  attachmentSchema,
  createIngredientRequestSchema,
  deleteIngredientQuerySchema,
  idParamsSchema,
  importQuerySchema,
  importResponseSchema,
  ingredientHistoryQuerySchema,
  ingredientHistoryResponseSchema,
  ingredientListQuerySchema,
  ingredientListResponseSchema,
  ingredientSchema,
  updateIngredientRequestSchema,
  apiErrorSchema,
} from '@shared/schemas';
import { documentRoute, openApiRegistry } from '../openapi/registry';

const write = ['chemist', 'admin'] as const;
documentRoute({ method: 'get', path: '/ingredients', summary: 'Ingredient library (search, role filter, sort, paging)', tag: 'ingredients', roles: 'any', query: ingredientListQuerySchema, response: ingredientListResponseSchema });
documentRoute({ method: 'get', path: '/ingredients/export.csv', summary: 'The library as CSV (text cells starting with = + - @ are prefixed with \' against formula injection; numbers stay numbers)', tag: 'ingredients', roles: 'any', response: z.string(), contentType: 'text/csv' });
documentRoute({ method: 'get', path: '/ingredients/:id', summary: 'One ingredient', tag: 'ingredients', roles: 'any', params: idParamsSchema, response: z.object({ ingredient: ingredientSchema }) });
documentRoute({ method: 'post', path: '/ingredients', summary: 'Add an ingredient (audited)', tag: 'ingredients', roles: [...write], body: createIngredientRequestSchema, response: z.object({ ingredient: ingredientSchema }), status: 201 });
documentRoute({ method: 'patch', path: '/ingredients/:id', summary: 'Change an ingredient (409 on a stale version; audited with before/after)', tag: 'ingredients', roles: [...write], params: idParamsSchema, body: updateIngredientRequestSchema, response: z.object({ ingredient: ingredientSchema }) });
documentRoute({ method: 'delete', path: '/ingredients/:id', summary: 'Remove an ingredient from the library (optional ?version= guards against a stale delete; audited)', tag: 'ingredients', roles: [...write], params: idParamsSchema, query: deleteIngredientQuerySchema, status: 204 });
documentRoute({ method: 'get', path: '/ingredients/:id/history', summary: 'Audit events of an ingredient, paged: who, when, before and after', tag: 'ingredients', roles: 'any', params: idParamsSchema, query: ingredientHistoryQuerySchema, response: ingredientHistoryResponseSchema });
documentRoute({ method: 'get', path: '/ingredients/:id/attachments', summary: 'Attachments of an ingredient (safety data sheets)', tag: 'ingredients', roles: 'any', params: idParamsSchema, query: attachmentListQuerySchema, response: attachmentListResponseSchema });

const errorContent = { 'application/json': { schema: apiErrorSchema } };
const fileForm = (description: string) => ({
  content: { 'multipart/form-data': { schema: z.object({ file: z.string().meta({ format: 'binary', description }) }) } },
  required: true,
});
const uploadErrors = {
  400: { description: 'Invalid input: each field (for CSV rows `rows.<row>.<column>`) and rule is named', content: errorContent },
  401: { description: 'No valid session', content: errorContent },
  403: { description: 'Wrong role', content: errorContent },
  404: { description: 'Not found (or in another workspace)', content: errorContent },
  413: { description: 'File too large', content: errorContent },
  415: { description: 'Wrong file type', content: errorContent },
};

openApiRegistry.registerPath({
  method: 'post',
  path: '/api/ingredients/import',
  summary: 'Import ingredients from CSV (header row; at most 1 MB), all or nothing: one bad row imports nothing and every bad row is named; ?dryRun=true only checks',
  description: 'Roles: chemist, admin. Rows matching an ingredient by name and grade update it; the others are created.',
  tags: ['ingredients'],
  security: [{ cookieSession: [] }, { bearer: [] }],
  request: { query: importQuerySchema, body: fileForm('CSV file (.csv or text/csv)') },
  responses: { 200: { description: 'Imported (or, on a dry run, checked)', content: { 'application/json': { schema: importResponseSchema } } }, ...uploadErrors },
});

openApiRegistry.registerPath({
  method: 'post',
  path: '/api/ingredients/{id}/attachments',
  summary: 'Attach a PDF (checked by its content, at most 5 MB)',
  description: 'Roles: chemist, admin.',
  tags: ['ingredients'],
  security: [{ cookieSession: [] }, { bearer: [] }],
  request: { params: idParamsSchema, body: fileForm('PDF document') },
  responses: { 201: { description: 'Stored', content: { 'application/json': { schema: z.object({ attachment: attachmentSchema }) } } }, ...uploadErrors },
});
