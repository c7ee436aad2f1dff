import {
  FormulaError,
  UnknownSpeciesError,
  dissolutionProducts,
  findSpecies,
  hillFormula,
  parseFormula,
  speciesKey,
  splitHydrate,
  type ChemistryLibrary,
} from '@shared/chemistry';
import type { Ingredient } from '@shared/schemas/library';
import type { EvaluateMixtureRequest, ResolvedMixture } from '@shared/schemas/mixtures';
import type { IngredientProcessInput } from '@shared/thermal';

/**
 * The process of a component given as a bare formula, by the rule the server applies to
 * POST /api/mixtures/evaluate: water (`H2O`) is the solvent; any other formula is a solid that
 * dissolves (phase `cr` unless tagged), a hydrate releasing its water of crystallisation.
 */
export function processForFormula(lib: ChemistryLibrary, formula: string): IngredientProcessInput {
  const parsed = parseFormula(formula);
  if (hillFormula(parsed) === 'H2O' && (parsed.phase === null || parsed.phase === 'l')) return { kind: 'inert', role: 'water' };
  const solid = findSpecies(lib, formula, parsed.phase ?? 'cr');
  if (solid.phase !== 'cr') {
    throw new UnknownSpeciesError(`A bare formula must be water or a dissolving solid; ${solid.key} is not a solid. Add it as an ingredient with its process.`, { formula, phase: solid.phase });
  }
  const { anhydrous, waterCount } = splitHydrate(solid.formula);
  let soluteKey = solid.key;
  if (waterCount > 0) {
    try {
      soluteKey = findSpecies(lib, anhydrous, 'cr').key;
    } catch {
      soluteKey = speciesKey(anhydrous, 'cr');
    }
  }
  let ions = 1;
  try {
    ions = Math.max(1, Math.round(dissolutionProducts(lib, soluteKey).products.reduce((n, p) => n + p.nu, 0)));
  } catch {
    ions = 1; // a non-electrolyte such as urea
  }
  return {
    kind: 'dissolution',
    solidKey: solid.key,
    ...(soluteKey !== solid.key ? { soluteKey } : {}),
    hydrateWaterPerFormula: waterCount,
    ionsPerFormulaUnit: Math.min(6, ions),
  };
}

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
      components.push({ formula, massG: c.massG, process: processForFormula(lib, formula) });
    } catch (error) {
      if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `components.${k}.formula`, message: error.message });
      else throw error;
    }
  });
  if (fields.length) return { ok: false, fields };
  const { components: _ignored, ...conditions } = request;
  return { ok: true, mixture: { ...conditions, components } };
}
