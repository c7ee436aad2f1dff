// Runs one optimisation off the main thread, so the API stays responsive and a cancelled
// run can simply be terminated. Input and output are plain data (structured clone).
import { parentPort, workerData } from 'node:worker_threads';
import { runOptimisation } from '@shared/optimiser';
import type { OptimiseThreadInput, OptimiseThreadMessage } from './optimise-thread.types';

const input = workerData as OptimiseThreadInput;
const post = (message: OptimiseThreadMessage) => parentPort!.postMessage(message);

try {
  const started = performance.now();
  let lastProgressAt = 0;
  const result = runOptimisation({
    brief: input.brief,
    ingredients: input.ingredients,
    chemistry: input.chemistry,
    calibrations: input.calibrations ?? null,
    onProgress: (done: number, total: number) => {
      const now = performance.now();
      if (done === total || now - lastProgressAt > 100) {
        lastProgressAt = now;
        post({ type: 'progress', done, total });
      }
    },
  });
  post({ type: 'result', result, elapsedMs: performance.now() - started });
} catch (error) {
  post({ type: 'error', message: error instanceof Error ? error.message : String(error) });
}
