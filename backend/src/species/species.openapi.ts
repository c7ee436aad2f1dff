import { z } from 'zod';
import { createSpeciesRequestSchema, idParamsSchema, speciesListQuerySchema, speciesListResponseSchema, speciesSchema, updateSpeciesRequestSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/species', summary: 'Species data of the workspace: reference rows and its own additions and corrections (search by formula or name, phase filter, paging)', tag: 'species', roles: 'any', query: speciesListQuerySchema, response: speciesListResponseSchema });
documentRoute({ method: 'post', path: '/species', summary: 'Add a species to the workspace, with a citation (audited; 409 when the species data already hold it)', tag: 'species', roles: ['chemist', 'admin'], body: createSpeciesRequestSchema, response: z.object({ species: speciesSchema }), status: 201 });
documentRoute({ method: 'patch', path: '/species/:id', summary: 'Correct a species, with a citation: a reference row gets a workspace correction (a new row that replaces it here only), a workspace row is edited (409 on a stale version); audited', tag: 'species', roles: ['chemist', 'admin'], params: idParamsSchema, body: updateSpeciesRequestSchema, response: z.object({ species: speciesSchema }) });
