import type { RunSummary } from '@shared/schemas/runs';
import { formatWhen } from '@/lib/format';

/**
 * What the run screen says about the worker behind a run (DEVELOPERS.md, "Optimisation runs"):
 * a worker writes the run's heartbeat every few seconds; a run whose heartbeat stops is queued
 * again for another worker, or failed once its attempts are used up.
 */
export interface RunHealthNote {
  tone: 'info' | 'caution';
  text: string;
}

/** Seconds of silence after which the screen mentions it (the heartbeat comes every ~5 s). */
export const SILENCE_NOTE_S = 15;

type RunHealth = Pick<RunSummary, 'status' | 'attempts' | 'maxAttempts' | 'interruptions' | 'lastInterruptedAt' | 'silentForS'>;

/** A note for a queued or running run, or null when there is nothing to say. */
export function runHealthNote(run: RunHealth, now: Date = new Date()): RunHealthNote | null {
  if (run.status === 'running' && run.silentForS !== null && run.silentForS >= SILENCE_NOTE_S) {
    return {
      tone: 'caution',
      text: `No word from the worker running this for ${run.silentForS} s. If it has stopped, the run is handed to another worker within a minute (attempt ${run.attempts} of ${run.maxAttempts}).`,
    };
  }
  if ((run.status === 'running' || run.status === 'queued') && run.interruptions > 0) {
    const when = formatWhen(run.lastInterruptedAt, now);
    const next = run.status === 'running' ? `started over on another worker (attempt ${run.attempts} of ${run.maxAttempts})` : `is waiting for a worker (attempt ${run.attempts + 1} of ${run.maxAttempts} next)`;
    return {
      tone: 'info',
      text: `The worker running this stopped responding (${when}), so the run was queued again and ${next}. Sets solved before are solved again; nothing is counted twice.`,
    };
  }
  return null;
}

/** The advice under a failed run's reason. */
export function failureAdvice(run: Pick<RunSummary, 'interruptions'>): string {
  return run.interruptions > 0
    ? 'Run it again; if it keeps happening, check that a worker is running (the app itself, or `npm run worker`) and has memory to spare.'
    : 'Check the brief and run it again.';
}
