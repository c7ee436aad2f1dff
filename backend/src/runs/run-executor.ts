import { sequelize } from '../db/sequelize';
import { CandidateRecord } from '../candidates/candidate.model';
import { RunRecord } from './run.model';
import { optimiseOnThread } from './optimise-pool';
import type { OptimiseThreadInput } from './optimise-thread.types';

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
  let lastProgressWrite = 0;
  const handle = optimiseOnThread(runId, input, (done, total) => {
    const now = Date.now();
    if (done === total || now - lastProgressWrite > PROGRESS_WRITE_MS) {
      lastProgressWrite = now;
      void RunRecord.update({ progressDone: done, progressTotal: total }, { where: { id: runId, status: 'running' } }).catch(() => undefined);
    }
  });
  // A cancel (the run's status turned `cancelled`) stops the thread; the next run gets a new one.
  const poll = setInterval(async () => {
    const current = await RunRecord.findByPk(runId, { attributes: ['status'] }).catch(() => null);
    if (current?.status === 'cancelled') await handle.cancel();
  }, CANCEL_POLL_MS);
  const outcome = await handle.outcome.finally(() => clearInterval(poll));

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
        progressDone: rest.stats.steps ?? rest.stats.setsEnumerated,
        progressTotal: rest.stats.steps ?? rest.stats.setsEnumerated,
        timings: { optimiseMs: Math.round(outcome.elapsedMs) },
        finishedAt: new Date(),
      },
      { transaction },
    );
  });
}
