import { Pager, usePageState } from '@/components/ui/pager';
import { EmptyState } from '@/components/ui/empty-state';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { formatDateTime, formatRelative } from '@/lib/format';
import { useIngredientHistory } from '../api/get-ingredient-history';

const ACTIONS: Record<string, string> = {
  'ingredient.create': 'Added',
  'ingredient.update': 'Changed',
  'ingredient.delete': 'Removed',
  'attachment.create': 'Attached a file',
};

const HIDDEN = new Set(['id', 'version', 'updatedAt', 'createdAt']);

/** Names of the fields whose values differ between two snapshots. */
function changedFields(before: unknown, after: unknown): string[] {
  if (!before || !after || typeof before !== 'object' || typeof after !== 'object') return [];
  const b = before as Record<string, unknown>;
  const a = after as Record<string, unknown>;
  const keys = new Set([...Object.keys(b), ...Object.keys(a)]);
  return [...keys].filter((k) => !HIDDEN.has(k) && JSON.stringify(b[k]) !== JSON.stringify(a[k]));
}

function versionOf(snapshot: unknown): number | null {
  if (snapshot && typeof snapshot === 'object' && 'version' in snapshot && typeof snapshot.version === 'number') return snapshot.version;
  return null;
}

export function IngredientHistory({ ingredientId }: { ingredientId: number }) {
  const paging = usePageState(20);
  const history = useIngredientHistory(ingredientId, { page: paging.page, pageSize: paging.pageSize });
  if (history.isPending) return <Loading label="Loading the history…" />;
  if (history.isError) return <QueryError error={history.error} onRetry={() => void history.refetch()} retrying={history.isFetching} />;
  if (history.data.total === 0) return <EmptyState title="No recorded changes">Changes made in Packwright are listed here.</EmptyState>;
  return (
    <div className="flex flex-col gap-3">
    <ol className="flex flex-col gap-3">
      {history.data.items.map((event) => {
        const fields = changedFields(event.before, event.after);
        const version = versionOf(event.after);
        const via = typeof event.detail.via === 'string' ? event.detail.via : null;
        return (
          <li key={event.id} className="border-l-2 border-frost-200 pl-3 text-small">
            <p className="font-semibold text-ink-900">
              {ACTIONS[event.action] ?? event.action}
              {version !== null && <span className="font-normal text-ink-500"> · version {version}</span>}
              {via && <span className="font-normal text-ink-500"> · via {via}</span>}
            </p>
            <p className="text-ink-600">
              {event.actor ?? 'Packwright'} ·{' '}
              <time dateTime={event.at} title={formatDateTime(event.at)}>
                {formatRelative(event.at)}
              </time>
            </p>
            {fields.length > 0 && <p className="text-caption text-ink-500">Fields: {fields.join(', ')}</p>}
          </li>
        );
      })}
    </ol>
    <Pager noun="change" label="Pages of the history" page={paging.page} pageSize={paging.pageSize} total={history.data.total} onPageChange={paging.setPage} />
    </div>
  );
}
