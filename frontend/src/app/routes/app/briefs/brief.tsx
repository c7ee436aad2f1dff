import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { RunStatusBadge } from '@/components/status/run-status-badge';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/field';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getBriefQueryOptions, useBrief } from '@/features/briefs/api/get-brief';
import { getBriefRunsQueryOptions } from '@/features/briefs/api/get-brief-runs';
import { useArchiveBrief, useDeleteBrief, useUnarchiveBrief } from '@/features/briefs/api/save-brief';
import { useStartRun } from '@/features/briefs/api/start-run';
import { BriefForm } from '@/features/briefs/components/brief-form';
import { BriefRunsList } from '@/features/briefs/components/brief-runs-list';
import { BriefSummary } from '@/features/briefs/components/brief-summary';
import { errorMessage, isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';
import { idFrom } from '@/lib/route-params';


export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const id = idFrom(params.id);
    if (id) {
      void queryClient.prefetchQuery(getBriefQueryOptions(id));
      void queryClient.prefetchQuery(getBriefRunsQueryOptions(id));
    }
    return null;
  };

export default function BriefRoute() {
  const me = useSessionUser();
  const id = idFrom(useParams().id);
  const brief = useBrief(id);
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const editing = search.get('edit') === '1';
  const setEditing = (on: boolean) => setSearch(on ? { edit: '1' } : {}, { replace: true });
  const canWrite = hasRole(me, ['designer', 'admin']);
  const startRun = useStartRun();
  const remove = useDeleteBrief();
  const archive = useArchiveBrief();
  const unarchive = useUnarchiveBrief();
  const [confirming, setConfirming] = useState<'delete' | 'archive' | null>(null);

  const back = (
    <p className="mb-2 text-small">
      <Link to="/briefs" className="font-semibold text-frost-700 hover:underline">
        ← Briefs
      </Link>
    </p>
  );
  if (!id || brief.isError)
    return (
      <>
        {back}
        <QueryError title="This brief could not be loaded" error={brief.error ?? new Error('There is no brief at this address.')} onRetry={id ? () => void brief.refetch() : undefined} retrying={brief.isFetching} />
      </>
    );
  if (brief.isPending)
    return (
      <>
        {back}
        <Loading label="Loading the brief…" />
      </>
    );

  const b = brief.data;
  const isArchived = b.archivedAt !== null;
  // Candidates in review or decided make the brief a record: the server refuses the delete and says why.
  const deleteRefused = isApiError(remove.error) && remove.error.code === 'brief_has_reviews';
  const doArchive = () =>
    archive.mutate(b.id, {
      onSuccess: () => {
        setConfirming(null);
        remove.reset();
      },
    });
  const run = () => startRun.mutate(b.id, { onSuccess: (runId) => void navigate(`/runs/${runId}`) });

  return (
    <>
      <title>{`${b.name} · Briefs · Packwright`}</title>
      {back}
      <PageHeader
        title={b.name}
        description={
          <>
            {isArchived && (
              <>
                <Badge>Archived</Badge>{' '}
              </>
            )}
            Version {b.version} · changed {formatDateTime(b.updatedAt)}
            {b.updatedBy ? ` by ${b.updatedBy}` : ''}
            {b.lastRun && (
              <>
                {' · last run '}
                <Link to={`/runs/${b.lastRun.id}`} className="font-semibold text-frost-700 hover:underline">
                  {formatDateTime(b.lastRun.createdAt)}
                </Link>{' '}
                <RunStatusBadge status={b.lastRun.status} />
              </>
            )}
          </>
        }
        action={
          canWrite && isArchived ? (
            <Button variant="secondary" onClick={() => unarchive.mutate(b.id)} pending={unarchive.isPending} pendingLabel="Unarchiving…">
              Unarchive
            </Button>
          ) : canWrite ? (
            <div className="flex flex-wrap gap-2">
              {!editing && (
                <Button variant="secondary" onClick={() => setEditing(true)}>
                  Edit the brief
                </Button>
              )}
              <Button onClick={run} pending={startRun.isPending} pendingLabel="Starting…" disabled={editing}>
                Run optimiser
              </Button>
            </div>
          ) : (
            <Badge>Read only</Badge>
          )
        }
      />
      {startRun.isError && <FormMessage>{errorMessage(startRun.error)}</FormMessage>}
      {unarchive.isError && <FormMessage>{errorMessage(unarchive.error)}</FormMessage>}
      {isArchived && (
        <div role="status" className="mb-gutter rounded-control border border-ink-100 bg-ink-50 px-4 py-3 text-small text-ink-700">
          Archived {formatDateTime(b.archivedAt!)}
          {b.archivedBy ? ` by ${b.archivedBy}` : ''}. It is read-only and not in the list of briefs; its runs, candidates, reviews and
          audit trail are kept as they were. {canWrite ? 'Unarchive it to edit or run it again.' : ''}
        </div>
      )}

      <div className="flex flex-col gap-gutter">
        <Card>
          <CardHeader
            title={editing ? 'Edit the brief' : 'The brief'}
            description={editing ? 'Saving makes a new version; earlier runs keep the version they ran.' : undefined}
          />
          <CardBody>
            {editing ? (
              <BriefForm
                key={`${b.id}-${b.version}`}
                brief={b}
                currency={me.workspace.currency}
                onSaved={() => setEditing(false)}
                onCancel={() => setEditing(false)}
                onReload={async () => (await brief.refetch()).data}
              />
            ) : (
              <BriefSummary brief={b} currency={me.workspace.currency} />
            )}
          </CardBody>
        </Card>

        <Card>
          <CardHeader title="Runs" description="Each run optimises the brief as it was when the run started." />
          <CardBody>
            <BriefRunsList briefId={b.id} currentVersion={b.version} lastRun={b.lastRun} />
          </CardBody>
        </Card>

        {canWrite && !editing && !isArchived && (
          <div className="flex flex-col gap-3">
            <div className="flex flex-wrap items-center gap-3">
              {confirming === 'archive' ? (
                <>
                  <span className="text-small text-ink-700">
                    Archive “{b.name}”? It leaves the list of briefs and becomes read-only (no edits, no new runs). Its runs, candidates, reviews and
                    audit trail are kept, and it can be unarchived at any time.
                  </span>
                  <Button size="sm" pending={archive.isPending} pendingLabel="Archiving…" onClick={doArchive}>
                    Yes, archive it
                  </Button>
                  <Button variant="ghost" size="sm" onClick={() => setConfirming(null)}>
                    Keep it active
                  </Button>
                </>
              ) : confirming === 'delete' ? (
                <>
                  <span className="text-small text-ink-700">
                    Delete “{b.name}” with its runs and candidates for good? A brief whose candidates went to review cannot be deleted; archive it
                    instead.
                  </span>
                  <Button variant="danger" size="sm" pending={remove.isPending} onClick={() => remove.mutate(b.id, { onSuccess: () => void navigate('/briefs') })}>
                    Yes, delete it
                  </Button>
                  <Button variant="ghost" size="sm" onClick={() => setConfirming(null)}>
                    Keep it
                  </Button>
                </>
              ) : (
                <>
                  <Button variant="secondary" size="sm" onClick={() => setConfirming('archive')}>
                    Archive this brief
                  </Button>
                  <Button variant="ghost" size="sm" onClick={() => setConfirming('delete')}>
                    Delete this brief
                  </Button>
                </>
              )}
            </div>
            {remove.isError && (
              <div className="flex flex-wrap items-center gap-3">
                <FormMessage>{errorMessage(remove.error)}</FormMessage>
                {deleteRefused && confirming !== 'archive' && (
                  <Button variant="secondary" size="sm" onClick={() => setConfirming('archive')}>
                    Archive instead
                  </Button>
                )}
              </div>
            )}
            {archive.isError && <FormMessage>{errorMessage(archive.error)}</FormMessage>}
          </div>
        )}
      </div>
    </>
  );
}
