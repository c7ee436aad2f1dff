import { FormulaError, UnknownSpeciesError, type ChemistryLibrary } from '@shared/chemistry';
import type { Ingredient } from '@shared/schemas/library';
import type { EvaluateMixtureRequest, ResolvedMixture } from '@shared/schemas/mixtures';
import { mixtureInputProblems, processForFormula, type IngredientProcessInput } from '@shared/thermal';

export type ResolveResult =
  | { ok: true; mixture: ResolvedMixture }
  | { ok: false; fields: { field: string; message: string }[] };

/** Turns a bench request (ingredient ids or formulas) into what the shared `evaluateMixture` takes. */
export function resolveMixture(lib: ChemistryLibrary, ingredients: ReadonlyMap<number, Ingredient>, request: EvaluateMixtureRequest): ResolveResult {
  const fields: { field: string; message: string }[] = [];
  const components: ResolvedMixture['components'] = [];
  request.components.forEach((c, k) => {
    if (c.ingredientId !== undefined) {
      const ing = ingredients.get(c.ingredientId);
      if (!ing) {
        fields.push({ field: `components.${k}.ingredientId`, message: `no ingredient ${c.ingredientId} in the library` });
        return;
      }
      const process: IngredientProcessInput =
        ing.process ??
        (ing.role === 'solvent'
          ? { kind: 'inert', role: 'water' }
          : { kind: 'inert', role: ing.role === 'packaging' ? 'packaging' : 'additive', ...(ing.cpJPerGK ? { cp_J_per_gK: ing.cpJPerGK } : {}) });
      components.push({ key: `${ing.name}${ing.grade ? ` (${ing.grade})` : ''}`, massG: c.massG, process });
      return;
    }
    const formula = c.formula ?? '';
    try {
      components.push({ formula, massG: c.massG, process: processForFormula(lib, formula, c.process) });
    } catch (error) {
      if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `components.${k}.formula`, message: error.message });
      else throw error;
    }
  });
  if (fields.length) return { ok: false, fields };
  // The same checks the server answers with a 400 (thermal/mixture-input-checks.ts).
  const problems = mixtureInputProblems(components, (k) => (request.components[k]!.ingredientId !== undefined ? 'ingredientId' : 'formula'));
  if (problems.length) return { ok: false, fields: problems };
  const { components: _ignored, ...conditions } = request;
  return { ok: true, mixture: { ...conditions, components } };
}
