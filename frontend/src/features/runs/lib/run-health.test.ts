import { describe, expect, it } from 'vitest';
import { failureAdvice, runHealthNote } from './run-health';

const base = { status: 'running' as const, attempts: 1, maxAttempts: 3, interruptions: 0, lastInterruptedAt: null, silentForS: 2 };

describe('runHealthNote', () => {
  it('says nothing about a run whose worker answers', () => {
    expect(runHealthNote(base)).toBeNull();
    expect(runHealthNote({ ...base, status: 'succeeded', silentForS: null })).toBeNull();
  });

  it('says when the worker has gone quiet, and what happens next', () => {
    const note = runHealthNote({ ...base, silentForS: 21 });
    expect(note?.tone).toBe('caution');
    expect(note?.text).toContain('No word from the worker running this for 21 s');
    expect(note?.text).toContain('within a minute');
  });

  it('says a run was queued again after its worker stopped, with the attempt', () => {
    const at = new Date('2026-03-12T14:05:00');
    const running = runHealthNote({ ...base, attempts: 2, interruptions: 1, lastInterruptedAt: at.toISOString() }, at);
    expect(running?.text).toMatch(/stopped responding \(Today, .*\), so the run was queued again and started over on another worker \(attempt 2 of 3\)/);
    const queued = runHealthNote({ ...base, status: 'queued', attempts: 1, interruptions: 1, lastInterruptedAt: at.toISOString(), silentForS: null }, at);
    expect(queued?.text).toContain('is waiting for a worker (attempt 2 of 3 next)');
  });

  it('advises on a failure caused by lost workers differently from one of the brief', () => {
    expect(failureAdvice({ interruptions: 3 })).toContain('check that a worker is running');
    expect(failureAdvice({ interruptions: 0 })).toBe('Check the brief and run it again.');
  });
});
