import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { labLogQueryOptions, useLabLog } from '@/features/lab-logs/api/lab-logs';
import { LabLogDetail } from '@/features/lab-logs/components/lab-log-detail';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    void queryClient.prefetchQuery(labLogQueryOptions(Number(params.id)));
    return null;
  };

export default function LabLogRoute() {
  const id = Number(useParams().id);
  const me = useSessionUser();
  const q = useLabLog(id);
  return (
    <>
      <title>{`${q.data?.labLog.name ?? 'Lab log'} · Packwright`}</title>
      <PageHeader
        title={q.data?.labLog.name ?? 'Lab log'}
        description={q.data ? `Uploaded by ${q.data.labLog.createdBy || 'a chemist'}; file SHA-256 ${q.data.labLog.sha256.slice(0, 12)}…` : undefined}
        action={<ButtonLink to="/lab-logs" variant="secondary">All lab logs</ButtonLink>}
      />
      <LabLogDetail id={id} canCalibrate={hasRole(me, ['chemist', 'admin'])} />
    </>
  );
}
