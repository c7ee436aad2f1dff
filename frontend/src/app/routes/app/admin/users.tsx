import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getInvitationsQueryOptions, useInvitations } from '@/features/users/api/get-invitations';
import { getUsersQueryOptions, useUsers } from '@/features/users/api/get-users';
import { Pager, usePageState } from '@/components/ui/pager';
import { InvitationsList } from '@/features/users/components/invitations-list';
import { InviteForm } from '@/features/users/components/invite-form';
import { UsersTable } from '@/features/users/components/users-table';
import { formatCount } from '@/lib/format';
import { useSessionUser } from '@/lib/session';
import { requireRole } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireRole(queryClient, request, ['admin']);
    void queryClient.prefetchQuery(getUsersQueryOptions());
    void queryClient.prefetchQuery(getInvitationsQueryOptions({ page: 1, pageSize: 10, status: 'pending' }));
    return null;
  };

export default function AdminUsersRoute() {
  const me = useSessionUser();
  const userPaging = usePageState(25);
  const invitationPaging = usePageState(10);
  const users = useUsers({ page: userPaging.page, pageSize: userPaging.pageSize });
  // Only pending invitations are listed; the server filters and counts them.
  const invitations = useInvitations({ page: invitationPaging.page, pageSize: invitationPaging.pageSize, status: 'pending' });
  const pendingCount = invitations.data?.total;

  return (
    <>
      <title>People · Packwright</title>
      <PageHeader
        title="People"
        description={`Who works in ${me.workspace.name}, and in which role. Disabled members cannot sign in; their work stays.`}
      />

      <div className="grid grid-cols-1 items-start gap-gutter xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card>
          <CardHeader
            title="Members"
            description={users.data ? formatCount(users.data.total, 'member') : undefined}
          />
          <CardBody>
            {users.isPending ? (
              <Loading label="Loading members…" />
            ) : users.isError ? (
              <QueryError error={users.error} onRetry={() => void users.refetch()} retrying={users.isFetching} />
            ) : (
              <div className="flex flex-col gap-3">
                <UsersTable users={users.data.items} currentUserId={me.id} />
                <Pager noun="member" label="Pages of the members" page={userPaging.page} pageSize={userPaging.pageSize} total={users.data.total} onPageChange={userPaging.setPage} pageSizes={[25, 50, 100]} onPageSizeChange={userPaging.setPageSize} />
              </div>
            )}
          </CardBody>
        </Card>

        <div className="flex flex-col gap-gutter">
          <Card>
            <CardHeader title="Invite someone" description="They get an e-mail with a link to join this workspace." />
            <CardBody>
              <InviteForm />
            </CardBody>
          </Card>

          <Card>
            <CardHeader
              title="Pending invitations"
              description={pendingCount !== undefined ? formatCount(pendingCount, 'invitation') + ' waiting' : undefined}
            />
            <CardBody>
              {invitations.isPending ? (
                <Loading label="Loading invitations…" />
              ) : invitations.isError ? (
                <QueryError error={invitations.error} onRetry={() => void invitations.refetch()} retrying={invitations.isFetching} />
              ) : (
                <div className="flex flex-col gap-3">
                  <InvitationsList invitations={invitations.data.items} />
                  <Pager noun="invitation" label="Pages of the pending invitations" page={invitationPaging.page} pageSize={invitationPaging.pageSize} total={invitations.data.total} onPageChange={invitationPaging.setPage} />
                </div>
              )}
            </CardBody>
          </Card>
        </div>
      </div>
    </>
  );
}
