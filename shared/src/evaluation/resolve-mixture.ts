import { FormulaError } from '../chemistry/formula';
import { UnknownSpeciesError } from '../chemistry/library';
import type { ChemistryLibrary } from '../chemistry/types';
import type { EvaluateMixtureRequest, ResolvedMixture } from '../schemas/mixtures';
import { processForFormula } from '../thermal/formula-process';
import { mixtureInputProblems } from '../thermal/mixture-input-checks';
import type { IngredientProcessInput } from '../thermal/process';
import { processOfLine, type LineRole } from './components';

/** What the bench needs of a library ingredient. */
export interface BenchIngredient {
  id: number;
  name: string;
  grade?: string | null;
  role: LineRole | string;
  process: IngredientProcessInput | null;
  cpJPerGK?: number | null;
}

export type ResolvedComponent<I extends BenchIngredient> =
  | { ingredient: I; formula: null; massG: number; process: IngredientProcessInput }
  | { ingredient: null; formula: string; massG: number; process: IngredientProcessInput };

export type ResolveMixtureResult<I extends BenchIngredient> =
  | { ok: true; mixture: ResolvedMixture; resolved: ResolvedComponent<I>[] }
  | { ok: false; fields: { field: string; message: string }[] };

/**
 * A bench request (ingredient ids or bare formulas) resolved to what {@link evaluateMixture}
 * takes — the one resolution the server (POST /api/mixtures/evaluate) and the browser's live
 * bench share: an ingredient runs its process (or the inert fallback of components.ts), a formula
 * the process the chemistry data give it (thermal/formula-process.ts). Unknown ids and formulas
 * come back as fields naming the component.
 */
export function resolveMixtureRequest<I extends BenchIngredient>(
  lib: ChemistryLibrary,
  ingredients: ReadonlyMap<number, I>,
  request: EvaluateMixtureRequest,
): ResolveMixtureResult<I> {
  const fields: { field: string; message: string }[] = [];
  const components: ResolvedMixture['components'] = [];
  const resolved: ResolvedComponent<I>[] = [];
  request.components.forEach((c, k) => {
    if (c.ingredientId !== undefined) {
      const ing = ingredients.get(c.ingredientId);
      if (!ing) {
        fields.push({ field: `components.${k}.ingredientId`, message: `no ingredient ${c.ingredientId} in this workspace's library` });
        return;
      }
      const process = processOfLine(ing);
      components.push({ key: `${ing.name}${ing.grade ? ` (${ing.grade})` : ''}`, massG: c.massG, process });
      resolved.push({ ingredient: ing, formula: null, massG: c.massG, process });
      return;
    }
    const formula = c.formula ?? '';
    try {
      // The process the bench chose or confirmed for a bare formula, else the one it is expected to have.
      const process = processForFormula(lib, formula, c.process);
      components.push({ formula, massG: c.massG, process });
      resolved.push({ ingredient: null, formula, massG: c.massG, process });
    } catch (error) {
      if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `components.${k}.formula`, message: error.message });
      else throw error;
    }
  });
  if (fields.length) return { ok: false, fields };
  // Mixtures that would pass silently: every mass 0, a salt with no water (thermal/mixture-input-checks.ts).
  const problems = mixtureInputProblems(components, (k) => (request.components[k]!.ingredientId !== undefined ? 'ingredientId' : 'formula'));
  if (problems.length) return { ok: false, fields: problems };
  const { components: _ignored, ...conditions } = request;
  return { ok: true, mixture: { ...conditions, components }, resolved };
}
