import type { IngredientHazardData } from '../schemas/hazards';
import { DEMO_HAZARD_DATA } from './demo-hazard-data';

/**
 * Hazard data of a bare formula on the bench: the project's hazard data of the same substance
 * (demo-hazard-data.ts, by species key of the solid). `basis` says whether the entry is the
 * harmonised classification (CLP Annex VI) or a supplier SDS; null data means the project has
 * no classification for the substance.
 */
const NAME_BY_SPECIES: Readonly<Record<string, string>> = {
  'NH4NO3(cr)': 'Ammonium nitrate',
  'NH4Cl(cr)': 'Ammonium chloride',
  'CO(NH2)2(cr)': 'Urea',
  'KCl(cr)': 'Potassium chloride',
  'KNO3(cr)': 'Potassium nitrate',
  'NaNO3(cr)': 'Sodium nitrate',
  'NaCl(cr)': 'Sodium chloride',
  'CH3COONa·3H2O(cr)': 'Sodium acetate trihydrate',
  'Na2S2O3·5H2O(cr)': 'Sodium thiosulfate pentahydrate',
  'CaCl2(cr)': 'Calcium chloride',
  'CaCl2·6H2O(cr)': 'Calcium chloride hexahydrate',
  'CaCl2·2H2O(cr)': 'Calcium chloride dihydrate',
  'MgSO4(cr)': 'Magnesium sulfate',
  'MgSO4·7H2O(cr)': 'Magnesium sulfate heptahydrate',
  'MgCl2(cr)': 'Magnesium chloride',
  'Na2CO3·10H2O(cr)': 'Sodium carbonate decahydrate',
  'Na2CO3(cr)': 'Sodium carbonate',
  'Na2SO4·10H2O(cr)': 'Sodium sulfate decahydrate',
  'NaHCO3(cr)': 'Sodium bicarbonate',
  '(NH4)2SO4(cr)': 'Ammonium sulfate',
  'LiCl(cr)': 'Lithium chloride',
  'NaOH(cr)': 'Sodium hydroxide',
  'CaO(cr)': 'Calcium oxide',
  'Fe(cr)': 'Iron powder',
  'Mg(cr)': 'Magnesium powder',
  'Ba(OH)2·8H2O(cr)': 'Barium hydroxide octahydrate',
  'BaCl2·2H2O(cr)': 'Barium chloride dihydrate',
  'H2O(l)': 'Water',
};

export interface FormulaHazardData {
  hazardData: IngredientHazardData | null;
  basis: 'harmonised' | 'supplier-sds' | null;
  /** One sentence for the bench: where the classification comes from, or that there is none. */
  statement: string;
}

/**
 * @example hazardDataForSpecies('NH4Cl(cr)', 'NH4Cl').basis // → 'harmonised'
 * @example hazardDataForSpecies('KBr(cr)', 'KBr').hazardData // → null
 */
export function hazardDataForSpecies(speciesKey: string, formula: string): FormulaHazardData {
  const name = NAME_BY_SPECIES[speciesKey];
  const data = name ? DEMO_HAZARD_DATA[name] ?? null : null;
  if (!data) {
    return { hazardData: null, basis: null, statement: `${formula}: the project's data hold no classification for this substance; check its safety data sheet before use.` };
  }
  const harmonised = /harmonised/i.test(data.source);
  return {
    hazardData: data,
    basis: harmonised ? 'harmonised' : 'supplier-sds',
    statement: `${formula}: classified as ${name} — ${harmonised ? 'harmonised classification (CLP Annex VI)' : 'a supplier safety data sheet (no harmonised entry in the project\'s data)'}; source: ${data.source}.`,
  };
}
