import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Pager, usePageState } from '@/components/ui/pager';
import { Loading } from '@/components/ui/spinner';
import { getMailMessagesQueryOptions, useMailMessages } from '@/features/mail/api/get-mail-messages';
import { MailInbox } from '@/features/mail/components/mail-inbox';
import { requireRole } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireRole(queryClient, request, ['admin']);
    void queryClient.prefetchQuery(getMailMessagesQueryOptions());
    return null;
  };

export default function AdminMailRoute() {
  const paging = usePageState(25);
  const mail = useMailMessages({ page: paging.page, pageSize: paging.pageSize });
  const [checking, setChecking] = useState(false);
  const checkNow = () => {
    setChecking(true);
    void mail.refetch().finally(() => setChecking(false));
  };

  return (
    <>
      <title>Mail sink · Packwright</title>
      <PageHeader
        title="Mail sink"
        description="The local mail sink catches every message Packwright sends for this workspace, so invitations and reset links can be followed without a real mailbox."
        action={
          <Button variant="secondary" onClick={checkNow} pending={checking}>
            Check for new mail
          </Button>
        }
      />
      {mail.isPending ? (
        <Loading label="Loading messages…" />
      ) : mail.isError ? (
        <QueryError error={mail.error} onRetry={() => void mail.refetch()} retrying={mail.isFetching} />
      ) : !mail.data.enabled ? (
        <Alert tone="info" title="The local mail sink is not running">
          Packwright is sending mail through a real mail server, so messages are not kept here.
        </Alert>
      ) : (
        <div className="flex flex-col gap-3">
          <MailInbox messages={mail.data.items} />
          <Pager noun="message" label="Pages of the mail" page={paging.page} pageSize={paging.pageSize} total={mail.data.total} onPageChange={paging.setPage} pageSizes={[25, 50, 100]} onPageSizeChange={paging.setPageSize} />
        </div>
      )}
    </>
  );
}
