import { lineOf, type EvaluationLine } from '../evaluation/components';
import { hazardsUnderBrief } from '../evaluation/hazards';
import type { Brief, Candidate } from '../schemas/briefs';
import type { CandidateHazards } from '../schemas/hazards';
import type { OptimiserIngredient, OptimiserWarning } from './types';

export { SKIN_CONTACT_BY_CASE } from '../evaluation/hazards';

/**
 * The hazards of one candidate through the evaluation core (evaluation/hazards.ts: the fill with
 * each ingredient's hazard data, process and density; the one temperature fallback; the brief's
 * skin contact, hold and venting), plus a warning where a per-ingredient cap cannot limit a sum.
 * Returns null (and no warning) when nothing in the composition carries hazard data.
 *
 * @example hazardsOfCandidate(candidate, brief, byId) // → { hazards: { notes, classification, label, score }, warnings: [] }
 */
export function hazardsOfCandidate(
  candidate: Candidate,
  brief: Brief,
  byId: ReadonlyMap<string, OptimiserIngredient>,
): { hazards: CandidateHazards | null; warnings: OptimiserWarning[] } {
  const lines: EvaluationLine[] = candidate.composition.map((c) => {
    const i = byId.get(c.ingredientId);
    return i ? { ...lineOf(i, c.massG, c.name), role: c.role } : { id: c.ingredientId, name: c.name, massG: c.massG, role: c.role, process: null };
  });
  const verified = candidate.verification.status === 'passed' || candidate.verification.status === 'missed';
  const r = hazardsUnderBrief(lines, brief, {
    predictedMinTempC: candidate.predictedMinTempC,
    predictedMaxTempC: candidate.predictedMaxTempC,
    predictedExtremeTempC: verified ? null : candidate.predictedExtremeTempC,
  });
  if (!r) return { hazards: null, warnings: [] };
  const warnings: OptimiserWarning[] = [];
  // Per-ingredient caps cannot see sums: say so when a capped class still applies to the mixture.
  const capped = brief.excludedHazardClasses.filter((e) => e.startsWith('cap:')).map((e) => e.slice(4));
  for (const c of r.classification) {
    if (capped.includes(`${c.hazardClass}-${c.category.toLowerCase()}`) || (capped.includes('skin-corr-1') && c.hazardClass === 'skin-corr')) {
      warnings.push({ code: 'hazards.cap-sum', message: `the mixture is still ${c.hazardClass} ${c.category} (${c.rule}): per-ingredient caps do not limit the sum of several ingredients` });
    }
  }
  const hazards: CandidateHazards = { notes: r.notes, classification: r.classification, label: r.label, score: r.score };
  return { hazards, warnings };
}
