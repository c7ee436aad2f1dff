import { DEMO_WATER_KEY, demoOptimiserLibrary } from './ingredients';
import { DEMO_HAZARD_DATA_BY_ID } from '../hazards/demo-hazard-data';
import type { BriefInput } from '../schemas/briefs';
import type { OptimiserIngredient } from '../optimiser/types';

/**
 * The demo ingredient library in the optimiser's shape, from the one demo data module
 * (shared/src/demo/ingredients.ts, also what the back end seeds): real chemistry (species keys
 * resolve to the bundled NBS 1982 / CRC data), invented costs in the demo workspace's currency.
 * Ids are the records' stable demo keys ('ammonium-nitrate', 'iron-powder', ...).
 *
 * Each carries the demo hazard data the seed gives the same record, so runs on it rank by hazard
 * as the app's runs do. Costs are invented for the demo scenario and are not market prices.
 */
export const DEMO_LIBRARY: readonly OptimiserIngredient[] = demoOptimiserLibrary().map((i) => ({ ...i, hazardData: DEMO_HAZARD_DATA_BY_ID[i.id] ?? null }));

export const DEMO_WATER_ID = DEMO_WATER_KEY;

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
