import { Link } from 'react-router';
import { RunStatusBadge, isRunActive } from '@/components/status/run-status-badge';
import { EmptyState } from '@/components/ui/empty-state';
import { QueryError } from '@/components/ui/query-error';
import { Pager, usePageState } from '@/components/ui/pager';
import { Loading } from '@/components/ui/spinner';
import { formatDateTime, formatDuration, formatNumber } from '@/lib/format';
import { useBriefRuns } from '../api/get-brief-runs';

/** The brief's runs, newest first, a page at a time: status, when, who, how far and how long. */
export function BriefRunsList({
  briefId,
  currentVersion,
  lastRun,
}: {
  briefId: number;
  currentVersion: number;
  /** The latest run with its candidate count (the list itself carries none). */
  lastRun: { id: number; candidates: number } | null;
}) {
  const paging = usePageState(10);
  const runs = useBriefRuns(briefId, { page: paging.page, pageSize: paging.pageSize });
  if (runs.isPending) return <Loading label="Loading the runs…" />;
  if (runs.isError) return <QueryError title="The runs could not be loaded" error={runs.error} onRetry={() => void runs.refetch()} retrying={runs.isFetching} />;
  if (runs.data.total === 0) return <EmptyState title="Not run yet">Run the optimiser to get ranked candidates for this brief.</EmptyState>;
  return (
    <div className="flex flex-col gap-3">
    <div className="-mx-5 overflow-x-auto">
      <table className="w-full min-w-[40rem] text-left text-small">
        <caption className="sr-only">Runs of this brief</caption>
        <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500 uppercase">
          <tr>
            <th scope="col" className="px-5 py-2">Run</th>
            <th scope="col" className="px-3 py-2">Status</th>
            <th scope="col" className="px-3 py-2">Started</th>
            <th scope="col" className="px-3 py-2">By</th>
            <th scope="col" className="px-3 py-2">Sets solved</th>
            <th scope="col" className="px-3 py-2">Candidates</th>
            <th scope="col" className="px-5 py-2">Took</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {runs.data.items.map((r) => (
            <tr key={r.id}>
              <th scope="row" className="px-5 py-2">
                <Link to={`/runs/${r.id}`} className="font-bold text-frost-700 hover:underline">
                  Run {r.id}
                </Link>
                <div className="text-caption font-normal text-ink-500">
                  brief version {r.briefVersion}
                  {r.briefVersion !== currentVersion && ' (earlier)'}
                </div>
              </th>
              <td className="px-3 py-2">
                <RunStatusBadge status={r.status} />
                {r.error && <div className="mt-0.5 max-w-xs text-caption text-rust-700">{r.error}</div>}
              </td>
              <td className="px-3 py-2 text-ink-700">{formatDateTime(r.createdAt)}</td>
              <td className="px-3 py-2 text-ink-700">{r.createdBy || '—'}</td>
              <td className="px-3 py-2 tabular-nums text-ink-700">
                {r.progress.total ? `${formatNumber(r.progress.done, { maxFractionDigits: 0 })} / ${formatNumber(r.progress.total, { maxFractionDigits: 0 })}` : isRunActive(r.status) ? 'starting…' : '—'}
              </td>
              <td className="px-3 py-2 tabular-nums text-ink-700">
                {lastRun && lastRun.id === r.id ? (
                  formatNumber(lastRun.candidates, { maxFractionDigits: 0 })
                ) : r.status === 'succeeded' ? (
                  <Link to={`/runs/${r.id}`} className="text-frost-700 hover:underline">
                    see the run
                  </Link>
                ) : (
                  '—'
                )}
              </td>
              <td className="px-5 py-2 tabular-nums text-ink-700">{formatDuration(r.startedAt, r.finishedAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
    <Pager noun="run" label="Pages of the runs" page={paging.page} pageSize={paging.pageSize} total={runs.data.total} onPageChange={paging.setPage} pageSizes={[10, 25, 50]} onPageSizeChange={paging.setPageSize} />
    </div>
  );
}
