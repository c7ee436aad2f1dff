import { ingredientHazardDataSchema, type GhsClassification, type IngredientHazardData } from '../schemas/hazards';

/**
 * Hazard data of the demo ingredients, keyed by the demo ingredient names of the back end's seed
 * (backend/src/ingredients/ingredients.seed.ts) and, through {@link DEMO_HAZARD_DATA_BY_ID}, by
 * the stable keys of shared/src/demo/ingredients.ts (the optimiser's demo-library ids).
 *
 * Every entry was written FROM MEMORY of typical supplier safety data sheets and, where one
 * exists, the harmonised classification of CLP Annex VI; none was checked against a current
 * SDS here. LD50 values are rat oral figures as commonly quoted in SDSs (from memory); pH values
 * of 1 % or saturated solutions are handbook/SDS figures (from memory). Grades differ: a fine or
 * pyrophoric metal powder is classified more severely than a coarse one. A chemist replaces these
 * with the current SDS of the grade actually bought.
 */

const SDS_MEMORY = 'typical supplier safety data sheet (from memory; not verified against a current SDS)';
const HARMONISED_MEMORY = 'CLP Annex VI harmonised classification (from memory; not verified against the current ATP)';

const cls = (hazardClass: string, category: string, ...hStatements: string[]): GhsClassification => ({ hazardClass, category, hStatements });

const entry = (d: Partial<IngredientHazardData> & { source: string }): IngredientHazardData => ingredientHazardDataSchema.parse(d);

const EU_2019_1148_AN = {
  code: 'eu-2019-1148-an',
  text: 'Regulation (EU) 2019/1148, Annex I: ammonium nitrate and mixtures at or above 16 % by weight of nitrogen in relation to ammonium nitrate are restricted explosives precursors (not to be made available to members of the general public); suspicious transactions are reportable (from memory).',
};
const EU_2019_1148_ANNEX_II = (what: string) => ({
  code: 'eu-2019-1148-annex-ii',
  text: `Regulation (EU) 2019/1148, Annex II: ${what} is a reportable explosives precursor (suspicious transactions, disappearances and thefts are reported; from memory).`,
});

/**
 * Demo ingredients' hazard data by seed name.
 *
 * @example DEMO_HAZARD_DATA['Ammonium nitrate'].classifications.map((c) => c.hStatements[0]) // → ['H272', 'H319']
 */
export const DEMO_HAZARD_DATA: Readonly<Record<string, IngredientHazardData>> = {
  'Ammonium nitrate': entry({
    classifications: [cls('ox-sol', '3', 'H272'), cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS03', 'GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 2217, dermalMgPerKg: null },
    solutionPH: 5.4,
    incompatibilityGroups: ['oxidiser'],
    regulatoryFlags: [EU_2019_1148_AN, { code: 'un-1942', text: 'UN 1942 Ammonium nitrate, class 5.1 for transport (from memory; check the ADR/IMDG entry and special provisions).' }],
    source: `${SDS_MEMORY}; LD50 oral rat ≈ 2217 mg/kg, 1 % solution pH ≈ 5.4 (from memory)`,
  }),
  'Ammonium chloride': entry({
    classifications: [cls('acute-tox-oral', '4', 'H302'), cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 1650, dermalMgPerKg: null },
    solutionPH: 5,
    incompatibilityGroups: ['acid'],
    source: `${HARMONISED_MEMORY}: Acute Tox. 4 H302, Eye Irrit. 2 H319; LD50 oral rat ≈ 1650 mg/kg, 1 % solution pH ≈ 5 (SDS, from memory)`,
  }),
  Urea: entry({ acuteToxicityEstimates: { oralMgPerKg: 8471, dermalMgPerKg: null }, solutionPH: 7.2, source: `${SDS_MEMORY}: not classified; LD50 oral rat ≈ 8471 mg/kg` }),
  'Potassium chloride': entry({ acuteToxicityEstimates: { oralMgPerKg: 2600, dermalMgPerKg: null }, solutionPH: 7, source: `${SDS_MEMORY}: not classified; LD50 oral rat ≈ 2600 mg/kg` }),
  'Potassium nitrate': entry({
    classifications: [cls('ox-sol', '3', 'H272')],
    pictograms: ['GHS03'],
    signalWord: 'Warning',
    solutionPH: 7,
    incompatibilityGroups: ['oxidiser'],
    regulatoryFlags: [EU_2019_1148_ANNEX_II('potassium nitrate'), { code: 'un-1486', text: 'UN 1486 Potassium nitrate, class 5.1 (from memory).' }],
    source: `${SDS_MEMORY}: Ox. Sol. 3 H272`,
  }),
  'Sodium nitrate': entry({
    classifications: [cls('ox-sol', '3', 'H272'), cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS03', 'GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 3236, dermalMgPerKg: null },
    solutionPH: 7,
    incompatibilityGroups: ['oxidiser'],
    regulatoryFlags: [EU_2019_1148_ANNEX_II('sodium nitrate'), { code: 'un-1498', text: 'UN 1498 Sodium nitrate, class 5.1 (from memory).' }],
    source: `${SDS_MEMORY}: Ox. Sol. 3 H272, Eye Irrit. 2 H319 (some SDSs); LD50 oral rat ≈ 3236 mg/kg`,
  }),
  'Sodium chloride': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified` }),
  'Sodium acetate trihydrate': entry({ solutionPH: 8.9, source: `${SDS_MEMORY}: not classified; 5 % solution pH ≈ 8.9` }),
  'Sodium thiosulfate pentahydrate': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified` }),
  'Calcium chloride': entry({
    classifications: [cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 2301, dermalMgPerKg: null },
    solutionPH: 9,
    source: `${HARMONISED_MEMORY}: Eye Irrit. 2 H319; LD50 oral rat ≈ 2301 mg/kg, solution pH 8–10 (SDS, from memory)`,
  }),
  'Calcium chloride hexahydrate': entry({
    classifications: [cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    solutionPH: 9,
    source: `${HARMONISED_MEMORY}: Eye Irrit. 2 H319 (calcium chloride entry)`,
  }),
  'Calcium chloride dihydrate': entry({
    classifications: [cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    solutionPH: 9,
    source: `${HARMONISED_MEMORY}: Eye Irrit. 2 H319 (calcium chloride entry)`,
  }),
  'Magnesium sulfate': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified` }),
  'Magnesium sulfate heptahydrate': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified` }),
  'Magnesium chloride': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified (anhydrous grades: some SDSs Eye Irrit. 2)` }),
  'Sodium carbonate decahydrate': entry({
    classifications: [cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 2800, dermalMgPerKg: null },
    solutionPH: 11.4,
    incompatibilityGroups: ['base'],
    source: `${HARMONISED_MEMORY}: Eye Irrit. 2 H319 (sodium carbonate); 1 % solution pH ≈ 11.4, LD50 oral rat ≈ 2800 mg/kg (from memory)`,
  }),
  'Sodium carbonate': entry({
    classifications: [cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 2800, dermalMgPerKg: null },
    solutionPH: 11.4,
    incompatibilityGroups: ['base'],
    source: `${HARMONISED_MEMORY}: Eye Irrit. 2 H319; 1 % solution pH ≈ 11.4 (from memory)`,
  }),
  'Sodium sulfate decahydrate': entry({ solutionPH: 7, source: `${SDS_MEMORY}: not classified` }),
  'Sodium bicarbonate': entry({ solutionPH: 8.3, source: `${SDS_MEMORY}: not classified; 1 % solution pH ≈ 8.3` }),
  'Ammonium sulfate': entry({ acuteToxicityEstimates: { oralMgPerKg: 4250, dermalMgPerKg: null }, solutionPH: 5.5, incompatibilityGroups: ['acid'], source: `${SDS_MEMORY}: not classified; LD50 oral rat ≈ 4250 mg/kg` }),
  'Lithium chloride': entry({
    classifications: [cls('acute-tox-oral', '4', 'H302'), cls('skin-irrit', '2', 'H315'), cls('eye-irrit', '2', 'H319')],
    pictograms: ['GHS07'],
    signalWord: 'Warning',
    acuteToxicityEstimates: { oralMgPerKg: 526, dermalMgPerKg: null },
    solutionPH: 7,
    source: `${SDS_MEMORY}: Acute Tox. 4 H302, Skin Irrit. 2 H315, Eye Irrit. 2 H319; LD50 oral rat ≈ 526 mg/kg`,
  }),
  'Sodium hydroxide': entry({
    classifications: [cls('skin-corr', '1A', 'H314'), cls('met-corr', '1', 'H290')],
    pictograms: ['GHS05'],
    signalWord: 'Danger',
    solutionPH: 13.4,
    incompatibilityGroups: ['base'],
    regulatoryFlags: [{ code: 'un-1823', text: 'UN 1823 Sodium hydroxide, solid, class 8 (from memory).' }],
    source: `${HARMONISED_MEMORY}: Skin Corr. 1A H314; Met. Corr. 1 H290 (SDS); 1 % solution pH ≈ 13.4 (from memory)`,
  }),
  'Calcium oxide': entry({
    classifications: [cls('skin-irrit', '2', 'H315'), cls('eye-dam', '1', 'H318'), cls('stot-se', '3', 'H335')],
    pictograms: ['GHS05', 'GHS07'],
    signalWord: 'Danger',
    solutionPH: 12.4,
    incompatibilityGroups: ['base', 'water-reactive'],
    source: `${SDS_MEMORY} (REACH registrants' self-classification): Skin Irrit. 2 H315, Eye Dam. 1 H318, STOT SE 3 H335; saturated Ca(OH)2 pH ≈ 12.4 at 25 °C`,
  }),
  'Iron powder': entry({
    classifications: [cls('flam-sol', '2', 'H228')],
    pictograms: ['GHS02'],
    signalWord: 'Warning',
    incompatibilityGroups: ['fuel', 'reducing-agent'],
    source: `${SDS_MEMORY}: Flam. Sol. 2 H228 for fine powders; coarse reduced iron is often not classified`,
  }),
  'Magnesium powder': entry({
    classifications: [cls('water-react', '2', 'H261'), cls('flam-sol', '1', 'H228')],
    pictograms: ['GHS02'],
    signalWord: 'Danger',
    incompatibilityGroups: ['fuel', 'reducing-agent', 'water-reactive'],
    regulatoryFlags: [EU_2019_1148_ANNEX_II('magnesium powder (fine particle sizes)'), { code: 'un-1418', text: 'UN 1418 Magnesium powder, class 4.3 (4.2) (from memory).' }],
    source: `${SDS_MEMORY}: Water-react. 2 H261, Flam. Sol. 1 H228 (stabilised powder); pyrophoric grades carry Pyr. Sol. 1 H250 and Water-react. 1 H260`,
  }),
  'Barium hydroxide octahydrate': entry({
    classifications: [cls('acute-tox-oral', '4', 'H302'), cls('acute-tox-inhal', '4', 'H332'), cls('skin-corr', '1B', 'H314')],
    pictograms: ['GHS05', 'GHS07'],
    signalWord: 'Danger',
    acuteToxicityEstimates: { oralMgPerKg: 550, dermalMgPerKg: null },
    solutionPH: 13,
    incompatibilityGroups: ['base'],
    source: `${SDS_MEMORY}: Acute Tox. 4 H302/H332, Skin Corr. 1B H314 (some SDSs Eye Dam. 1 H318 instead); LD50 oral rat ≈ 550 mg/kg, saturated pH ≈ 13`,
  }),
  'Barium chloride dihydrate': entry({
    classifications: [cls('acute-tox-oral', '3', 'H301'), cls('acute-tox-inhal', '4', 'H332')],
    pictograms: ['GHS06'],
    signalWord: 'Danger',
    acuteToxicityEstimates: { oralMgPerKg: 118, dermalMgPerKg: null },
    solutionPH: 6.5,
    source: `${HARMONISED_MEMORY}: Acute Tox. 3 H301, Acute Tox. 4 H332; LD50 oral rat ≈ 118 mg/kg (SDS, from memory)`,
  }),
  'Activated carbon': entry({ incompatibilityGroups: ['fuel'], source: `${SDS_MEMORY}: not classified (some grades Self-heat. 2 H252 in bulk)` }),
  Vermiculite: entry({ source: `${SDS_MEMORY}: not classified` }),
  'Guar gum': entry({ source: `${SDS_MEMORY}: not classified` }),
  'Sodium carboxymethyl cellulose': entry({ source: `${SDS_MEMORY}: not classified` }),
  Water: entry({ source: 'water: not classified (no SDS needed)' }),
};

/** Optimiser demo-library ids → seed names (same substances; the demo library has a few more). */
export const DEMO_HAZARD_NAME_BY_ID: Readonly<Record<string, string>> = {
  'ammonium-nitrate': 'Ammonium nitrate',
  'ammonium-chloride': 'Ammonium chloride',
  urea: 'Urea',
  'potassium-chloride': 'Potassium chloride',
  'potassium-nitrate': 'Potassium nitrate',
  'sodium-nitrate': 'Sodium nitrate',
  'ammonium-sulfate': 'Ammonium sulfate',
  'sodium-thiosulfate-5h2o': 'Sodium thiosulfate pentahydrate',
  'sodium-carbonate-10h2o': 'Sodium carbonate decahydrate',
  'sodium-sulfate-10h2o': 'Sodium sulfate decahydrate',
  'sodium-acetate-3h2o': 'Sodium acetate trihydrate',
  'magnesium-sulfate-7h2o': 'Magnesium sulfate heptahydrate',
  'calcium-chloride-6h2o': 'Calcium chloride hexahydrate',
  'sodium-bicarbonate': 'Sodium bicarbonate',
  'barium-chloride-2h2o': 'Barium chloride dihydrate',
  'calcium-chloride': 'Calcium chloride',
  'calcium-chloride-2h2o': 'Calcium chloride dihydrate',
  'magnesium-sulfate': 'Magnesium sulfate',
  'magnesium-chloride': 'Magnesium chloride',
  'lithium-chloride': 'Lithium chloride',
  'sodium-hydroxide': 'Sodium hydroxide',
  'sodium-carbonate': 'Sodium carbonate',
  quicklime: 'Calcium oxide',
  'magnesium-powder': 'Magnesium powder',
  'sodium-acetate-supercooled': 'Sodium acetate trihydrate',
  'iron-powder': 'Iron powder',
  water: 'Water',
  'sodium-chloride': 'Sodium chloride',
  'activated-carbon': 'Activated carbon',
  vermiculite: 'Vermiculite',
  'barium-hydroxide-8h2o': 'Barium hydroxide octahydrate',
  'sodium-chloride-food': 'Sodium chloride',
  'guar-gum': 'Guar gum',
  'carboxymethyl-cellulose': 'Sodium carboxymethyl cellulose',
};

/**
 * Demo hazard data by optimiser demo-library id.
 *
 * @example DEMO_HAZARD_DATA_BY_ID.quicklime === DEMO_HAZARD_DATA['Calcium oxide'] // → true
 */
export const DEMO_HAZARD_DATA_BY_ID: Readonly<Record<string, IngredientHazardData>> = Object.fromEntries(
  Object.entries(DEMO_HAZARD_NAME_BY_ID).map(([id, name]) => {
    const d = DEMO_HAZARD_DATA[name];
    if (!d) throw new Error(`demo hazard data: expected an entry named ${JSON.stringify(name)} for id ${id}; found none`);
    return [id, d];
  }),
);

/**
 * The demo hazard data of an ingredient by its seed name (exact, then case-insensitive), or null.
 *
 * @example demoHazardDataFor('ammonium nitrate')?.incompatibilityGroups // → ['oxidiser']
 */
export function demoHazardDataFor(name: string): IngredientHazardData | null {
  const exact = DEMO_HAZARD_DATA[name];
  if (exact) return exact;
  const lower = name.trim().toLowerCase();
  const hit = Object.entries(DEMO_HAZARD_DATA).find(([k]) => k.toLowerCase() === lower);
  return hit ? hit[1] : null;
}
