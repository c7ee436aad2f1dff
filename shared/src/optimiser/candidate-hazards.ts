import { candidateHazards } from '../hazards/evaluate-candidate-hazards';
import type { SkinContact } from '../hazards/hazard-notes';
import type { Brief, Candidate } from '../schemas/briefs';
import type { CandidateHazards } from '../schemas/hazards';
import type { OptimiserIngredient, OptimiserWarning } from './types';

/**
 * How a brief's contact case meets the skin for the hazard notes: a pack worn against the skin
 * through fabric → `through-fabric`; a pack in still air is one a person holds or lays on skin
 * (a compress) → `possible`; an insulated insert (a medicine carrier) → `none`.
 */
export const SKIN_CONTACT_BY_CASE: Readonly<Record<Brief['contact'], SkinContact>> = {
  'skin-through-fabric': 'through-fabric',
  'still-air': 'possible',
  insulated: 'none',
};

/**
 * The hazards of one candidate (hazards/evaluate-candidate-hazards.ts): composition with each
 * ingredient's hazard data and process; temperatures from the verification when there is one,
 * else the linear model's adiabatic extreme and the initial temperature; contact time the
 * brief's hold; a pack that may evolve gas (`maxGasL > 0`) is taken to be vented.
 * Returns null (and a warning) when nothing in the composition carries hazard data.
 *
 * @example hazardsOfCandidate(candidate, brief, byId) // → { hazards: { notes, classification, label, score }, warnings: [] }
 */
export function hazardsOfCandidate(
  candidate: Candidate,
  brief: Brief,
  byId: ReadonlyMap<string, OptimiserIngredient>,
): { hazards: CandidateHazards | null; warnings: OptimiserWarning[] } {
  const composition = candidate.composition
    .filter((c) => c.massG > 0)
    .map((c) => {
      const i = byId.get(c.ingredientId);
      return { name: c.name, massG: c.massG, hazardData: i?.hazardData ?? null, process: i?.process ?? null, densityGPerMl: i?.densityGPerMl ?? null };
    });
  if (!composition.some((c) => c.hazardData)) return { hazards: null, warnings: [] };
  const cold = brief.packType === 'cold';
  const extreme = candidate.verification.status === 'passed' || candidate.verification.status === 'missed' ? null : candidate.predictedExtremeTempC;
  const minTempC = candidate.predictedMinTempC ?? (cold ? (extreme ?? brief.targetTempC) : brief.initialTempC);
  const maxTempC = candidate.predictedMaxTempC ?? (cold ? brief.initialTempC : (extreme ?? brief.targetTempC));
  const r = candidateHazards({
    composition,
    predicted: { minTempC, maxTempC, contact: SKIN_CONTACT_BY_CASE[brief.contact], holdMin: brief.holdMin },
    packType: brief.packType,
    vented: brief.maxGasL > 0,
  });
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
