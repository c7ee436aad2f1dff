import { Op, QueryTypes, UniqueConstraintError, fn, col, where as sqlWhere, type Transaction } from 'sequelize';
import { findSpeciesByKey } from '@shared/chemistry';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import {
  ingredientRuleErrors,
  type CreateIngredientRequest,
  type FieldError,
  type Ingredient,
  type IngredientNeed,
  type IngredientListQuery,
  type Paged,
  type UpdateIngredientRequest,
} from '@shared/schemas';
import type { IngredientProcess } from '@shared/thermal/process';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { likePattern, pageOf, pageWindow, sortColumn, type PageQuery } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import { AuditEventRecord } from '../audit/audit-event.model';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { workspaceChemistryLibrary } from '../species/species.service';
import { IngredientRecord } from './ingredient.model';

/** "12.5000" → "12.50", "0.1230" → "0.123": at least two decimals, no trailing zeros beyond. */
export function formatCost(value: string): string {
  const [whole = '0', frac = ''] = String(value).split('.');
  const trimmed = frac.replace(/0+$/, '');
  return `${whole}.${trimmed.padEnd(2, '0')}`;
}

export function toIngredientDto(r: IngredientRecord): Ingredient {
  return {
    id: r.id,
    name: r.name,
    grade: r.grade,
    role: r.role,
    speciesKey: r.speciesKey ?? null,
    process: r.process ?? null,
    costPerKg: formatCost(r.costPerKg),
    currency: r.currency,
    densityGPerMl: r.densityGPerMl ?? null,
    cpJPerGK: r.cpJPerGK ?? null,
    sources: r.sources ?? [],
    notes: r.notes ?? '',
    needs: r.needs ?? [],
    version: r.version,
    createdBy: r.createdBy?.name ?? null,
    updatedBy: r.updatedBy?.name ?? null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

/** The values an audit event keeps as before/after. */
export function snapshot(r: IngredientRecord) {
  const { createdBy: _c, updatedBy: _u, createdAt: _ca, updatedAt: _ua, ...values } = toIngredientDto(r);
  return values;
}

const withUsers = [
  { model: UserRecord, as: 'createdBy', attributes: ['id', 'name'] },
  { model: UserRecord, as: 'updatedBy', attributes: ['id', 'name'] },
];

const SORT_COLUMNS = { name: 'i.name', costPerKg: 'i.cost_per_kg', role: 'i.role', updatedAt: 'i.updated_at' } as const;

interface IngredientListRow {
  id: number;
  name: string;
  grade: string;
  role: Ingredient['role'];
  species_key: string | null;
  process: Ingredient['process'];
  cost_per_kg: string;
  currency: string;
  density_g_per_ml: number | null;
  cp_j_per_g_k: number | null;
  sources: Ingredient['sources'] | null;
  notes: string | null;
  needs: IngredientNeed[] | null;
  version: number;
  created_by: string | null;
  updated_by: string | null;
  created_at: Date;
  updated_at: Date;
  total: string;
}

/**
 * One page of the library in one query (the two names by join, the total by a window), read as
 * plain rows: building Sequelize instances with includes cost most of the request's CPU time.
 */
export async function listIngredients(workspaceId: number, query: IngredientListQuery): Promise<Paged<Ingredient>> {
  const where = ['i.workspace_id = :workspaceId', 'i.deleted_at IS NULL'];
  const replacements: Record<string, unknown> = { workspaceId, ...pageWindow(query) };
  if (query.q) {
    where.push('(i.name ILIKE :q OR i.grade ILIKE :q OR i.species_key ILIKE :q OR i.notes ILIKE :q)');
    replacements.q = likePattern(query.q);
  }
  if (query.role) {
    where.push('i.role = :role');
    replacements.role = query.role;
  }
  const { column, direction } = sortColumn(query.sort, SORT_COLUMNS);
  const rows = await sequelize.query<IngredientListRow>(
    `SELECT i.id, i.name, i.grade, i.role, i.species_key, i.process, i.cost_per_kg, i.currency, i.density_g_per_ml, i.cp_j_per_g_k,
            i.sources, i.notes, i.needs, i.version, i.created_at, i.updated_at, cu.name AS created_by, uu.name AS updated_by,
            count(*) OVER () AS total
       FROM ingredients i
       LEFT JOIN users cu ON cu.id = i.created_by_id
       LEFT JOIN users uu ON uu.id = i.updated_by_id
      WHERE ${where.join(' AND ')}
      ORDER BY ${column} ${direction}, i.name ASC, i.id ASC
      LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && query.page > 1) {
    // Past the last page: the window counted nothing, so count on its own.
    const [counted] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM ingredients i WHERE ${where.join(' AND ')}`, { replacements, type: QueryTypes.SELECT });
    total = Number(counted?.n ?? 0);
  }
  const items = rows.map(
    (r): Ingredient => ({
      id: r.id,
      name: r.name,
      grade: r.grade,
      role: r.role,
      speciesKey: r.species_key ?? null,
      process: r.process ?? null,
      costPerKg: formatCost(r.cost_per_kg),
      currency: r.currency,
      densityGPerMl: r.density_g_per_ml ?? null,
      cpJPerGK: r.cp_j_per_g_k ?? null,
      sources: r.sources ?? [],
      notes: r.notes ?? '',
      needs: r.needs ?? [],
      version: r.version,
      createdBy: r.created_by ?? null,
      updatedBy: r.updated_by ?? null,
      createdAt: r.created_at.toISOString(),
      updatedAt: r.updated_at.toISOString(),
    }),
  );
  return pageOf(query, items, total);
}

async function findInWorkspace(workspaceId: number, id: number, transaction?: Transaction): Promise<IngredientRecord> {
  const row = await IngredientRecord.findOne({ where: { id, workspaceId }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!row) throw AppError.notFound('Ingredient');
  return row;
}

async function reloadWithUsers(id: number, transaction?: Transaction): Promise<IngredientRecord> {
  return (await IngredientRecord.findByPk(id, { include: withUsers, transaction }))!;
}

export async function getIngredient(workspaceId: number, id: number): Promise<Ingredient> {
  const row = await IngredientRecord.findOne({ where: { id, workspaceId }, include: withUsers });
  if (!row) throw AppError.notFound('Ingredient');
  return toIngredientDto(row);
}

/** Species keys named by an ingredient must exist in the workspace's species data. */
export function referenceErrors(lib: ChemistryLibrary, x: { speciesKey?: string | null; process?: IngredientProcess | null }): FieldError[] {
  const errors: FieldError[] = [];
  const check = (key: string | undefined | null, field: string) => {
    if (!key) return;
    try {
      findSpeciesByKey(lib, key);
    } catch (error) {
      errors.push({ field, message: `names a species not in the species data: ${error instanceof Error ? error.message : key}` });
    }
  };
  check(x.speciesKey, 'speciesKey');
  const p = x.process;
  if (p?.kind === 'dissolution') {
    check(p.solidKey, 'process.solidKey');
    check(p.soluteKey, 'process.soluteKey');
  } else if (p?.kind === 'reaction') {
    p.reactants.forEach((t, k) => check(t.key, `process.reactants.${k}.key`));
    p.products.forEach((t, k) => check(t.key, `process.products.${k}.key`));
    check(p.ingredientKey, 'process.ingredientKey');
  } else if (p?.kind === 'air-oxidation') {
    check(p.metalKey, 'process.metalKey');
    check(p.oxideKey, 'process.oxideKey');
  }
  return errors;
}

type IngredientValues = {
  name: string;
  grade: string;
  role: Ingredient['role'];
  speciesKey: string | null;
  process: IngredientProcess | null;
  costPerKg: string;
  currency: string;
  densityGPerMl: number | null;
  cpJPerGK: number | null;
  sources: string[];
  notes: string;
  /** Left out: the column keeps what it has (a new record: none). */
  needs?: IngredientNeed[];
};

/** A parsed create request with the defaults of a new ingredient filled in. */
export function valuesFromCreate(input: CreateIngredientRequest, defaultCurrency: string): IngredientValues {
  const process = input.process ?? null;
  return {
    name: input.name,
    grade: input.grade ?? '',
    role: input.role,
    // A dissolving solid is the species it dissolves, unless told otherwise.
    speciesKey: input.speciesKey ?? (process?.kind === 'dissolution' ? process.solidKey : null),
    process,
    costPerKg: input.costPerKg,
    currency: input.currency ?? defaultCurrency,
    densityGPerMl: input.densityGPerMl ?? null,
    cpJPerGK: input.cpJPerGK ?? null,
    sources: input.sources ?? [],
    notes: input.notes ?? '',
    ...(input.needs ? { needs: input.needs } : {}),
  };
}

/**
 * Needs name live ingredients of the same workspace, never the ingredient itself; the ratios
 * were checked by the schema. Another workspace's id reads as unknown.
 */
export async function needsErrors(workspaceId: number, needs: IngredientNeed[] | undefined, selfId?: number, transaction?: Transaction): Promise<FieldError[]> {
  if (!needs?.length) return [];
  const ids = [...new Set(needs.map((n) => n.ingredientId))];
  const found = new Set((await IngredientRecord.findAll({ where: { workspaceId, id: ids }, attributes: ['id'], transaction })).map((r) => r.id));
  const errors: FieldError[] = [];
  needs.forEach((n, k) => {
    if (selfId !== undefined && n.ingredientId === selfId) errors.push({ field: `needs.${k}.ingredientId`, message: 'an ingredient cannot need itself' });
    else if (!found.has(n.ingredientId)) errors.push({ field: `needs.${k}.ingredientId`, message: `is not an ingredient of this library (id ${n.ingredientId})` });
  });
  return errors;
}

function duplicateName(): AppError {
  return new AppError({
    status: 409,
    code: 'duplicate_ingredient',
    message: 'The library already has an ingredient with this name and grade.',
    fields: [{ field: 'name', message: 'already used with this grade in the library' }],
  });
}

export async function createIngredient(actor: AuthUser, input: CreateIngredientRequest): Promise<Ingredient> {
  const values = valuesFromCreate(input, actor.workspace.currency);
  const lib = await workspaceChemistryLibrary(actor.workspaceId);
  const errors = [...referenceErrors(lib, values), ...(await needsErrors(actor.workspaceId, values.needs))];
  if (errors.length) throw AppError.validation(`Invalid ingredient: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}`, errors);
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await IngredientRecord.create({ ...values, workspaceId: actor.workspaceId, createdById: actor.id, updatedById: actor.id }, { transaction });
      await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.create', entityType: 'ingredient', entityId: row.id, detail: { before: null, after: snapshot(row) } }, transaction);
      return toIngredientDto(await reloadWithUsers(row.id, transaction));
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw duplicateName();
    throw error;
  }
}

export async function updateIngredient(actor: AuthUser, id: number, change: UpdateIngredientRequest): Promise<Ingredient> {
  const lib = await workspaceChemistryLibrary(actor.workspaceId);
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await findInWorkspace(actor.workspaceId, id, transaction);
      if (row.version !== change.version) throw AppError.staleVersion('ingredient');
      const { version: _v, ...fields } = change;
      const merged: IngredientValues = {
        name: fields.name ?? row.name,
        grade: fields.grade ?? row.grade,
        role: fields.role ?? row.role,
        speciesKey: fields.speciesKey === undefined ? (row.speciesKey ?? null) : fields.speciesKey,
        process: fields.process === undefined ? (row.process ?? null) : fields.process,
        costPerKg: fields.costPerKg ?? row.costPerKg,
        currency: fields.currency ?? row.currency,
        densityGPerMl: fields.densityGPerMl === undefined ? (row.densityGPerMl ?? null) : fields.densityGPerMl,
        cpJPerGK: fields.cpJPerGK === undefined ? (row.cpJPerGK ?? null) : fields.cpJPerGK,
        sources: fields.sources ?? row.sources,
        notes: fields.notes ?? row.notes,
        needs: fields.needs ?? row.needs ?? [],
      };
      const errors = [...ingredientRuleErrors(merged), ...referenceErrors(lib, merged), ...(await needsErrors(actor.workspaceId, fields.needs, row.id, transaction))];
      if (errors.length) throw AppError.validation(`Invalid ingredient: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}`, errors);
      const before = snapshot(row);
      await row.update({ ...merged, version: row.version + 1, updatedById: actor.id }, { transaction });
      await row.reload({ transaction });
      await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.update', entityType: 'ingredient', entityId: row.id, detail: { before, after: snapshot(row) } }, transaction);
      return toIngredientDto(await reloadWithUsers(row.id, transaction));
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw duplicateName();
    throw error;
  }
}

/** Removes an ingredient from the library (soft delete: its history and attachments stay). */
export async function deleteIngredient(actor: AuthUser, id: number, version?: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const row = await findInWorkspace(actor.workspaceId, id, transaction);
    if (version !== undefined && row.version !== version) throw AppError.staleVersion('ingredient');
    const before = snapshot(row);
    await row.destroy({ transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.delete', entityType: 'ingredient', entityId: row.id, detail: { before, after: null } }, transaction);
  });
}

/** The audit events of one ingredient, oldest first. */
export async function ingredientHistory(workspaceId: number, id: number, query: PageQuery<'at'>) {
  const row = await IngredientRecord.findOne({ where: { id, workspaceId }, paranoid: false, attributes: ['id'] });
  if (!row) throw AppError.notFound('Ingredient');
  const direction = query.sort === '-at' ? 'DESC' : 'ASC';
  const { rows: events, count } = await AuditEventRecord.findAndCountAll({
    where: { workspaceId, entityType: 'ingredient', entityId: String(id) },
    order: [['id', direction]],
    ...pageWindow(query),
  });
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((x): x is number => x !== null))];
  const actors = new Map((await UserRecord.findAll({ where: { id: actorIds, workspaceId }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
  return pageOf(
    query,
    events.map((e) => {
      const { before = null, after = null, ...rest } = e.detail as { before?: unknown; after?: unknown };
      return { id: Number(e.id), action: e.action, actor: e.actorId === null ? null : (actors.get(e.actorId) ?? null), at: e.createdAt.toISOString(), before, after, detail: rest };
    }),
    count,
  );
}

/** Active ingredients of a workspace by id (for mixture evaluation); a missing id → 404 naming the field. */
export async function ingredientsByIds(workspaceId: number, ids: number[]): Promise<Map<number, Ingredient>> {
  if (ids.length === 0) return new Map();
  const rows = await IngredientRecord.findAll({ where: { workspaceId, id: [...new Set(ids)] } });
  return new Map(rows.map((r) => [r.id, toIngredientDto(r)]));
}

/** Finds a live ingredient by its natural key (name and grade, case-insensitive). */
export async function findByNaturalKey(workspaceId: number, name: string, grade: string, transaction?: Transaction) {
  return IngredientRecord.findOne({
    where: {
      [Op.and]: [
        { workspaceId },
        sqlWhere(fn('lower', col('name')), name.toLowerCase()),
        sqlWhere(fn('lower', col('grade')), grade.toLowerCase()),
      ],
    },
    transaction,
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
  });
}

export type { IngredientValues };
