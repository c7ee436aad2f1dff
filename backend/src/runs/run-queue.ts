import PgBoss from 'pg-boss';
import type { Transaction } from 'sequelize';
import { config } from '../config';

/** One pg-boss queue carries optimisation runs; any number of worker processes may serve it. */
export const RUN_QUEUE = config.runs.queueName;

export interface RunJobData {
  runId: number;
}

let bossPromise: Promise<PgBoss> | null = null;

/** The process's pg-boss client, started on first use (sending needs it as much as working). */
export function getBoss(): Promise<PgBoss> {
  bossPromise ??= (async () => {
    const boss = new PgBoss({
      connectionString: config.databaseUrl,
      schema: 'pgboss',
      max: 4,
      // Expired jobs (a worker that died mid-run) are found by maintenance and retried.
      maintenanceIntervalSeconds: config.runs.maintenanceSeconds,
    });
    boss.on('error', (error) => console.error('[runs] queue error:', error.message));
    await boss.start();
    await boss.createQueue(RUN_QUEUE, {
      name: RUN_QUEUE,
      retryLimit: config.runs.retryLimit,
      retryDelay: 1,
      expireInSeconds: config.runs.expireSeconds,
    });
    return boss;
  })();
  bossPromise.catch(() => {
    bossPromise = null;
  });
  return bossPromise;
}

export async function enqueueRun(runId: number): Promise<string | null> {
  const boss = await getBoss();
  return boss.send(RUN_QUEUE, { runId } satisfies RunJobData, {
    retryLimit: config.runs.retryLimit,
    retryDelay: 1,
    expireInSeconds: config.runs.expireSeconds,
  });
}

export async function cancelRunJob(jobId: string): Promise<void> {
  const boss = await getBoss();
  await boss.cancel(RUN_QUEUE, jobId);
}

/** Lets pg-boss write inside a Sequelize transaction (its own SQL, on the transaction's connection). */
function onTransaction(transaction: Transaction): PgBoss.Db {
  const connection = (transaction as unknown as { connection?: { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> } }).connection;
  if (!connection) throw new Error('the transaction has no connection');
  return { executeSql: (text, values) => connection.query(text, values) as Promise<{ rows: never[] }> };
}

/**
 * Inside `transaction`: cancels a lost run's old job (its worker is gone) and sends a new one, so
 * the re-queued run and its job are committed together. Answers the new job's id.
 */
export async function resendRunJob(runId: number, oldJobId: string | null, transaction: Transaction): Promise<string | null> {
  const boss = await getBoss();
  const db = onTransaction(transaction);
  if (oldJobId) await boss.cancel(RUN_QUEUE, oldJobId, { db });
  return boss.send(RUN_QUEUE, { runId } satisfies RunJobData, {
    retryLimit: config.runs.retryLimit,
    retryDelay: 1,
    expireInSeconds: config.runs.expireSeconds,
    db,
  });
}

/** Serves the queue in this process: one run at a time per worker. */
export async function startRunWorker(handle: (data: RunJobData) => Promise<void>): Promise<void> {
  const boss = await getBoss();
  await boss.work<RunJobData>(RUN_QUEUE, { batchSize: 1, pollingIntervalSeconds: config.runs.pollingSeconds }, async (jobs) => {
    for (const job of jobs) await handle(job.data);
  });
}

export async function stopRunQueue(): Promise<void> {
  if (!bossPromise) return;
  const boss = await bossPromise.catch(() => null);
  bossPromise = null;
  await boss?.stop({ graceful: false, wait: true, timeout: 2000 }).catch(() => undefined);
}
