import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { REVIEW_STATES, nextState, reviewAction, type ReviewAction, type ReviewState } from '../../shared/src/reviews/state-machine';
import { demo, harbour, runBriefToEnd, useHarness, type Harness } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });
const ROLES = ['designer', 'chemist', 'reviewer', 'admin'] as const;

const CHEMISTRY_OK = { dataSourcesChecked: true, modelValidInRegime: true, labLog: { waivedReason: 'a lab log of this family exists (API test)' } };
const REGULATORY_OK = { classificationChecked: true, labelElementsChecked: true, cautionsChecked: true, regulatoryFlagsChecked: true };

/** The brief of the designer's story: at most 5 °C within 3 min, held 15 min, ≤ 200 g, ≤ 0.60 a unit. */
const sideline = { name: `Sideline cold compress (reviews API test ${Date.now().toString(36)})`, packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' };

let base: { id: number; runId: number; composition: { ingredientId: string; massG: number; role: string }[] };
let cloneCount = 0;

beforeAll(async () => {
  const { startRunWorker } = await import('../../backend/src/runs/run-queue');
  const { executeRun } = await import('../../backend/src/runs/run-executor');
  await startRunWorker(({ runId }) => executeRun(runId));
  const token = await h.token(demo.designer);
  const { runId, run } = await runBriefToEnd(h, token, sideline, 60_000);
  expect(run.status).toBe('succeeded');
  expect(run.candidates.length).toBeGreaterThan(0);
  const first = run.candidates[0];
  base = { id: first.id, runId, composition: first.composition };
}, 90_000);
afterAll(async () => {
  const { stopRunQueue } = await import('../../backend/src/runs/run-queue');
  await stopRunQueue();
});

/**
 * A new candidate of the test run in the given state: the optimiser's first answer copied under a
 * distinct set key (a fixture for the matrix; the path tests below go through the API only).
 */
async function candidateIn(state: ReviewState): Promise<number> {
  const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
  const { UserRecord } = await import('../../backend/src/users/user.model');
  const src = (await CandidateRecord.findByPk(base.id))!;
  const designer = (await UserRecord.findOne({ where: { email: demo.designer } }))!;
  const submitted = !['proposed', 'shortlisted'].includes(state);
  const row = await CandidateRecord.create({
    workspaceId: src.workspaceId,
    runId: src.runId,
    briefId: src.briefId,
    setKey: `${src.setKey}#fixture-${++cloneCount}-${Math.random().toString(36).slice(2, 8)}`,
    rank: src.rank,
    pareto: false,
    verificationStatus: src.verificationStatus,
    state,
    data: src.data,
    submittedAt: submitted ? new Date() : null,
    submittedById: submitted ? designer.id : null,
  });
  return row.id;
}

async function stateOf(id: number): Promise<string> {
  const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
  return (await CandidateRecord.findByPk(id))!.state;
}

type ApiAction = Exclude<ReviewAction, 'shortlist' | 'unshortlist'>;
const API_ACTIONS: ApiAction[] = ['submit', 'chemistry-approve', 'chemistry-request-changes', 'chemistry-reject', 'regulatory-approve', 'regulatory-request-changes', 'regulatory-reject', 'revise'];

function call(action: ApiAction, id: number, token: string) {
  const r = request(h.app);
  if (action === 'submit') return r.post(`/api/candidates/${id}/submit`).set(bearer(token)).send({});
  if (action === 'revise') return r.post(`/api/candidates/${id}/revise`).set(bearer(token)).send({ composition: base.composition.map((c) => ({ ingredientId: Number(c.ingredientId), massG: c.massG })), comment: 'matrix' });
  const [stage, ...rest] = action.split('-');
  const verdict = rest.join('-') === 'approve' ? 'approved' : rest.join('-') === 'request-changes' ? 'changes-requested' : 'rejected';
  const checklist = stage === 'chemistry' ? CHEMISTRY_OK : REGULATORY_OK;
  return r.post(`/api/candidates/${id}/reviews`).set(bearer(token)).send({ stage, verdict, checklist, comment: verdict === 'approved' ? '' : 'matrix comment' });
}

/** Polls the sink for a message to the address that links to the candidate. */
async function mailAbout(hh: Harness, email: string, candidateId: number, timeoutMs = 8000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await hh.mailFor(email)).find((m) => m.text.includes(`/candidates/${candidateId}\n`) || m.text.endsWith(`/candidates/${candidateId}`) || m.text.includes(`/candidates/${candidateId} `) || new RegExp(`/candidates/${candidateId}(\\s|$)`).test(m.text));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${email} about candidate ${candidateId}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function noMailAbout(hh: Harness, email: string, candidateId: number) {
  await new Promise((r) => setTimeout(r, 500));
  return (await hh.mailFor(email)).filter((m) => new RegExp(`/candidates/${candidateId}(\\s|$)`).test(m.text)).length;
}

describe('the review state machine through the API: every transition × every role × every state', () => {
  it(
    'each call answers as the state table says: 2xx and the new state when legal, 403 for a wrong role, 409 for a wrong state',
    async () => {
      const tokens = Object.fromEntries(await Promise.all(ROLES.map(async (r) => [r, await h.token(demo[r])] as const)));
      const failures: string[] = [];
      for (const state of REVIEW_STATES) {
        for (const action of API_ACTIONS) {
          for (const role of ROLES) {
            const id = await candidateIn(state);
            const res = await call(action, id, tokens[role]!);
            const expected = nextState(state, action, role);
            const after = await stateOf(id);
            if ('to' in expected) {
              const okStatus = action === 'submit' ? 200 : 201;
              if (res.status !== okStatus) failures.push(`${action} by ${role} from ${state}: ${res.status} ${JSON.stringify(res.body)}`);
              if (action === 'revise') {
                // The old version keeps its state; the new one starts where the table says.
                if (after !== state || res.body.candidate?.state !== expected.to) failures.push(`revise by ${role}: old ${after}, new ${res.body.candidate?.state}`);
              } else if (after !== expected.to) failures.push(`${action} by ${role} from ${state}: state ${after}, expected ${expected.to}`);
            } else {
              const code = expected.error === 'forbidden' ? 403 : 409;
              if (res.status !== code) failures.push(`${action} by ${role} from ${state}: ${res.status}, expected ${code}`);
              if (after !== state) failures.push(`${action} by ${role} from ${state}: refused but the state became ${after}`);
            }
          }
        }
      }
      expect(failures).toEqual([]);
    },
    180_000,
  );

  it('no session answers 401', async () => {
    const id = await candidateIn('shortlisted');
    expect((await request(h.app).post(`/api/candidates/${id}/submit`).send({})).status).toBe(401);
    expect((await request(h.app).get(`/api/candidates/${id}/reviews`)).status).toBe(401);
    expect((await request(h.app).get(`/api/candidates/${id}/dossier`)).status).toBe(401);
  });
});

describe('decisions need a comment unless approved, and an approval needs its checklist', () => {
  it('changes requested or rejected without a comment answers 400 naming the comment, and nothing changes', async () => {
    const id = await candidateIn('in-chemistry-review');
    const token = await h.token(demo.chemist);
    for (const verdict of ['changes-requested', 'rejected']) {
      const res = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(token)).send({ stage: 'chemistry', verdict, checklist: {}, comment: '   ' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('comment');
    }
    expect(await stateOf(id)).toBe('in-chemistry-review');
  });

  it('a chemistry approval needs data sources checked, the model valid in this regime, and a lab log attached or waived with a reason', async () => {
    const id = await candidateIn('in-chemistry-review');
    const token = await h.token(demo.chemist);
    const send = (checklist: unknown) => request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(token)).send({ stage: 'chemistry', verdict: 'approved', checklist });
    const empty = await send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.map((f: { field: string }) => f.field).sort()).toEqual(['checklist.dataSourcesChecked', 'checklist.labLog', 'checklist.modelValidInRegime']);
    const notAttached = await send({ dataSourcesChecked: true, modelValidInRegime: true, labLog: { attached: false } });
    expect(notAttached.status).toBe(400);
    expect(notAttached.body.error.fields[0].field).toBe('checklist.labLog');
    const emptyWaiver = await send({ dataSourcesChecked: true, modelValidInRegime: true, labLog: { waivedReason: '  ' } });
    expect(emptyWaiver.status).toBe(400);
    expect(await stateOf(id)).toBe('in-chemistry-review');
    const attached = await send({ dataSourcesChecked: true, modelValidInRegime: true, labLog: { attached: true } });
    expect(attached.status).toBe(201);
    expect(attached.body.review).toMatchObject({ stage: 'chemistry', verdict: 'approved', checklist: { labLog: { attached: true } } });
    expect(await stateOf(id)).toBe('in-regulatory-review');
  });

  it('a regulatory approval needs classification, label elements, cautions and regulatory flags checked', async () => {
    const id = await candidateIn('in-regulatory-review');
    const token = await h.token(demo.reviewer);
    const partial = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(token)).send({ stage: 'regulatory', verdict: 'approved', checklist: { classificationChecked: true } });
    expect(partial.status).toBe(400);
    expect(partial.body.error.fields.map((f: { field: string }) => f.field).sort()).toEqual(['checklist.cautionsChecked', 'checklist.labelElementsChecked', 'checklist.regulatoryFlagsChecked']);
    const bad = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(token)).send({ stage: 'regulatory', verdict: 'maybe' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].field).toBe('verdict');
    expect(await stateOf(id)).toBe('in-regulatory-review');
  });
});

describe('the whole path through the API: audit events, e-mails with working links, home lists, revision, dossier', () => {
  it('designer submits → chemist approves → reviewer requests changes → designer revises → both approve', async () => {
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const { appUrl } = await import('../../backend/src/app-url');
    const designer = await h.token(demo.designer);
    const chemist = await h.token(demo.chemist);
    const reviewer = await h.token(demo.reviewer);

    // Shortlist the run's first candidate through its own endpoint, then submit it.
    const shortlisted = await request(h.app).post(`/api/candidates/${base.id}/shortlist`).set(bearer(designer)).send({ shortlisted: true });
    expect(shortlisted.status).toBe(200);
    expect((await request(h.app).get(`/api/candidates/${base.id}/dossier`).set(bearer(designer))).status).toBe(409);
    const submitted = await request(h.app).post(`/api/candidates/${base.id}/submit`).set(bearer(designer)).send({ comment: 'ready for a look' });
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toMatchObject({ state: 'in-chemistry-review', revision: 1, submittedBy: 'Dana Designer' });

    // The chemists hear of it, with a link to the candidate that opens for them; the other workspace's chemist does not.
    const toChemist = await mailAbout(h, demo.chemist, base.id);
    expect(toChemist.subject).toMatch(/Chemistry review waiting/);
    const link = toChemist.text.match(/https?:\/\/\S+\/candidates\/\d+/)![0];
    expect(link).toBe(appUrl(`/candidates/${base.id}`));
    const linkedId = Number(new URL(link).pathname.split('/').pop());
    expect((await request(h.app).get(`/api/candidates/${linkedId}`).set(bearer(chemist))).status).toBe(200);
    expect(toChemist.html).toContain(`href="${link}"`);
    expect(await noMailAbout(h, harbour.chemist, base.id)).toBe(0);

    // The audit event says who, from → to and the comment.
    const audit = await AuditEventRecord.findOne({ where: { action: 'candidate.submit', entityId: String(base.id) } });
    expect(audit!.detail).toMatchObject({ from: 'shortlisted', to: 'in-chemistry-review', comment: 'ready for a look' });
    expect(audit!.actorId).not.toBeNull();

    // The chemist's home lists it; once submitted, the composition cannot change in place.
    const home = (await request(h.app).get('/api/home').set(bearer(chemist))).body;
    expect(home.waiting.map((w: { href: string }) => w.href)).toContain(`/candidates/${base.id}`);
    const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
    const row = (await CandidateRecord.findByPk(base.id))!;
    row.data = { ...row.data, composition: row.data.composition.map((c) => ({ ...c, massG: c.massG + 1 })) };
    await expect(row.save()).rejects.toThrow(/frozen/);

    const chem = await request(h.app).post(`/api/candidates/${base.id}/reviews`).set(bearer(chemist)).send({ stage: 'chemistry', verdict: 'approved', checklist: CHEMISTRY_OK });
    expect(chem.status).toBe(201);
    expect((await mailAbout(h, demo.reviewer, base.id)).subject).toMatch(/Regulatory review waiting/);
    expect((await request(h.app).get('/api/home').set(bearer(reviewer))).body.waiting.map((w: { href: string }) => w.href)).toContain(`/candidates/${base.id}`);

    const changes = await request(h.app).post(`/api/candidates/${base.id}/reviews`).set(bearer(reviewer)).send({ stage: 'regulatory', verdict: 'changes-requested', checklist: { classificationChecked: true }, comment: 'Less ammonium nitrate, please: stay under the precursor threshold.' });
    expect(changes.status).toBe(201);
    const toDesigner = await mailAbout(h, demo.designer, base.id);
    expect(toDesigner.subject).toMatch(/Changes requested/);
    expect(toDesigner.text).toContain('Less ammonium nitrate');
    expect((await request(h.app).get('/api/home').set(bearer(designer))).body.waiting.map((w: { href: string }) => w.href)).toContain(`/candidates/${base.id}`);
    const reviewAudit = await AuditEventRecord.findOne({ where: { action: 'candidate.review', entityId: String(base.id) }, order: [['id', 'DESC']] });
    expect(reviewAudit!.detail).toMatchObject({ from: 'in-regulatory-review', to: 'changes-requested', verdict: 'changes-requested', stage: 'regulatory' });

    // The designer revises: 10 % less of the first line, re-checked by the time model.
    const edited = base.composition.map((c, k) => ({ ingredientId: Number(c.ingredientId), massG: k === 0 ? Math.round(c.massG * 0.9 * 10) / 10 : c.massG }));
    const revised = await request(h.app).post(`/api/candidates/${base.id}/revise`).set(bearer(designer)).send({ composition: edited, comment: 'trimmed the first ingredient' });
    expect(revised.status).toBe(201);
    const v2 = revised.body.candidate;
    expect(revised.body.status).toMatchObject({ revision: 2, parentCandidateId: base.id, state: 'shortlisted' });
    expect(v2.composition.map((c: { massG: number }) => c.massG)).toEqual(edited.filter((e) => e.massG > 0).map((e) => e.massG));
    expect(v2.fillMassG).toBeCloseTo(edited.reduce((a, e) => a + e.massG, 0), 9);
    expect(['passed', 'missed', 'failed']).toContain(v2.verification.status);
    expect(await stateOf(base.id)).toBe('changes-requested');
    expect((await request(h.app).post(`/api/candidates/${base.id}/revise`).set(bearer(designer)).send({ composition: edited })).status).toBe(409);
    // Once revised, the old version no longer waits on the designer.
    expect((await request(h.app).get('/api/home').set(bearer(designer))).body.waiting.map((w: { href: string }) => w.href)).not.toContain(`/candidates/${base.id}`);

    expect((await request(h.app).post(`/api/candidates/${v2.id}/submit`).set(bearer(designer)).send({})).status).toBe(200);
    await mailAbout(h, demo.chemist, v2.id);
    expect((await request(h.app).post(`/api/candidates/${v2.id}/reviews`).set(bearer(chemist)).send({ stage: 'chemistry', verdict: 'approved', checklist: { ...CHEMISTRY_OK, labLog: { attached: true } } })).status).toBe(201);
    expect((await request(h.app).post(`/api/candidates/${v2.id}/reviews`).set(bearer(reviewer)).send({ stage: 'regulatory', verdict: 'approved', checklist: REGULATORY_OK })).status).toBe(201);
    expect((await mailAbout(h, demo.designer, v2.id)).subject).toMatch(/^Approved/);
    expect(await stateOf(v2.id)).toBe('approved');

    // The history of the new version carries the old version's decisions too, oldest first.
    const history = (await request(h.app).get(`/api/candidates/${v2.id}/reviews`).set(bearer(reviewer))).body;
    expect(history.events.map((e: { kind: string; revision: number; to: string }) => `${e.kind}:${e.revision}:${e.to}`)).toEqual([
      'submitted:1:in-chemistry-review',
      'review:1:in-regulatory-review',
      'review:1:changes-requested',
      'revised:1:shortlisted',
      'submitted:2:in-chemistry-review',
      'review:2:in-regulatory-review',
      'review:2:approved',
    ]);

    // The dossier: JSON with everything the page shows, and the PDF in A4 and Letter.
    const dossier = await request(h.app).get(`/api/candidates/${v2.id}/dossier`).set(bearer(designer));
    expect(dossier.status).toBe(200);
    expect(dossier.body.composition.length).toBe(v2.composition.length);
    expect(dossier.body.curve.length).toBeGreaterThan(10);
    expect(dossier.body.signOffs.map((s: { stage: string }) => s.stage)).toEqual(['chemistry', 'chemistry', 'regulatory']);
    expect(dossier.body.standingCaution).toMatch(/do not replace local codes/);
    expect(dossier.body.label).not.toBeNull();
    for (const n of dossier.body.hazardNotes) expect(['info', 'caution', 'warning', 'blocker']).toContain(n.severity);
    const hazards = await request(h.app).get(`/api/candidates/${v2.id}/hazards`).set(bearer(reviewer));
    expect(hazards.status).toBe(200);
    expect(hazards.body.hazards.notes).toEqual(dossier.body.hazardNotes);
    const a4 = await request(h.app).get(`/api/candidates/${v2.id}/dossier.pdf`).set(bearer(reviewer)).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(a4.status).toBe(200);
    expect(a4.headers['content-type']).toBe('application/pdf');
    const a4Text = (a4.body as Buffer).toString('latin1');
    expect(a4Text.startsWith('%PDF-')).toBe(true);
    // ISO 216: A4 is 210 × 297 mm = 595.28 × 841.89 pt (1 pt = 1/72 in = 0.3528 mm).
    expect(a4Text).toMatch(/\/MediaBox \[0 0 595\.28 841\.89\]/);
    const letter = await request(h.app).get(`/api/candidates/${v2.id}/dossier.pdf?paper=letter`).set(bearer(reviewer)).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    // ANSI/ASME Y14.1 Letter: 8.5 × 11 in = 612 × 792 pt.
    expect((letter.body as Buffer).toString('latin1')).toMatch(/\/MediaBox \[0 0 612 792\]/);

    // Another workspace sees none of it.
    const theirs = await h.token(harbour.designer);
    for (const path of [`/api/candidates/${v2.id}/dossier`, `/api/candidates/${v2.id}/dossier.pdf`, `/api/candidates/${v2.id}/reviews`]) {
      expect((await request(h.app).get(path).set(bearer(theirs))).status).toBe(404);
    }
    expect((await request(h.app).post(`/api/candidates/${v2.id}/submit`).set(bearer(theirs)).send({})).status).toBe(404);
    expect((await request(h.app).post(`/api/candidates/${v2.id}/reviews`).set(bearer(await h.token(harbour.chemist))).send({ stage: 'chemistry', verdict: 'approved', checklist: CHEMISTRY_OK })).status).toBe(404);
    const queue = (await request(h.app).get('/api/reviews').query({ queue: 'recent', pageSize: 200 }).set(bearer(theirs))).body;
    expect(queue.items.map((q: { candidateId: number }) => q.candidateId)).not.toContain(v2.id);
  }, 60_000);

  it('a rejected candidate mails its designer and keeps a dossier; a decision of the wrong stage is refused', async () => {
    const designer = await h.token(demo.designer);
    const chemist = await h.token(demo.chemist);
    const id = await candidateIn('shortlisted');
    await request(h.app).post(`/api/candidates/${id}/submit`).set(bearer(designer)).send({});
    expect((await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(await h.token(demo.reviewer))).send({ stage: 'regulatory', verdict: 'approved', checklist: REGULATORY_OK })).status).toBe(409);
    const rejected = await request(h.app).post(`/api/candidates/${id}/reviews`).set(bearer(chemist)).send({ stage: 'chemistry', verdict: 'rejected', comment: 'Outside the model: the solution freezes.' });
    expect(rejected.status).toBe(201);
    expect((await mailAbout(h, demo.designer, id)).subject).toMatch(/^Rejected/);
    expect((await request(h.app).get(`/api/candidates/${id}/dossier`).set(bearer(designer))).status).toBe(200);
    expect(reviewAction('chemistry', 'rejected')).toBe('chemistry-reject');
  });
});

describe('hazard data on ingredients', () => {
  const data = {
    classifications: [{ hazardClass: 'ox-sol', category: '3', hStatements: ['H272'] }],
    pictograms: ['GHS03'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 2950, dermalMgPerKg: null },
    solutionPH: 5.4,
    incompatibilityGroups: ['oxidiser'],
    regulatoryFlags: [{ code: 'un-2067', text: 'Ammonium nitrate based fertiliser (transport)' }],
    source: 'supplier safety data sheet of the demo scenario (invented), section 2',
  };

  async function newIngredient(): Promise<number> {
    const res = await request(h.app).post('/api/ingredients').set(bearer(await h.token(demo.chemist))).send({
      name: `Hazard test salt ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`,
      grade: 'API test',
      role: 'active',
      process: { kind: 'dissolution', solidKey: 'CO(NH2)2(cr)', ionsPerFormulaUnit: 1 },
      costPerKg: '0.85',
      sources: ['NBS 1982'],
    });
    expect(res.status).toBe(201);
    return res.body.ingredient.id;
  }

  it('everyone reads; chemists and admins write with the version they loaded; the change is audited before/after', async () => {
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const id = await newIngredient();
    const read = await request(h.app).get(`/api/ingredients/${id}/hazards`).set(bearer(await h.token(demo.reviewer)));
    expect(read.status).toBe(200);
    expect(read.body).toMatchObject({ hazardData: null, hazardVersion: 0 });
    for (const role of ['designer', 'reviewer'] as const) {
      expect((await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(await h.token(demo[role]))).send({ hazardData: data, version: 0 })).status).toBe(403);
    }
    const saved = await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(await h.token(demo.chemist))).send({ hazardData: data, version: 0 });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ hazardVersion: 1, hazardData: { signalWord: 'Warning', classifications: [{ hStatements: ['H272'] }] } });
    const stale = await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(await h.token(demo.admin))).send({ hazardData: { ...data, signalWord: 'Danger' }, version: 0 });
    expect(stale.status).toBe(409);
    const byAdmin = await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(await h.token(demo.admin))).send({ hazardData: { ...data, signalWord: 'Danger' }, version: 1 });
    expect(byAdmin.status).toBe(200);
    const events = await AuditEventRecord.findAll({ where: { action: 'ingredient.hazards.update', entityId: String(id) }, order: [['id', 'ASC']] });
    expect(events.length).toBe(2);
    expect(events[0]!.detail).toMatchObject({ before: { hazardData: null }, after: { hazardData: { signalWord: 'Warning' } } });
    expect(events[1]!.detail).toMatchObject({ before: { hazardData: { signalWord: 'Warning' } }, after: { hazardData: { signalWord: 'Danger' } } });
  });

  it('bad hazard data names the field; another workspace answers 404', async () => {
    const id = await newIngredient();
    const chemist = await h.token(demo.chemist);
    const bad = await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(chemist)).send({ hazardData: { ...data, classifications: [{ hazardClass: 'ox-sol', category: '3', hStatements: ['272'] }], source: '' }, version: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { field: string }) => f.field)).toEqual(expect.arrayContaining(['hazardData.classifications.0.hStatements.0', 'hazardData.source']));
    const theirs = await h.token(harbour.chemist);
    expect((await request(h.app).get(`/api/ingredients/${id}/hazards`).set(bearer(theirs))).status).toBe(404);
    expect((await request(h.app).put(`/api/ingredients/${id}/hazards`).set(bearer(theirs)).send({ hazardData: data, version: 0 })).status).toBe(404);
  });

  it('the H-statement texts are served by code', async () => {
    const res = await request(h.app).get('/api/hazards/h-statements').set(bearer(await h.token(demo.designer)));
    expect(res.status).toBe(200);
    // UN GHS Rev. 9, Annex 3, Table A3.1.1 (from memory): H272 "May intensify fire; oxidizer".
    expect(res.body.statements.find((s: { code: string }) => s.code === 'H272').text).toBe('May intensify fire; oxidizer');
  });
});

describe('the candidate curve is replayed on the server with the run’s data', () => {
  it('GET /api/candidates/:id/curve answers the curve the run verified, the band, and 401/404 outside the workspace', async () => {
    const designer = await h.token(demo.designer);
    const res = await request(h.app).get(`/api/candidates/${base.id}/curve`).set(bearer(designer));
    expect(res.status).toBe(200);
    expect(res.body.error).toBeNull();
    expect(res.body.curve.length).toBeGreaterThan(10);
    const candidate = (await request(h.app).get(`/api/candidates/${base.id}`).set(bearer(designer))).body.candidate;
    // The same evaluation core and the same snapshot as the run's verification: the same figures
    // within the verification's own time tolerance (0.05 min; the stored masses are rounded).
    if (candidate.verification.timeToTargetMin !== null) expect(Math.abs(res.body.timeToTargetMin - candidate.verification.timeToTargetMin)).toBeLessThan(0.05);
    expect(Math.abs(res.body.minutesInBand - candidate.verification.minutesInBand)).toBeLessThan(0.05);
    expect(res.body.band.maxC).toBeCloseTo(5 + 2, 9);
    expect((await request(h.app).get(`/api/candidates/${base.id}/curve`)).status).toBe(401);
    expect((await request(h.app).get(`/api/candidates/${base.id}/curve`).set(bearer(await h.token(harbour.designer)))).status).toBe(404);
  });
});
