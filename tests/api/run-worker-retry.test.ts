// A worker that dies mid-run: its job expires, another worker retries it, and the run ends
// with each set's candidate stored once. Real processes: `scripts/worker.ts` is started and
// killed with SIGKILL.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { useHarness } from './support/harness';

// The job is taken as lost once it has run this long without finishing; a run of the library
// below takes a few seconds, so a live worker always finishes well inside it.
process.env.RUN_EXPIRE_SECONDS = '15';
process.env.RUN_MAINTENANCE_SECONDS = '1';
// A queue of its own, so the workers of other test files cannot take this run.
process.env.RUN_QUEUE = `retry-test-${process.pid}`;

const h = useHarness();
const workers: ChildProcess[] = [];
const root = path.resolve(import.meta.dirname, '..', '..');

function startWorker(): ChildProcess {
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
  return child;
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

async function waitFor<T>(what: string, probe: () => Promise<T | null>, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== null) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('a worker killed mid-run', () => {
  it('leaves the job to be retried by another worker, with no duplicate candidates', async () => {
    const { Workspace } = await import('../../backend/src/workspaces/workspace.model');
    const { UserRecord } = await import('../../backend/src/users/user.model');
    const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
    const { hashPassword } = await import('../../backend/src/auth/passwords');
    const { RunRecord } = await import('../../backend/src/runs/run.model');
    const { CandidateRecord } = await import('../../backend/src/candidates/candidate.model');

    // A workspace of its own with a large library (grades of the demo's dissolving salts), so a
    // three-active run takes long enough to be interrupted.
    const slug = `retry-${Date.now().toString(36)}`;
    const ws = await Workspace.create({ slug, name: 'Retry test workspace', currency: 'EUR' });
    const email = `designer-${slug}@example.test`;
    await UserRecord.create({ workspaceId: ws.id, email, name: 'Retry Designer', role: 'designer', passwordHash: await hashPassword('retry-password-1') });
    const demo = await Workspace.findOne({ where: { slug: 'demo' } });
    const demoIngredients = await IngredientRecord.findAll({ where: { workspaceId: demo!.id } });
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

    const first = startWorker();
    const runId = (await request(h.app).post(`/api/briefs/${brief.body.brief.id}/runs`).set('Authorization', `Bearer ${token}`)).body.runId as number;
    // Kill the first worker once it is visibly part-way through.
    await waitFor('progress from the first worker', async () => {
      const run = await RunRecord.findByPk(runId, { attributes: ['status', 'progressDone', 'progressTotal'] });
      return run && run.status === 'running' && run.progressDone > 0 && run.progressDone < run.progressTotal ? run : null;
    }, 60_000);
    killGroup(first);
    await new Promise((r) => setTimeout(r, 300));
    const interrupted = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts'] });
    expect(interrupted!.status).toBe('running');
    expect(interrupted!.attempts).toBe(1);

    startWorker();
    const finished = await waitFor('the retried run to finish', async () => {
      const run = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts', 'error'] });
      return run && !['queued', 'running'].includes(run.status) ? run : null;
    }, 120_000);
    expect(finished.error).toBeNull();
    expect(finished.status).toBe('succeeded');
    // Retried at least once (on a loaded machine a slow retry may itself expire and run again).
    expect(finished.attempts).toBeGreaterThanOrEqual(2);

    const candidates = await CandidateRecord.findAll({ where: { runId }, attributes: ['setKey'] });
    expect(candidates.length).toBeGreaterThan(0);
    expect(new Set(candidates.map((c) => c.setKey)).size).toBe(candidates.length);
  }, 180_000);
});
