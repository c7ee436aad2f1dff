import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { useEffect, useState } from 'react';
import { SelectField, TextField } from '@/components/ui/field';
import { Pager, usePageState } from '@/components/ui/pager';
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
    const archived = new URL(request.url).searchParams.get('archived') === '1';
    void queryClient.prefetchQuery(getBriefsQueryOptions({ page: 1, pageSize: 25, ...(archived ? { archived: 'true' as const } : {}) }));
    return null;
  };

export default function BriefsRoute() {
  const me = useSessionUser();
  const archived = useSearchParams()[0].get('archived') === '1';
  const paging = usePageState(25);
  const { setPage } = paging;
  const [draft, setDraft] = useState('');
  const [q, setQ] = useState('');
  const [packType, setPackType] = useState<'' | 'cold' | 'warm'>('');
  // Search as the user types, a moment after they stop; a new search starts at page 1.
  useEffect(() => {
    const timer = setTimeout(() => {
      if (draft.trim() === q) return;
      setQ(draft.trim());
      setPage(1);
    }, 300);
    return () => clearTimeout(timer);
  }, [draft, q, setPage]);
  const briefs = useBriefs({ page: paging.page, pageSize: paging.pageSize, ...(q ? { q } : {}), ...(packType ? { packType } : {}), ...(archived ? { archived: 'true' as const } : {}) });
  const filtered = Boolean(q || packType);
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
              {briefs.data ? `${formatCount(briefs.data.total, 'brief')} · ` : ''}
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
          <div className="mb-4 flex flex-wrap items-end gap-3">
            <TextField label="Search by name" type="search" value={draft} onChange={(event) => setDraft(event.target.value)} containerClassName="min-w-64 flex-1" placeholder="e.g. sideline" />
            <SelectField
              label="Pack type"
              value={packType}
              containerClassName="w-48"
              onChange={(event) => {
                setPackType(event.target.value as '' | 'cold' | 'warm');
                paging.setPage(1);
              }}
            >
              <option value="">Cold and warm</option>
              <option value="cold">Cold packs</option>
              <option value="warm">Warm packs</option>
            </SelectField>
          </div>
          {briefs.isPending ? (
            <Loading label="Loading the briefs…" />
          ) : briefs.isError ? (
            <QueryError error={briefs.error} onRetry={() => void briefs.refetch()} retrying={briefs.isFetching} />
          ) : (
            <div className="flex flex-col gap-3">
              {filtered && briefs.data.total === 0 ? (
                <p className="text-small text-ink-600">No brief matches; try a shorter search or the other pack type.</p>
              ) : (
                <BriefsTable briefs={briefs.data.items} canWrite={canWrite} newAction={archived ? undefined : newBrief} archived={archived} />
              )}
              <Pager noun="brief" label="Pages of the briefs" page={paging.page} pageSize={paging.pageSize} total={briefs.data.total} onPageChange={paging.setPage} pageSizes={[25, 50, 100]} onPageSizeChange={paging.setPageSize} />
            </div>
          )}
        </CardBody>
      </Card>
    </>
  );
}
