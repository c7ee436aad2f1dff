import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { ROLES, ROLE_LABELS, roleSchema, type Role } from '@shared/schemas/common';
import type { User } from '@shared/schemas/users';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { EmptyState } from '@/components/ui/empty-state';
import { isApiError, errorMessage } from '@/lib/api-client';
import { formatDateTime, formatRelative } from '@/lib/format';
import { usersKeys } from '../api/get-users';
import { useUpdateUser } from '../api/update-user';

export function UsersTable({ users, currentUserId }: { users: User[]; currentUserId: number }) {
  if (users.length === 0) return <EmptyState title="No members yet">Invite someone below.</EmptyState>;
  const sorted = [...users].sort((a, b) => Number(a.disabled) - Number(b.disabled) || a.name.localeCompare(b.name));
  return (
    <div className="-mx-5 overflow-x-auto">
      <table className="w-full min-w-[50rem] text-left text-small">
        <caption className="sr-only">Workspace members</caption>
        <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500 uppercase">
          <tr>
            <th scope="col" className="px-5 py-2">Member</th>
            <th scope="col" className="px-3 py-2">Role</th>
            <th scope="col" className="px-3 py-2">Status</th>
            <th scope="col" className="px-3 py-2">Last sign-in</th>
            <th scope="col" className="px-5 py-2 text-right">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {sorted.map((user) => (
            <UserRow key={user.id} user={user} isSelf={user.id === currentUserId} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

function UserRow({ user, isSelf }: { user: User; isSelf: boolean }) {
  const queryClient = useQueryClient();
  const update = useUpdateUser();
  const stale = isApiError(update.error) && update.error.status === 409;
  // A role is chosen first and saved on purpose, so browsing the options never sends a change.
  const [draftRole, setDraftRole] = useState<Role | null>(null);
  const roleChanged = draftRole !== null && draftRole !== user.role;
  const savingRole = update.isPending && update.variables.role !== undefined;
  const pendingDisabled = update.isPending ? update.variables.disabled : undefined;

  const change = (patch: { role?: Role; disabled?: boolean }) =>
    update.mutate(
      { id: user.id, version: user.version, ...patch },
      { onSuccess: () => setDraftRole(null) },
    );

  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: usersKeys.all });
    setDraftRole(null);
    update.reset();
  };

  return (
    <>
      <tr className={user.disabled ? 'bg-ink-50/70 text-ink-500' : undefined}>
        <td className="px-5 py-3">
          <p className="font-bold text-ink-900">
            {user.name}
            {isSelf && <span className="ml-2 text-caption font-semibold text-ink-500">(you)</span>}
          </p>
          <p className="break-all text-ink-600">{user.email}</p>
        </td>
        <td className="px-3 py-3">
          <div className="flex items-center gap-2">
            <SelectField
              label={`Role of ${user.name}`}
              hideLabel
              controlSize="sm"
              containerClassName="w-48"
              value={draftRole ?? user.role}
              disabled={isSelf || update.isPending}
              title={isSelf ? 'You cannot change your own role.' : undefined}
              onChange={(event) => {
                const parsed = roleSchema.safeParse(event.target.value);
                if (parsed.success) setDraftRole(parsed.data);
              }}
            >
              {ROLES.map((role) => (
                <option key={role} value={role}>
                  {ROLE_LABELS[role]}
                </option>
              ))}
            </SelectField>
            {roleChanged && (
              <>
                <Button size="sm" pending={savingRole} disabled={update.isPending} onClick={() => change({ role: draftRole })}>
                  Save<span className="sr-only"> the role of {user.name}</span>
                </Button>
                <Button size="sm" variant="ghost" disabled={update.isPending} onClick={() => setDraftRole(null)}>
                  Cancel
                </Button>
              </>
            )}
          </div>
        </td>
        <td className="px-3 py-3">
          {(pendingDisabled ?? user.disabled) ? <Badge tone="danger">Disabled</Badge> : <Badge tone="success">Active</Badge>}
        </td>
        <td className="px-3 py-3 whitespace-nowrap" title={formatDateTime(user.lastLoginAt)}>
          {user.lastLoginAt ? formatRelative(user.lastLoginAt) : 'Never'}
        </td>
        <td className="px-5 py-3 text-right">
          {!isSelf && (
            <Button
              size="sm"
              variant={user.disabled ? 'secondary' : 'danger'}
              pending={pendingDisabled !== undefined}
              disabled={update.isPending}
              onClick={() => change({ disabled: !user.disabled })}
            >
              {user.disabled ? 'Enable' : 'Disable'}
              <span className="sr-only"> {user.name}</span>
            </Button>
          )}
        </td>
      </tr>
      {update.isError && (
        <tr>
          <td colSpan={5} className="px-5 pb-3">
            <div
              role="alert"
              className="flex flex-wrap items-center justify-between gap-3 rounded-control border border-rust-100 bg-rust-50 px-3 py-2 text-small text-rust-700"
            >
              <span>
                {stale
                  ? `Someone else changed ${user.name} while you were looking. Reload to see their change, then try again.`
                  : `Could not change ${user.name}: ${errorMessage(update.error)}`}
              </span>
              <span className="flex gap-2">
                {stale ? (
                  <Button size="sm" variant="secondary" onClick={() => void reload()}>
                    Reload
                  </Button>
                ) : (
                  <Button size="sm" variant="ghost" onClick={() => update.reset()}>
                    Dismiss
                  </Button>
                )}
              </span>
            </div>
          </td>
        </tr>
      )}
    </>
  );
}
