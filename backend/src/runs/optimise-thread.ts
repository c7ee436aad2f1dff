// The process's long-lived optimisation thread: it takes runs one after another, off the main
// thread, so the API stays responsive and the code is loaded and compiled once rather than per
// run. Input and output are plain data (structured clone). Cancelling a run terminates the whole
// thread; the process starts a new one for the next run (optimise-pool.ts).
import { parentPort } from 'node:worker_threads';
import { runOptimisation, sweepTarget } from '@shared/optimiser';
import type { Brief } from '@shared/schemas/briefs';
import type { OptimiseThreadMessage, OptimiseThreadReply, OptimiseThreadRequest } from './optimise-thread.types';

// Runs of the same workspace carry equal species data: the optimiser takes the chemistry model
// from the one cache per library revision (evaluation/chemistry-cache.ts), so its sampled curves
// are reused from one run to the next.

/**
 * The target sweep shown beside a run: 13 target temperatures from 6 K on the easy side of the
 * brief's target to 6 K on the hard side (kept on the right side of ambient), so the designer
 * sees what each degree costs.
 */
function sweepRange(brief: Brief) {
  const cold = brief.packType === 'cold';
  const easy = cold ? Math.min(brief.targetTempC + 6, brief.ambientC - 0.5) : Math.max(brief.targetTempC - 6, brief.ambientC + 0.5);
  const hard = cold ? brief.targetTempC - 6 : brief.targetTempC + 6;
  return { parameter: 'targetTempC' as const, from: easy, to: hard, points: 13 };
}

parentPort!.on('message', (request: OptimiseThreadRequest) => {
  if (request.type !== 'run') return;
  const { runId, input } = request;
  const post = (message: OptimiseThreadMessage) => parentPort!.postMessage({ ...message, runId } satisfies OptimiseThreadReply);
  try {
    const started = performance.now();
    let lastProgressAt = 0;
    // Steps: sets solved + candidates simulated + sweep points, so the bar does not sit at 100 %
    // while the sweep runs; the finished run reports the same count (run-executor.ts).
    const range = sweepRange(input.brief);
    const sweepSteps = range.points + 1;
    const report = (done: number, total: number) => {
      const now = performance.now();
      if (done === total || now - lastProgressAt > 100) {
        lastProgressAt = now;
        post({ type: 'progress', done, total });
      }
    };
    let runSteps = 0;
    const result = runOptimisation({
      brief: input.brief,
      ingredients: input.ingredients,
      chemistry: input.chemistry,
      calibrations: input.calibrations ?? null,
      onProgress: (done: number, total: number) => {
        runSteps = done;
        report(done, total + sweepSteps);
      },
    });
    const optimiseMs = performance.now() - started;
    const sweep = sweepTarget(
      { brief: input.brief, ingredients: input.ingredients, chemistry: input.chemistry, calibrations: input.calibrations ?? null },
      range,
      { run: result, onProgress: (done, total) => report(runSteps + done, runSteps + Math.max(total, sweepSteps)) },
    );
    const steps = runSteps + sweep.points.length;
    report(steps, steps);
    post({ type: 'result', result: { ...result, sweep, stats: { ...result.stats, steps } }, elapsedMs: optimiseMs });
  } catch (error) {
    post({ type: 'error', message: error instanceof Error ? error.message : String(error) });
  }
});
