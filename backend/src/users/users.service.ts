import { Op, type WhereOptions } from 'sequelize';
import type { Paged, UpdateUserRequest, User, UserListQuery } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { likePattern, pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { ReviewRecordModel } from '../reviews/review.model';
import { UserRecord } from './user.model';

export function toUserDto(user: UserRecord): User {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    disabled: user.disabled,
    createdAt: user.createdAt.toISOString(),
    lastLoginAt: user.lastLoginAt ? user.lastLoginAt.toISOString() : null,
    version: user.version,
  };
}

export async function listUsers(workspaceId: number, query: UserListQuery): Promise<Paged<User>> {
  const and: WhereOptions[] = [{ workspaceId }];
  if (query.q) {
    const p = likePattern(query.q);
    and.push({ [Op.or]: [{ name: { [Op.iLike]: p } }, { email: { [Op.iLike]: p } }] });
  }
  if (query.role) and.push({ role: query.role });
  if (query.disabled !== undefined) and.push({ disabled: query.disabled });
  const { column, direction } = sortColumn(query.sort, { name: 'name', email: 'email', role: 'role', createdAt: 'createdAt', lastLoginAt: 'lastLoginAt' });
  const { rows, count } = await UserRecord.findAndCountAll({
    where: { [Op.and]: and },
    order: [[column, direction === 'DESC' ? 'DESC NULLS LAST' : 'ASC NULLS FIRST'], ['name', 'ASC'], ['id', 'ASC']],
    ...pageWindow(query),
  });
  return pageOf(query, rows.map(toUserDto), count);
}

/** Changes a member's role or disables them. Disabling bumps the token version, ending their sessions. */
export async function updateUser(actor: AuthUser, userId: number, change: UpdateUserRequest): Promise<User> {
  if (userId === actor.id) {
    throw new AppError({ status: 400, code: 'self_change', message: 'You cannot change your own role or disable yourself; ask another administrator.', fields: [{ field: 'id', message: 'is your own account' }] });
  }
  return sequelize.transaction(async (transaction) => {
    const user = await UserRecord.findOne({ where: { id: userId, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw AppError.notFound('User');
    if (user.version !== change.version) throw AppError.staleVersion('user');
    const before = { role: user.role, disabled: user.disabled };
    const disabling = change.disabled === true && !user.disabled;
    await user.update(
      {
        role: change.role ?? user.role,
        disabled: change.disabled ?? user.disabled,
        tokenVersion: disabling ? user.tokenVersion + 1 : user.tokenVersion,
        version: user.version + 1,
      },
      { transaction },
    );
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'user.update', entityType: 'user', entityId: user.id, detail: { before, after: { role: user.role, disabled: user.disabled } } },
      transaction,
    );
    // A role change gets an entry of its own: who changed whose role, from what to what, and
    // which sign-offs the member had already given (separation of duties follows the person).
    if (before.role !== user.role) {
      const decisions = await ReviewRecordModel.count({ where: { workspaceId: actor.workspaceId, reviewerId: user.id }, transaction });
      await recordAudit(
        { workspaceId: actor.workspaceId, actorId: actor.id, action: 'user.role_change', entityType: 'user', entityId: user.id, detail: { email: user.email, from: before.role, to: user.role, reviewDecisionsSoFar: decisions } },
        transaction,
      );
    }
    return toUserDto(user);
  });
}
