import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getBriefsQueryOptions, useBriefs } from '@/features/briefs/api/get-briefs';
import { BriefsTable } from '@/features/briefs/components/briefs-table';
import { formatCount } from '@/lib/format';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(getBriefsQueryOptions(new URL(request.url).searchParams.get('archived') === '1'));
    return null;
  };

export default function BriefsRoute() {
  const me = useSessionUser();
  const archived = useSearchParams()[0].get('archived') === '1';
  const briefs = useBriefs(archived);
  const canWrite = hasRole(me, ['designer', 'admin']);
  const newBrief = canWrite ? <ButtonLink to="/briefs/new">New brief</ButtonLink> : undefined;
  return (
    <>
      <title>Briefs · Packwright</title>
      <PageHeader
        title="Briefs"
        description="What each pack must do: its thermal target and its limits. Run the optimiser on a brief to get ranked, costed candidates."
        action={newBrief}
      />
      <Card>
        <CardHeader
          title={archived ? 'Archived briefs' : 'Active briefs'}
          description={
            <>
              {briefs.data ? `${formatCount(briefs.data.length, 'brief')} · ` : ''}
              {archived ? (
                <>
                  Archived briefs are read-only; open one to unarchive it.{' '}
                  <Link to="/briefs" className="font-semibold text-frost-700 hover:underline">
                    Back to the active briefs
                  </Link>
                </>
              ) : (
                <Link to="/briefs?archived=1" className="font-semibold text-frost-700 hover:underline">
                  Show the archived briefs
                </Link>
              )}
            </>
          }
        />
        <CardBody>
          {briefs.isPending ? (
            <Loading label="Loading the briefs…" />
          ) : briefs.isError ? (
            <QueryError error={briefs.error} onRetry={() => void briefs.refetch()} retrying={briefs.isFetching} />
          ) : (
            <BriefsTable briefs={briefs.data} canWrite={canWrite} newAction={archived ? undefined : newBrief} archived={archived} />
          )}
        </CardBody>
      </Card>
    </>
  );
}
