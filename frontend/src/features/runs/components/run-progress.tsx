import type { RunDetail } from '@shared/schemas/runs';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/field';
import { Spinner } from '@/components/ui/spinner';
import { errorMessage } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import { useCancelRun } from '../api/cancel-run';
import { runHealthNote } from '../lib/run-health';

/** A queued or running run: steps done (sets solved, candidates simulated, sweep points) out of the total, and a way to stop it. */
export function RunProgress({ run, canCancel }: { run: RunDetail; canCancel: boolean }) {
  const cancel = useCancelRun();
  const { done, total } = run.progress;
  const fraction = total > 0 ? Math.min(1, done / total) : 0;
  const queued = run.status === 'queued';
  const health = runHealthNote(run);
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="flex items-center gap-2 font-semibold text-ink-800">
          <Spinner size="sm" className="text-frost-600" />
          {queued ? 'Waiting for the optimiser to pick this run up…' : 'Solving each set of actives, simulating every candidate, then sweeping the target…'}
        </p>
        {canCancel && (
          <Button variant="secondary" size="sm" onClick={() => cancel.mutate(run.id)} pending={cancel.isPending} pendingLabel="Cancelling…">
            Cancel the run
          </Button>
        )}
      </div>
      <div>
        <div
          role="progressbar"
          aria-label="Run steps done"
          aria-valuemin={0}
          aria-valuemax={total || 1}
          aria-valuenow={done}
          aria-valuetext={total ? `${done} of ${total} steps done` : 'starting'}
          className="h-3 w-full overflow-hidden rounded-full bg-ink-100"
        >
          <div className="h-full rounded-full bg-frost-500 transition-[width] duration-500" style={{ width: `${fraction * 100}%` }} />
        </div>
        <p className="mt-1.5 text-small tabular-nums text-ink-600" aria-live="polite">
          {total
            ? `${formatNumber(done, { maxFractionDigits: 0 })} / ${formatNumber(total, { maxFractionDigits: 0 })} steps done (${formatNumber(fraction * 100, { maxFractionDigits: 0 })} %)`
            : 'Counting the sets of actives…'}
        </p>
      </div>
      {health && (
        <Alert tone={health.tone} title={health.tone === 'caution' ? 'Its worker has gone quiet' : 'Picked up again'}>
          {health.text}
        </Alert>
      )}
      {cancel.isError && <FormMessage>{errorMessage(cancel.error)}</FormMessage>}
    </div>
  );
}
