import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { compareCandidatesQueryOptions, useCompareCandidates } from '@/features/candidates/api/get-candidate';
import { CompareView } from '@/features/candidates/components/compare-view';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../guards';

function idsFrom(value: string | null): number[] {
  if (!value) return [];
  const ids = value.split(',').map((s) => Number(s.trim()));
  return ids.every((id) => Number.isInteger(id) && id > 0) ? [...new Set(ids)] : [];
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const ids = idsFrom(new URL(request.url).searchParams.get('ids'));
    if (ids.length >= 2 && ids.length <= 4) void queryClient.prefetchQuery(compareCandidatesQueryOptions(ids));
    return null;
  };

export default function CompareRoute() {
  const me = useSessionUser();
  const [search] = useSearchParams();
  const ids = idsFrom(search.get('ids'));
  const compare = useCompareCandidates(ids);
  const canWrite = hasRole(me, ['designer', 'admin']);
  const runId = compare.data?.[0]?.runId;

  return (
    <>
      <title>Compare candidates · Packwright</title>
      <p className="mb-2 text-small">
        <Link to={runId ? `/runs/${runId}` : '/briefs'} className="font-semibold text-frost-700 hover:underline">
          ← {runId ? `Run ${runId}` : 'Briefs'}
        </Link>
      </p>
      <PageHeader title="Compare candidates" description="Side by side: what is in them, what they cost and weigh, and how their temperatures run." />
      {ids.length < 2 || ids.length > 4 ? (
        <EmptyState title="Choose two to four candidates">Select candidates in a run’s table, then choose Compare.</EmptyState>
      ) : compare.isPending ? (
        <Loading label="Loading the candidates…" />
      ) : compare.isError ? (
        <QueryError title="These candidates could not be loaded" error={compare.error} onRetry={() => void compare.refetch()} retrying={compare.isFetching} />
      ) : (
        <CompareView candidates={compare.data} canWrite={canWrite} />
      )}
    </>
  );
}
