import { briefSchema, updateBriefRequestSchema, type Brief, type BriefInput } from '@shared/schemas/briefs';
import type { BriefRecord as BriefDto } from '@shared/schemas/runs';
import { fieldErrorsFromZod } from '@shared/schemas';
import type { z } from 'zod';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { RunRecord } from '../runs/run.model';
import { CandidateRecord } from '../candidates/candidate.model';
import { BriefRecord, BriefVersionRecord } from './brief.model';

const withPeople = [
  { model: UserRecord, as: 'createdBy', attributes: ['name'] },
  { model: UserRecord, as: 'updatedBy', attributes: ['name'] },
];

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
  };
}

export async function listBriefs(workspaceId: number): Promise<BriefDto[]> {
  const rows = await BriefRecord.findAll({ where: { workspaceId }, include: withPeople, order: [['updatedAt', 'DESC']] });
  return Promise.all(rows.map(toDto));
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

export async function deleteBrief(actor: AuthUser, id: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const brief = await BriefRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!brief) throw AppError.notFound('Brief');
    const shortlisted = await CandidateRecord.count({ where: { briefId: id, state: 'shortlisted' }, transaction });
    if (shortlisted > 0) throw AppError.conflict('This brief has shortlisted candidates; it cannot be deleted.', 'has_shortlist');
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'brief.delete', entityType: 'brief', entityId: brief.id, detail: { name: brief.name } }, transaction);
    await brief.destroy({ transaction });
  });
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
