// The process's long-lived optimisation thread: it takes runs one after another, off the main
// thread, so the API stays responsive and the code is loaded and compiled once rather than per
// run. Input and output are plain data (structured clone). Cancelling a run terminates the whole
// thread; the process starts a new one for the next run (optimise-pool.ts).
import { parentPort } from 'node:worker_threads';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import { runOptimisation } from '@shared/optimiser';
import type { OptimiseThreadMessage, OptimiseThreadReply, OptimiseThreadRequest } from './optimise-thread.types';

// Runs of the same workspace carry equal species data; reusing the first copy keeps the
// chemistry port's sampled curves (cached per library object) from one run to the next.
let lastChemistryJson = '';
let lastChemistry: ChemistryLibrary | null = null;
function sameChemistry(lib: ChemistryLibrary): ChemistryLibrary {
  const json = JSON.stringify(lib);
  if (lastChemistry && json === lastChemistryJson) return lastChemistry;
  lastChemistryJson = json;
  lastChemistry = lib;
  return lib;
}

parentPort!.on('message', (request: OptimiseThreadRequest) => {
  if (request.type !== 'run') return;
  const { runId, input } = request;
  const post = (message: OptimiseThreadMessage) => parentPort!.postMessage({ ...message, runId } satisfies OptimiseThreadReply);
  try {
    const started = performance.now();
    let lastProgressAt = 0;
    const result = runOptimisation({
      brief: input.brief,
      ingredients: input.ingredients,
      chemistry: sameChemistry(input.chemistry),
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
});
