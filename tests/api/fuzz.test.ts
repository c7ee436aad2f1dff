// A bounded fuzz of the whole API, driven by GET /api/openapi.json: every write route (and every
// GET that takes a query) with malformed bodies, ids and query strings, every upload route with
// broken multipart forms. Any 5xx or hung request fails the suite; 4xx answers must carry the
// one error shape. Fixed seed, about 1,500 requests; FUZZ_REQUESTS and FUZZ_SEED change both
// (`npx tsx scripts/bench/fuzz.ts` runs 10,000 and prints the counts).
import { writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { useHarness } from './support/harness';
import { planRequests, routesFromOpenApi, type FuzzRequest, type FuzzRoute } from './support/fuzz';

const TOTAL = Number(process.env.FUZZ_REQUESTS ?? 1500);
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const CONCURRENCY = 4;

const h = useHarness();
const tag = `fz${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let server: Server;
let base = '';
const tokens = { admin: '', chemist: '' };
const real = { ingredientId: 0, briefId: 0 };
let workspaceId = 0;

beforeAll(async () => {
  // A workspace of its own, so nothing the fuzz creates or changes touches the demo workspaces.
  const { Workspace } = await import('../../backend/src/workspaces/workspace.model');
  const { UserRecord } = await import('../../backend/src/users/user.model');
  const { hashPassword } = await import('../../backend/src/auth/passwords');
  const { issueSessionToken } = await import('../../backend/src/auth/session-token');
  const workspace = await Workspace.create({ slug: tag, name: `Fuzz ${tag}`, currency: 'EUR' });
  workspaceId = workspace.id;
  const passwordHash = await hashPassword(`fuzz-${tag}-password`);
  for (const role of ['admin', 'chemist'] as const) {
    const user = await UserRecord.create({ workspaceId: workspace.id, email: `${role}-${tag}@fuzz.test`, name: `Fuzz ${role}`, passwordHash, role });
    tokens[role] = issueSessionToken(user);
  }
  const auth = { Authorization: `Bearer ${tokens.admin}` };
  const ingredient = await request(h.app).post('/api/ingredients').set(auth).send({ name: 'Fuzz urea', role: 'additive', costPerKg: '0.70' });
  real.ingredientId = ingredient.body.ingredient.id;
  const brief = await request(h.app).post('/api/briefs').set(auth).send({ name: 'Fuzz brief' });
  real.briefId = brief.body.brief?.id ?? brief.body.id;
  server = h.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise((resolve) => server?.close(resolve));
  const { sequelize } = await import('../../backend/src/db/sequelize');
  // Everything hangs off the workspace; remove its rows, children first.
  const tables = (await sequelize.query(
    `SELECT table_name FROM information_schema.columns WHERE column_name = 'workspace_id' AND table_schema = 'public' AND table_name <> 'workspaces'`,
    { type: 'SELECT' },
  )) as { table_name: string }[];
  for (let pass = 0; pass < 4; pass++) {
    for (const { table_name } of tables) {
      await sequelize.query(`DELETE FROM "${table_name}" WHERE workspace_id = $1`, { bind: [workspaceId] }).catch(() => undefined);
    }
  }
  await sequelize.query('DELETE FROM workspaces WHERE id = $1', { bind: [workspaceId] }).catch(() => undefined);
});

/** Real ids of the fuzz workspace for routes on ingredients and briefs (not runs: no optimisation starts). */
function realIds(route: FuzzRoute): number[] {
  if (route.path.startsWith('/api/ingredients/{id}')) return [real.ingredientId];
  if (route.path.startsWith('/api/briefs/{id}') && !route.path.endsWith('/runs')) return [real.briefId];
  return [];
}

function tokenFor(r: FuzzRequest): string | null {
  // Logging out ends the session; it is fuzzed without one, so the rest keeps its token.
  if (r.anonymous || r.route === 'POST /api/auth/logout') return null;
  return r.route === 'POST /api/candidates/{id}/reviews' ? tokens.chemist : tokens.admin;
}

interface Outcome {
  request: FuzzRequest;
  status: number;
  body: string;
  ms: number;
}

async function send(r: FuzzRequest): Promise<Outcome> {
  const headers: Record<string, string> = {};
  const token = tokenFor(r);
  if (token) headers.Authorization = `Bearer ${token}`;
  if (r.contentType) headers['Content-Type'] = r.contentType;
  const t0 = performance.now();
  try {
    const res = await fetch(base + r.url, { method: r.method.toUpperCase(), headers, body: r.method === 'get' || r.body === undefined ? undefined : typeof r.body === 'string' ? r.body : new Uint8Array(r.body), signal: AbortSignal.timeout(20_000) });
    const body = await res.text();
    return { request: r, status: res.status, body, ms: performance.now() - t0 };
  } catch (error) {
    // A URL fetch itself refuses (none expected) or a request that hung.
    return { request: r, status: 599, body: String(error), ms: performance.now() - t0 };
  }
}

function describeOutcome(o: Outcome): string {
  const body = typeof o.request.body === 'string' ? o.request.body : (o.request.body?.toString('latin1') ?? '');
  return `${o.status} ${o.request.method.toUpperCase()} ${o.request.url} ${o.request.contentType ?? ''} ${JSON.stringify(body.slice(0, 160))} → ${o.body.slice(0, 200)}`;
}

describe('fuzz: the API answers malformed input with 4xx, never 5xx', () => {
  it(`${TOTAL} generated requests (seed ${SEED}) over every write and upload route of the OpenAPI document`, async () => {
    const doc = await request(h.app).get('/api/openapi.json');
    expect(doc.status).toBe(200);
    const routes = routesFromOpenApi(doc.body);
    const uploads = routes.filter((r) => r.multipart).map((r) => r.path);
    // The four upload routes are in the document as multipart forms.
    expect(uploads.sort()).toEqual(['/api/ingredients/import', '/api/ingredients/{id}/attachments', '/api/lab-logs', '/api/lab-logs/preview']);
    expect(routes.filter((r) => r.method !== 'get').length).toBeGreaterThan(25);

    const plan = planRequests(routes, { seed: SEED, total: TOTAL, realIds });
    const outcomes: Outcome[] = [];
    const started = Date.now();
    let next = 0;
    await Promise.all(
      Array.from({ length: CONCURRENCY }, async () => {
        while (next < plan.length) outcomes.push(await send(plan[next++]!));
      }),
    );
    const elapsedS = (Date.now() - started) / 1000;

    const byStatus: Record<string, number> = {};
    for (const o of outcomes) byStatus[o.status] = (byStatus[o.status] ?? 0) + 1;
    const serverErrors = outcomes.filter((o) => o.status >= 500);
    // Every refusal carries the one error shape with a message.
    const shapeless = outcomes.filter((o) => {
      if (o.status < 400 || o.status >= 500) return false;
      try {
        const parsed = JSON.parse(o.body) as { error?: { code?: unknown; message?: unknown } };
        return typeof parsed.error?.code !== 'string' || typeof parsed.error?.message !== 'string' || parsed.error.message.length === 0;
      } catch {
        return true;
      }
    });
    const msByRoute: Record<string, number> = {};
    for (const o of outcomes) msByRoute[o.request.route] = (msByRoute[o.request.route] ?? 0) + o.ms;
    const slowest = Object.entries(msByRoute)
      .sort((a, b) => b[1] - a[1])
      .slice(0, 5)
      .map(([route, ms]) => `${route} ${Math.round(ms)} ms`);
    const summary = { seed: SEED, requests: outcomes.length, routes: routes.length, elapsedS, byStatus, serverErrors: serverErrors.length, shapeless: shapeless.length, slowest };
    console.log(`[fuzz] ${JSON.stringify(summary)}`);
    if (process.env.FUZZ_REPORT) {
      writeFileSync(process.env.FUZZ_REPORT, JSON.stringify({ ...summary, serverErrorSamples: serverErrors.slice(0, 50).map(describeOutcome), shapelessSamples: shapeless.slice(0, 20).map(describeOutcome) }, null, 2));
    }
    expect(outcomes.length).toBe(plan.length);
    expect(outcomes.length).toBeGreaterThanOrEqual(TOTAL * 0.9);
    expect(serverErrors.map(describeOutcome)).toEqual([]);
    expect(shapeless.map(describeOutcome)).toEqual([]);
  }, Math.max(90_000, TOTAL * 200));
});
