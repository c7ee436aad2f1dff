import { Worker } from 'node:worker_threads';
import type { OptimiseThreadInput, OptimiseThreadMessage, OptimiseThreadReply, OptimiseThreadRequest } from './optimise-thread.types';

/**
 * ONE long-lived optimisation thread per process. Starting a thread (the TypeScript loader, the
 * optimiser's modules, the JIT) costs 1–2.5 s, so the thread is started on the first run and kept:
 * each run is posted to it and answered with progress messages and one result (or error).
 * Runs go one at a time (the queue serves one run per worker anyway); a second request waits.
 *
 * - `cancel()` of the running run terminates the thread; the next run starts a new one.
 * - A thread that crashes or exits fails only the run it was on; the next run starts a new one.
 * - The thread is unref'd: an idle thread never keeps the process alive.
 */
export interface OptimiseHandle {
  /** Settles with the run's outcome: its result, an error, or `cancelled`. */
  outcome: Promise<OptimiseThreadMessage | { type: 'cancelled' }>;
  /** Stops the run (terminates the thread). */
  cancel(): Promise<void>;
}

interface Current {
  runId: number;
  onProgress: (done: number, total: number) => void;
  settle: (outcome: OptimiseThreadMessage | { type: 'cancelled' }) => void;
}

let worker: Worker | null = null;
let current: Current | null = null;
let queue: Promise<unknown> = Promise.resolve();
/** Threads started by this process (a new one after each cancel or crash). */
let threadsStarted = 0;

function startThread(): Worker {
  const w = new Worker(new URL('./optimise-thread-boot.mjs', import.meta.url));
  threadsStarted++;
  w.unref();
  w.on('message', (reply: OptimiseThreadReply) => {
    if (!current || reply.runId !== current.runId) return; // from a run already settled
    if (reply.type === 'progress') {
      current.onProgress(reply.done, reply.total);
      return;
    }
    const { runId: _runId, ...message } = reply;
    current.settle(message as OptimiseThreadMessage);
  });
  w.on('error', (error) => {
    if (worker === w) worker = null;
    current?.settle({ type: 'error', message: error.message });
  });
  w.on('exit', (code) => {
    if (worker === w) worker = null;
    current?.settle({ type: 'error', message: `the optimisation stopped unexpectedly (exit code ${code})` });
  });
  return w;
}

/** Runs one optimisation on the process's thread (started if there is none). */
export function optimiseOnThread(runId: number, input: OptimiseThreadInput, onProgress: (done: number, total: number) => void): OptimiseHandle {
  let cancelRequested = false;
  let started: Worker | null = null;
  const outcome = new Promise<OptimiseThreadMessage | { type: 'cancelled' }>((resolve) => {
    queue = queue.then(
      () =>
        new Promise<void>((done) => {
          const settle = (o: OptimiseThreadMessage | { type: 'cancelled' }) => {
            if (current?.runId === runId) current = null;
            resolve(o);
            done();
          };
          if (cancelRequested) return settle({ type: 'cancelled' });
          worker ??= startThread();
          started = worker;
          current = { runId, onProgress, settle };
          started.ref(); // keep the process up while a run is on the thread
          const request: OptimiseThreadRequest = { type: 'run', runId, input };
          started.postMessage(request);
        }).finally(() => started?.unref()),
    );
  });
  return {
    outcome,
    async cancel() {
      cancelRequested = true;
      if (current?.runId !== runId || !started) return;
      const w = started;
      const c = current;
      current = null;
      if (worker === w) worker = null;
      c.settle({ type: 'cancelled' });
      w.ref();
      await w.terminate().catch(() => undefined);
    },
  };
}

/** How many threads this process has started (for tests and the benchmark). */
export function optimiseThreadsStarted(): number {
  return threadsStarted;
}

/** Stops the thread (shutdown, tests). */
export async function stopOptimiseThread(): Promise<void> {
  const w = worker;
  worker = null;
  if (!w) return;
  w.ref(); // an idle thread is unref'd: hold the process until it has gone
  await w.terminate().catch(() => undefined);
}
