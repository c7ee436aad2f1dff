import { Op, type Transaction } from 'sequelize';
import type { ModelCalibrations } from '@shared/calibration/calibrations';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import { lineOf, type EvaluationLine } from '@shared/evaluation/components';
import type { Brief } from '@shared/schemas/briefs';
import { ingredientHazardDataSchema, type IngredientHazardData } from '@shared/schemas/hazards';
import { AppError } from '../http/errors';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { RunRecord, type RunDataSnapshot } from '../runs/run.model';
import { toOptimiserIngredient } from '../runs/runs.service';
import { CandidateRecord } from './candidate.model';

/** A candidate with everything its figures are computed from. */
export interface CandidateContext {
  candidate: CandidateRecord;
  run: RunRecord;
  /** The brief as the run froze it. */
  brief: Brief;
  /** The data the run froze: ingredients, chemistry library, applied calibrations. */
  snapshot: RunDataSnapshot;
  chemistry: ChemistryLibrary;
  calibrations: ModelCalibrations | null;
  /** The library's records of the composition's ingredients (deleted ones too), by id. */
  records: Map<string, IngredientRecord>;
  /**
   * The composition as evaluation lines: each ingredient's process and heat data as the run saw
   * it (the snapshot; the library for an ingredient a revision added), its current name and
   * hazard data from the library.
   */
  lines: EvaluationLine[];
  /** Composition ids found neither in the snapshot nor in the library. */
  missing: string[];
}

/** A candidate row of the workspace (404 otherwise); with `lock` inside a transaction, locked for update. */
export async function findCandidateRow(workspaceId: number, id: number, options: { transaction?: Transaction; lock?: boolean } = {}): Promise<CandidateRecord> {
  const { transaction, lock = false } = options;
  const candidate = await CandidateRecord.findOne({ where: { id, workspaceId }, transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  if (!candidate) throw AppError.notFound('Candidate');
  return candidate;
}

/** An ingredient record's hazard data when it parses, else null. */
export function hazardDataOf(r: IngredientRecord | undefined): IngredientHazardData | null {
  if (!r?.hazardData) return null;
  const parsed = ingredientHazardDataSchema.safeParse(r.hazardData);
  return parsed.success ? parsed.data : null;
}

/**
 * THE loader of "a candidate with its run, brief and snapshot" (DEVELOPERS.md, "The evaluation
 * core"), for candidates, reviews, the dossier and lab logs. Another workspace's candidate (or
 * none) answers 404. With `lock` inside a transaction the candidate row is locked for update.
 */
export async function loadCandidateContext(workspaceId: number, id: number, options: { transaction?: Transaction; lock?: boolean } = {}): Promise<CandidateContext> {
  const { transaction } = options;
  const candidate = await findCandidateRow(workspaceId, id, options);
  const ids = candidate.data.composition.map((c) => Number(c.ingredientId)).filter((n) => Number.isInteger(n));
  const [run, rows] = await Promise.all([
    RunRecord.findOne({ where: { id: candidate.runId, workspaceId }, transaction }),
    ids.length ? IngredientRecord.findAll({ where: { workspaceId, id: { [Op.in]: ids } }, paranoid: false, transaction }) : Promise.resolve([]),
  ]);
  if (!run) throw AppError.notFound('Run');
  const records = new Map(rows.map((r) => [String(r.id), r]));
  const snapshotById = new Map(run.dataSnapshot.ingredients.map((i) => [i.id, i]));
  const lines: EvaluationLine[] = [];
  const missing: string[] = [];
  for (const c of candidate.data.composition) {
    const record = records.get(c.ingredientId);
    const ing = snapshotById.get(c.ingredientId) ?? (record ? toOptimiserIngredient(record) : undefined);
    if (!ing) {
      if (c.massG > 0) missing.push(c.ingredientId);
      continue;
    }
    lines.push({ ...lineOf(ing, c.massG, record?.name ?? c.name), role: c.role, hazardData: hazardDataOf(record) ?? ing.hazardData ?? null });
  }
  return {
    candidate,
    run,
    brief: run.briefSnapshot,
    snapshot: run.dataSnapshot,
    chemistry: run.dataSnapshot.chemistry,
    calibrations: run.dataSnapshot.calibrations ?? null,
    records,
    lines,
    missing,
  };
}
