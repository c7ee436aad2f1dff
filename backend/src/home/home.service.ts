import { Op } from 'sequelize';
import type { HomeResponse, Role } from '@shared/schemas';
import type { AuthUser } from '../auth/session-user';
import { InvitationRecord } from '../invitations/invitation.model';

type WaitingItem = HomeResponse['waiting'][number];
type WaitingProvider = (user: AuthUser) => Promise<{ items: WaitingItem[]; counts?: Record<string, number> }>;

const providers: { roles: Role[]; provide: WaitingProvider }[] = [];

/** Features add what is waiting for a role here (briefs to run, candidates to review, ...). */
export function registerWaitingProvider(roles: Role[], provide: WaitingProvider): void {
  providers.push({ roles, provide });
}

registerWaitingProvider(['admin'], async (user) => {
  const pending = await InvitationRecord.findAll({
    where: { workspaceId: user.workspaceId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['expiresAt', 'ASC']],
    limit: 20,
  });
  return {
    items: pending.map((inv) => ({
      kind: 'invitation',
      title: `Invitation to ${inv.name} (${inv.role}) not yet accepted`,
      detail: `Sent to ${inv.email}; the link expires in ${hoursLeft(inv.expiresAt)}.`,
      href: '/admin/users',
    })),
    counts: { pendingInvitations: pending.length },
  };
});

function hoursLeft(when: Date): string {
  const hours = Math.max(0, Math.round((when.getTime() - Date.now()) / 3600_000));
  return hours === 1 ? '1 hour' : `${hours} hours`;
}

export async function homeFor(user: AuthUser): Promise<HomeResponse> {
  const results = await Promise.all(providers.filter((p) => p.roles.includes(user.role)).map((p) => p.provide(user)));
  return {
    role: user.role,
    waiting: results.flatMap((r) => r.items),
    counts: Object.assign({}, ...results.map((r) => r.counts ?? {})),
  };
}
