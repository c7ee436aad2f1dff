import { HAZARD_STANDING_CAUTION } from '@shared/schemas/hazards';
import type { Dossier } from '@shared/schemas/reviews';
import { isInOrPastReview, REVIEW_STATE_LABELS, type ReviewState } from '@shared/reviews/state-machine';
import { hazardsUnderBrief } from '@shared/evaluation/hazards';
import { holdBand } from '@shared/evaluation/verify';
import { AppError } from '../http/errors';
import { hazardDataOf, loadCandidateContext, type CandidateContext } from '../candidates/candidate-context';
import { candidateCurve } from '../candidates/candidates.service';
import { toCandidateDto } from '../runs/runs.service';
import { Workspace } from '../workspaces/workspace.model';
import { reviewHistory } from './reviews.service';

function hazardsOfContext(ctx: CandidateContext) {
  const v = ctx.candidate.data.verification;
  return hazardsUnderBrief(
    ctx.lines,
    ctx.brief,
    { verified: { minTempC: v.minTempC, maxTempC: v.maxTempC }, predictedMinTempC: ctx.candidate.data.predictedMinTempC, predictedMaxTempC: ctx.candidate.data.predictedMaxTempC, predictedExtremeTempC: ctx.candidate.data.predictedExtremeTempC },
    { evenWithoutHazardData: true },
  )!;
}

/** The computed hazards of any candidate of the workspace (notes, classification, label, score), with the standing caution. */
export async function candidateHazardsView(workspaceId: number, id: number) {
  const ctx = await loadCandidateContext(workspaceId, id);
  const h = hazardsOfContext(ctx);
  const missing = ctx.candidate.data.composition.filter((c) => c.massG > 0 && c.role !== 'packaging' && !hazardDataOf(ctx.records.get(c.ingredientId))).map((c) => c.name);
  return { hazards: { notes: h.notes, classification: h.classification, label: h.label, score: h.score }, standingCaution: HAZARD_STANDING_CAUTION, ingredientsWithoutHazardData: missing };
}

/**
 * Everything the printable dossier shows: composition with its sources, the predicted
 * performance and the temperature curve against the brief's band, the hazard notes and label
 * elements, the review history and the sign-offs. Only for candidates in or past review.
 */
export async function buildDossier(workspaceId: number, id: number): Promise<Dossier> {
  const ctx = await loadCandidateContext(workspaceId, id);
  const { candidate, brief, records: byId } = ctx;
  if (!isInOrPastReview(candidate.state)) {
    throw AppError.conflict(`This candidate is ${REVIEW_STATE_LABELS[candidate.state as ReviewState]?.toLowerCase() ?? candidate.state}; a dossier exists once it is submitted for review.`, 'not_in_review');
  }
  const [workspace, history] = await Promise.all([Workspace.findByPk(workspaceId), reviewHistory(workspaceId, id)]);
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
      hazardSource: hazardDataOf(r)?.source ?? null,
    };
  });

  // The curve and the hazards through the evaluation core, with the data and calibrations the run froze.
  const curve = candidateCurve(ctx).curve;
  const hazards = hazardsOfContext(ctx);

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
