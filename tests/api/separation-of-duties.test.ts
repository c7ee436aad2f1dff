// Separation of duties: whoever made the chemistry decision on a candidate revision cannot make
// its regulatory decision, whatever their role is now; role changes are audited.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, linkFrom, runBriefToEnd, tokenFromLink, uniqueEmail, useHarness, waitForMail } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });

const CHEMISTRY_OK = { dataSourcesChecked: true, modelValidInRegime: true, labLog: { waivedReason: 'a lab log of this family exists (API test)' } };
const REGULATORY_OK = { classificationChecked: true, labelElementsChecked: true, cautionsChecked: true, regulatoryFlagsChecked: true };
const sideline = { name: `Sideline cold compress (duties API test ${Date.now().toString(36)})`, packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' };

let candidateIds: number[] = [];

beforeAll(async () => {
  const { startRunWorker } = await import('../../backend/src/runs/run-queue');
  const { executeRun } = await import('../../backend/src/runs/run-executor');
  await startRunWorker(({ runId }) => executeRun(runId));
  const token = await h.token(demo.designer);
  const { run } = await runBriefToEnd(h, token, sideline, 80_000);
  expect(run.status).toBe('succeeded');
  candidateIds = run.candidates.map((c: { id: number }) => c.id);
  expect(candidateIds.length).toBeGreaterThanOrEqual(2);
}, 90_000);
afterAll(async () => {
  const { stopRunQueue } = await import('../../backend/src/runs/run-queue');
  await stopRunQueue();
});

/** A new chemist of the demo workspace (through an invitation), so the shared demo accounts keep their roles. */
async function newChemist(): Promise<{ id: number; email: string; token: string }> {
  const email = uniqueEmail('chemist-then-reviewer');
  await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'Casey Crossover', role: 'chemist' });
  const token = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));
  const accepted = await request(h.app).post('/api/invitations/accept').send({ token, name: 'Casey Crossover', password: 'crossover-password-1' });
  expect(accepted.status).toBe(201);
  return { id: accepted.body.user.id, email, token: accepted.body.token };
}

async function toRegulatoryReview(candidateId: number, chemistToken: string) {
  const designer = await h.token(demo.designer);
  expect((await request(h.app).post(`/api/candidates/${candidateId}/shortlist`).set(bearer(designer)).send({ shortlisted: true })).status).toBe(200);
  expect((await request(h.app).post(`/api/candidates/${candidateId}/submit`).set(bearer(designer)).send({ comment: 'for review' })).status).toBe(200);
  const chem = await request(h.app).post(`/api/candidates/${candidateId}/reviews`).set(bearer(chemistToken)).send({ stage: 'chemistry', verdict: 'approved', checklist: CHEMISTRY_OK, comment: '' });
  expect(chem.status).toBe(201);
  expect(chem.body.status.state).toBe('in-regulatory-review');
}

async function setRole(userId: number, role: string) {
  const admin = await h.token(demo.admin);
  const users = (await request(h.app).get('/api/users').set(bearer(admin))).body.items as { id: number; version: number }[];
  const version = users.find((u) => u.id === userId)!.version;
  const res = await request(h.app).patch(`/api/users/${userId}`).set(bearer(admin)).send({ role, version });
  expect(res.status).toBe(200);
}

describe('separation of duties', () => {
  it('a chemist made reviewer cannot give the regulatory sign-off of a revision they approved in chemistry; another reviewer can', async () => {
    const casey = await newChemist();
    const id = candidateIds[0]!;
    await toRegulatoryReview(id, casey.token);
    await setRole(casey.id, 'reviewer');

    const second = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(casey.token)).send({ stage: 'regulatory', verdict: 'approved', checklist: REGULATORY_OK, comment: '' });
    expect(second.status).toBe(403);
    expect(second.body.error.code).toBe('separation_of_duties');
    expect(second.body.error.message).toMatch(/You made the chemistry decision on revision 1 of this candidate/);
    expect(second.body.error.message).toMatch(/another reviewer/);
    // Nothing changed: still waiting for the regulatory decision, and no review was stored.
    const history = await request(h.app).get(`/api/candidates/${id}/reviews`).set(bearer(casey.token));
    expect(history.body.status.state).toBe('in-regulatory-review');
    expect(history.body.reviews.filter((r: { stage: string }) => r.stage === 'regulatory')).toHaveLength(0);

    // Refusing or requesting changes is a regulatory decision too.
    for (const verdict of ['rejected', 'changes-requested']) {
      const res = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(casey.token)).send({ stage: 'regulatory', verdict, checklist: REGULATORY_OK, comment: 'not mine to decide' });
      expect(res.status).toBe(403);
    }

    const other = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(await h.token(demo.reviewer))).send({ stage: 'regulatory', verdict: 'approved', checklist: REGULATORY_OK, comment: '' });
    expect(other.status).toBe(201);
    expect(other.body.status.state).toBe('approved');
  });

  it('the same person may give the regulatory decision on a revision whose chemistry someone else decided', async () => {
    const casey = await newChemist();
    await setRole(casey.id, 'reviewer');
    const id = candidateIds[1]!;
    await toRegulatoryReview(id, await h.token(demo.chemist));
    const res = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(casey.token)).send({ stage: 'regulatory', verdict: 'approved', checklist: REGULATORY_OK, comment: '' });
    expect(res.status).toBe(201);
  });

  it('a role change is audited: who, whose, from and to, and the decisions given so far', async () => {
    const casey = await newChemist();
    await setRole(casey.id, 'reviewer');
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const { UserRecord } = await import('../../backend/src/users/user.model');
    const admin = await UserRecord.findOne({ where: { email: demo.admin } });
    const events = await AuditEventRecord.findAll({ where: { action: 'user.role_change', entityType: 'user', entityId: String(casey.id) } });
    expect(events).toHaveLength(1);
    expect(events[0]!.actorId).toBe(admin!.id);
    expect(events[0]!.detail).toEqual({ email: casey.email, from: 'chemist', to: 'reviewer', reviewDecisionsSoFar: 0 });
    // A change that leaves the role as it is (disabling) adds no role-change entry.
    const users = (await request(h.app).get('/api/users').set(bearer(await h.token(demo.admin)))).body.items as { id: number; version: number }[];
    await request(h.app).patch(`/api/users/${casey.id}`).set(bearer(await h.token(demo.admin))).send({ disabled: true, version: users.find((u) => u.id === casey.id)!.version });
    expect(await AuditEventRecord.count({ where: { action: 'user.role_change', entityId: String(casey.id) } })).toBe(1);
  });
});
