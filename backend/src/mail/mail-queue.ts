import { config } from '../config';
import { getBoss } from '../runs/run-queue';

/**
 * Mail sent in the background as pg-boss jobs (the same PostgreSQL-backed queue as optimisation
 * runs): the request that causes a message answers at once, and a failed send is retried with
 * backoff. Each kind of job names a handler registered by the module that owns it.
 */
export const MAIL_QUEUE = config.mail.queueName;

export interface MailJobData {
  kind: string;
  payload: Record<string, unknown>;
}

type MailJobHandler = (payload: Record<string, unknown>) => Promise<void>;
const handlers = new Map<string, MailJobHandler>();

export function registerMailJob(kind: string, handler: MailJobHandler): void {
  handlers.set(kind, handler);
}

const jobOptions = () => ({
  retryLimit: config.mail.retryLimit,
  // 2 s, 4 s, 8 s, … between attempts (pg-boss's exponential backoff).
  retryDelay: 2,
  retryBackoff: true,
  expireInSeconds: 60,
});

let queueReady: Promise<void> | null = null;

async function ensureQueue() {
  queueReady ??= (async () => {
    const boss = await getBoss();
    await boss.createQueue(MAIL_QUEUE, { name: MAIL_QUEUE, ...jobOptions() });
  })();
  queueReady.catch(() => {
    queueReady = null;
  });
  return queueReady;
}

/** This process's mail workers: woken when this process queues a message, so it goes out at once. */
const localWorkers: string[] = [];
/** Messages are sent one per job (so a failure retries only its own), a few at a time. */
const MAIL_WORKERS = 3;

export async function enqueueMailJob(kind: string, payload: Record<string, unknown>): Promise<void> {
  if (!handlers.has(kind)) throw new Error(`no mail job handler for "${kind}"`);
  await ensureQueue();
  const boss = await getBoss();
  await boss.send(MAIL_QUEUE, { kind, payload } satisfies MailJobData, jobOptions());
  for (const id of localWorkers) boss.notifyWorker(id);
}

/** Serves the mail queue in this process; a handler that throws fails the job, which pg-boss retries. */
export async function startMailWorker(): Promise<void> {
  await ensureQueue();
  const boss = await getBoss();
  localWorkers.length = 0;
  for (let k = 0; k < MAIL_WORKERS; k++) {
    const id = await boss.work<MailJobData>(MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
      const handler = job && handlers.get(job.data.kind);
      if (!handler) throw new Error(`no mail job handler for "${job?.data.kind}"`);
      await handler(job.data.payload);
    });
    localWorkers.push(id);
  }
}

/** Stops this process's mail workers (queued jobs wait for the next worker); startMailWorker starts them again. */
export async function stopMailWorker(): Promise<void> {
  if (localWorkers.length === 0) return;
  const boss = await getBoss();
  await Promise.all(localWorkers.map((id) => boss.offWork({ id })));
  localWorkers.length = 0;
}
