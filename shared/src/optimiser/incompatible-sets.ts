import type { ChemistryLibrary } from '../chemistry/types';
import { incompatibilities, type Incompatibility } from '../hazards/incompatibilities';
import type { Candidate, CandidateIncompatibility } from '../schemas/briefs';
import { ingredientProcessSchema } from '../thermal/process';
import type { OptimiserIngredient } from './types';

/**
 * What goes wrong when a candidate's ingredients meet, for marking and ranking (DEVELOPERS.md,
 * "Optimiser: incompatible sets"): {@link incompatibilities} of the hazards module on the
 * candidate's grams at its simulated end temperature (the brief's target when not simulated),
 * less what its chemistry does by design:
 * - gas from a reaction whose reactants one ingredient brings with the pack's water (magnesium
 *   + water → H2) is the brief's gas limit's business (the gas row), not an incompatibility;
 *   gas from a reaction that takes a reactant of another ingredient is one;
 * - `incompat.water-reactive` is the intended reaction when every water-reactive ingredient's
 *   own process is a reaction that takes water (quicklime, magnesium);
 * - `incompat.acid-base` is the intended reaction when the pair is one member's reaction and
 *   the partner it takes (barium hydroxide + ammonium chloride).
 * The hazard notes still carry every such caution; this decides only the mark and the ranking.
 * Precipitation between two ingredients' ions and the other reactive pairs always count.
 *
 * @example candidateIncompatibilities(candidate, byId, lib, 25) // → [{ kind: 'precipitation', between: ['Sodium carbonate decahydrate', 'Calcium chloride hexahydrate'], … }]
 */
export function candidateIncompatibilities(
  candidate: Pick<Candidate, 'composition'>,
  byId: ReadonlyMap<string, OptimiserIngredient>,
  lib: ChemistryLibrary,
  tempC: number,
): CandidateIncompatibility[] {
  const parts = candidate.composition
    .filter((c) => c.massG > 0)
    .map((c) => {
      const i = byId.get(c.ingredientId);
      const parsed = i?.process ? ingredientProcessSchema.safeParse(i.process) : null;
      return { name: c.name, massG: c.massG, process: parsed?.success ? parsed.data : null, hazardData: i?.hazardData ?? null };
    });
  const designed = (i: Incompatibility): boolean => {
    if (i.kind === 'gas') {
      const p = parts.find((c) => c.name === i.between[0])?.process;
      return p?.kind === 'reaction' && p.reactants.every((t) => t.key === p.ingredientKey || t.key === 'H2O(l)' || p.basis === 'premix');
    }
    if (i.kind === 'reactive' && i.subject === 'incompat.water-reactive') {
      const reactive = parts.filter((c) => c.hazardData?.incompatibilityGroups.includes('water-reactive'));
      return reactive.every((c) => c.process?.kind === 'reaction' && c.process.reactants.some((t) => t.key === 'H2O(l)'));
    }
    if (i.kind === 'reactive' && i.subject === 'incompat.acid-base') {
      // The pair is one member's reaction and the partner it takes (barium hydroxide + ammonium chloride).
      return parts.some((r) => {
        const p = r.process;
        if (p?.kind !== 'reaction') return false;
        const inIt = (c: (typeof parts)[number]) => c === r || (c.process?.kind === 'dissolution' && p.reactants.some((t) => t.key === (c.process as { solidKey: string }).solidKey));
        return i.between.length > 1 && i.between.every((n) => parts.some((c) => c.name === n && inIt(c)));
      });
    }
    return false;
  };
  return incompatibilities(parts, lib, tempC)
    .filter((i) => !designed(i))
    .map((i) => ({ kind: i.kind, between: i.between, subject: i.subject, message: i.message }));
}
