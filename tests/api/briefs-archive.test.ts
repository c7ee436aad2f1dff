// A brief with candidates in review or decided cannot be deleted (their reviews are records);
// it can be archived: out of the default list, read-only, still reachable, and audited.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, runBriefToEnd, useHarness } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });
const tag = Date.now().toString(36);
const sideline = (name: string) => ({ name: `${name} (archive API test ${tag})`, packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' });

let reviewed: { briefId: number; candidateId: number };

beforeAll(async () => {
  const { startRunWorker } = await import('../../backend/src/runs/run-queue');
  const { executeRun } = await import('../../backend/src/runs/run-executor');
  await startRunWorker(({ runId }) => executeRun(runId));
  const token = await h.token(demo.designer);
  const { brief, run } = await runBriefToEnd(h, token, sideline('Reviewed brief'), 80_000);
  expect(run.status).toBe('succeeded');
  const candidateId = run.candidates[0].id as number;
  expect((await request(h.app).post(`/api/candidates/${candidateId}/shortlist`).set(bearer(token)).send({ shortlisted: true })).status).toBe(200);
  expect((await request(h.app).post(`/api/candidates/${candidateId}/submit`).set(bearer(token)).send({ comment: 'for review' })).status).toBe(200);
  reviewed = { briefId: brief.id, candidateId };
}, 90_000);
afterAll(async () => {
  const { stopRunQueue } = await import('../../backend/src/runs/run-queue');
  await stopRunQueue();
});

async function listed(token: string, archived?: boolean): Promise<number[]> {
  const req = request(h.app).get('/api/briefs').set(bearer(token));
  if (archived !== undefined) req.query({ archived: String(archived) });
  const res = await req;
  expect(res.status).toBe(200);
  return res.body.items.map((b: { id: number }) => b.id);
}

describe('deleting a brief whose candidates have been reviewed', () => {
  it('is refused with 409 and the reason, and nothing is deleted', async () => {
    const token = await h.token(demo.designer);
    const res = await request(h.app).delete(`/api/briefs/${reviewed.briefId}`).set(bearer(token));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('brief_has_reviews');
    expect(res.body.error.message).toMatch(/1 candidate in review/);
    expect(res.body.error.message).toMatch(/regulatory records/);
    expect(res.body.error.message).toMatch(/Archive the brief instead/);
    expect((await request(h.app).get(`/api/briefs/${reviewed.briefId}`).set(bearer(token))).status).toBe(200);
    expect((await request(h.app).get(`/api/candidates/${reviewed.candidateId}`).set(bearer(token))).status).toBe(200);
  });

  it('counts decided candidates too (a rejected one is a decision on record)', async () => {
    const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
    const token = await h.token(demo.chemist);
    const decided = await request(h.app)
      .post(`/api/candidates/${reviewed.candidateId}/reviews`)
      .set(bearer(token))
      .send({ stage: 'chemistry', verdict: 'rejected', checklist: { dataSourcesChecked: true, modelValidInRegime: true, labLog: { waivedReason: 'archive API test' } }, comment: 'not for this market' });
    expect(decided.status).toBe(201);
    expect((await CandidateRecord.findByPk(reviewed.candidateId))!.state).toBe('rejected');
    const res = await request(h.app).delete(`/api/briefs/${reviewed.briefId}`).set(bearer(await h.token(demo.designer)));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/1 candidate with a review decision/);
  });

  it('a brief without reviewed or shortlisted candidates can still be deleted, and the deletion is audited', async () => {
    const token = await h.token(demo.designer);
    const brief = (await request(h.app).post('/api/briefs').set(bearer(token)).send(sideline('Scratch brief'))).body.brief;
    expect((await request(h.app).delete(`/api/briefs/${brief.id}`).set(bearer(token))).status).toBe(204);
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    expect(await AuditEventRecord.count({ where: { action: 'brief.delete', entityId: String(brief.id) } })).toBe(1);
  });
});

describe('archiving a brief', () => {
  it('hides it from the default list, keeps it reachable with its candidates and review history, and is audited', async () => {
    const token = await h.token(demo.designer);
    const archived = await request(h.app).post(`/api/briefs/${reviewed.briefId}/archive`).set(bearer(token));
    expect(archived.status).toBe(200);
    expect(archived.body.brief.archivedAt).toEqual(expect.any(String));
    expect(archived.body.brief.archivedBy).toBeTruthy();

    expect(await listed(token)).not.toContain(reviewed.briefId);
    expect(await listed(token, false)).not.toContain(reviewed.briefId);
    expect(await listed(token, true)).toContain(reviewed.briefId);
    const one = await request(h.app).get(`/api/briefs/${reviewed.briefId}`).set(bearer(token));
    expect(one.status).toBe(200);
    expect(one.body.brief.archivedAt).toBe(archived.body.brief.archivedAt);
    expect((await request(h.app).get(`/api/briefs/${reviewed.briefId}/runs`).set(bearer(token))).body.items.length).toBeGreaterThan(0);
    const history = await request(h.app).get(`/api/candidates/${reviewed.candidateId}/reviews`).set(bearer(token));
    expect(history.status).toBe(200);
    expect(history.body.reviews.length).toBeGreaterThan(0);

    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    expect(await AuditEventRecord.count({ where: { action: 'brief.archive', entityId: String(reviewed.briefId) } })).toBe(1);
    expect(await AuditEventRecord.count({ where: { action: 'candidate.review', entityId: String(reviewed.candidateId) } })).toBe(1);
  });

  it('an archived brief is read-only: no change, no run, no second archive; it can be copied', async () => {
    const token = await h.token(demo.designer);
    const version = (await request(h.app).get(`/api/briefs/${reviewed.briefId}`).set(bearer(token))).body.brief.version;
    const patch = await request(h.app).patch(`/api/briefs/${reviewed.briefId}`).set(bearer(token)).send({ version, holdMin: 20 });
    expect(patch.status).toBe(409);
    expect(patch.body.error.code).toBe('brief_archived');
    expect(patch.body.error.message).toMatch(/Unarchive it first/);
    const run = await request(h.app).post(`/api/briefs/${reviewed.briefId}/runs`).set(bearer(token));
    expect(run.status).toBe(409);
    expect(run.body.error.code).toBe('brief_archived');
    expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/archive`).set(bearer(token))).status).toBe(409);
    const copy = await request(h.app).post(`/api/briefs/${reviewed.briefId}/duplicate`).set(bearer(token));
    expect(copy.status).toBe(201);
    expect(copy.body.brief.archivedAt).toBeNull();
  });

  it('unarchiving brings it back to the list, audited', async () => {
    const token = await h.token(demo.admin);
    const res = await request(h.app).post(`/api/briefs/${reviewed.briefId}/unarchive`).set(bearer(token));
    expect(res.status).toBe(200);
    expect(res.body.brief.archivedAt).toBeNull();
    expect(res.body.brief.archivedBy).toBeNull();
    expect(await listed(token)).toContain(reviewed.briefId);
    expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/unarchive`).set(bearer(token))).status).toBe(409);
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    expect(await AuditEventRecord.count({ where: { action: 'brief.unarchive', entityId: String(reviewed.briefId) } })).toBe(1);
  });

  it('checks role, session, workspace and the query', async () => {
    for (const role of ['chemist', 'reviewer'] as const) {
      expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/archive`).set(bearer(await h.token(demo[role])))).status).toBe(403);
    }
    expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/archive`)).status).toBe(401);
    expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/archive`).set(bearer(await h.token(harbour.designer)))).status).toBe(404);
    expect((await request(h.app).post(`/api/briefs/${reviewed.briefId}/unarchive`).set(bearer(await h.token(harbour.admin)))).status).toBe(404);
    const bad = await request(h.app).get('/api/briefs').query({ archived: 'maybe' }).set(bearer(await h.token(demo.designer)));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].field).toBe('query.archived');
  });
});
