import os from 'node:os';
import { QueryTypes } from 'sequelize';
import { config } from '../config';
import { sequelize } from '../db/sequelize';
import { CandidateRecord } from '../candidates/candidate.model';
import { RunRecord } from './run.model';
import { optimiseOnThread } from './optimise-pool';
import { maxRunAttempts, releaseRun } from './run-sweeper';
import type { OptimiseThreadInput } from './optimise-thread.types';

const CANCEL_POLL_MS = 300;
const PROGRESS_WRITE_MS = 250;
/** Names this process on the runs it executes. */
const WORKER_ID = `${os.hostname()}:${process.pid}`.slice(0, 120);

/**
 * Executes one queued run (the pg-boss job handler). Safe to repeat: the run is claimed in one
 * UPDATE (queued, or running with a stale heartbeat and attempts left), so two jobs for one run
 * never execute it together; a finished run is left alone. While it works the worker writes the
 * run's heartbeat (run-sweeper.ts re-queues a run whose heartbeat stops); if another worker has
 * taken the run meanwhile, this one stops and writes nothing. Candidates are written once, in one
 * transaction, keyed by (run, set), so a retried run adds no duplicates.
 */
export async function executeRun(runId: number): Promise<void> {
  const attempt = await claimRun(runId);
  if (attempt === null) return;
  try {
    await executeClaimed(runId, attempt);
  } catch (error) {
    // Our own failure (a database error while writing, say), not the optimiser's: hand the run
    // back for another attempt, or fail it with the reason when none is left. Should that fail
    // too, the heartbeat has stopped and the sweeper does it.
    const message = error instanceof Error ? error.message : String(error);
    await releaseRun(runId, attempt, `The worker failed while running it: ${message}`).catch(() => undefined);
  }
}

/** Takes the run for this worker; answers the attempt number, or null when it is not ours to run. */
async function claimRun(runId: number): Promise<number | null> {
  const rows = await sequelize.query<{ attempts: number }>(
    `UPDATE runs SET status = 'running', attempts = attempts + 1, started_at = COALESCE(started_at, now()),
       heartbeat_at = now(), worker_id = :workerId, queue_name = :queue, progress_done = 0, error = NULL, updated_at = now()
     WHERE id = :runId AND attempts < :maxAttempts
       AND (status = 'queued' OR (status = 'running' AND COALESCE(heartbeat_at, updated_at) < now() - make_interval(secs => :staleSeconds)))
     RETURNING attempts`,
    { replacements: { runId, workerId: WORKER_ID, queue: config.runs.queueName, maxAttempts: maxRunAttempts(), staleSeconds: config.runs.staleSeconds }, type: QueryTypes.SELECT },
  );
  return rows[0]?.attempts ?? null;
}

async function executeClaimed(runId: number, attempt: number): Promise<void> {
  const run = await RunRecord.findByPk(runId);
  if (!run) return;
  /** Rows this attempt may still write: the run is running and nobody took it over. */
  const ours = { id: runId, status: 'running', attempts: attempt } as const;

  const input: OptimiseThreadInput = { brief: run.briefSnapshot, ingredients: run.dataSnapshot.ingredients, chemistry: run.dataSnapshot.chemistry, calibrations: run.dataSnapshot.calibrations ?? null };
  let lastProgressWrite = 0;
  const handle = optimiseOnThread(runId, input, (done, total) => {
    const now = Date.now();
    if (done === total || now - lastProgressWrite > PROGRESS_WRITE_MS) {
      lastProgressWrite = now;
      void RunRecord.update({ progressDone: done, progressTotal: total }, { where: ours }).catch(() => undefined);
    }
  });
  // A cancel (the run's status turned `cancelled`), or the run taken over by another worker after
  // this one was taken for lost, stops the thread; the next run gets a new one.
  let lost = false;
  const poll = setInterval(async () => {
    const current = await RunRecord.findByPk(runId, { attributes: ['status', 'attempts'] }).catch(() => null);
    if (!current) return;
    if (current.status === 'cancelled') await handle.cancel();
    else if (current.status !== 'running' || current.attempts !== attempt) {
      lost = true;
      await handle.cancel();
    }
  }, CANCEL_POLL_MS);
  // The heartbeat, written with the database's clock (the sweeper compares with it).
  const heartbeat = setInterval(() => {
    void sequelize
      .query(`UPDATE runs SET heartbeat_at = now() WHERE id = :runId AND status = 'running' AND attempts = :attempt`, { replacements: { runId, attempt } })
      .catch(() => undefined);
  }, config.runs.heartbeatSeconds * 1000);
  const outcome = await handle.outcome.finally(() => {
    clearInterval(poll);
    clearInterval(heartbeat);
  });

  if (outcome.type === 'cancelled' || lost) return;
  if (outcome.type === 'error' || outcome.type === 'progress') {
    await RunRecord.update(
      { status: 'failed', error: outcome.type === 'error' ? outcome.message : 'no result', finishedAt: new Date(), heartbeatAt: null },
      { where: ours },
    );
    return;
  }

  const { candidates, ...rest } = outcome.result;
  await sequelize.transaction(async (transaction) => {
    const current = await RunRecord.findByPk(runId, { transaction, lock: transaction.LOCK.UPDATE, attributes: { exclude: ['dataSnapshot', 'briefSnapshot', 'result'] } });
    // Cancelled while the last sets were solved, or taken over by another worker.
    if (!current || current.status !== 'running' || current.attempts !== attempt) return;
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
        heartbeatAt: null,
      },
      { transaction },
    );
  });
}
