import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { ShortlistButton } from '@/features/candidates/components/shortlist-button';
import { getRunQueryOptions, useRun } from '@/features/runs/api/get-run';
import { RunView } from '@/features/runs/components/run-view';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';
import { idFrom } from '@/lib/route-params';


export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const id = idFrom(params.id);
    if (id) void queryClient.prefetchQuery(getRunQueryOptions(id));
    return null;
  };

export default function RunRoute() {
  const me = useSessionUser();
  const id = idFrom(useParams().id);
  const run = useRun(id);
  const canWrite = hasRole(me, ['designer', 'admin']);

  const back = (
    <p className="mb-2 text-small">
      <Link to={run.data ? `/briefs/${run.data.briefId}` : '/briefs'} className="font-semibold text-frost-700 hover:underline">
        ← {run.data ? run.data.brief.name : 'Briefs'}
      </Link>
    </p>
  );
  if (!id || run.isError)
    return (
      <>
        {back}
        <QueryError
          title="This run could not be loaded"
          error={run.error ?? new Error('There is no run at this address.')}
          onRetry={id ? () => void run.refetch() : undefined}
          retrying={run.isFetching}
        />
      </>
    );
  if (run.isPending)
    return (
      <>
        {back}
        <Loading label="Loading the run…" />
      </>
    );

  return (
    <>
      <title>{`Run ${run.data.id} · ${run.data.brief.name} · Packwright`}</title>
      {back}
      <PageHeader title={`Run ${run.data.id}`} description={`Optimiser run of “${run.data.brief.name}”.`} />
      <RunView
        run={run.data}
        canWrite={canWrite}
        selectionActions={canWrite ? (selected) => <ShortlistButton candidates={selected} /> : undefined}
      />
    </>
  );
}
