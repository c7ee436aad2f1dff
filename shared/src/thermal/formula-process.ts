import { UnknownSpeciesError, dissolutionProducts, findSpecies, hillFormula, parseFormula, speciesKey, splitHydrate } from '../chemistry';
import type { ChemistryLibrary } from '../chemistry/types';
import type { IngredientProcessInput } from './process';

/**
 * The process of a mixture component given as a bare formula rather than a library
 * ingredient: water (`H2O`, phase l or untagged) is the solvent; any other formula is a solid
 * that dissolves (phase `cr` unless tagged), a hydrate releasing its water of crystallisation
 * into the solution. Ions per formula unit come from the species' dissociation products (a
 * non-electrolyte such as urea counts 1), for the colligative freezing estimate.
 *
 * Used by POST /api/mixtures/evaluate and by the mixture bench in the browser, so both resolve
 * a formula the same way.
 *
 * @example processForFormula(lib, 'CaCl2·6H2O')
 * // → { kind: 'dissolution', solidKey: 'CaCl2·6H2O(cr)', soluteKey: 'CaCl2(cr)', hydrateWaterPerFormula: 6, ionsPerFormulaUnit: 3 }
 * @throws UnknownSpeciesError when the formula is not in the species data or is not a solid
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
