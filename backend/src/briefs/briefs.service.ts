import { briefSchema, updateBriefRequestSchema, type Brief, type BriefInput } from '@shared/schemas/briefs';
import type { BriefListQuery, BriefRecord as BriefDto } from '@shared/schemas/runs';
import { fieldErrorsFromZod, type Paged } from '@shared/schemas';
import { QueryTypes } from 'sequelize';
import type { z } from 'zod';
import { Op } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { likePattern, pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { RunRecord } from '../runs/run.model';
import { CandidateRecord } from '../candidates/candidate.model';
import { BriefRecord, BriefVersionRecord } from './brief.model';

const withPeople = [
  { model: UserRecord, as: 'createdBy', attributes: ['name'] },
  { model: UserRecord, as: 'updatedBy', attributes: ['name'] },
  { model: UserRecord, as: 'archivedBy', attributes: ['name'] },
];

/** Candidate states that make a review record: submitted, in review, or decided. */
const REVIEWED_STATES = ['in-chemistry-review', 'in-regulatory-review', 'approved', 'changes-requested', 'rejected'] as const;

async function toDto(b: BriefRecord): Promise<BriefDto> {
  const last = await RunRecord.findOne({ where: { briefId: b.id }, order: [['createdAt', 'DESC'], ['id', 'DESC']], attributes: ['id', 'status', 'createdAt'] });
  const candidates = last ? await CandidateRecord.count({ where: { runId: last.id } }) : 0;
  return {
    id: b.id,
    name: b.name,
    packType: b.packType,
    spec: b.spec,
    version: b.version,
    createdBy: b.createdBy?.name ?? '',
    updatedBy: b.updatedBy?.name ?? '',
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
    lastRun: last ? { id: last.id, status: last.status, createdAt: last.createdAt.toISOString(), candidates } : null,
    archivedAt: b.archivedAt ? b.archivedAt.toISOString() : null,
    archivedBy: b.archivedAt ? (b.archivedBy?.name ?? '') : null,
  };
}

interface BriefListRow {
  id: number;
  name: string;
  pack_type: 'cold' | 'warm';
  spec: BriefDto['spec'];
  version: number;
  created_at: Date;
  updated_at: Date;
  created_by: string | null;
  updated_by: string | null;
  archived_at: Date | null;
  archived_by: string | null;
  last_run_id: number | null;
  last_run_status: string | null;
  last_run_created_at: Date | null;
  last_run_candidates: string | null;
  total: string;
}

const BRIEF_SORT_COLUMNS = { name: 'b.name', updatedAt: 'b.updated_at', createdAt: 'b.created_at' } as const;

/**
 * One page of the workspace's briefs, each with its last run and that run's candidate count, in
 * one query: the last run by a lateral join, the count by a subquery, the total by a window.
 */
export async function listBriefs(workspaceId: number, query: BriefListQuery): Promise<Paged<BriefDto>> {
  const where = ['b.workspace_id = :workspaceId'];
  const replacements: Record<string, unknown> = { workspaceId, ...pageWindow(query) };
  if (query.q) {
    where.push('b.name ILIKE :q');
    replacements.q = likePattern(query.q);
  }
  if (query.packType) {
    where.push('b.pack_type = :packType');
    replacements.packType = query.packType;
  }
  // Archived briefs leave the default list and stay reachable by id (and with archived=true).
  where.push(query.archived === 'true' ? 'b.archived_at IS NOT NULL' : 'b.archived_at IS NULL');
  const { column, direction } = sortColumn(query.sort, BRIEF_SORT_COLUMNS);
  const rows = await sequelize.query<BriefListRow>(
    `SELECT b.id, b.name, b.pack_type, b.spec, b.version, b.created_at, b.updated_at,
            cu.name AS created_by, uu.name AS updated_by, b.archived_at, au.name AS archived_by,
            lr.id AS last_run_id, lr.status AS last_run_status, lr.created_at AS last_run_created_at,
            (SELECT count(*) FROM candidates c WHERE c.run_id = lr.id) AS last_run_candidates,
            count(*) OVER () AS total
       FROM briefs b
       LEFT JOIN users cu ON cu.id = b.created_by_id
       LEFT JOIN users uu ON uu.id = b.updated_by_id
       LEFT JOIN users au ON au.id = b.archived_by_id
       LEFT JOIN LATERAL (
         SELECT r.id, r.status, r.created_at FROM runs r
          WHERE r.workspace_id = b.workspace_id AND r.brief_id = b.id
          ORDER BY r.created_at DESC, r.id DESC LIMIT 1
       ) lr ON true
      WHERE ${where.join(' AND ')}
      ORDER BY ${column} ${direction}, b.id ${direction}
      LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && query.page > 1) {
    // Past the last page: the window counted nothing, so count on its own.
    const [counted] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM briefs b WHERE ${where.join(' AND ')}`, { replacements, type: QueryTypes.SELECT });
    total = Number(counted?.n ?? 0);
  }
  const items = rows.map(
    (r): BriefDto => ({
      id: r.id,
      name: r.name,
      packType: r.pack_type,
      spec: r.spec,
      version: r.version,
      createdBy: r.created_by ?? '',
      updatedBy: r.updated_by ?? '',
      createdAt: r.created_at.toISOString(),
      updatedAt: r.updated_at.toISOString(),
      archivedAt: r.archived_at ? r.archived_at.toISOString() : null,
      archivedBy: r.archived_at ? (r.archived_by ?? '') : null,
      lastRun:
        r.last_run_id !== null
          ? { id: r.last_run_id, status: r.last_run_status!, createdAt: r.last_run_created_at!.toISOString(), candidates: Number(r.last_run_candidates ?? 0) }
          : null,
    }),
  );
  return pageOf(query, items, total);
}

export async function findBrief(workspaceId: number, id: number): Promise<BriefRecord> {
  const brief = await BriefRecord.findOne({ where: { id, workspaceId }, include: withPeople });
  if (!brief) throw AppError.notFound('Brief');
  return brief;
}

export async function getBrief(workspaceId: number, id: number): Promise<BriefDto> {
  return toDto(await findBrief(workspaceId, id));
}

export async function createBrief(actor: AuthUser, spec: Brief): Promise<BriefDto> {
  const id = await sequelize.transaction(async (transaction) => {
    const brief = await BriefRecord.create(
      { workspaceId: actor.workspaceId, name: spec.name, packType: spec.packType, spec, createdById: actor.id, updatedById: actor.id },
      { transaction },
    );
    await BriefVersionRecord.create({ briefId: brief.id, version: 0, spec, savedById: actor.id }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'brief.create', entityType: 'brief', entityId: brief.id, detail: { name: spec.name } }, transaction);
    return brief.id;
  });
  return getBrief(actor.workspaceId, id);
}

/** Merges a partial change onto the stored brief and validates the whole (cross-field rules need it). */
export async function updateBrief(actor: AuthUser, id: number, change: z.output<typeof updateBriefRequestSchema>): Promise<BriefDto> {
  await sequelize.transaction(async (transaction) => {
    const brief = await BriefRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!brief) throw AppError.notFound('Brief');
    refuseIfArchived(brief, 'changed');
    if (brief.version !== change.version) throw AppError.staleVersion('brief');
    const { version: _version, ...fields } = change;
    const merged = briefSchema.safeParse({ ...(brief.spec as BriefInput), ...stripUndefined(fields) });
    if (!merged.success) throw AppError.validation('The brief is not valid after this change.', fieldErrorsFromZod(merged.error));
    const spec = merged.data;
    await brief.update({ name: spec.name, packType: spec.packType, spec, version: brief.version + 1, updatedById: actor.id }, { transaction });
    await BriefVersionRecord.create({ briefId: brief.id, version: brief.version, spec, savedById: actor.id }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'brief.update', entityType: 'brief', entityId: brief.id, detail: { version: brief.version } }, transaction);
  });
  return getBrief(actor.workspaceId, id);
}

export async function duplicateBrief(actor: AuthUser, id: number): Promise<BriefDto> {
  const source = await findBrief(actor.workspaceId, id);
  const name = `${source.name} (copy)`.slice(0, 120);
  return createBrief(actor, { ...source.spec, name });
}

/** An archived brief is read-only: it can be read, copied and unarchived, not changed or run. */
export function refuseIfArchived(brief: BriefRecord, what: 'changed' | 'run'): void {
  if (!brief.archivedAt) return;
  throw AppError.conflict(`This brief is archived, so it cannot be ${what}. Unarchive it first, or duplicate it.`, 'brief_archived');
}

function plural(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

/**
 * Deletes a brief with its runs and candidates. Refused (409) while candidates are shortlisted,
 * and always once any candidate was submitted for review: a reviewed or signed-off candidate is
 * a regulatory record, so such a brief can only be archived. The audit trail is kept either way.
 */
export async function deleteBrief(actor: AuthUser, id: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const brief = await BriefRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!brief) throw AppError.notFound('Brief');
    const rows = (await CandidateRecord.findAll({
      where: { briefId: id, workspaceId: actor.workspaceId, state: { [Op.in]: [...REVIEWED_STATES] } },
      attributes: ['state', [sequelize.fn('COUNT', sequelize.col('id')), 'n']],
      group: ['state'],
      raw: true,
      transaction,
    })) as unknown as { state: string; n: string }[];
    const count = (states: readonly string[]) => rows.filter((r) => states.includes(r.state)).reduce((a, r) => a + Number(r.n), 0);
    const inReview = count(['in-chemistry-review', 'in-regulatory-review']);
    const decided = count(['approved', 'changes-requested', 'rejected']);
    if (inReview + decided > 0) {
      const parts = [inReview ? `${plural(inReview, 'candidate')} in review` : '', decided ? `${plural(decided, 'candidate')} with a review decision (${plural(count(['approved']), 'signed off', 'signed off')})` : ''].filter(Boolean);
      throw AppError.conflict(
        `This brief cannot be deleted: it has ${parts.join(' and ')}, and their reviews are regulatory records. Archive the brief instead: it leaves the list of briefs, and stays readable with its runs, candidates and review history.`,
        'brief_has_reviews',
      );
    }
    const shortlisted = await CandidateRecord.count({ where: { briefId: id, state: 'shortlisted' }, transaction });
    if (shortlisted > 0) throw AppError.conflict(`This brief has ${plural(shortlisted, 'shortlisted candidate')}; take them off the shortlist or archive the brief instead.`, 'has_shortlist');
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'brief.delete', entityType: 'brief', entityId: brief.id, detail: { name: brief.name } }, transaction);
    await brief.destroy({ transaction });
  });
}

/** Archives (or unarchives) a brief; recorded in the audit trail. Archiving twice answers 409. */
export async function setBriefArchived(actor: AuthUser, id: number, archived: boolean): Promise<BriefDto> {
  await sequelize.transaction(async (transaction) => {
    const brief = await BriefRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!brief) throw AppError.notFound('Brief');
    if (Boolean(brief.archivedAt) === archived) {
      throw AppError.conflict(archived ? 'This brief is already archived.' : 'This brief is not archived.', archived ? 'already_archived' : 'not_archived');
    }
    await brief.update({ archivedAt: archived ? new Date() : null, archivedById: archived ? actor.id : null }, { transaction, silent: true });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: archived ? 'brief.archive' : 'brief.unarchive', entityType: 'brief', entityId: brief.id, detail: { name: brief.name } }, transaction);
  });
  return getBrief(actor.workspaceId, id);
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
