import { Worker } from 'node:worker_threads';
import { sequelize } from '../db/sequelize';
import { CandidateRecord } from '../candidates/candidate.model';
import { RunRecord } from './run.model';
import type { OptimiseThreadInput, OptimiseThreadMessage } from './optimise-thread.types';

const CANCEL_POLL_MS = 300;
const PROGRESS_WRITE_MS = 250;

/**
 * Executes one queued run (the pg-boss job handler). Safe to repeat: a run that already
 * finished is left alone, and candidates are written once, in one transaction, keyed by
 * (run, set), so a job retried after its worker died adds no duplicates.
 */
export async function executeRun(runId: number): Promise<void> {
  const run = await RunRecord.findByPk(runId);
  if (!run || run.status === 'succeeded' || run.status === 'cancelled' || run.status === 'failed') return;
  await run.update({ status: 'running', attempts: run.attempts + 1, startedAt: run.startedAt ?? new Date(), error: null });

  const input: OptimiseThreadInput = { brief: run.briefSnapshot, ingredients: run.dataSnapshot.ingredients, chemistry: run.dataSnapshot.chemistry, calibrations: run.dataSnapshot.calibrations ?? null };
  const worker = new Worker(new URL('./optimise-thread-boot.mjs', import.meta.url), { workerData: input });
  let lastProgressWrite = 0;
  let cancelled = false;

  const outcome = await new Promise<OptimiseThreadMessage | { type: 'cancelled' }>((resolve) => {
    const poll = setInterval(async () => {
      const current = await RunRecord.findByPk(runId, { attributes: ['status'] }).catch(() => null);
      if (current?.status === 'cancelled') {
        cancelled = true;
        clearInterval(poll);
        await worker.terminate();
        resolve({ type: 'cancelled' });
      }
    }, CANCEL_POLL_MS);
    worker.on('message', (message: OptimiseThreadMessage) => {
      if (message.type === 'progress') {
        const now = Date.now();
        if (message.done === message.total || now - lastProgressWrite > PROGRESS_WRITE_MS) {
          lastProgressWrite = now;
          void RunRecord.update({ progressDone: message.done, progressTotal: message.total }, { where: { id: runId, status: 'running' } }).catch(() => undefined);
        }
        return;
      }
      clearInterval(poll);
      resolve(message);
    });
    worker.on('error', (error) => {
      clearInterval(poll);
      resolve({ type: 'error', message: error.message });
    });
    worker.on('exit', (code) => {
      clearInterval(poll);
      if (!cancelled) resolve({ type: 'error', message: `the optimisation stopped unexpectedly (exit code ${code})` });
    });
  });
  await worker.terminate().catch(() => undefined);

  if (outcome.type === 'cancelled') return;
  if (outcome.type === 'error' || outcome.type === 'progress') {
    await RunRecord.update(
      { status: 'failed', error: outcome.type === 'error' ? outcome.message : 'no result', finishedAt: new Date() },
      { where: { id: runId, status: 'running' } },
    );
    return;
  }

  const { candidates, ...rest } = outcome.result;
  await sequelize.transaction(async (transaction) => {
    const current = await RunRecord.findByPk(runId, { transaction, lock: transaction.LOCK.UPDATE, attributes: { exclude: ['dataSnapshot', 'briefSnapshot', 'result'] } });
    if (!current || current.status !== 'running') return; // cancelled while the last sets were solved
    await CandidateRecord.bulkCreate(
      candidates.map((c) => ({
        workspaceId: run.workspaceId,
        runId,
        briefId: run.briefId,
        setKey: c.setIds.join('+'),
        rank: c.rank,
        pareto: c.pareto,
        verificationStatus: c.verification.status,
        data: c,
      })),
      { transaction, ignoreDuplicates: true },
    );
    await current.update(
      {
        status: 'succeeded',
        result: rest,
        progressDone: rest.stats.setsEnumerated,
        progressTotal: rest.stats.setsEnumerated,
        timings: { optimiseMs: Math.round(outcome.elapsedMs) },
        finishedAt: new Date(),
      },
      { transaction },
    );
  });
}
