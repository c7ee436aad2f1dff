import { QueryTypes } from 'sequelize';
import { config } from '../config';
import { sequelize } from '../db/sequelize';
import { resendRunJob } from './run-queue';

/**
 * Lost runs (DEVELOPERS.md, "Optimisation runs"). The worker executing a run writes its heartbeat
 * every `RUN_HEARTBEAT_SECONDS`; a process that dies (SIGKILL, OOM, power) stops writing it. Every
 * app and worker process sweeps every `RUN_SWEEP_SECONDS`: a running run whose heartbeat is older
 * than `RUN_STALE_SECONDS` is re-queued with a new job, or — its attempts used up — failed with the
 * reason. One UPDATE … RETURNING takes the rows, so concurrent sweepers never take the same run twice
 * (PostgreSQL re-checks the WHERE on a row another sweeper just updated, and it no longer matches).
 * A sweeper takes only runs last executed on its own queue (RUN_QUEUE), and older rows without one.
 */

/** Attempts a run may take: the first plus `RUN_RETRY_LIMIT` retries. */
export const maxRunAttempts = () => config.runs.retryLimit + 1;

interface SweptRow {
  id: number;
  status: 'queued' | 'failed';
  job_id: string | null;
}

/** The reason stored on a run that was lost on its last attempt (the run screen shows it). */
const LOST_REASON_SQL = `'Its worker stopped responding (no heartbeat for ' || :staleSeconds || ' s) on attempt ' || attempts || ' of ' || :maxAttempts || ', the last one allowed, so the run was stopped.'`;

/** Re-queues or fails every running run whose heartbeat is stale; answers what it did. */
export async function sweepLostRuns(): Promise<{ requeued: number[]; failed: number[] }> {
  return sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<SweptRow>(
      `UPDATE runs SET
         status = CASE WHEN attempts >= :maxAttempts THEN 'failed' ELSE 'queued' END,
         error = CASE WHEN attempts >= :maxAttempts THEN ${LOST_REASON_SQL} ELSE NULL END,
         finished_at = CASE WHEN attempts >= :maxAttempts THEN now() ELSE NULL END,
         interruptions = interruptions + 1,
         last_interrupted_at = now(),
         heartbeat_at = NULL,
         updated_at = now()
       WHERE status = 'running' AND COALESCE(heartbeat_at, updated_at) < now() - make_interval(secs => :staleSeconds)
         AND COALESCE(queue_name, :queue) = :queue
       RETURNING id, status, job_id`,
      { replacements: { maxAttempts: maxRunAttempts(), staleSeconds: config.runs.staleSeconds, queue: config.runs.queueName }, type: QueryTypes.SELECT, transaction },
    );
    const requeued: number[] = [];
    const failed: number[] = [];
    for (const row of rows) {
      if (row.status === 'failed') {
        failed.push(row.id);
        continue;
      }
      // The new job is committed with the run's new status, or neither is.
      const jobId = await resendRunJob(row.id, row.job_id, transaction);
      await sequelize.query('UPDATE runs SET job_id = :jobId WHERE id = :id', { replacements: { jobId, id: row.id }, transaction });
      requeued.push(row.id);
    }
    return { requeued, failed };
  });
}

/**
 * Hands back a run this worker could not finish (its own error, not the optimiser's): re-queued
 * with a new job while attempts remain, else failed with `reason`. Only while this worker still
 * holds the run (same attempt, still running).
 */
export async function releaseRun(runId: number, attempt: number, reason: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<SweptRow>(
      `UPDATE runs SET
         status = CASE WHEN attempts >= :maxAttempts THEN 'failed' ELSE 'queued' END,
         error = CASE WHEN attempts >= :maxAttempts THEN :reason ELSE NULL END,
         finished_at = CASE WHEN attempts >= :maxAttempts THEN now() ELSE NULL END,
         heartbeat_at = NULL,
         updated_at = now()
       WHERE id = :runId AND attempts = :attempt AND status = 'running'
       RETURNING id, status, job_id`,
      {
        replacements: { maxAttempts: maxRunAttempts(), runId, attempt, reason: `${reason} (attempt ${attempt} of ${maxRunAttempts()}, the last one allowed)` },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    const row = rows[0];
    if (row?.status === 'queued') {
      const jobId = await resendRunJob(row.id, row.job_id, transaction);
      await sequelize.query('UPDATE runs SET job_id = :jobId WHERE id = :id', { replacements: { jobId, id: row.id }, transaction });
    }
  });
}

let timer: NodeJS.Timeout | null = null;
let sweeping: Promise<unknown> | null = null;
let lastError = '';

/** Starts this process's sweeper (idempotent). The timer never keeps the process alive. */
export function startRunSweeper(): void {
  if (timer) return;
  const tick = () => {
    if (sweeping) return;
    sweeping = sweepLostRuns()
      .then(({ requeued, failed }) => {
        lastError = '';
        if (requeued.length) console.log(`[runs] re-queued lost run(s) ${requeued.join(', ')} (no heartbeat for ${config.runs.staleSeconds} s)`);
        if (failed.length) console.log(`[runs] failed lost run(s) ${failed.join(', ')}: no attempts left`);
      })
      .catch((error: unknown) => {
        // Said once per distinct error: a database outage must not flood the log.
        const message = error instanceof Error ? error.message : String(error);
        if (message !== lastError) console.error('[runs] sweeping lost runs failed:', message);
        lastError = message;
      })
      .finally(() => {
        sweeping = null;
      });
  };
  // A random offset spreads the sweeps of processes started together.
  const first = setTimeout(() => {
    tick();
    timer = setInterval(tick, config.runs.sweepSeconds * 1000);
    timer.unref();
  }, Math.random() * config.runs.sweepSeconds * 1000);
  first.unref();
  timer = first;
}

export async function stopRunSweeper(): Promise<void> {
  if (timer) clearTimeout(timer);
  timer = null;
  await sweeping;
}
