import type { BriefInput } from '../schemas/briefs';
import type { IngredientProcessInput } from '../thermal/process';
import type { OptimiserIngredient } from './types';

/**
 * The demo ingredient library: real chemistry (species keys resolve to the bundled NBS 1982 /
 * CRC data), invented costs in the demo workspace's currency. 30 ingredients: 26 actives, water
 * and three additives the iron warmer needs. The back end's seed can map these one-to-one.
 *
 * Costs are invented for the demo scenario and are not market prices.
 */

const dissolve = (solidKey: string, ions: number, hydrate?: { soluteKey: string; water: number }): IngredientProcessInput => ({
  kind: 'dissolution',
  solidKey,
  ionsPerFormulaUnit: ions,
  ...(hydrate ? { soluteKey: hydrate.soluteKey, hydrateWaterPerFormula: hydrate.water } : {}),
});

const active = (id: string, name: string, costPerKg: string, process: IngredientProcessInput, extra: Partial<OptimiserIngredient> = {}): OptimiserIngredient => ({
  id,
  name,
  role: 'active',
  costPerKg,
  process,
  ...extra,
});

export const DEMO_WATER_ID = 'water';

export const DEMO_LIBRARY: readonly OptimiserIngredient[] = [
  // Endothermic dissolution: cold packs.
  active('ammonium-nitrate', 'Ammonium nitrate, prills', '1.20', dissolve('NH4NO3(cr)', 2)),
  active('ammonium-chloride', 'Ammonium chloride', '0.95', dissolve('NH4Cl(cr)', 2)),
  active('urea', 'Urea, technical', '0.60', dissolve('CO(NH2)2(cr)', 1)),
  active('potassium-chloride', 'Potassium chloride', '0.70', dissolve('KCl(cr)', 2)),
  active('potassium-nitrate', 'Potassium nitrate', '1.80', dissolve('KNO3(cr)', 2)),
  active('sodium-nitrate', 'Sodium nitrate', '1.10', dissolve('NaNO3(cr)', 2)),
  active('ammonium-sulfate', 'Ammonium sulfate', '0.50', dissolve('(NH4)2SO4(cr)', 3)),
  active('sodium-thiosulfate-5h2o', 'Sodium thiosulfate pentahydrate', '1.40', dissolve('Na2S2O3·5H2O(cr)', 3, { soluteKey: 'Na2S2O3(cr)', water: 5 })),
  active('sodium-carbonate-10h2o', 'Sodium carbonate decahydrate', '0.80', dissolve('Na2CO3·10H2O(cr)', 3, { soluteKey: 'Na2CO3(cr)', water: 10 })),
  active('sodium-sulfate-10h2o', 'Sodium sulfate decahydrate', '0.40', dissolve('Na2SO4·10H2O(cr)', 3, { soluteKey: 'Na2SO4(cr)', water: 10 })),
  active('sodium-acetate-3h2o', 'Sodium acetate trihydrate (to dissolve)', '2.10', dissolve('CH3COONa·3H2O(cr)', 2, { soluteKey: 'CH3COONa(cr)', water: 3 })),
  active('magnesium-sulfate-7h2o', 'Magnesium sulfate heptahydrate', '0.55', dissolve('MgSO4·7H2O(cr)', 2, { soluteKey: 'MgSO4(cr)', water: 7 })),
  active('calcium-chloride-6h2o', 'Calcium chloride hexahydrate', '0.65', dissolve('CaCl2·6H2O(cr)', 3, { soluteKey: 'CaCl2(cr)', water: 6 })),
  active('sodium-bicarbonate', 'Sodium bicarbonate', '0.45', dissolve('NaHCO3(cr)', 2)),
  active('barium-chloride-2h2o', 'Barium chloride dihydrate', '3.50', dissolve('BaCl2·2H2O(cr)', 3, { soluteKey: 'BaCl2(cr)', water: 2 })),
  // Exothermic dissolution: warm packs.
  active('calcium-chloride', 'Calcium chloride, anhydrous', '0.90', dissolve('CaCl2(cr)', 3)),
  active('calcium-chloride-2h2o', 'Calcium chloride dihydrate', '0.70', dissolve('CaCl2·2H2O(cr)', 3, { soluteKey: 'CaCl2(cr)', water: 2 })),
  active('magnesium-sulfate', 'Magnesium sulfate, anhydrous', '1.20', dissolve('MgSO4(cr)', 2)),
  active('magnesium-chloride', 'Magnesium chloride, anhydrous', '1.50', dissolve('MgCl2(cr)', 3)),
  active('lithium-chloride', 'Lithium chloride', '9.00', dissolve('LiCl(cr)', 2)),
  active('sodium-hydroxide', 'Sodium hydroxide, pellets', '1.60', dissolve('NaOH(cr)', 2)),
  active('sodium-carbonate', 'Sodium carbonate, anhydrous', '0.40', dissolve('Na2CO3(cr)', 3)),
  // Reactions, crystallisation, air oxidation.
  active('quicklime', 'Calcium oxide (quicklime)', '0.35', {
    kind: 'reaction',
    reactants: [
      { key: 'CaO(cr)', coef: 1 },
      { key: 'H2O(l)', coef: 1 },
    ],
    products: [{ key: 'Ca(OH)2(cr)', coef: 1 }],
    ingredientKey: 'CaO(cr)',
  }),
  active('magnesium-powder', 'Magnesium powder', '6.00', {
    kind: 'reaction',
    reactants: [
      { key: 'Mg(cr)', coef: 1 },
      { key: 'H2O(l)', coef: 2 },
    ],
    products: [
      { key: 'Mg(OH)2(cr)', coef: 1 },
      { key: 'H2(g)', coef: 1 },
    ],
    ingredientKey: 'Mg(cr)',
  }),
  active('sodium-acetate-supercooled', 'Sodium acetate trihydrate, supercooled melt', '2.40', { kind: 'crystallisation' }),
  active('iron-powder', 'Iron powder, reduced', '2.50', { kind: 'air-oxidation' }, {
    needs: [
      // Typical warmer recipes: salt a few % of the iron, carbon and a filler of the order of a third to a half (common practice, from memory).
      { ingredientId: 'sodium-chloride', minGPerG: 0.03, maxGPerG: 0.15, source: 'common practice (from memory)' },
      { ingredientId: 'activated-carbon', minGPerG: 0.2, maxGPerG: 0.6, source: 'common practice (from memory)' },
      { ingredientId: 'vermiculite', minGPerG: 0.15, maxGPerG: 0.6, source: 'common practice (from memory)' },
      { ingredientId: DEMO_WATER_ID, minGPerG: 0.25, maxGPerG: 0.6, source: 'common practice (from memory)' },
    ],
  }),
  // Solvent and additives.
  { id: DEMO_WATER_ID, name: 'Water, deionised', role: 'solvent', costPerKg: '0.01', process: { kind: 'inert', role: 'water' } },
  { id: 'sodium-chloride', name: 'Sodium chloride, fine', role: 'additive', costPerKg: '0.20', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.864, cpSource: 'Cp° 50.5 J/(mol·K), NBS 1982' } },
  { id: 'activated-carbon', name: 'Activated carbon', role: 'additive', costPerKg: '3.00', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.71, cpSource: 'graphite Cp° 8.53 J/(mol·K), NBS 1982' } },
  { id: 'vermiculite', name: 'Vermiculite, fine', role: 'additive', costPerKg: '0.80', process: { kind: 'inert', role: 'additive', cp_J_per_gK: 0.84, cpSource: 'typical mineral filler (from memory)' } },
];

/**
 * The demo workspace's briefs (invented scenario: an outdoor-gear maker's product team).
 */
export const DEMO_BRIEFS: readonly BriefInput[] = [
  {
    name: 'Sideline cold compress',
    packType: 'cold',
    ambientC: 25,
    targetTempC: 5,
    bandK: 3,
    reachWithinMin: 5,
    holdMin: 15,
    contact: 'still-air',
    packAreaM2: 0.03,
    maxMassG: 400,
    maxUnitCost: '1.50',
    minSurfaceTempC: -2,
    objective: 'least-cost',
    maxActives: 3,
  },
  {
    name: 'Trail-meal heater',
    packType: 'warm',
    ambientC: 15,
    targetTempC: 60,
    bandK: 10,
    reachWithinMin: 12,
    holdMin: 10,
    contact: 'still-air',
    packAreaM2: 0.05,
    maxMassG: 400,
    maxUnitCost: '2.00',
    maxSurfaceTempC: 100,
    maxGasL: 3,
    // The meal pouch it heats: 250 g at about 3.5 J/(g·K) (typical moist food, from memory) plus the tray.
    packaging: { massG: 30, heatCapacityJPerK: 950, cost: '0.20' },
    objective: 'least-cost',
    maxActives: 3,
  },
  {
    name: 'Glove warmer insert',
    packType: 'warm',
    // A winter glove: −5 °C outside, the insert opened at room temperature.
    ambientC: -5,
    initialTempC: 15,
    targetTempC: 38,
    bandK: 3,
    reachWithinMin: 20,
    holdMin: 120,
    contact: 'skin-through-fabric',
    packAreaM2: 0.01,
    maxMassG: 80,
    maxUnitCost: '0.80',
    // Worn inside a glove lining, not on bare skin; the hazard notes carry the burn cautions.
    maxSurfaceTempC: 55,
    packaging: { massG: 4, heatCapacityJPerK: 8, cost: '0.04' },
    objective: 'least-mass',
    maxActives: 2,
  },
  {
    name: 'Medicine-carrier cold insert',
    packType: 'cold',
    ambientC: 25,
    targetTempC: 8,
    bandK: 2,
    reachWithinMin: 15,
    holdMin: 120,
    contact: 'insulated',
    packAreaM2: 0.06,
    maxMassG: 1500,
    minSurfaceTempC: 1,
    packaging: { massG: 25, heatCapacityJPerK: 50, cost: '0.15' },
    objective: 'most-hold-margin',
    maxActives: 2,
  },
];
