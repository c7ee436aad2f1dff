// A worker that dies mid-run: it stops writing the run's heartbeat, the sweeper of a surviving
// worker re-queues the run within a minute, that worker continues it, and the run ends with each
// set's candidate stored once. Real processes: `scripts/worker.ts` is started and killed with
// SIGKILL. Then the sweeper's rules on their own: a lost run on its last attempt is failed with
// the reason, and concurrent sweepers re-queue a lost run once.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, useHarness } from './support/harness';

// pg-boss's own expiry of a job (10 minutes by default) is far beyond this test's deadline: the
// run must continue through the heartbeat and the sweeper alone. Heartbeat, staleness and sweep
// keep their defaults (5 s, 30 s, 10 s), so the time measured is the one users get.
process.env.RUN_EXPIRE_SECONDS = '600';
// A queue of its own, so the workers of other test files cannot take this run.
process.env.RUN_QUEUE = `retry-test-${process.pid}`;

const h = useHarness();
const workers: ChildProcess[] = [];
const root = path.resolve(import.meta.dirname, '..', '..');

/** Starts `npm run worker` (scripts/worker.ts) and resolves once it serves the queue. */
function startWorker(): Promise<ChildProcess> {
  // One node process with the TypeScript loader (the tsx CLI would add a child process).
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'scripts', 'worker.ts')], {
    cwd: root,
    env: { ...process.env, RUN_POLLING_SECONDS: '0.5' },
    stdio: ['ignore', 'pipe', 'pipe'],
    // Its own process group, so SIGKILL reaches tsx's node child as well.
    detached: true,
  });
  child.stderr?.on('data', (d) => process.stderr.write(`[worker ${child.pid}] ${d}`));
  workers.push(child);
  return new Promise((resolve, reject) => {
    let out = '';
    child.stdout?.on('data', (d) => {
      out += String(d);
      if (out.includes('serving optimisation runs')) resolve(child);
    });
    child.once('exit', (code) => reject(new Error(`worker exited with ${code} before serving: ${out}`)));
  });
}

function killGroup(child: ChildProcess) {
  try {
    process.kill(-child.pid!, 'SIGKILL');
  } catch {
    // already gone
  }
}

afterAll(() => {
  for (const w of workers) killGroup(w);
});

async function waitFor<T>(what: string, probe: () => Promise<T | null>, timeoutMs: number, state?: () => Promise<unknown>): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== null) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}${state ? `; now: ${JSON.stringify(await state())}` : ''}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** A workspace of its own with a large library and a three-active brief; answers a token and the brief id. */
async function setUpLongBrief(): Promise<{ token: string; briefId: number }> {
  const { Workspace } = await import('../../backend/src/workspaces/workspace.model');
  const { UserRecord } = await import('../../backend/src/users/user.model');
  const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
  const { hashPassword } = await import('../../backend/src/auth/passwords');

  // A workspace of its own with a large library (grades of the demo's dissolving salts), so a
  // three-active run takes long enough to be interrupted.
  const slug = `retry-${Date.now().toString(36)}`;
  const ws = await Workspace.create({ slug, name: 'Retry test workspace', currency: 'EUR' });
  const email = `designer-${slug}@example.test`;
  await UserRecord.create({ workspaceId: ws.id, email, name: 'Retry Designer', role: 'designer', passwordHash: await hashPassword('retry-password-1') });
  const demoWs = await Workspace.findOne({ where: { slug: 'demo' } });
  const demoIngredients = await IngredientRecord.findAll({ where: { workspaceId: demoWs!.id } });
  const dissolving = demoIngredients.filter((i) => i.role === 'active' && i.process?.kind === 'dissolution');
  const water = demoIngredients.find((i) => i.role === 'solvent')!;
  const grades = ['A', 'B', 'C'];
  const rows = [water, ...dissolving.flatMap((i) => grades.map((g) => ({ ...i.get(), grade: `${i.grade} ${g}`, costPerKg: String(Number(i.costPerKg) * (1 + grades.indexOf(g) * 0.05)) })))];
  await IngredientRecord.bulkCreate(rows.map((r) => {
    const { id: _id, createdAt: _c, updatedAt: _u, deletedAt: _d, ...values } = 'get' in r ? (r as typeof water).get() : r;
    return { ...values, workspaceId: ws.id };
  }));

  const login = await request(h.app).post('/api/auth/login').send({ email, password: 'retry-password-1' });
  const token = login.body.token as string;
  const brief = await request(h.app)
    .post('/api/briefs')
    .set('Authorization', `Bearer ${token}`)
    .send({ name: 'Retry brief', packType: 'cold', targetTempC: 5, holdMin: 15, maxMassG: 300, maxActives: 3, contact: 'still-air' });
  expect(brief.status).toBe(201);
  return { token, briefId: brief.body.brief.id as number };
}

/** A run row made to look as if its worker died: running, its heartbeat a minute old. */
async function lostRun(attempts: number) {
  const { RunRecord } = await import('../../backend/src/runs/run.model');
  const { enqueueRun } = await import('../../backend/src/runs/run-queue');
  const demoWs = await (await import('../../backend/src/workspaces/workspace.model')).Workspace.findOne({ where: { slug: 'demo' } });
  const brief = await (await import('../../backend/src/briefs/brief.model')).BriefRecord.findOne({ where: { workspaceId: demoWs!.id } });
  const run = await RunRecord.create({
    workspaceId: demoWs!.id,
    briefId: brief!.id,
    briefVersion: brief!.version,
    briefSnapshot: brief!.spec,
    dataSnapshot: { ingredients: [], chemistry: { species: [] } } as never,
    createdById: null,
    status: 'running',
    attempts,
    progressDone: 7,
    progressTotal: 20,
    startedAt: new Date(Date.now() - 120_000),
    queueName: process.env.RUN_QUEUE,
  });
  const jobId = await enqueueRun(run.id);
  await RunRecord.sequelize!.query(`UPDATE runs SET job_id = :jobId, heartbeat_at = now() - interval '1 minute' WHERE id = :id`, { replacements: { jobId, id: run.id } });
  return run.id;
}

/** Keeps a synthetic run from being executed by the workers started later in this file. */
async function retire(runId: number) {
  const { RunRecord } = await import('../../backend/src/runs/run.model');
  const { cancelRunJob } = await import('../../backend/src/runs/run-queue');
  const run = await RunRecord.findByPk(runId, { attributes: ['id', 'jobId'] });
  await RunRecord.update({ status: 'cancelled' }, { where: { id: runId } });
  if (run?.jobId) await cancelRunJob(run.jobId);
}

describe('the lost-run sweeper', () => {
  it('fails a lost run on its last attempt, with the reason in words, and the run answers so', async () => {
    const { sweepLostRuns, maxRunAttempts } = await import('../../backend/src/runs/run-sweeper');
    const { config } = await import('../../backend/src/config');
    const runId = await lostRun(maxRunAttempts());
    const swept = await sweepLostRuns();
    expect(swept.failed).toContain(runId);
    expect(swept.requeued).not.toContain(runId);
    const res = await request(h.app).get(`/api/runs/${runId}`).set('Authorization', `Bearer ${await h.token(demo.designer)}`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('failed');
    expect(res.body.error).toBe(`Its worker stopped responding (no heartbeat for ${config.runs.staleSeconds} s) on attempt ${maxRunAttempts()} of ${maxRunAttempts()}, the last one allowed, so the run was stopped.`);
    expect(res.body.interruptions).toBe(1);
    expect(res.body.finishedAt).not.toBeNull();
    await retire(runId);
  });

  it('re-queues a lost run with attempts left exactly once, however many sweepers run at the same time', async () => {
    const { sweepLostRuns } = await import('../../backend/src/runs/run-sweeper');
    const { RunRecord } = await import('../../backend/src/runs/run.model');
    const { getBoss, RUN_QUEUE } = await import('../../backend/src/runs/run-queue');
    const runId = await lostRun(1);
    const oldJobId = (await RunRecord.findByPk(runId, { attributes: ['jobId'] }))!.jobId!;
    const results = await Promise.all(Array.from({ length: 4 }, () => sweepLostRuns()));
    expect(results.filter((r) => r.requeued.includes(runId))).toHaveLength(1);
    const run = await RunRecord.findByPk(runId);
    expect(run!.status).toBe('queued');
    expect(run!.interruptions).toBe(1);
    expect(run!.heartbeatAt).toBeNull();
    expect(run!.jobId).not.toBe(oldJobId);
    const boss = await getBoss();
    expect((await boss.getJobById(RUN_QUEUE, oldJobId))?.state).toBe('cancelled');
    expect((await boss.getJobById(RUN_QUEUE, run!.jobId!))?.state).toBe('created');
    // And the screen's fields: queued again, attempt 2 of 3 next.
    const res = await request(h.app).get(`/api/runs/${runId}`).set('Authorization', `Bearer ${await h.token(demo.designer)}`);
    expect(res.body).toMatchObject({ status: 'queued', attempts: 1, maxAttempts: 3, interruptions: 1, error: null });
    await retire(runId);
  });
});

describe('a worker killed mid-run', () => {
  it('is noticed by a surviving worker, which continues the run within a minute, with no duplicate candidates', async () => {
    const { RunRecord } = await import('../../backend/src/runs/run.model');
    const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');
    const { token, briefId } = await setUpLongBrief();

    // Two workers serve the queue; one takes the run, the other is idle until the first dies.
    const pair = await Promise.all([startWorker(), startWorker()]);
    const runId = (await request(h.app).post(`/api/briefs/${briefId}/runs`).set('Authorization', `Bearer ${token}`)).body.runId as number;
    // Kill the worker that took the run once it is visibly part-way through.
    const startedAt = Date.now();
    const before = await waitFor('progress from the first worker', async () => {
      const run = await RunRecord.findByPk(runId, { attributes: ['status', 'progressDone', 'progressTotal', 'workerId', 'attempts'] });
      return run && run.status === 'running' && run.progressDone > 0 && run.progressDone < run.progressTotal ? run : null;
    }, 60_000);
    const victim = pair.find((w) => before.workerId?.endsWith(`:${w.pid}`));
    const survivor = pair.find((w) => w !== victim)!;
    expect(victim, `the run names its worker (${before.workerId})`).toBeDefined();
    killGroup(victim!);
    const killedAt = Date.now();
    console.log(`[worker-kill] killed the worker at ${before.progressDone} / ${before.progressTotal} sets, ${((killedAt - startedAt) / 1000).toFixed(1)} s after the run was sent`);
    await new Promise((r) => setTimeout(r, 300));
    const interrupted = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts'] });
    expect(interrupted!.status).toBe('running');
    expect(interrupted!.attempts).toBe(1);

    // Continuing: the second attempt, on the surviving worker, solving sets again.
    await waitFor('the run to continue on the surviving worker', async () => {
      const run = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts', 'workerId', 'progressDone'] });
      return run && run.attempts >= 2 && run.workerId?.endsWith(`:${survivor.pid}`) && (run.status !== 'running' || run.progressDone > 0) ? run : null;
    }, 90_000);
    const continuedAfterS = (Date.now() - killedAt) / 1000;
    console.log(`[worker-kill] the run continued ${continuedAfterS.toFixed(1)} s after its worker was killed with SIGKILL`);
    expect(continuedAfterS).toBeLessThan(60);

    const state = () => RunRecord.findByPk(runId, { attributes: ['status', 'attempts', 'progressDone', 'progressTotal', 'workerId', 'heartbeatAt', 'interruptions', 'error'], raw: true });
    // 18 000 sets of three actives: a few seconds on an idle machine, minutes on a loaded one.
    const finished = await waitFor('the continued run to finish', async () => {
      const run = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts', 'error', 'interruptions'] });
      return run && !['queued', 'running'].includes(run.status) ? run : null;
    }, 420_000, state);
    expect(finished.error).toBeNull();
    expect(finished.status).toBe('succeeded');
    expect(finished.attempts).toBe(2);
    expect(finished.interruptions).toBe(1);

    const candidates = await CandidateRecord.findAll({ where: { runId }, attributes: ['setKey'] });
    expect(candidates.length).toBeGreaterThan(0);
    expect(new Set(candidates.map((c) => c.setKey)).size).toBe(candidates.length);
  }, 600_000);
});
