import type { Role } from '@shared/schemas/common';
import { ROLE_LABELS } from '@shared/schemas/roles';
import { ButtonLink } from '@/components/ui/button';
import { StatusPage } from './status-page';

function listRoles(roles: readonly Role[]): string {
  const labels = roles.map((role) => ROLE_LABELS[role].toLowerCase());
  if (labels.length <= 1) return labels[0] ?? 'another role';
  return `${labels.slice(0, -1).join(', ')} or ${labels[labels.length - 1]}`;
}

export function ForbiddenMessage({ roles, role }: { roles?: readonly Role[]; role?: Role }) {
  return (
    <StatusPage
      eyebrow="Not for your role"
      title="This page belongs to another role"
      actions={<ButtonLink to="/">Go to your home page</ButtonLink>}
    >
      <p>
        {roles && roles.length > 0 ? `Only a workspace ${listRoles(roles)} can use this page` : 'Your role cannot use this page'}
        {role ? `, and you are signed in as a ${ROLE_LABELS[role].toLowerCase()}.` : '.'}
      </p>
      <p className="mt-2">If you need it, ask your workspace administrator to change your role.</p>
    </StatusPage>
  );
}
