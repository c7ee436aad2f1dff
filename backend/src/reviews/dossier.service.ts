import { Op } from 'sequelize';
import type { Brief } from '@shared/schemas/briefs';
import { HAZARD_STANDING_CAUTION, ingredientHazardDataSchema, type IngredientHazardData } from '@shared/schemas/hazards';
import type { Dossier } from '@shared/schemas/reviews';
import { isInOrPastReview, REVIEW_STATE_LABELS, type ReviewState } from '@shared/reviews/state-machine';
import { holdBand } from '@shared/optimiser/verify';
import { verifyComposition } from '@shared/optimiser/verify';
import { chemistryPort } from '@shared/thermal';
import type { OptimiserIngredient } from '@shared/optimiser/types';
import { AppError } from '../http/errors';
import type { CandidateRecord } from '../candidates/candidate.model';
import { RunRecord } from '../runs/run.model';
import { toCandidateDto, toOptimiserIngredient } from '../runs/runs.service';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { workspaceChemistryLibrary } from '../species/species.service';
import { Workspace } from '../workspaces/workspace.model';
import { findCandidate, reviewHistory } from './reviews.service';
import { hazardsForCandidate } from './candidate-hazards';

function hazardOf(r: IngredientRecord | undefined): IngredientHazardData | null {
  if (!r?.hazardData) return null;
  const parsed = ingredientHazardDataSchema.safeParse(r.hazardData);
  return parsed.success ? parsed.data : null;
}

function hazardsFromRecords(candidate: CandidateRecord, brief: Brief, byId: Map<string, IngredientRecord>) {
  return hazardsForCandidate(
    candidate.data.composition.map((c) => {
      const r = byId.get(c.ingredientId);
      const process = r?.process ?? (r?.role === 'solvent' ? { kind: 'inert' as const, role: 'water' as const } : null);
      return { name: r?.name ?? c.name, role: c.role, massG: c.massG, hazardData: hazardOf(r), process, densityGPerMl: r?.densityGPerMl ?? null };
    }),
    brief,
    { minTempC: candidate.data.verification.minTempC ?? candidate.data.predictedMinTempC, maxTempC: candidate.data.verification.maxTempC ?? candidate.data.predictedMaxTempC },
  );
}

/** The computed hazards of any candidate of the workspace (notes, classification, label, score), with the standing caution. */
export async function candidateHazardsView(workspaceId: number, id: number) {
  const candidate = await findCandidate(workspaceId, id);
  const ids = candidate.data.composition.map((c) => Number(c.ingredientId));
  const [run, records] = await Promise.all([
    RunRecord.findOne({ where: { id: candidate.runId, workspaceId }, attributes: ['id', 'briefSnapshot'] }),
    IngredientRecord.findAll({ where: { workspaceId, id: { [Op.in]: ids } }, paranoid: false }),
  ]);
  const byId = new Map(records.map((r) => [String(r.id), r]));
  const h = hazardsFromRecords(candidate, run!.briefSnapshot as Brief, byId);
  const missing = candidate.data.composition.filter((c) => c.massG > 0 && c.role !== 'packaging' && !hazardOf(byId.get(c.ingredientId))).map((c) => c.name);
  return { hazards: { notes: h.notes, classification: h.classification, label: h.label, score: h.score }, standingCaution: HAZARD_STANDING_CAUTION, ingredientsWithoutHazardData: missing };
}

/**
 * Everything the printable dossier shows: composition with its sources, the predicted
 * performance and the temperature curve against the brief's band, the hazard notes and label
 * elements, the review history and the sign-offs. Only for candidates in or past review.
 */
export async function buildDossier(workspaceId: number, id: number): Promise<Dossier> {
  const candidate = await findCandidate(workspaceId, id);
  if (!isInOrPastReview(candidate.state)) {
    throw AppError.conflict(`This candidate is ${REVIEW_STATE_LABELS[candidate.state as ReviewState]?.toLowerCase() ?? candidate.state}; a dossier exists once it is submitted for review.`, 'not_in_review');
  }
  const ids = candidate.data.composition.map((c) => Number(c.ingredientId));
  const [run, workspace, records, lib, history] = await Promise.all([
    RunRecord.findOne({ where: { id: candidate.runId, workspaceId }, attributes: ['id', 'briefSnapshot', 'dataSnapshot'] }),
    Workspace.findByPk(workspaceId),
    IngredientRecord.findAll({ where: { workspaceId, id: { [Op.in]: ids } }, paranoid: false }),
    workspaceChemistryLibrary(workspaceId),
    reviewHistory(workspaceId, id),
  ]);
  const brief = run!.briefSnapshot as Brief;
  const byId = new Map(records.map((r) => [String(r.id), r]));
  const snapshotById = new Map(run!.dataSnapshot.ingredients.map((i) => [i.id, i]));
  const fill = candidate.data.composition.filter((c) => c.massG > 0);
  const fillMassG = fill.reduce((a, c) => a + c.massG, 0);


  const composition = candidate.data.composition.map((c) => {
    const r = byId.get(c.ingredientId);
    return {
      ingredientId: c.ingredientId,
      name: r?.name ?? c.name,
      grade: r?.grade ?? '',
      role: c.role,
      massG: c.massG,
      massFraction: fillMassG > 0 ? c.massG / fillMassG : 0,
      sources: r?.sources ?? [],
      hazardSource: hazardOf(r)?.source ?? null,
    };
  });

  // The curve: the time model over the verification horizon, with the ingredients as the run saw them
  // (a revision's edited lines with the library's current data).
  let curve: { tMin: number; tempC: number }[] = [];
  const lines = fill.flatMap((c) => {
    const ing: OptimiserIngredient | undefined = snapshotById.get(c.ingredientId) ?? (byId.get(c.ingredientId) ? toOptimiserIngredient(byId.get(c.ingredientId)!) : undefined);
    return ing ? [{ ingredient: ing, massG: c.massG }] : [];
  });
  if (lines.length === fill.length && lines.length > 0) {
    const verified = verifyComposition(chemistryPort(lib), brief, lines);
    curve = verified.profile?.curve.map((p) => ({ tMin: p.tMin, tempC: p.tempC })) ?? [];
  }

  const hazards = hazardsFromRecords(candidate, brief, byId);

  return {
    generatedAt: new Date().toISOString(),
    workspace: { name: workspace?.name ?? '', currency: workspace?.currency ?? 'EUR' },
    candidate: toCandidateDto(candidate),
    status: history.status,
    brief: brief as unknown as Record<string, unknown>,
    composition,
    curve,
    band: holdBand(brief),
    hazards: { notes: hazards.notes, classification: hazards.classification, label: hazards.label, score: hazards.score },
    hazardNotes: hazards.notes,
    label: hazards.label,
    standingCaution: HAZARD_STANDING_CAUTION,
    history: history.events,
    signOffs: history.reviews.filter((r) => r.verdict === 'approved'),
  };
}
