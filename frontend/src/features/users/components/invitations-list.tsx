import { ROLE_LABELS } from '@shared/schemas/common';
import type { Invitation } from '@shared/schemas/users';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { errorMessage } from '@/lib/api-client';
import { formatDateTime, formatRelative } from '@/lib/format';
import { useRevokeInvitation } from '../api/revoke-invitation';

export function InvitationsList({ invitations }: { invitations: Invitation[] }) {
  const pending = invitations.filter((invitation) => invitation.status === 'pending');
  if (pending.length === 0) {
    return <EmptyState title="No invitations are waiting">Invitations you send appear here until they are accepted.</EmptyState>;
  }
  return (
    <ul className="divide-y divide-ink-100">
      {pending.map((invitation) => (
        <InvitationRow key={invitation.id} invitation={invitation} />
      ))}
    </ul>
  );
}

function InvitationRow({ invitation }: { invitation: Invitation }) {
  const revoke = useRevokeInvitation();
  return (
    <li className="py-3 first:pt-0 last:pb-0">
      <div className="grid grid-cols-[minmax(0,1fr)_auto] items-start gap-3">
        <div className="min-w-0">
          <p className="font-bold text-ink-900">
            {invitation.name} <span className="font-semibold text-ink-500">· {ROLE_LABELS[invitation.role]}</span>
          </p>
          <p className="break-all text-small text-ink-600">{invitation.email}</p>
          <p className="text-caption text-ink-500">
            Invited by {invitation.invitedBy} {formatRelative(invitation.createdAt)} ·{' '}
            <span title={formatDateTime(invitation.expiresAt)}>expires {formatRelative(invitation.expiresAt)}</span>
          </p>
        </div>
        <Button size="sm" variant="danger" pending={revoke.isPending} onClick={() => revoke.mutate(invitation.id)}>
          Revoke<span className="sr-only"> the invitation for {invitation.email}</span>
        </Button>
      </div>
      {revoke.isError && (
        <p role="alert" className="mt-2 text-small font-semibold text-rust-600">
          Could not revoke: {errorMessage(revoke.error)}
        </p>
      )}
    </li>
  );
}
