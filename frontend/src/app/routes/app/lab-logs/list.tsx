import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '@/components/ui/page-header';
import { LabLogList } from '@/features/lab-logs/components/lab-log-list';
import { LabLogUpload } from '@/features/lab-logs/components/lab-log-upload';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

export default function LabLogsRoute() {
  const me = useSessionUser();
  const canUpload = hasRole(me, ['chemist', 'admin']);
  return (
    <>
      <title>Lab logs · Packwright</title>
      <PageHeader title="Lab logs" description="Recorded temperature curves against the model's prediction, and the calibrations fitted to them." />
      <div className="flex flex-col gap-6">
        {canUpload && <LabLogUpload />}
        <LabLogList />
      </div>
    </>
  );
}
