import { UnknownSpeciesError, dissolutionProducts, findSpecies, hillFormula, parseFormula, speciesKey, splitHydrate } from '../chemistry';
import type { ChemistryLibrary } from '../chemistry/types';
import type { IngredientProcessInput } from './process';

/** The process kinds a bench may choose for a bare formula. */
export const FORMULA_PROCESS_KINDS = ['dissolution', 'reaction', 'crystallisation', 'air-oxidation'] as const;
export type FormulaProcessKind = (typeof FORMULA_PROCESS_KINDS)[number];

export interface FormulaProcessOption {
  kind: FormulaProcessKind;
  /** What a chemist would call it, e.g. "hydrates: CaO + H2O → Ca(OH)2". */
  label: string;
}

/**
 * Formulas whose expected process is not dissolving (common practice, no source; the reactions'
 * enthalpies come from the species data by Hess's law):
 * - quicklime hydrates, CaO + H2O → Ca(OH)2 (the flameless food heater);
 * - magnesium oxide hydrates, MgO + H2O → Mg(OH)2 (slowly in practice);
 * - magnesium corrodes in salt water, Mg + 2 H2O → Mg(OH)2 + H2 (the ration heater);
 * - iron oxidises in air, 4 Fe + 3 O2 → 2 Fe2O3 (the hand warmer);
 * - sodium acetate trihydrate may be charged as a supercooled melt that crystallises on a trigger
 *   (the re-usable warm pack) or dissolve like any salt hydrate.
 */
const WATER_REACTIONS: Readonly<Record<string, { reactants: { key: string; coef: number }[]; products: { key: string; coef: number }[]; ingredientKey: string; label: string }>> = {
  'CaO(cr)': { reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)', label: 'hydrates: CaO + H2O → Ca(OH)2' },
  'MgO(cr)': { reactants: [{ key: 'MgO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }], ingredientKey: 'MgO(cr)', label: 'hydrates: MgO + H2O → Mg(OH)2' },
  'Mg(cr)': { reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)', label: 'reacts with water: Mg + 2 H2O → Mg(OH)2 + H2 (flammable gas)' },
};
const AIR_OXIDISING = new Set(['Fe(cr)']);
const SUPERCOOLED_MELTS = new Set(['CH3COONa·3H2O(cr)']);

/**
 * The processes a bare formula can have on the bench, the expected one first. A salt (or salt
 * hydrate) dissolves; the formulas above get their reaction, oxidation or crystallisation.
 * Melting of other salt hydrates in their own crystal water is not offered here yet.
 *
 * @example formulaProcessOptions(lib, 'CaO').map((o) => o.kind) // → ['reaction']
 * @example formulaProcessOptions(lib, 'NaCH3COO·3H2O').map((o) => o.kind) // → ['dissolution', 'crystallisation']
 */
export function formulaProcessOptions(lib: ChemistryLibrary, formula: string): FormulaProcessOption[] {
  const parsed = parseFormula(formula);
  if (hillFormula(parsed) === 'H2O' && (parsed.phase === null || parsed.phase === 'l')) return [];
  const solid = findSpecies(lib, formula, parsed.phase ?? 'cr');
  const reaction = WATER_REACTIONS[solid.key];
  if (reaction) return [{ kind: 'reaction', label: reaction.label }];
  if (AIR_OXIDISING.has(solid.key)) return [{ kind: 'air-oxidation', label: 'oxidises in air: 4 Fe + 3 O2 → 2 Fe2O3 (through the pouch film)' }];
  const options: FormulaProcessOption[] = [{ kind: 'dissolution', label: 'dissolves in the water' }];
  if (SUPERCOOLED_MELTS.has(solid.key)) options.push({ kind: 'crystallisation', label: 'a supercooled melt that crystallises on a trigger (58 °C plateau)' });
  return options;
}

/**
 * The process of a mixture component given as a bare formula rather than a library
 * ingredient: water (`H2O`, phase l or untagged) is the solvent; other formulas get the process
 * a chemist expects ({@link formulaProcessOptions}: the first option), or `kind` when the bench
 * chose one of the options. A dissolving solid is phase `cr` unless tagged, a hydrate releasing
 * its water of crystallisation into the solution. Ions per formula unit come from the species'
 * dissociation products (a non-electrolyte such as urea counts 1), for the colligative estimate.
 *
 * Used by POST /api/mixtures/evaluate and by the mixture bench in the browser, so both resolve
 * a formula the same way.
 *
 * @example processForFormula(lib, 'CaCl2·6H2O')
 * // → { kind: 'dissolution', solidKey: 'CaCl2·6H2O(cr)', soluteKey: 'CaCl2(cr)', hydrateWaterPerFormula: 6, ionsPerFormulaUnit: 3 }
 * @example processForFormula(lib, 'CaO').kind // → 'reaction'
 * @throws UnknownSpeciesError when the formula is not in the species data, is not a solid, or
 *   `kind` is not one of its options
 */
export function processForFormula(lib: ChemistryLibrary, formula: string, kind?: FormulaProcessKind): IngredientProcessInput {
  const parsed = parseFormula(formula);
  if (hillFormula(parsed) === 'H2O' && (parsed.phase === null || parsed.phase === 'l')) return { kind: 'inert', role: 'water' };
  const solid = findSpecies(lib, formula, parsed.phase ?? 'cr');
  if (solid.phase !== 'cr') {
    throw new UnknownSpeciesError(`A bare formula must be water or a solid; ${solid.key} is not a solid. Add it as an ingredient with its process.`, { formula, phase: solid.phase });
  }
  const options = formulaProcessOptions(lib, formula);
  const chosen = kind ?? options[0]?.kind ?? 'dissolution';
  if (!options.some((o) => o.kind === chosen)) {
    throw new UnknownSpeciesError(`${solid.key} cannot be given the process "${chosen}" on the bench; it can: ${options.map((o) => `${o.kind} (${o.label})`).join(', ')}.`, { formula, phase: solid.phase });
  }
  if (chosen === 'reaction') {
    const r = WATER_REACTIONS[solid.key]!;
    return { kind: 'reaction', reactants: r.reactants, products: r.products, ingredientKey: r.ingredientKey };
  }
  if (chosen === 'air-oxidation') return { kind: 'air-oxidation', metalKey: solid.key };
  if (chosen === 'crystallisation') return { kind: 'crystallisation' };
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
