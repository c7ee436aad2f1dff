import { z } from 'zod';
import { createBriefRequestSchema, updateBriefRequestSchema } from '@shared/schemas/briefs';
import { briefIdParamsSchema, briefListQuerySchema, briefListResponseSchema, briefRecordSchema, createRunResponseSchema, runListQuerySchema, runListResponseSchema } from '@shared/schemas/runs';
import { documentRoute } from '../openapi/registry';

const one = z.object({ brief: briefRecordSchema });
documentRoute({ method: 'get', path: '/briefs', summary: 'Active briefs of the workspace (archived=true: the archived ones), paged (search by name, pack type filter, sort), each with its last run', tag: 'briefs', roles: 'any', query: briefListQuerySchema, response: briefListResponseSchema });
documentRoute({ method: 'post', path: '/briefs', summary: 'Create a brief (defaults a designer would use)', tag: 'briefs', roles: ['designer', 'admin'], body: createBriefRequestSchema, response: one, status: 201 });
documentRoute({ method: 'get', path: '/briefs/:id', summary: 'One brief', tag: 'briefs', roles: 'any', params: briefIdParamsSchema, response: one });
documentRoute({ method: 'patch', path: '/briefs/:id', summary: 'Change a brief (saves a new version; 409 on a stale version)', tag: 'briefs', roles: ['designer', 'admin'], params: briefIdParamsSchema, body: updateBriefRequestSchema, response: one });
documentRoute({ method: 'post', path: '/briefs/:id/duplicate', summary: 'Copy a brief', tag: 'briefs', roles: ['designer', 'admin'], params: briefIdParamsSchema, response: one, status: 201 });
documentRoute({ method: 'delete', path: '/briefs/:id', summary: 'Delete a brief and its runs; 409 brief_has_reviews when candidates are in review or decided (archive it instead), 409 has_shortlist while candidates are shortlisted', tag: 'briefs', roles: ['designer', 'admin'], params: briefIdParamsSchema, status: 204 });
documentRoute({ method: 'post', path: '/briefs/:id/archive', summary: 'Archive a brief: out of the default list, read-only, still reachable with its runs, candidates and reviews', tag: 'briefs', roles: ['designer', 'admin'], params: briefIdParamsSchema, response: one });
documentRoute({ method: 'post', path: '/briefs/:id/unarchive', summary: 'Bring an archived brief back to the list', tag: 'briefs', roles: ['designer', 'admin'], params: briefIdParamsSchema, response: one });
documentRoute({ method: 'get', path: '/briefs/:id/runs', summary: 'Runs of a brief, paged, newest first unless sorted otherwise', tag: 'runs', roles: 'any', params: briefIdParamsSchema, query: runListQuerySchema, response: runListResponseSchema });
documentRoute({ method: 'post', path: '/briefs/:id/runs', summary: 'Queue an optimisation run (202 with its id)', tag: 'runs', roles: ['designer', 'admin'], params: briefIdParamsSchema, response: createRunResponseSchema, status: 202 });
