import type { OptimiserIngredient } from '@shared/optimiser/types';
import type { CandidateRecord as CandidateDto, RunDetail, RunListQuery, RunSummary } from '@shared/schemas/runs';
import type { Paged } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { findBrief, refuseIfArchived } from '../briefs/briefs.service';
import { CandidateRecord } from '../candidates/candidate.model';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { workspaceChemistryLibrary } from '../species/species.service';
import { Workspace } from '../workspaces/workspace.model';
import { RunRecord, type RunDataSnapshot } from './run.model';
import { activeCalibrations } from '../lab-logs/lab-logs.service';
import { cancelRunJob, enqueueRun } from './run-queue';
import { maxRunAttempts } from './run-sweeper';

export function toRunSummary(run: RunRecord): RunSummary {
  return {
    id: run.id,
    briefId: run.briefId,
    briefVersion: run.briefVersion,
    status: run.status,
    progress: { done: run.progressDone, total: run.progressTotal },
    error: run.error,
    attempts: run.attempts,
    maxAttempts: maxRunAttempts(),
    interruptions: run.interruptions,
    lastInterruptedAt: run.lastInterruptedAt ? run.lastInterruptedAt.toISOString() : null,
    silentForS: run.status === 'running' && run.heartbeatAt ? Math.max(0, Math.round((Date.now() - run.heartbeatAt.getTime()) / 1000)) : null,
    createdBy: run.createdBy?.name ?? '',
    createdAt: run.createdAt.toISOString(),
    startedAt: run.startedAt ? run.startedAt.toISOString() : null,
    finishedAt: run.finishedAt ? run.finishedAt.toISOString() : null,
    timings: run.timings,
  };
}

export function toCandidateDto(c: CandidateRecord): CandidateDto {
  return { ...c.data, id: c.id, runId: c.runId, briefId: c.briefId, state: c.state, setKey: c.setKey, rank: c.rank, pareto: c.pareto };
}

/** Maps a library record to what the optimiser reads; the version is kept for the snapshot. */
export function toOptimiserIngredient(r: IngredientRecord): OptimiserIngredient & { version: number } {
  const extra = r as unknown as { hazardClasses?: string[] };
  // Library needs name other records by their numeric id; the optimiser's ids are strings.
  const needs = (r.needs ?? []).map((n) => ({
    ingredientId: String(n.ingredientId),
    minGPerG: n.minGPerG,
    ...(n.maxGPerG !== undefined ? { maxGPerG: n.maxGPerG } : {}),
    ...(n.source ? { source: n.source } : {}),
  }));
  return {
    id: String(r.id),
    name: r.grade ? `${r.name} (${r.grade})` : r.name,
    role: r.role,
    costPerKg: r.costPerKg,
    process: r.process,
    cpJPerGK: r.cpJPerGK,
    densityGPerMl: r.densityGPerMl,
    ...(needs.length ? { needs } : {}),
    ...(extra.hazardClasses ? { hazardClasses: extra.hazardClasses } : {}),
    // The hazard notes, score and excluded classes of a run read it (optimiser/candidate-hazards.ts).
    ...(r.hazardData ? { hazardData: r.hazardData } : {}),
    version: r.version,
  };
}

/** Freezes the brief and the data, stores a queued run and sends its job; answers the run id. */
export async function createRun(actor: AuthUser, briefId: number): Promise<number> {
  const brief = await findBrief(actor.workspaceId, briefId);
  refuseIfArchived(brief, 'run');
  const [ingredients, chemistry] = await Promise.all([
    IngredientRecord.findAll({ where: { workspaceId: actor.workspaceId }, order: [['id', 'ASC']] }),
    workspaceChemistryLibrary(actor.workspaceId),
  ]);
  const calibrations = await activeCalibrations(actor.workspaceId);
  const dataSnapshot: RunDataSnapshot = { ingredients: ingredients.map(toOptimiserIngredient), chemistry, calibrations };
  const run = await sequelize.transaction(async (transaction) => {
    const created = await RunRecord.create(
      { workspaceId: actor.workspaceId, briefId: brief.id, briefVersion: brief.version, briefSnapshot: brief.spec, dataSnapshot, createdById: actor.id },
      { transaction },
    );
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'run.create', entityType: 'run', entityId: created.id, detail: { briefId: brief.id, briefVersion: brief.version } }, transaction);
    return created;
  });
  try {
    const jobId = await enqueueRun(run.id);
    await run.update({ jobId });
  } catch (error) {
    await run.update({ status: 'failed', error: `The run could not be queued: ${error instanceof Error ? error.message : String(error)}`, finishedAt: new Date() });
    throw new AppError({ status: 503, code: 'queue_unavailable', message: 'The run could not be queued. Try again shortly.' });
  }
  return run.id;
}

const summaryAttributes = { exclude: ['dataSnapshot', 'result', 'briefSnapshot'] as string[] };

export async function listRuns(workspaceId: number, briefId: number, query: RunListQuery): Promise<Paged<RunSummary>> {
  await findBrief(workspaceId, briefId);
  const { column, direction } = sortColumn(query.sort, { createdAt: 'createdAt', status: 'status' });
  const { rows, count } = await RunRecord.findAndCountAll({
    where: { workspaceId, briefId, ...(query.status ? { status: query.status } : {}) },
    attributes: summaryAttributes,
    include: [{ model: UserRecord, as: 'createdBy', attributes: ['name'] }],
    order: [[column, direction], ['createdAt', 'DESC'], ['id', 'DESC']],
    ...pageWindow(query),
    distinct: true,
  });
  return pageOf(query, rows.map(toRunSummary), count);
}

async function findRun(workspaceId: number, id: number): Promise<RunRecord> {
  const run = await RunRecord.findOne({ where: { id, workspaceId }, include: [{ model: UserRecord, as: 'createdBy', attributes: ['name'] }] });
  if (!run) throw AppError.notFound('Run');
  return run;
}

export async function getRun(workspaceId: number, id: number): Promise<RunDetail> {
  const run = await findRun(workspaceId, id);
  const [candidates, workspace] = await Promise.all([
    CandidateRecord.findAll({ where: { runId: run.id, workspaceId, parentCandidateId: null }, order: [['rank', 'ASC']] }), // revisions live on their candidate's page, not in the run's ranking
    Workspace.findByPk(workspaceId),
  ]);
  const result = run.result;
  return {
    ...toRunSummary(run),
    objective: result?.objective ?? run.briefSnapshot.objective,
    objectiveUnit: result?.objectiveUnit ?? null,
    currency: workspace?.currency ?? 'EUR',
    brief: run.briefSnapshot,
    candidates: candidates.map(toCandidateDto),
    infeasible: result?.infeasible ?? [],
    excludedIngredients: result?.excludedIngredients ?? [],
    sweep: result?.sweep ?? null,
    stats: result?.stats ?? null,
    warnings: result?.warnings ?? [],
    dataSnapshot: {
      ingredients: run.dataSnapshot.ingredients.map((i) => ({ id: i.id, name: i.name, version: i.version })),
      speciesCount: run.dataSnapshot.chemistry.species.length,
      calibrations: { ...(run.dataSnapshot.calibrations ?? {}) },
    },
  };
}

export async function cancelRun(actor: AuthUser, id: number): Promise<RunSummary> {
  const run = await sequelize.transaction(async (transaction) => {
    const found = await RunRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, attributes: summaryAttributes, transaction, lock: transaction.LOCK.UPDATE });
    if (!found) throw AppError.notFound('Run');
    if (found.status !== 'queued' && found.status !== 'running') {
      throw AppError.conflict(`This run has already ${found.status === 'succeeded' ? 'finished' : found.status}.`, 'run_finished');
    }
    await found.update({ status: 'cancelled', finishedAt: new Date() }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'run.cancel', entityType: 'run', entityId: found.id }, transaction);
    return found;
  });
  if (run.jobId) await cancelRunJob(run.jobId).catch(() => undefined);
  return toRunSummary(await findRun(actor.workspaceId, id));
}
