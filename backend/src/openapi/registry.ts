import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiErrorSchema, type Role } from '@shared/schemas';

/** One registry for the whole API; each router documents its routes beside their definitions. */
export const openApiRegistry = new OpenAPIRegistry();

openApiRegistry.registerComponent('securitySchemes', 'cookieSession', { type: 'apiKey', in: 'cookie', name: 'pw_session' });
openApiRegistry.registerComponent('securitySchemes', 'bearer', { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' });

interface RouteDoc {
  method: RouteConfig['method'];
  /** Express-style path under /api, e.g. `/users/:id`. */
  path: string;
  summary: string;
  tag: string;
  /** Omit for public routes. */
  roles?: Role[] | 'any';
  body?: z.ZodType;
  /** A multipart/form-data upload: its fields (a file is `z.string().meta({ format: 'binary' })`). */
  multipart?: z.ZodObject;
  query?: z.ZodObject;
  params?: z.ZodObject;
  response?: z.ZodType;
  status?: number;
  contentType?: string;
}

const errorContent = { 'application/json': { schema: apiErrorSchema } };

export function documentRoute(doc: RouteDoc): void {
  const status = doc.status ?? 200;
  const openApiPath = `/api${doc.path}`.replace(/:(\w+)/g, '{$1}');
  const responses: RouteConfig['responses'] = {
    [status]: doc.response
      ? { description: 'Success', content: { [doc.contentType ?? 'application/json']: { schema: doc.response } } }
      : { description: 'Success' },
    400: { description: 'Invalid input: each field and rule is named', content: errorContent },
  };
  if (doc.roles) {
    responses[401] = { description: 'No valid session', content: errorContent };
    responses[403] = { description: 'Wrong role', content: errorContent };
    responses[404] = { description: 'Not found (or in another workspace)', content: errorContent };
  }
  const roleNote = doc.roles === 'any' ? 'Any signed-in member.' : doc.roles ? `Roles: ${doc.roles.join(', ')}.` : 'Public.';
  openApiRegistry.registerPath({
    method: doc.method,
    path: openApiPath,
    summary: doc.summary,
    description: roleNote,
    tags: [doc.tag],
    security: doc.roles ? [{ cookieSession: [] }, { bearer: [] }] : [],
    request: {
      ...(doc.params ? { params: doc.params } : {}),
      ...(doc.query ? { query: doc.query } : {}),
      ...(doc.body ? { body: { content: { 'application/json': { schema: doc.body } }, required: true } } : {}),
      ...(doc.multipart ? { body: { content: { 'multipart/form-data': { schema: doc.multipart } }, required: true } } : {}),
    },
    responses,
  });
}

export function buildOpenApiDocument() {
  return new OpenApiGeneratorV31(openApiRegistry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Packwright API', version: '0.1.0', description: 'Design thermal packs: briefs, candidates, hazard notes and sign-off.' },
    servers: [{ url: '/' }],
  });
}
