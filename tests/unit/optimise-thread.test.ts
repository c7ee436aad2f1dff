import { afterAll, describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '@shared/demo/demo-library';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { briefSchema } from '@shared/schemas/briefs';
import { optimiseOnThread, optimiseThreadsStarted, stopOptimiseThread } from '../../backend/src/runs/optimise-pool';
import type { OptimiseThreadInput } from '../../backend/src/runs/optimise-thread.types';

// The process keeps one optimisation thread and posts every run to it (backend/src/runs/optimise-pool.ts).
afterAll(stopOptimiseThread);

const chemistry = defaultChemistryLibrary();
const input = (maxActives: number): OptimiseThreadInput => ({
  brief: briefSchema.parse({ ...DEMO_BRIEFS[0]!, maxActives }),
  ingredients: [...DEMO_LIBRARY],
  chemistry,
});

describe('the long-lived optimisation thread', () => {
  it('answers two runs in a row from one thread, with progress up to the total and the same result as a run on this thread', async () => {
    const before = optimiseThreadsStarted();
    const seen: [number, number][] = [];
    const first = await optimiseOnThread(1, input(1), (d, t) => seen.push([d, t])).outcome;
    const second = await optimiseOnThread(2, input(2), () => undefined).outcome;
    expect(first.type).toBe('result');
    expect(second.type).toBe('result');
    expect(optimiseThreadsStarted() - before).toBeLessThanOrEqual(1);
    expect(seen.at(-1)![0]).toBe(seen.at(-1)![1]);
    // Reference: the same optimisation run here, on the test's own thread.
    const here = runOptimisation({ brief: input(1).brief, ingredients: DEMO_LIBRARY, chemistry });
    if (first.type !== 'result') throw new Error('no result');
    expect(first.result.candidates.map((c) => c.setIds.join('+'))).toEqual(here.candidates.map((c) => c.setIds.join('+')));
    expect(first.result.candidates[0]!.objectiveValue).toBeCloseTo(here.candidates[0]!.objectiveValue, 12);
  }, 60_000);

  it('cancelling a run ends it as cancelled and the next run gets a new thread', async () => {
    const before = optimiseThreadsStarted();
    let progressed!: () => void;
    const onTheThread = new Promise<void>((r) => (progressed = r));
    const handle = optimiseOnThread(3, input(3), () => progressed());
    await onTheThread;
    await handle.cancel();
    expect((await handle.outcome).type).toBe('cancelled');
    const next = await optimiseOnThread(4, input(1), () => undefined).outcome;
    expect(next.type).toBe('result');
    expect(optimiseThreadsStarted() - before).toBeLessThanOrEqual(1);
  }, 60_000);

  it('a thread that dies mid-run fails only that run; the next run succeeds on a new thread', async () => {
    let progressed!: () => void;
    const onTheThread = new Promise<void>((r) => (progressed = r));
    const doomed = optimiseOnThread(5, input(3), () => progressed());
    await onTheThread;
    const before = optimiseThreadsStarted();
    await stopOptimiseThread(); // the thread goes away under the run, as a crash would
    const failed = await doomed.outcome;
    expect(failed.type).toBe('error');
    expect(failed.type === 'error' ? failed.message : '').toMatch(/stopped unexpectedly/);
    const next = await optimiseOnThread(6, input(1), () => undefined).outcome;
    expect(next.type).toBe('result');
    expect(optimiseThreadsStarted() - before).toBe(1);
  }, 60_000);
});
