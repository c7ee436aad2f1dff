import { Op, col, fn, where as sqlWhere } from 'sequelize';
import { createIngredientRequestSchema, ingredientRuleErrors, type CreateIngredientRequest } from '@shared/schemas';
import type { z } from 'zod';
import { registerSeedStep } from '../db/seed';
import { workspaceChemistryLibrary } from '../species/species.service';
import { IngredientRecord } from './ingredient.model';
import { referenceErrors, valuesFromCreate } from './ingredients.service';

// Demo ingredient libraries: invented grades and invented costs, real chemistry. Thermochemical
// data come from the species data (NBS 1982); densities are handbook values written from memory
// (CRC Handbook, "Physical Constants of Inorganic Compounds"), bulk densities of porous media and
// the packaging figures are typical values, from memory.

type SeedIngredient = z.input<typeof createIngredientRequestSchema>;

const NBS = 'NBS 1982 tables (Wagman et al., J. Phys. Chem. Ref. Data 11, Suppl. 2): ΔfH°, S°, Cp°';
const CRC_SOL = 'CRC Handbook of Chemistry and Physics, 98th ed., Aqueous Solubility of Inorganic Compounds';
const CRC_DENSITY = 'CRC Handbook, Physical Constants of Inorganic Compounds: density (from memory)';
const TYPICAL = 'typical handbook value (from memory)';
const INVENTED_SHEET = 'supplier data sheet of the demo scenario (invented)';

const dissolving = (solidKey: string, extra: Record<string, unknown> = {}) => ({ kind: 'dissolution' as const, solidKey, ...extra });

export const DEMO_INGREDIENTS: SeedIngredient[] = [
  {
    name: 'Ammonium nitrate', grade: 'Prilled, technical 34.5 % N', role: 'active', process: dissolving('NH4NO3(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '1.85', densityGPerMl: 1.72, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Strongly endothermic on dissolving (≈ +25.7 kJ/mol at infinite dilution). Oxidiser (GHS H272); a regulated explosives precursor in many jurisdictions — check local rules and the safety data sheet before buying or shipping.',
  },
  {
    name: 'Ammonium chloride', grade: 'Fine crystals, technical', role: 'active', process: dissolving('NH4Cl(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '1.20', densityGPerMl: 1.519, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; harmful if swallowed and an eye irritant (see the safety data sheet).',
  },
  {
    name: 'Urea', grade: 'Prilled, technical 46 % N', role: 'active', process: dissolving('CO(NH2)2(cr)', { ionsPerFormulaUnit: 1 }),
    costPerKg: '0.72', densityGPerMl: 1.32, sources: [NBS, "Lange's Handbook of Chemistry: solubility of urea in water (as in the species data)", CRC_DENSITY],
    notes: 'The non-oxidising cold-pack solute; the CRC solubility table does not cover urea, so its solubility series comes from a handbook of organic solubilities (rounded, see the species data).',
  },
  {
    name: 'Potassium chloride', grade: 'Crystalline, technical', role: 'active', process: dissolving('KCl(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '0.95', densityGPerMl: 1.988, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    name: 'Potassium nitrate', grade: 'Crystalline, technical', role: 'active', process: dissolving('KNO3(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '1.60', densityGPerMl: 2.105, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Oxidiser (GHS H272); keep away from fuels such as iron powder, carbon and organic thickeners.',
  },
  {
    name: 'Sodium chloride', grade: 'Fine, food grade', role: 'active', process: dissolving('NaCl(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '0.30', densityGPerMl: 2.17, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Only weakly endothermic on dissolving; mostly useful for its freezing-point depression.',
  },
  {
    name: 'Sodium chloride', grade: 'Electrolyte grade, fine powder', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.864, cpSource: 'NBS 1982 Cp° of NaCl(cr) 50.5 J/(mol·K) ÷ 58.44 g/mol' },
    costPerKg: '0.45', densityGPerMl: 2.17, cpJPerGK: 0.864, sources: [NBS, CRC_DENSITY],
    notes: 'Electrolyte that lets iron powder oxidise in air in warmers; carried as heat capacity only.',
  },
  {
    name: 'Sodium acetate trihydrate', grade: 'Crystallising grade, nucleation-clean', role: 'active',
    process: { kind: 'crystallisation' },
    costPerKg: '2.40', densityGPerMl: 1.45, speciesKey: 'CH3COONa·3H2O(cr)',
    sources: ['Lane 1983 and Sharma et al. 2009: melting point 58 °C, latent heat 264–289 J/g (from memory)', CRC_DENSITY],
    notes: 'Reusable warm pack: a supercooled melt crystallises on a trigger and holds near 54–58 °C; boiling the pouch re-melts it. Skin contact above about 44 °C for long periods can burn — mind the fabric sleeve.',
  },
  {
    name: 'Sodium thiosulfate pentahydrate', grade: 'Crystals, photographic grade', role: 'active',
    process: dissolving('Na2S2O3·5H2O(cr)', { soluteKey: 'Na2S2O3(cr)', hydrateWaterPerFormula: 5, ionsPerFormulaUnit: 3 }),
    costPerKg: '1.35', densityGPerMl: 1.69, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; its water of crystallisation joins the solution.',
  },
  {
    name: 'Calcium chloride', grade: 'Anhydrous granules 94–97 %', role: 'active', process: dissolving('CaCl2(cr)', { ionsPerFormulaUnit: 3 }),
    costPerKg: '0.85', densityGPerMl: 2.15, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Strongly exothermic on dissolving (≈ −81 kJ/mol); eye irritant (GHS H319). Hygroscopic: store sealed.',
  },
  {
    name: 'Calcium chloride hexahydrate', grade: 'Flakes, technical', role: 'active',
    process: dissolving('CaCl2·6H2O(cr)', { soluteKey: 'CaCl2(cr)', hydrateWaterPerFormula: 6, ionsPerFormulaUnit: 3 }),
    costPerKg: '0.70', densityGPerMl: 1.71, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Unlike the anhydrous salt, the hexahydrate dissolves endothermically.',
  },
  {
    name: 'Magnesium sulfate', grade: 'Anhydrous, technical', role: 'active', process: dissolving('MgSO4(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '0.90', densityGPerMl: 2.66, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Exothermic on dissolving (≈ −91 kJ/mol).',
  },
  {
    name: 'Magnesium sulfate heptahydrate', grade: 'Epsom salt, technical', role: 'active',
    process: dissolving('MgSO4·7H2O(cr)', { soluteKey: 'MgSO4(cr)', hydrateWaterPerFormula: 7, ionsPerFormulaUnit: 2 }),
    costPerKg: '0.55', densityGPerMl: 1.68, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'The heptahydrate dissolves endothermically.',
  },
  {
    name: 'Sodium carbonate decahydrate', grade: 'Washing soda crystals', role: 'active',
    process: dissolving('Na2CO3·10H2O(cr)', { soluteKey: 'Na2CO3(cr)', hydrateWaterPerFormula: 10, ionsPerFormulaUnit: 3 }),
    costPerKg: '0.65', densityGPerMl: 1.46, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Endothermic on dissolving; eye irritant (GHS H319).',
  },
  {
    name: 'Calcium oxide', grade: 'Quicklime, food-heater grade', role: 'active',
    process: { kind: 'reaction', reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)' },
    costPerKg: '0.40', densityGPerMl: 3.34, sources: [NBS, CRC_DENSITY],
    notes: 'Hydration CaO + H2O → Ca(OH)2 releases about 65 kJ/mol. Corrosive to eyes and skin (GHS H315, H318); steam and surfaces can exceed 100 °C locally.',
  },
  {
    name: 'Iron powder', grade: 'Reduced, 100 mesh', role: 'active', process: { kind: 'air-oxidation' },
    costPerKg: '3.10', densityGPerMl: 7.874, sources: [NBS, CRC_DENSITY, 'O2 permeance default: back-calculated from the usual behaviour of disposable hand warmers (assumption)'],
    notes: 'Air oxidation 4Fe + 3O2 → 2Fe2O3 with salt water, activated carbon and vermiculite; the rate is set by oxygen through the pouch film. Flammable solid when very fine.',
  },
  {
    name: 'Magnesium powder', grade: 'Mg–Fe alloy powder for flameless heaters', role: 'active',
    process: { kind: 'reaction', reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' },
    costPerKg: '6.80', densityGPerMl: 1.738, speciesKey: 'Mg(cr)', sources: [NBS, CRC_DENSITY],
    notes: 'Mg + 2H2O → Mg(OH)2 + H2 releases about 353 kJ/mol and one mole of hydrogen per mole of magnesium (about 1 L per g at 25 °C): flammable gas, vent the heater bag (GHS H260, H250 for fine powder).',
  },
  {
    name: 'Barium hydroxide octahydrate', grade: 'Crystals, reagent', role: 'active',
    process: {
      kind: 'reaction',
      reactants: [{ key: 'Ba(OH)2·8H2O(cr)', coef: 1 }, { key: 'NH4Cl(cr)', coef: 2 }],
      products: [{ key: 'BaCl2·2H2O(cr)', coef: 1 }, { key: 'NH3(g)', coef: 2 }, { key: 'H2O(l)', coef: 8 }],
      ingredientKey: 'Ba(OH)2·8H2O(cr)',
    },
    costPerKg: '9.50', densityGPerMl: 2.18, speciesKey: 'Ba(OH)2·8H2O(cr)', sources: [NBS, CRC_DENSITY],
    notes: 'Solid–solid endothermic reaction with ammonium chloride; releases ammonia. Barium compounds are harmful if swallowed and corrosive (GHS H302, H332, H314): a demonstration chemistry, not for consumer packs.',
  },
  {
    name: 'Barium chloride dihydrate', grade: 'Crystals, reagent', role: 'active',
    process: dissolving('BaCl2·2H2O(cr)', { soluteKey: 'BaCl2(cr)', hydrateWaterPerFormula: 2, ionsPerFormulaUnit: 3 }),
    costPerKg: '4.20', densityGPerMl: 3.097, sources: [NBS, CRC_SOL, CRC_DENSITY],
    notes: 'Toxic if swallowed (GHS H301); listed for comparison only.',
  },
  {
    name: 'Water', grade: 'Deionised', role: 'solvent', process: { kind: 'inert', role: 'water' },
    costPerKg: '0.02', densityGPerMl: 0.997, speciesKey: 'H2O(l)', sources: ['IAPWS-95: density 0.997 g/mL and cp 4.18 J/(g·K) at 25 °C'], notes: '',
  },
  {
    name: 'Guar gum', grade: 'Thickener, 5000 mPa·s (1 %)', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 1.4, cpSource: `polysaccharide powder, ${TYPICAL}` },
    costPerKg: '5.20', densityGPerMl: 1.5, cpJPerGK: 1.4, sources: [INVENTED_SHEET, TYPICAL],
    notes: 'Thickens the solution so it stays spread in the pouch.',
  },
  {
    name: 'Sodium carboxymethyl cellulose', grade: 'CMC, medium viscosity', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 1.3, cpSource: `cellulose ether powder, ${TYPICAL}` },
    costPerKg: '6.40', densityGPerMl: 1.6, cpJPerGK: 1.3, sources: [INVENTED_SHEET, TYPICAL], notes: 'Gel former for reusable packs.',
  },
  {
    name: 'Activated carbon', grade: 'Powder, 900 m²/g', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.71, cpSource: `graphite-like carbon near 25 °C, ${TYPICAL}` },
    costPerKg: '2.90', densityGPerMl: 0.45, cpJPerGK: 0.71, sources: [TYPICAL, INVENTED_SHEET],
    notes: 'Holds water and spreads air through iron-powder warmers. Density is the bulk density.',
  },
  {
    name: 'Vermiculite', grade: 'Exfoliated, fine', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.84, cpSource: `mica mineral, ${TYPICAL}` },
    costPerKg: '1.10', densityGPerMl: 0.1, cpJPerGK: 0.84, sources: [TYPICAL, INVENTED_SHEET],
    notes: 'Water reservoir and insulation in warmers. Density is the bulk density.',
  },
  {
    name: 'Pouch film', grade: 'PET/PE laminate 12/75 µm', role: 'packaging', process: { kind: 'inert', role: 'packaging', cp_J_per_gK: 1.9, cpSource: `polyethylene, ${TYPICAL}` },
    costPerKg: '7.50', densityGPerMl: 1.0, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Sealed outer pouch of cold packs; barrier to water vapour.',
  },
  {
    name: 'Breathable pouch film', grade: 'Microporous PE, air-permeable', role: 'packaging', process: { kind: 'inert', role: 'packaging', cp_J_per_gK: 1.9, cpSource: `polyethylene, ${TYPICAL}` },
    costPerKg: '11.80', densityGPerMl: 0.93, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Lets oxygen reach iron-powder warmers; its permeance sets their heat output.',
  },
  {
    name: 'Non-woven fabric sleeve', grade: 'Polypropylene spunbond 40 g/m²', role: 'packaging', process: { kind: 'inert', role: 'packaging', cp_J_per_gK: 1.9, cpSource: `polypropylene, ${TYPICAL}` },
    costPerKg: '4.60', densityGPerMl: 0.91, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Skin-side sleeve: spreads contact heat and cold.',
  },
];

/** The harbour workspace's smaller cold-chain library (costs in GBP, invented). */
export const HARBOUR_INGREDIENTS: SeedIngredient[] = [
  {
    name: 'Ammonium chloride', grade: 'Technical, 99.5 %', role: 'active', process: dissolving('NH4Cl(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '1.05', densityGPerMl: 1.519, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    name: 'Urea', grade: 'Fertiliser prills', role: 'active', process: dissolving('CO(NH2)2(cr)', { ionsPerFormulaUnit: 1 }),
    costPerKg: '0.61', densityGPerMl: 1.32, sources: [NBS, CRC_DENSITY], notes: '',
  },
  {
    name: 'Sodium sulfate decahydrate', grade: "Glauber's salt, technical", role: 'active',
    process: dissolving('Na2SO4·10H2O(cr)', { soluteKey: 'Na2SO4(cr)', hydrateWaterPerFormula: 10, ionsPerFormulaUnit: 3 }),
    costPerKg: '0.48', densityGPerMl: 1.46, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: 'Endothermic on dissolving.',
  },
  {
    name: 'Potassium chloride', grade: 'Food grade', role: 'active', process: dissolving('KCl(cr)', { ionsPerFormulaUnit: 2 }),
    costPerKg: '1.15', densityGPerMl: 1.988, sources: [NBS, CRC_SOL, CRC_DENSITY], notes: '',
  },
  {
    name: 'Water', grade: 'Potable', role: 'solvent', process: { kind: 'inert', role: 'water' },
    costPerKg: '0.01', densityGPerMl: 0.997, speciesKey: 'H2O(l)', sources: ['IAPWS-95: density 0.997 g/mL at 25 °C'], notes: '',
  },
  {
    name: 'Sodium carboxymethyl cellulose', grade: 'High viscosity', role: 'additive', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 1.3, cpSource: `cellulose ether powder, ${TYPICAL}` },
    costPerKg: '5.90', densityGPerMl: 1.6, cpJPerGK: 1.3, sources: [INVENTED_SHEET, TYPICAL], notes: '',
  },
  {
    name: 'HDPE insert shell', grade: 'Blow-moulded, 1.2 mm', role: 'packaging', process: { kind: 'inert', role: 'packaging', cp_J_per_gK: 1.9, cpSource: `high-density polyethylene, ${TYPICAL}` },
    costPerKg: '3.20', densityGPerMl: 0.95, cpJPerGK: 1.9, sources: [INVENTED_SHEET, TYPICAL], notes: 'Rigid shell of the medicine-box cold insert.',
  },
];

async function seedLibrary(workspaceId: number, currency: string, items: SeedIngredient[]) {
  const lib = await workspaceChemistryLibrary(workspaceId);
  for (const item of items) {
    const parsed: CreateIngredientRequest = createIngredientRequestSchema.parse(item);
    const values = valuesFromCreate(parsed, currency);
    const problems = [...ingredientRuleErrors(values), ...referenceErrors(lib, values)];
    if (problems.length) throw new Error(`Demo ingredient ${item.name} (${item.grade}) is invalid: ${problems.map((p) => `${p.field} ${p.message}`).join('; ')}`);
    const existing = await IngredientRecord.findOne({
      where: { [Op.and]: [{ workspaceId }, sqlWhere(fn('lower', col('name')), values.name.toLowerCase()), sqlWhere(fn('lower', col('grade')), values.grade.toLowerCase())] },
      paranoid: false,
    });
    if (!existing) await IngredientRecord.create({ ...values, workspaceId });
  }
}

registerSeedStep(async (workspaces) => {
  const demo = workspaces.get('demo');
  if (demo) await seedLibrary(demo.id, demo.currency, DEMO_INGREDIENTS);
  const harbour = workspaces.get('harbour');
  if (harbour) await seedLibrary(harbour.id, harbour.currency, HARBOUR_INGREDIENTS);
});
