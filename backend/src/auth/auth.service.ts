import { Op } from 'sequelize';
import { PASSWORD_RESET_VALID_HOURS } from '@shared/schemas';
import { appUrl } from '../app-url';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { sendMail } from '../mail/mailer';
import { enqueueMailJob, registerMailJob } from '../mail/mail-queue';
import { linkMail } from '../mail/templates';
import { UserRecord } from '../users/user.model';
import { recordAudit } from '../audit/audit.service';
import { hashToken, newOneTimeToken } from './one-time-token';
import { hashPassword } from './passwords';
import { PasswordResetTokenRecord } from './password-reset-token.model';

export const PASSWORD_RESET_ANSWER =
  'If that address belongs to an account, we have sent it a link to choose a new password. The link is valid for 1 hour.';

export async function recordLogin(userId: number): Promise<UserRecord> {
  const user = await UserRecord.findByPk(userId);
  if (!user) throw AppError.unauthenticated();
  await user.update({ lastLoginAt: new Date() }, { silent: true });
  return user;
}

const PASSWORD_RESET_JOB = 'password-reset';

/**
 * Starts a reset. The answer never reveals whether the address exists: for every address the
 * request does the same work — one job put on the mail queue — and answers at once; the lookup,
 * the link and the send happen in the background (a send that fails is retried).
 */
export async function requestPasswordReset(email: string): Promise<void> {
  try {
    await enqueueMailJob(PASSWORD_RESET_JOB, { email });
  } catch (error) {
    console.error('[mail] password reset could not be queued:', error);
    throw new AppError({ status: 503, code: 'mail_unavailable', message: 'Password reset is unavailable right now. Try again in a few moments.' });
  }
}

/**
 * The background half of a reset: for an active account, revoke the links still pending (a new
 * request makes older links void), store the new link's hash, and send the mail. Throwing fails
 * the job, and the queue tries again with a fresh link.
 */
export async function deliverPasswordReset(email: string): Promise<void> {
  const user = await UserRecord.findOne({ where: { email: email.trim().toLowerCase() } });
  if (!user || user.disabled) return;
  const { token, tokenHash } = newOneTimeToken();
  await sequelize.transaction(async (transaction) => {
    await PasswordResetTokenRecord.update(
      { revokedAt: new Date() },
      { where: { userId: user.id, usedAt: null, revokedAt: null }, transaction },
    );
    await PasswordResetTokenRecord.create(
      { userId: user.id, tokenHash, expiresAt: new Date(Date.now() + PASSWORD_RESET_VALID_HOURS * 3600_000) },
      { transaction },
    );
  });
  const link = appUrl(`/reset-password?token=${encodeURIComponent(token)}`);
  const body = linkMail({
    greeting: `Hello ${user.name},`,
    lines: ['Someone asked to reset the password of your Packwright account. If it was you, choose a new password within 1 hour. Only the newest link you were sent works.'],
    linkLabel: 'Choose a new password',
    link,
    footer: 'If you did not ask for this, ignore this message; your password stays as it is.',
  });
  await sendMail({ to: user.email, subject: 'Reset your Packwright password', ...body, workspaceId: user.workspaceId });
}

registerMailJob(PASSWORD_RESET_JOB, async (payload) => {
  if (typeof payload.email === 'string') await deliverPasswordReset(payload.email);
});

/** Spends a reset token and sets the password; older sessions and the user's other reset links stop working. */
export async function confirmPasswordReset(token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await sequelize.transaction(async (transaction) => {
    const record = await PasswordResetTokenRecord.findOne({
      where: { tokenHash: hashToken(token), usedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!record) {
      throw new AppError({ status: 400, code: 'invalid_token', message: 'This reset link is invalid, already used or expired. Ask for a new one.' });
    }
    const user = await UserRecord.findByPk(record.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || user.disabled) {
      throw new AppError({ status: 400, code: 'invalid_token', message: 'This reset link is invalid, already used or expired. Ask for a new one.' });
    }
    await record.update({ usedAt: new Date() }, { transaction });
    const [revoked] = await PasswordResetTokenRecord.update(
      { revokedAt: new Date() },
      { where: { userId: user.id, usedAt: null, revokedAt: null, id: { [Op.ne]: record.id } }, transaction },
    );
    await user.update({ passwordHash, tokenVersion: user.tokenVersion + 1 }, { transaction });
    await recordAudit({ workspaceId: user.workspaceId, actorId: user.id, action: 'user.password_reset', entityType: 'user', entityId: user.id, detail: { otherLinksRevoked: revoked } }, transaction);
  });
}

/**
 * Ends the member's sessions: the token version goes up, so every token issued before (this
 * bearer token, the cookie, other devices) stops working at once (passport.ts compares `tv`).
 */
export async function endSessions(userId: number): Promise<void> {
  await UserRecord.increment({ tokenVersion: 1 }, { where: { id: userId } });
}
