import type { IngredientProcessInput } from '../thermal/process';
import type { OptimiserIngredient } from '../optimiser/types';

// The demo scenario's ingredient libraries, as pure data. One source for the database seed
// (backend/src/ingredients/ingredients.seed.ts maps each record to a create-ingredient request)
// and for the optimiser's benchmark and tests (demoOptimiserLibrary() below).
//
// Invented grades and invented costs (not market prices); real chemistry. Thermochemical data
// come from the species data (NBS 1982); densities are handbook values written from memory (CRC
// Handbook, "Physical Constants of Inorganic Compounds"); bulk densities of porous media and the
// packaging figures are typical values, from memory.

export type DemoIngredientRole = 'active' | 'solvent' | 'additive' | 'packaging';

/** What an ingredient needs beside it, by the stable demo key of the other ingredient. */
export interface DemoIngredientNeed {
  key: string;
  /** Grams of the other ingredient per gram of this one, at least. */
  minGPerG: number;
  /** At most; absent: no upper ratio. */
  maxGPerG?: number;
  source?: string;
}

export interface DemoIngredient {
  /** Stable key of the demo record (the optimiser's tests and benchmark use it as the id). */
  key: string;
  name: string;
  grade: string;
  role: DemoIngredientRole;
  process: IngredientProcessInput | null;
  /** Decimal string in the workspace currency (invented). */
  costPerKg: string;
  densityGPerMl: number | null;
  /** Specific heat capacity of an inert ingredient, J/(g·K). */
  cpJPerGK?: number;
  /** The species the ingredient is, when it is not the dissolving solid of its process. */
  speciesKey?: string;
  sources: string[];
  notes: string;
  needs?: DemoIngredientNeed[];
}

const NBS = 'NBS 1982 tables (Wagman et al., J. Phys. Chem. Ref. Data 11, Suppl. 2): ΔfH°, S°, Cp°';
const CRC_SOL = 'CRC Handbook of Chemistry and Physics, 98th ed., Aqueous Solubility of Inorganic Compounds';
const CRC_DENSITY = 'CRC Handbook, Physical Constants of Inorganic Compounds: density (from memory)';
const TYPICAL = 'typical handbook value (from memory)';
const INVENTED_SHEET = 'supplier data sheet of the demo scenario (invented)';
const PRACTICE = 'common practice (from memory)';

const dissolving = (solidKey: string, ions: number, hydrate?: { soluteKey: string; water: number }): IngredientProcessInput => ({
  kind: 'dissolution',
  solidKey,
  ionsPerFormulaUnit: ions,
  ...(hydrate ? { soluteKey: hydrate.soluteKey, hydrateWaterPerFormula: hydrate.water } : {}),
});

const inert = (role: 'additive' | 'packaging', cp: number, cpSource: string): IngredientProcessInput => ({ kind: 'inert', role, cp_J_per_gK: cp, cpSource });

/** Key of the demo workspace's water. */
export const DEMO_WATER_KEY = 'water';

/** Typical iron-warmer recipes: salt a few % of the iron, carbon and a filler of the order of a third to a half. */
const IRON_WARMER_NEEDS = [
  { key: 'sodium-chloride', minGPerG: 0.03, maxGPerG: 0.15, source: PRACTICE },
  { key: 'activated-carbon', minGPerG: 0.2, maxGPerG: 0.6, source: PRACTICE },
  { key: 'vermiculite', minGPerG: 0.15, maxGPerG: 0.6, source: PRACTICE },
  { key: DEMO_WATER_KEY, minGPerG: 0.25, maxGPerG: 0.6, source: PRACTICE },
];

/** The demo workspace's library: 38 ingredients — 29 actives, water, 5 additives (3 of them what the iron warmer needs) and 3 packaging items. */
export const DEMO_INGREDIENTS: readonly DemoIngredient[] = [
  // Endothermic dissolution: cold packs.
  {
    key: 'ammonium-nitrate', name: 'Ammonium nitrate', grade: 'Prilled, technical 34.5 % N', role: 'active', process: dissolving('NH4NO3(cr)', 2),
    costPerKg: '1.85', densityGPerMl: 1.72, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Strongly endothermic on dissolving (≈ +25.7 kJ/mol at infinite dilution). Oxidiser (GHS H272); a regulated explosives precursor in many jurisdictions — check local rules and the safety data sheet before buying or shipping.',
  },
  {
    key: 'ammonium-chloride', name: 'Ammonium chloride', grade: 'Fine crystals, technical', role: 'active', process: dissolving('NH4Cl(cr)', 2),
    costPerKg: '1.20', densityGPerMl: 1.519, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; harmful if swallowed and an eye irritant (see the safety data sheet).',
  },
  {
    key: 'urea', name: 'Urea', grade: 'Prilled, technical 46 % N', role: 'active', process: dissolving('CO(NH2)2(cr)', 1),
    costPerKg: '0.72', densityGPerMl: 1.32, sources: [NBS, "Lange's Handbook of Chemistry: solubility of urea in water (as in the species data)", CRC_DENSITY],
    notes: 'The non-oxidising cold-pack solute; the CRC solubility table does not cover urea, so its solubility series comes from a handbook of organic solubilities (rounded, see the species data).',
  },
  {
    key: 'potassium-chloride', name: 'Potassium chloride', grade: 'Crystalline, technical', role: 'active', process: dissolving('KCl(cr)', 2),
    costPerKg: '0.95', densityGPerMl: 1.988, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    key: 'potassium-nitrate', name: 'Potassium nitrate', grade: 'Crystalline, technical', role: 'active', process: dissolving('KNO3(cr)', 2),
    costPerKg: '1.60', densityGPerMl: 2.105, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Oxidiser (GHS H272); keep away from fuels such as iron powder, carbon and organic thickeners.',
  },
  {
    key: 'sodium-nitrate', name: 'Sodium nitrate', grade: 'Crystalline, technical', role: 'active', process: dissolving('NaNO3(cr)', 2),
    costPerKg: '1.10', densityGPerMl: 2.26, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving. Oxidiser (GHS H272); keep away from fuels.',
  },
  {
    key: 'ammonium-sulfate', name: 'Ammonium sulfate', grade: 'Crystalline, technical', role: 'active', process: dissolving('(NH4)2SO4(cr)', 3),
    costPerKg: '0.50', densityGPerMl: 1.77, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Mildly endothermic on dissolving; very soluble and cheap.',
  },
  {
    key: 'sodium-chloride-food', name: 'Sodium chloride', grade: 'Fine, food grade', role: 'active', process: dissolving('NaCl(cr)', 2),
    costPerKg: '0.30', densityGPerMl: 2.17, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Only weakly endothermic on dissolving; mostly useful for its freezing-point depression.',
  },
  {
    key: 'sodium-thiosulfate-5h2o', name: 'Sodium thiosulfate pentahydrate', grade: 'Crystals, photographic grade', role: 'active',
    process: dissolving('Na2S2O3·5H2O(cr)', 3, { soluteKey: 'Na2S2O3(cr)', water: 5 }),
    costPerKg: '1.35', densityGPerMl: 1.69, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; its water of crystallisation joins the solution.',
  },
  {
    key: 'sodium-carbonate-10h2o', name: 'Sodium carbonate decahydrate', grade: 'Washing soda crystals', role: 'active',
    process: dissolving('Na2CO3·10H2O(cr)', 3, { soluteKey: 'Na2CO3(cr)', water: 10 }),
    costPerKg: '0.65', densityGPerMl: 1.46, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; eye irritant (GHS H319).',
  },
  {
    key: 'sodium-sulfate-10h2o', name: 'Sodium sulfate decahydrate', grade: "Glauber's salt, technical", role: 'active',
    process: dissolving('Na2SO4·10H2O(cr)', 3, { soluteKey: 'Na2SO4(cr)', water: 10 }),
    costPerKg: '0.40', densityGPerMl: 1.46, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Endothermic on dissolving.',
  },
  {
    key: 'sodium-acetate-3h2o', name: 'Sodium acetate trihydrate', grade: 'Crystals, technical (for dissolving)', role: 'active',
    process: dissolving('CH3COONa·3H2O(cr)', 2, { soluteKey: 'CH3COONa(cr)', water: 3 }),
    costPerKg: '2.10', densityGPerMl: 1.45, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'The trihydrate dissolves endothermically.',
  },
  {
    key: 'magnesium-sulfate-7h2o', name: 'Magnesium sulfate heptahydrate', grade: 'Epsom salt, technical', role: 'active',
    process: dissolving('MgSO4·7H2O(cr)', 2, { soluteKey: 'MgSO4(cr)', water: 7 }),
    costPerKg: '0.55', densityGPerMl: 1.68, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'The heptahydrate dissolves endothermically.',
  },
  {
    key: 'calcium-chloride-6h2o', name: 'Calcium chloride hexahydrate', grade: 'Flakes, technical', role: 'active',
    process: dissolving('CaCl2·6H2O(cr)', 3, { soluteKey: 'CaCl2(cr)', water: 6 }),
    costPerKg: '0.70', densityGPerMl: 1.71, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Unlike the anhydrous salt, the hexahydrate dissolves endothermically.',
  },
  {
    key: 'sodium-bicarbonate', name: 'Sodium bicarbonate', grade: 'Powder, technical', role: 'active', process: dissolving('NaHCO3(cr)', 2),
    costPerKg: '0.45', densityGPerMl: 2.2, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Endothermic on dissolving, but only sparingly soluble.',
  },
  {
    key: 'barium-chloride-2h2o', name: 'Barium chloride dihydrate', grade: 'Crystals, reagent', role: 'active',
    process: dissolving('BaCl2·2H2O(cr)', 3, { soluteKey: 'BaCl2(cr)', water: 2 }),
    costPerKg: '4.20', densityGPerMl: 3.097, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Toxic if swallowed (GHS H301); listed for comparison only.',
  },
  // Exothermic dissolution: warm packs.
  {
    key: 'calcium-chloride', name: 'Calcium chloride', grade: 'Anhydrous granules 94–97 %', role: 'active', process: dissolving('CaCl2(cr)', 3),
    costPerKg: '0.85', densityGPerMl: 2.15, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Strongly exothermic on dissolving (≈ −81 kJ/mol); eye irritant (GHS H319). Hygroscopic: store sealed.',
  },
  {
    key: 'calcium-chloride-2h2o', name: 'Calcium chloride dihydrate', grade: 'Flakes 74–77 %', role: 'active',
    process: dissolving('CaCl2·2H2O(cr)', 3, { soluteKey: 'CaCl2(cr)', water: 2 }),
    costPerKg: '0.70', densityGPerMl: 1.85, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Exothermic on dissolving, less so than the anhydrous salt; eye irritant (GHS H319).',
  },
  {
    key: 'magnesium-sulfate', name: 'Magnesium sulfate', grade: 'Anhydrous, technical', role: 'active', process: dissolving('MgSO4(cr)', 2),
    costPerKg: '0.90', densityGPerMl: 2.66, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Exothermic on dissolving (≈ −91 kJ/mol).',
  },
  {
    key: 'magnesium-chloride', name: 'Magnesium chloride', grade: 'Anhydrous, technical', role: 'active', process: dissolving('MgCl2(cr)', 3),
    costPerKg: '1.50', densityGPerMl: 2.32, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Strongly exothermic on dissolving; hygroscopic.',
  },
  {
    key: 'lithium-chloride', name: 'Lithium chloride', grade: 'Anhydrous, 99 %', role: 'active', process: dissolving('LiCl(cr)', 2),
    costPerKg: '9.00', densityGPerMl: 2.07, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Exothermic on dissolving; harmful if swallowed (GHS H302), skin and eye irritant.',
  },
  {
    key: 'sodium-hydroxide', name: 'Sodium hydroxide', grade: 'Pellets, technical', role: 'active', process: dissolving('NaOH(cr)', 2),
    costPerKg: '1.60', densityGPerMl: 2.13, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Strongly exothermic on dissolving; causes severe skin burns and eye damage (GHS H314): a comparison chemistry, not for consumer packs.',
  },
  {
    key: 'sodium-carbonate', name: 'Sodium carbonate', grade: 'Anhydrous, dense soda ash', role: 'active', process: dissolving('Na2CO3(cr)', 3),
    costPerKg: '0.40', densityGPerMl: 2.54, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Exothermic on dissolving; eye irritant (GHS H319).',
  },
  // Reactions, crystallisation, air oxidation.
  {
    key: 'quicklime', name: 'Calcium oxide', grade: 'Quicklime, food-heater grade', role: 'active',
    process: { kind: 'reaction', reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)' },
    costPerKg: '0.40', densityGPerMl: 3.34, sources: [NBS, CRC_DENSITY],
    notes: 'Hydration CaO + H2O → Ca(OH)2 releases about 65 kJ/mol. Corrosive to eyes and skin (GHS H315, H318); steam and surfaces can exceed 100 °C locally.',
  },
  {
    key: 'magnesium-powder', name: 'Magnesium powder', grade: 'Mg–Fe alloy powder for flameless heaters', role: 'active',
    process: { kind: 'reaction', reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' },
    costPerKg: '6.80', densityGPerMl: 1.738, speciesKey: 'Mg(cr)', sources: [NBS, CRC_DENSITY],
    notes: 'Mg + 2H2O → Mg(OH)2 + H2 releases about 353 kJ/mol and one mole of hydrogen per mole of magnesium (about 1 L per g at 25 °C): flammable gas, vent the heater bag (GHS H260, H250 for fine powder).',
  },
  {
    key: 'barium-hydroxide-8h2o', name: 'Barium hydroxide octahydrate', grade: 'Crystals, reagent', role: 'active',
    process: {
      kind: 'reaction',
      reactants: [{ key: 'Ba(OH)2·8H2O(cr)', coef: 1 }, { key: 'NH4Cl(cr)', coef: 2 }],
      // The ammonia dissolves in the eight waters the reaction frees (as the chemistry reference check writes it).
      products: [{ key: 'BaCl2·2H2O(cr)', coef: 1 }, { key: 'NH3(aq)', coef: 2 }, { key: 'H2O(l)', coef: 8 }],
      ingredientKey: 'Ba(OH)2·8H2O(cr)',
    },
    costPerKg: '9.50', densityGPerMl: 2.18, speciesKey: 'Ba(OH)2·8H2O(cr)', sources: [NBS, CRC_DENSITY],
    notes: 'Solid–solid endothermic reaction with ammonium chloride (2 mol per mol); the ammonia dissolves in the water the reaction frees and smells strongly. Barium compounds are harmful if swallowed and corrosive (GHS H302, H332, H314): a demonstration chemistry, not for consumer packs.',
  },
  {
    key: 'sodium-acetate-supercooled', name: 'Sodium acetate trihydrate', grade: 'Crystallising grade, nucleation-clean', role: 'active',
    process: { kind: 'crystallisation' },
    costPerKg: '2.40', densityGPerMl: 1.45, speciesKey: 'CH3COONa·3H2O(cr)',
    sources: ['Lane 1983 and Sharma et al. 2009: melting point 58 °C, latent heat 264–289 J/g (from memory)', CRC_DENSITY],
    notes: 'Reusable warm pack: a supercooled melt crystallises on a trigger and holds near 54–58 °C; boiling the pouch re-melts it. Skin contact above about 44 °C for long periods can burn — mind the fabric sleeve.',
  },
  {
    key: 'iron-powder', name: 'Iron powder', grade: 'Reduced, 100 mesh', role: 'active', process: { kind: 'air-oxidation' },
    costPerKg: '3.10', densityGPerMl: 7.874, sources: [NBS, CRC_DENSITY, 'O2 permeance default: back-calculated from the usual behaviour of disposable hand warmers (assumption)'],
    notes: 'Air oxidation 4Fe + 3O2 → 2Fe2O3 with salt water, activated carbon and vermiculite; the rate is set by oxygen through the pouch film. Flammable solid when very fine.',
    needs: IRON_WARMER_NEEDS,
  },
  {
    // The same powder packed in a reduced-flow microporous film: about 60 % of the default permeance, so
    // a slim insert against the skin settles at a gentle temperature for hours instead of running hot.
    key: 'iron-powder-reduced-flow', name: 'Iron powder', grade: 'Reduced, 100 mesh, in reduced-flow film pouch', role: 'active',
    process: { kind: 'air-oxidation', filmO2Permeance_mol_per_m2_s_Pa: 2.6e-8 },
    costPerKg: '3.60', densityGPerMl: 7.874, sources: [NBS, CRC_DENSITY, 'reduced-flow film permeance: about 60 % of the default film (invented demo grade; assumption)'],
    notes: 'As the standard iron powder, in a pouch film that lets about 60 % as much oxygen through: lower, longer heat for gloves and inserts. Long skin contact at 40–44 °C can still cause low-temperature burns.',
    needs: IRON_WARMER_NEEDS,
  },
  // Solvent, additives, packaging.
  {
    key: DEMO_WATER_KEY, name: 'Water', grade: 'Deionised', role: 'solvent', process: { kind: 'inert', role: 'water' },
    costPerKg: '0.02', densityGPerMl: 0.997, speciesKey: 'H2O(l)', sources: ['IAPWS-95: density 0.997 g/mL and cp 4.18 J/(g·K) at 25 °C'], notes: '',
  },
  {
    key: 'sodium-chloride', name: 'Sodium chloride', grade: 'Electrolyte grade, fine powder', role: 'additive', process: inert('additive', 0.864, 'NBS 1982 Cp° of NaCl(cr) 50.5 J/(mol·K) ÷ 58.44 g/mol'),
    costPerKg: '0.45', densityGPerMl: 2.17, cpJPerGK: 0.864, sources: [NBS, CRC_DENSITY],
    notes: 'Electrolyte that lets iron powder oxidise in air in warmers; carried as heat capacity only.',
  },
  {
    key: 'activated-carbon', name: 'Activated carbon', grade: 'Powder, 900 m²/g', role: 'additive', process: inert('additive', 0.71, `graphite-like carbon near 25 °C, ${TYPICAL}`),
    costPerKg: '2.90', densityGPerMl: 0.45, cpJPerGK: 0.71, sources: [TYPICAL, INVENTED_SHEET],
    notes: 'Holds water and spreads air through iron-powder warmers. Density is the bulk density.',
  },
  {
    key: 'vermiculite', name: 'Vermiculite', grade: 'Exfoliated, fine', role: 'additive', process: inert('additive', 0.84, `mica mineral, ${TYPICAL}`),
    costPerKg: '1.10', densityGPerMl: 0.1, cpJPerGK: 0.84, sources: [TYPICAL, INVENTED_SHEET],
    notes: 'Water reservoir and insulation in warmers. Density is the bulk density.',
  },
  {
    key: 'guar-gum', name: 'Guar gum', grade: 'Thickener, 5000 mPa·s (1 %)', role: 'additive', process: inert('additive', 1.4, `polysaccharide powder, ${TYPICAL}`),
    costPerKg: '5.20', densityGPerMl: 1.5, cpJPerGK: 1.4, sources: [INVENTED_SHEET, TYPICAL],
    notes: 'Thickens the solution so it stays spread in the pouch.',
  },
  {
    key: 'carboxymethyl-cellulose', name: 'Sodium carboxymethyl cellulose', grade: 'CMC, medium viscosity', role: 'additive', process: inert('additive', 1.3, `cellulose ether powder, ${TYPICAL}`),
    costPerKg: '6.40', densityGPerMl: 1.6, cpJPerGK: 1.3, sources: [INVENTED_SHEET, TYPICAL], notes: 'Gel former for reusable packs.',
  },
  {
    key: 'pouch-film', name: 'Pouch film', grade: 'PET/PE laminate 12/75 µm', role: 'packaging', process: inert('packaging', 1.9, `polyethylene, ${TYPICAL}`),
    costPerKg: '7.50', densityGPerMl: 1.0, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Sealed outer pouch of cold packs; barrier to water vapour.',
  },
  {
    key: 'breathable-pouch-film', name: 'Breathable pouch film', grade: 'Microporous PE, air-permeable', role: 'packaging', process: inert('packaging', 1.9, `polyethylene, ${TYPICAL}`),
    costPerKg: '11.80', densityGPerMl: 0.93, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Lets oxygen reach iron-powder warmers; its permeance sets their heat output.',
  },
  {
    key: 'fabric-sleeve', name: 'Non-woven fabric sleeve', grade: 'Polypropylene spunbond 40 g/m²', role: 'packaging', process: inert('packaging', 1.9, `polypropylene, ${TYPICAL}`),
    costPerKg: '4.60', densityGPerMl: 0.91, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Skin-side sleeve: spreads contact heat and cold.',
  },
];

/** The harbour workspace's smaller cold-chain library (costs in GBP, invented). */
export const HARBOUR_INGREDIENTS: readonly DemoIngredient[] = [
  {
    key: 'ammonium-chloride', name: 'Ammonium chloride', grade: 'Technical, 99.5 %', role: 'active', process: dissolving('NH4Cl(cr)', 2),
    costPerKg: '1.05', densityGPerMl: 1.519, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    key: 'urea', name: 'Urea', grade: 'Fertiliser prills', role: 'active', process: dissolving('CO(NH2)2(cr)', 1),
    costPerKg: '0.61', densityGPerMl: 1.32, sources: [NBS, CRC_DENSITY], notes: '',
  },
  {
    key: 'sodium-sulfate-10h2o', name: 'Sodium sulfate decahydrate', grade: "Glauber's salt, technical", role: 'active',
    process: dissolving('Na2SO4·10H2O(cr)', 3, { soluteKey: 'Na2SO4(cr)', water: 10 }),
    costPerKg: '0.48', densityGPerMl: 1.46, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Endothermic on dissolving.',
  },
  {
    key: 'potassium-chloride', name: 'Potassium chloride', grade: 'Food grade', role: 'active', process: dissolving('KCl(cr)', 2),
    costPerKg: '1.15', densityGPerMl: 1.988, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    key: DEMO_WATER_KEY, name: 'Water', grade: 'Potable', role: 'solvent', process: { kind: 'inert', role: 'water' },
    costPerKg: '0.01', densityGPerMl: 0.997, speciesKey: 'H2O(l)', sources: ['IAPWS-95: density 0.997 g/mL at 25 °C'], notes: '',
  },
  {
    key: 'carboxymethyl-cellulose', name: 'Sodium carboxymethyl cellulose', grade: 'High viscosity', role: 'additive', process: inert('additive', 1.3, `cellulose ether powder, ${TYPICAL}`),
    costPerKg: '5.90', densityGPerMl: 1.6, cpJPerGK: 1.3, sources: [INVENTED_SHEET, TYPICAL], notes: '',
  },
  {
    key: 'hdpe-insert-shell', name: 'HDPE insert shell', grade: 'Blow-moulded, 1.2 mm', role: 'packaging', process: inert('packaging', 1.9, `high-density polyethylene, ${TYPICAL}`),
    costPerKg: '3.20', densityGPerMl: 0.95, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Rigid shell of the medicine-box cold insert.',
  },
];

/**
 * A demo library in the optimiser's shape: the demo key is the id, needs name ingredients by
 * their key, the name carries the grade (as the back end's mapping of library records does).
 * Throws when a need names a key the list does not hold.
 *
 * @example demoOptimiserLibrary().find((i) => i.id === 'iron-powder')!.needs![0]!.ingredientId // → 'sodium-chloride'
 */
export function demoOptimiserLibrary(items: readonly DemoIngredient[] = DEMO_INGREDIENTS): OptimiserIngredient[] {
  const keys = new Set(items.map((i) => i.key));
  return items.map((i) => {
    const needs = i.needs?.map((n) => {
      if (!keys.has(n.key)) throw new Error(`Demo ingredient ${i.key} needs "${n.key}", which is not in the list; expected one of ${[...keys].join(', ')}.`);
      return { ingredientId: n.key, minGPerG: n.minGPerG, ...(n.maxGPerG !== undefined ? { maxGPerG: n.maxGPerG } : {}), ...(n.source ? { source: n.source } : {}) };
    });
    return {
      id: i.key,
      name: i.grade ? `${i.name} (${i.grade})` : i.name,
      role: i.role,
      costPerKg: i.costPerKg,
      process: i.process,
      cpJPerGK: i.cpJPerGK ?? null,
      densityGPerMl: i.densityGPerMl,
      ...(needs ? { needs } : {}),
    };
  });
}
