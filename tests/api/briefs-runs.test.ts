import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });

beforeAll(async () => {
  const { startRunWorker } = await import('../../backend/src/runs/run-queue');
  const { executeRun } = await import('../../backend/src/runs/run-executor');
  await startRunWorker(({ runId }) => executeRun(runId));
});
afterAll(async () => {
  const { stopRunQueue } = await import('../../backend/src/runs/run-queue');
  await stopRunQueue();
});

/** The brief of the designer's story: at most 5 °C within 3 min, held 15 min, ≤ 200 g, ≤ 0.60 a unit. */
const sideline = { name: 'Sideline cold compress (API test)', packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' };

async function waitForRun(token: string, runId: number, until: (s: string) => boolean = (s) => !['queued', 'running'].includes(s), timeoutMs = 80_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await request(h.app).get(`/api/runs/${runId}`).set(bearer(token));
    if (until(res.body.status)) return res.body;
    if (Date.now() > deadline) throw new Error(`run ${runId} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

describe('briefs', () => {
  it('a designer creates a brief with defaults filled in, and everyone in the workspace reads it', async () => {
    const res = await request(h.app).post('/api/briefs').set(bearer(await h.token(demo.designer))).send(sideline);
    expect(res.status).toBe(201);
    expect(res.body.brief.spec).toMatchObject({ targetTempC: 5, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60', ambientC: 25, initialTempC: 25 });
    for (const role of ['chemist', 'reviewer'] as const) {
      const read = await request(h.app).get(`/api/briefs/${res.body.brief.id}`).set(bearer(await h.token(demo[role])));
      expect(read.status).toBe(200);
    }
  });

  it('only designers and admins write briefs', async () => {
    for (const role of ['chemist', 'reviewer'] as const) {
      const res = await request(h.app).post('/api/briefs').set(bearer(await h.token(demo[role]))).send(sideline);
      expect(res.status).toBe(403);
    }
    expect((await request(h.app).post('/api/briefs').set(bearer(await h.token(demo.admin))).send({ ...sideline, name: 'Admin brief' })).status).toBe(201);
  });

  it('bad input names the field and the rule, and nothing is stored', async () => {
    const token = await h.token(demo.designer);
    const before = (await request(h.app).get('/api/briefs').set(bearer(token))).body.total;
    const res = await request(h.app).post('/api/briefs').set(bearer(token)).send({ name: 'Bad', packType: 'cold', targetTempC: 30, maxMassG: -5, maxActives: 4 });
    expect(res.status).toBe(400);
    const fields = res.body.error.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['maxMassG', 'maxActives']));
    const after = (await request(h.app).get('/api/briefs').set(bearer(token))).body.total;
    expect(after).toBe(before);
  });

  it('an edit saves a new version; a stale version answers 409; a copy is a new brief', async () => {
    const token = await h.token(demo.designer);
    const created = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Versioned brief' })).body.brief;
    const edited = await request(h.app).patch(`/api/briefs/${created.id}`).set(bearer(token)).send({ holdMin: 20, version: 0 });
    expect(edited.status).toBe(200);
    expect(edited.body.brief).toMatchObject({ version: 1 });
    expect(edited.body.brief.spec.holdMin).toBe(20);
    const stale = await request(h.app).patch(`/api/briefs/${created.id}`).set(bearer(token)).send({ holdMin: 25, version: 0 });
    expect(stale.status).toBe(409);
    const crossRule = await request(h.app).patch(`/api/briefs/${created.id}`).set(bearer(token)).send({ targetTempC: 40, version: 1 });
    expect(crossRule.status).toBe(400);
    expect(crossRule.body.error.fields[0].field).toBe('targetTempC');
    const copy = await request(h.app).post(`/api/briefs/${created.id}/duplicate`).set(bearer(token));
    expect(copy.status).toBe(201);
    expect(copy.body.brief.id).not.toBe(created.id);
    expect(copy.body.brief.spec.holdMin).toBe(20);
  });

  it("another workspace's brief answers 404 for reads, writes and runs", async () => {
    const mine = (await request(h.app).post('/api/briefs').set(bearer(await h.token(demo.designer))).send({ ...sideline, name: 'Private brief' })).body.brief;
    const theirs = await h.token(harbour.designer);
    expect((await request(h.app).get(`/api/briefs/${mine.id}`).set(bearer(theirs))).status).toBe(404);
    expect((await request(h.app).patch(`/api/briefs/${mine.id}`).set(bearer(theirs)).send({ holdMin: 5, version: 0 })).status).toBe(404);
    expect((await request(h.app).post(`/api/briefs/${mine.id}/runs`).set(bearer(theirs))).status).toBe(404);
    const list = (await request(h.app).get('/api/briefs').query({ pageSize: 200 }).set(bearer(theirs))).body.items.map((b: { id: number }) => b.id);
    expect(list).not.toContain(mine.id);
  });
});

describe('runs', () => {
  it('queue → progress → ranked, verified candidates; GET /api/runs/:id answers as the design says', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Run lifecycle brief' })).body.brief;
    const queued = await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(token));
    expect(queued.status).toBe(202);
    expect(typeof queued.body.runId).toBe('number');
    const run = await waitForRun(token, queued.body.runId);
    expect(run.status).toBe('succeeded');
    expect(run.progress.total).toBeGreaterThan(0);
    expect(run.progress.done).toBe(run.progress.total);
    expect(run.candidates.length).toBeGreaterThan(0);
    expect(Array.isArray(run.infeasible)).toBe(true);
    const ranks = run.candidates.map((c: { rank: number }) => c.rank);
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    for (const c of run.candidates) {
      expect(c.massG).toBeLessThanOrEqual(200 + 1e-6);
      expect(Number(c.unitCost)).toBeLessThanOrEqual(0.6 + 1e-9);
      expect(['passed', 'missed', 'not-verified', 'failed']).toContain(c.verification.status);
    }
    // Candidates that miss in simulation rank below those that pass.
    const firstMiss = run.candidates.findIndex((c: { verification: { status: string } }) => c.verification.status === 'missed');
    const lastPass = run.candidates.map((c: { verification: { status: string } }) => c.verification.status).lastIndexOf('passed');
    if (firstMiss >= 0 && lastPass >= 0) expect(lastPass).toBeLessThan(firstMiss);
    // A target sweep of 10–30 points comes with the run.
    expect(run.sweep.parameter).toBe('targetTempC');
    expect(run.sweep.points.length).toBeGreaterThanOrEqual(10);
    expect(run.sweep.points.length).toBeLessThanOrEqual(30);
    // The run keeps the brief and the data it used.
    expect(run.brief.name).toBe('Run lifecycle brief');
    expect(run.dataSnapshot.ingredients.length).toBeGreaterThanOrEqual(25);
  });

  it('the run is reproducible after the library changes: its snapshot keeps the old data', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Snapshot brief' })).body.brief;
    const runId = (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(token))).body.runId;
    const before = await waitForRun(token, runId);
    const { RunRecord } = await import('../../backend/src/runs/run.model');
    const stored = await RunRecord.findByPk(runId);
    const ammoniumNitrate = stored!.dataSnapshot.ingredients.find((i) => i.name.startsWith('Ammonium nitrate'))!;
    expect(Number(ammoniumNitrate.costPerKg)).toBeGreaterThan(0);
    expect(before.dataSnapshot.ingredients.find((i: { id: string }) => i.id === ammoniumNitrate.id).version).toBe(ammoniumNitrate.version);
  });

  it('an impossible brief returns no candidates and names the blocking constraints', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Impossible brief', targetTempC: -30, maxMassG: 30, maxUnitCost: '0.10', minSurfaceTempC: null })).body.brief;
    const run = await waitForRun(token, (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(token))).body.runId);
    expect(run.status).toBe('succeeded');
    expect(run.candidates).toEqual([]);
    expect(run.infeasible.length).toBeGreaterThan(0);
    for (const set of run.infeasible) {
      expect(set.blocking.length).toBeGreaterThan(0);
      expect(set.reason.length).toBeGreaterThan(0);
    }
  });

  it('only designers and admins start or cancel runs; another workspace gets 404', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Roles brief' })).body.brief;
    for (const role of ['chemist', 'reviewer'] as const) {
      expect((await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(await h.token(demo[role])))).status).toBe(403);
    }
    const runId = (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(await h.token(demo.admin)))).body.runId;
    expect((await request(h.app).get(`/api/runs/${runId}`).set(bearer(await h.token(demo.reviewer)))).status).toBe(200);
    expect((await request(h.app).get(`/api/runs/${runId}`).set(bearer(await h.token(harbour.admin)))).status).toBe(404);
    expect((await request(h.app).post(`/api/runs/${runId}/cancel`).set(bearer(await h.token(demo.chemist)))).status).toBe(403);
    await waitForRun(token, runId);
  });

  it('a queued run can be cancelled and then stores no candidates', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Cancelled brief', maxActives: 3 })).body.brief;
    const runId = (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(token))).body.runId;
    const cancelled = await request(h.app).post(`/api/runs/${runId}/cancel`).set(bearer(token));
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.run.status).toBe('cancelled');
    await new Promise((r) => setTimeout(r, 1500));
    const run = (await request(h.app).get(`/api/runs/${runId}`).set(bearer(token))).body;
    expect(run.status).toBe('cancelled');
    expect(run.candidates).toEqual([]);
    const again = await request(h.app).post(`/api/runs/${runId}/cancel`).set(bearer(token));
    expect(again.status).toBe(409);
  });
});

describe('candidates', () => {
  it('compare 2–4 candidates, shortlist one (designer only), other workspaces 404', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send({ ...sideline, name: 'Compare brief' })).body.brief;
    const run = await waitForRun(token, (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(bearer(token))).body.runId);
    expect(run.candidates.length).toBeGreaterThanOrEqual(2);
    const [a, b] = run.candidates;
    const compared = await request(h.app).get('/api/candidates/compare').query({ ids: `${a.id},${b.id}` }).set(bearer(await h.token(demo.reviewer)));
    expect(compared.status).toBe(200);
    expect(compared.body.candidates.map((c: { id: number }) => c.id)).toEqual([a.id, b.id]);
    const tooFew = await request(h.app).get('/api/candidates/compare').query({ ids: `${a.id}` }).set(bearer(token));
    expect(tooFew.status).toBe(400);
    expect(tooFew.body.error.fields[0].field).toBe('query.ids');

    expect((await request(h.app).post(`/api/candidates/${a.id}/shortlist`).set(bearer(await h.token(demo.chemist))).send({})).status).toBe(403);
    const listed = await request(h.app).post(`/api/candidates/${a.id}/shortlist`).set(bearer(token)).send({});
    expect(listed.status).toBe(200);
    expect(listed.body.candidate.state).toBe('shortlisted');
    expect((await request(h.app).get(`/api/candidates/${a.id}`).set(bearer(await h.token(harbour.designer)))).status).toBe(404);
    expect((await request(h.app).post(`/api/candidates/${a.id}/shortlist`).set(bearer(await h.token(harbour.designer))).send({})).status).toBe(404);
  });
});
