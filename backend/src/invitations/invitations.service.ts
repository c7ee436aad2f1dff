import { Op, type WhereOptions } from 'sequelize';
import { INVITATION_VALID_HOURS, type AcceptInvitationRequest, type CreateInvitationRequest, type Invitation, type InvitationListQuery, type Paged } from '@shared/schemas';
import { appUrl } from '../app-url';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn } from '../http/paging';
import { sendMail } from '../mail/mailer';
import { linkMail, plainMail } from '../mail/templates';
import { recordAudit } from '../audit/audit.service';
import { hashToken, newOneTimeToken } from '../auth/one-time-token';
import { hashPassword } from '../auth/passwords';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { Workspace } from '../workspaces/workspace.model';
import { InvitationRecord } from './invitation.model';

const INVALID_TOKEN = () =>
  new AppError({ status: 400, code: 'invalid_token', message: 'This invitation link is invalid, already used, revoked or expired. Ask your administrator for a new one.' });

function statusOf(inv: InvitationRecord, now = new Date()): Invitation['status'] {
  if (inv.acceptedAt) return 'accepted';
  if (inv.revokedAt) return 'revoked';
  if (inv.expiresAt <= now) return 'expired';
  return 'pending';
}

function toDto(inv: InvitationRecord): Invitation {
  return {
    id: inv.id,
    email: inv.email,
    name: inv.name,
    role: inv.role,
    status: statusOf(inv),
    invitedBy: inv.invitedBy?.name ?? '',
    expiresAt: inv.expiresAt.toISOString(),
    createdAt: inv.createdAt.toISOString(),
  };
}

/** The SQL condition of each status, the same rules as {@link statusOf}. */
function statusWhere(status: Invitation['status'], now: Date): WhereOptions {
  if (status === 'accepted') return { acceptedAt: { [Op.ne]: null } };
  if (status === 'revoked') return { acceptedAt: null, revokedAt: { [Op.ne]: null } };
  if (status === 'expired') return { acceptedAt: null, revokedAt: null, expiresAt: { [Op.lte]: now } };
  return { acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: now } };
}

export async function listInvitations(workspaceId: number, query: InvitationListQuery): Promise<Paged<Invitation>> {
  const { column, direction } = sortColumn(query.sort, { createdAt: 'createdAt', email: 'email', expiresAt: 'expiresAt' });
  const { rows, count } = await InvitationRecord.findAndCountAll({
    where: { workspaceId, ...(query.status ? statusWhere(query.status, new Date()) : {}) },
    include: [{ model: UserRecord, as: 'invitedBy', attributes: ['name'] }],
    order: [[column, direction], ['id', direction]],
    ...pageWindow(query),
    distinct: true,
  });
  return pageOf(query, rows.map((r) => toDto(r)), count);
}

/**
 * Creates an invitation and e-mails its one-time link; if the mail cannot be sent, nothing is kept.
 *
 * An address belongs to one workspace (users.email is unique). Inviting a member of this
 * workspace answers 409 `already_member` (the administrator can see their own members anyway).
 * Inviting an address that has an account in ANOTHER workspace must not tell this workspace so:
 * the answer, the invitation kept and the time taken are those of any invitation, and a message
 * goes to the address; only its owner learns, from that message, that the address cannot join
 * (it carries no link, so the invitation simply expires). See DEVELOPERS.md, "Invitations".
 * A new invitation to an address with a pending one replaces it (`resent: true`).
 */
export async function createInvitation(actor: AuthUser, input: CreateInvitationRequest): Promise<{ invitation: Invitation; resent: boolean }> {
  const existing = await UserRecord.findOne({ where: { email: input.email } });
  if (existing && existing.workspaceId === actor.workspaceId) {
    throw new AppError({
      status: 409,
      code: 'already_member',
      message: `${input.email} is already a member of this workspace${existing.disabled ? ' (disabled; enable them under Users)' : ''}.`,
      fields: [{ field: 'email', message: 'is already a member of this workspace' }],
    });
  }
  const elsewhere = existing !== null;
  const { token, tokenHash } = newOneTimeToken();
  return sequelize.transaction(async (transaction) => {
    // A new invitation to the same address replaces any pending one (an expired one stays expired).
    const [replaced] = await InvitationRecord.update(
      { revokedAt: new Date() },
      { where: { workspaceId: actor.workspaceId, email: input.email, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
    );
    const invitation = await InvitationRecord.create(
      {
        workspaceId: actor.workspaceId,
        email: input.email,
        name: input.name,
        role: input.role,
        tokenHash,
        invitedById: actor.id,
        expiresAt: new Date(Date.now() + INVITATION_VALID_HOURS * 3600_000),
      },
      { transaction },
    );
    // The audit detail stays as for any invitation: the workspace's records must not tell either.
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'invitation.create', entityType: 'invitation', entityId: invitation.id, detail: { email: input.email, role: input.role, resent: replaced > 0 } }, transaction);
    const invitedTo = `${actor.name} invites you to join ${actor.workspace.name} on Packwright as ${input.role}.`;
    const body = elsewhere
      ? plainMail({
          greeting: `Hello ${input.name},`,
          lines: [
            invitedTo,
            'This address already has a Packwright account in another workspace, and an address can belong to one workspace only, so this invitation cannot be accepted.',
            `To join ${actor.workspace.name}, ask ${actor.name} to invite another address of yours. We have not told ${actor.workspace.name} that this address has an account.`,
          ],
        })
      : linkMail({
          greeting: `Hello ${input.name},`,
          lines: [invitedTo, `The link is valid for ${INVITATION_VALID_HOURS} hours and works once.`],
          linkLabel: 'Accept the invitation and choose a password',
          link: appUrl(`/accept-invitation?token=${encodeURIComponent(token)}`),
          footer: 'If you did not expect this invitation, you can ignore this message.',
        });
    try {
      // The message belongs to its recipient: one with an account elsewhere is filed under their own
      // workspace, so the inviting workspace's mail view (the local sink) does not show it either.
      await sendMail({ to: input.email, subject: `You are invited to ${actor.workspace.name} on Packwright`, ...body, workspaceId: existing?.workspaceId ?? actor.workspaceId });
    } catch (error) {
      console.error('[mail] invitation could not be sent:', error);
      throw new AppError({ status: 503, code: 'mail_unavailable', message: 'The invitation e-mail could not be sent, so no invitation was created. Check the mail settings and try again.' });
    }
    invitation.invitedBy = await UserRecord.findByPk(actor.id, { transaction }) ?? undefined;
    return { invitation: toDto(invitation), resent: replaced > 0 };
  });
}

export async function revokeInvitation(actor: AuthUser, id: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const inv = await InvitationRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!inv) throw AppError.notFound('Invitation');
    if (statusOf(inv) !== 'pending') throw AppError.conflict(`This invitation is already ${statusOf(inv)}.`, 'not_pending');
    await inv.update({ revokedAt: new Date() }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'invitation.revoke', entityType: 'invitation', entityId: inv.id }, transaction);
  });
}

async function findPending(token: string, transaction?: import('sequelize').Transaction) {
  return InvitationRecord.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: Workspace, as: 'workspace' }],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: InvitationRecord } : undefined,
  });
}

export async function lookupInvitation(token: string) {
  const inv = await findPending(token);
  if (!inv) throw INVALID_TOKEN();
  return { email: inv.email, name: inv.name, role: inv.role, workspaceName: inv.workspace?.name ?? '' };
}

/** Spends the invitation and creates the member in one transaction; answers the new user's id. */
export async function acceptInvitation(input: AcceptInvitationRequest): Promise<number> {
  const passwordHash = await hashPassword(input.password);
  return sequelize.transaction(async (transaction) => {
    const inv = await findPending(input.token, transaction);
    if (!inv) throw INVALID_TOKEN();
    if (await UserRecord.findOne({ where: { email: inv.email }, transaction })) {
      throw new AppError({ status: 409, code: 'email_taken', message: 'An account with this address already exists. Sign in instead.' });
    }
    const user = await UserRecord.create({ workspaceId: inv.workspaceId, email: inv.email, name: input.name, passwordHash, role: inv.role }, { transaction });
    await inv.update({ acceptedAt: new Date() }, { transaction });
    await recordAudit({ workspaceId: inv.workspaceId, actorId: user.id, action: 'invitation.accept', entityType: 'invitation', entityId: inv.id }, transaction);
    return user.id;
  });
}
