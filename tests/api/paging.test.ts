// Paged lists: page boundaries, totals, sort, filters, 400s naming the field, workspace
// separation, and a workspace with 1,600 briefs whose list answer stays small.
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });
const BRIEFS = 1600;
const PASSWORD = 'paging-test-password-1';
const suffix = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const designerEmail = `paging-designer-${suffix}@example.test`;
let workspaceId = 0;
let ranBriefId = 0;
let token = '';

/** Every list endpoint and a sort key it accepts (the brief's and ingredient's ids are filled in later). */
const LIST_ROUTES = (ids: { briefId: number; ingredientId: number }) => [
  { path: '/api/briefs', sort: '-updatedAt', as: 'designer' },
  { path: `/api/briefs/${ids.briefId}/runs`, sort: '-createdAt', as: 'designer' },
  { path: '/api/candidates', sort: '-updatedAt', as: 'designer' },
  { path: '/api/ingredients', sort: 'costPerKg', as: 'designer' },
  { path: `/api/ingredients/${ids.ingredientId}/history`, sort: '-at', as: 'designer' },
  { path: `/api/ingredients/${ids.ingredientId}/attachments`, sort: 'filename', as: 'designer' },
  { path: '/api/species', sort: 'name', as: 'designer' },
  { path: '/api/lab-logs', sort: 'name', as: 'designer' },
  { path: '/api/calibrations', sort: 'createdAt', as: 'designer' },
  { path: '/api/reviews', sort: 'updatedAt', as: 'designer' },
  { path: '/api/users', sort: '-lastLoginAt', as: 'admin' },
  { path: '/api/invitations', sort: 'email', as: 'admin' },
  { path: '/api/mail-messages', sort: 'receivedAt', as: 'admin' },
];

beforeAll(async () => {
  const { Workspace } = await import('../../backend/src/workspaces/workspace.model');
  const { UserRecord } = await import('../../backend/src/users/user.model');
  const { BriefRecord } = await import('../../backend/src/briefs/brief.model');
  const { RunRecord } = await import('../../backend/src/runs/run.model');
  const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
  const { hashPassword } = await import('../../backend/src/auth/passwords');
  const { briefSchema } = await import('../../shared/src/schemas/briefs');
  const workspace = await Workspace.create({ slug: `paging-${suffix}`, name: `Paging test ${suffix}` });
  workspaceId = workspace.id;
  const user = await UserRecord.create({ workspaceId, email: designerEmail, name: 'Paula Pager', passwordHash: await hashPassword(PASSWORD), role: 'designer' });
  const rows = Array.from({ length: BRIEFS }, (_, k) => {
    const packType: 'cold' | 'warm' = k % 2 === 0 ? 'cold' : 'warm';
    const name = `Brief ${String(k).padStart(4, '0')}`;
    const spec = briefSchema.parse(
      packType === 'cold'
        ? { name, packType, targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200 }
        : { name, packType, targetTempC: 40, reachWithinMin: 5, holdMin: 30, maxMassG: 200 },
    );
    return { workspaceId, name, packType, spec, createdById: user.id, updatedById: user.id };
  });
  await BriefRecord.bulkCreate(rows);
  // One brief with two runs; the last has three candidates: the list shows that run and that count.
  const ran = (await BriefRecord.findOne({ where: { workspaceId, name: 'Brief 0007' } }))!;
  ranBriefId = ran.id;
  const snapshot = { ingredients: [], chemistry: { species: [] } } as never;
  await RunRecord.create({ workspaceId, briefId: ran.id, briefVersion: 0, briefSnapshot: ran.spec, dataSnapshot: snapshot, createdById: user.id, status: 'failed' });
  await new Promise((r) => setTimeout(r, 5));
  const last = await RunRecord.create({ workspaceId, briefId: ran.id, briefVersion: 0, briefSnapshot: ran.spec, dataSnapshot: snapshot, createdById: user.id, status: 'succeeded' });
  await CandidateRecord.bulkCreate(
    [0, 1, 2].map((k) => ({ workspaceId, runId: last.id, briefId: ran.id, setKey: `set-${k}`, rank: k + 1, pareto: k === 0, verificationStatus: 'verified', data: { setNames: [`Set ${k}`] } as never })),
  );
  token = await h.token(designerEmail, PASSWORD);
}, 120_000);

const list = (query: Record<string, string | number>, t = token) => request(h.app).get('/api/briefs').query(query).set(bearer(t));

describe('GET /api/briefs in a workspace of 1,600 briefs', () => {
  it('answers the first page of 50 with the total, and the answer stays small', async () => {
    const res = await list({});
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(['items', 'page', 'pageSize', 'total']);
    expect(res.body).toMatchObject({ page: 1, pageSize: 50, total: BRIEFS });
    expect(res.body.items).toHaveLength(50);
    const bytes = Buffer.byteLength(res.text);
    const perBrief = bytes / 50;
    // The whole list would be 1,600 × the size of one brief; one page is 50 of them.
    expect(bytes).toBeLessThan(100 * 1024);
    expect(bytes).toBeLessThan((BRIEFS * perBrief) / 20);
  });

  it('pages without gaps or repeats up to the last page, and past it answers an empty page with the total', async () => {
    const seen = new Set<number>();
    for (let page = 1; page <= 8; page++) {
      const res = await list({ page, pageSize: 200 });
      expect(res.status).toBe(200);
      expect(res.body.items).toHaveLength(200);
      for (const b of res.body.items as { id: number }[]) seen.add(b.id);
    }
    expect(seen.size).toBe(BRIEFS);
    const last = await list({ page: 32, pageSize: 50 });
    expect(last.body.items).toHaveLength(50);
    const past = await list({ page: 33, pageSize: 50 });
    expect(past.status).toBe(200);
    expect(past.body).toMatchObject({ items: [], page: 33, pageSize: 50, total: BRIEFS });
    const partial = await list({ page: 11, pageSize: 150 });
    expect(partial.body.items).toHaveLength(BRIEFS - 10 * 150); // the last page holds the rest
  });

  it('sorts in SQL by a whitelisted key, both ways; the default is most recently changed first', async () => {
    const asc = (await list({ sort: 'name', pageSize: 5 })).body.items.map((b: { name: string }) => b.name);
    expect(asc).toEqual(['Brief 0000', 'Brief 0001', 'Brief 0002', 'Brief 0003', 'Brief 0004']);
    const desc = (await list({ sort: '-name', pageSize: 3 })).body.items.map((b: { name: string }) => b.name);
    expect(desc).toEqual(['Brief 1599', 'Brief 1598', 'Brief 1597']);
    const byChange = (await list({ pageSize: 200 })).body.items as { id: number; updatedAt: string }[];
    for (let k = 1; k < byChange.length; k++) {
      const [a, b] = [byChange[k - 1]!, byChange[k]!];
      expect(a.updatedAt > b.updatedAt || (a.updatedAt === b.updatedAt && a.id > b.id)).toBe(true);
    }
  });

  it('filters in SQL by name and pack type, and counts only the matches', async () => {
    const named = await list({ q: 'brief 001', sort: 'name' });
    expect(named.body.total).toBe(10); // Brief 0010 … Brief 0019
    expect(named.body.items.map((b: { name: string }) => b.name)).toEqual(Array.from({ length: 10 }, (_, k) => `Brief 001${k}`));
    expect((await list({ q: '%' })).body.total).toBe(0); // % and _ are literal characters, not wildcards
    expect((await list({ q: '_' })).body.total).toBe(0);
    const warm = await list({ packType: 'warm', pageSize: 200 });
    expect(warm.body.total).toBe(BRIEFS / 2);
    expect(warm.body.items.every((b: { packType: string }) => b.packType === 'warm')).toBe(true);
    const both = await list({ packType: 'cold', q: 'Brief 000' });
    expect(both.body.items.map((b: { name: string }) => b.name).sort()).toEqual(['Brief 0000', 'Brief 0002', 'Brief 0004', 'Brief 0006', 'Brief 0008']);
  });

  it("gives each brief its last run and that run's candidate count", async () => {
    const res = await list({ q: 'Brief 000', pageSize: 10 });
    const ran = res.body.items.find((b: { id: number }) => b.id === ranBriefId);
    expect(ran.lastRun).toMatchObject({ status: 'succeeded', candidates: 3 });
    expect(res.body.items.filter((b: { lastRun: unknown }) => b.lastRun === null)).toHaveLength(9);
  });

  it('answers 400 naming the field for a bad page, page size, sort key or filter', async () => {
    const cases: [Record<string, string | number>, string][] = [
      [{ page: 0 }, 'query.page'],
      [{ page: 'abc' }, 'query.page'],
      [{ page: 1.5 }, 'query.page'],
      [{ pageSize: 0 }, 'query.pageSize'],
      [{ pageSize: 201 }, 'query.pageSize'],
      [{ sort: 'spec' }, 'query.sort'],
      [{ sort: '-' }, 'query.sort'],
      [{ sort: 'name; DROP TABLE briefs' }, 'query.sort'],
      [{ packType: 'hot' }, 'query.packType'],
      [{ q: 'x'.repeat(101) }, 'query.q'],
      [{ q: 'a\u0000b' }, 'query.q'],
    ];
    for (const [query, field] of cases) {
      const res = await list(query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain(field);
    }
    const sort = await list({ sort: 'spec' });
    expect(sort.body.error.message).toMatch(/name, -name, updatedAt, -updatedAt, createdAt, -createdAt/);
  });

  it("shows no other workspace's briefs, either way", async () => {
    const ours = new Set<number>();
    for (let page = 1; page <= 8; page++) for (const b of (await list({ page, pageSize: 200 })).body.items as { id: number }[]) ours.add(b.id);
    for (const email of [demo.designer, harbour.designer]) {
      const theirs = await list({ pageSize: 200 }, await h.token(email));
      expect(theirs.status).toBe(200);
      expect(theirs.body.total).toBeLessThan(BRIEFS);
      expect((theirs.body.items as { id: number }[]).some((b) => ours.has(b.id))).toBe(false);
    }
    expect((await request(h.app).get(`/api/briefs/${ranBriefId}/runs`).set(bearer(await h.token(demo.designer)))).status).toBe(404);
  });
});

describe('every list endpoint', () => {
  let ids = { briefId: 0, ingredientId: 0 };
  beforeAll(async () => {
    const t = await h.token(demo.designer);
    const brief = (await request(h.app).get('/api/briefs').query({ pageSize: 1 }).set(bearer(t))).body.items[0];
    const ingredient = (await request(h.app).get('/api/ingredients').query({ pageSize: 1 }).set(bearer(t))).body.items[0];
    ids = { briefId: brief.id, ingredientId: ingredient.id };
  });

  it('answers { items, page, pageSize, total } for the asked page and size, and sorts by its whitelisted keys', async () => {
    for (const route of LIST_ROUTES(ids)) {
      const t = await h.token(route.as === 'admin' ? demo.admin : demo.designer);
      const res = await request(h.app).get(route.path).query({ page: 1, pageSize: 2, sort: route.sort }).set(bearer(t));
      expect(res.status, route.path).toBe(200);
      expect(res.body, route.path).toMatchObject({ page: 1, pageSize: 2 });
      expect(Array.isArray(res.body.items), route.path).toBe(true);
      expect(res.body.items.length, route.path).toBeLessThanOrEqual(2);
      expect(res.body.total, route.path).toBeGreaterThanOrEqual(res.body.items.length);
      const rest = await request(h.app).get(route.path).query({ page: 2, pageSize: 2, sort: route.sort }).set(bearer(t));
      expect(rest.body.items.length, route.path).toBe(Math.max(0, Math.min(2, res.body.total - 2)));
    }
  });

  it('answers 400 naming query.sort, query.page and query.pageSize for bad values', async () => {
    for (const route of LIST_ROUTES(ids)) {
      const t = await h.token(route.as === 'admin' ? demo.admin : demo.designer);
      for (const [query, field] of [
        [{ sort: 'password_hash' }, 'query.sort'],
        [{ page: -1 }, 'query.page'],
        [{ pageSize: 1000 }, 'query.pageSize'],
      ] as const) {
        const res = await request(h.app).get(route.path).query(query).set(bearer(t));
        expect(res.status, `${route.path} ${JSON.stringify(query)}`).toBe(400);
        expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain(field);
      }
    }
  });

  it('the ingredient library totals what matches and pages it', async () => {
    const t = await h.token(demo.designer);
    const all = (await request(h.app).get('/api/ingredients').query({ pageSize: 200 }).set(bearer(t))).body;
    const firstTwo = (await request(h.app).get('/api/ingredients').query({ pageSize: 2, sort: '-costPerKg' }).set(bearer(t))).body;
    expect(firstTwo.total).toBe(all.total);
    const costs = (all.items as { costPerKg: string }[]).map((i) => Number(i.costPerKg)).sort((a, b) => b - a);
    expect(firstTwo.items.map((i: { costPerKg: string }) => Number(i.costPerKg))).toEqual(costs.slice(0, 2));
  });

  it('every list is documented in the OpenAPI document with page, pageSize and sort, and the paged answer', async () => {
    const doc = (await request(h.app).get('/api/openapi.json')).body as { paths: Record<string, { get?: { parameters?: { name: string; in: string }[]; responses: Record<string, { content?: Record<string, { schema: { properties?: Record<string, unknown>; allOf?: unknown } }> }> } }> };
    for (const route of LIST_ROUTES({ briefId: 1, ingredientId: 1 })) {
      const path = route.path.replace(/\/1(?=\/|$)/g, '/{id}');
      const get = doc.paths[path]?.get;
      expect(get, path).toBeDefined();
      const names = (get!.parameters ?? []).filter((p) => p.in === 'query').map((p) => p.name);
      expect(names, path).toEqual(expect.arrayContaining(['page', 'pageSize', 'sort']));
      const schema = get!.responses['200']!.content!['application/json']!.schema;
      expect(Object.keys(schema.properties ?? {}), path).toEqual(expect.arrayContaining(['items', 'page', 'pageSize', 'total']));
    }
  });
});
