import type { ChemistryLibrary } from '../chemistry/types';
import { incompatibilities } from '../hazards/incompatibilities';
import type { Candidate, CandidateIncompatibility } from '../schemas/briefs';
import type { OptimiserIngredient } from './types';

/**
 * What goes wrong when a candidate's ingredients meet, for marking and ranking (DEVELOPERS.md,
 * "Optimiser: incompatible sets"): {@link incompatibilities} of the hazards module on the
 * candidate's grams at its simulated end temperature (the brief's target when not simulated),
 * less what its chemistry does by design (`intended`, judged there). The hazard notes still
 * carry every such caution; this decides only the mark and the ranking.
 *
 * @example candidateIncompatibilities(candidate, byId, lib, 25) // → [{ kind: 'precipitation', between: ['Sodium carbonate decahydrate', 'Calcium chloride hexahydrate'], … }]
 */
export function candidateIncompatibilities(
  candidate: Pick<Candidate, 'composition'>,
  byId: ReadonlyMap<string, OptimiserIngredient>,
  lib: ChemistryLibrary,
  tempC: number,
): CandidateIncompatibility[] {
  const parts = candidate.composition.map((c) => {
    const i = byId.get(c.ingredientId);
    return { name: c.name, massG: c.massG, process: i?.process ?? null, hazardData: i?.hazardData ?? null };
  });
  return incompatibilities(parts, lib, tempC)
    .filter((i) => !i.intended)
    .map((i) => ({ kind: i.kind, between: i.between, subject: i.subject, message: i.message }));
}
