import { describe, expect, it } from 'vitest';
import { ingredientHazardDataSchema } from '../schemas/hazards';
import {
  AN_MAX_MASS_FRACTION,
  anNitrogenFraction,
  burnThresholdC,
  gasesEvolved,
  gasNotes,
  hazardScore,
  incompatibilityNotes,
  ingestionNotes,
  MOLAR_VOLUME_25C_L_PER_MOL,
  precursorNotes,
  skinColdNotes,
  skinHeatNotes,
} from './hazard-notes';

const hd = (extra: Record<string, unknown>) => ingredientHazardDataSchema.parse({ source: 'constructed test case', ...extra });
const an = hd({ incompatibilityGroups: ['oxidiser'], regulatoryFlags: [{ code: 'eu-2019-1148-an', text: 'AN' }] });
const ids = (ns: { ruleId: string; severity: string }[]) => ns.map((n) => `${n.ruleId}:${n.severity}`);

describe('skin heat (ISO 13732-1:2006 and Moritz & Henriques 1947, from memory)', () => {
  it('burnThresholdC passes through 51 °C at 1 min, 48 °C at 10 min, 43 °C at 8 h and stays at 43 °C beyond', () => {
    expect(burnThresholdC(1)).toBeCloseTo(51, 12);
    expect(burnThresholdC(10)).toBeCloseTo(48, 12);
    expect(burnThresholdC(480)).toBeCloseTo(43, 12);
    expect(burnThresholdC(2000)).toBe(43);
    // log-linear between 10 min and 8 h: 48 − 5·ln(12)/ln(48) at 120 min.
    expect(burnThresholdC(120)).toBeCloseTo(48 - (5 * Math.log(12)) / Math.log(48), 12);
  });
  it('skin.burn is a warning at the threshold and nothing 3 K or more below it (short contact)', () => {
    expect(ids(skinHeatNotes({ maxTempC: 48, contactMin: 10, skinContact: 'direct' }))).toEqual(['skin.burn:warning']);
    expect(ids(skinHeatNotes({ maxTempC: 47.99, contactMin: 10, skinContact: 'direct' }))).toEqual([]);
  });
  it('skin.low-temperature-burn: within 3 K below the threshold with ≥ 60 min contact → caution; 59 min → nothing', () => {
    const thr = burnThresholdC(120);
    expect(ids(skinHeatNotes({ maxTempC: thr - 3, contactMin: 120, skinContact: 'through-fabric' }))).toEqual(['skin.low-temperature-burn:caution']);
    expect(ids(skinHeatNotes({ maxTempC: thr - 3.01, contactMin: 120, skinContact: 'through-fabric' }))).toEqual([]);
    expect(ids(skinHeatNotes({ maxTempC: burnThresholdC(59) - 1, contactMin: 59, skinContact: 'direct' }))).toEqual([]);
  });
  it('70 °C on skin is a blocker; without skin contact ≥ 51 °C is a handling caution', () => {
    expect(ids(skinHeatNotes({ maxTempC: 70, contactMin: 1, skinContact: 'possible' }))).toEqual(['skin.burn:blocker']);
    expect(ids(skinHeatNotes({ maxTempC: 51, contactMin: 10, skinContact: 'none' }))).toEqual(['skin.hot-surface:caution']);
    expect(ids(skinHeatNotes({ maxTempC: 50.9, contactMin: 10, skinContact: 'none' }))).toEqual([]);
  });
});

describe('skin cold (ISO 13732-3:2008 criteria, from memory)', () => {
  it('below 0 °C → frostbite warning; at 0 °C → numbness caution', () => {
    expect(ids(skinColdNotes({ minTempC: -0.01, contactMin: 15, skinContact: 'direct' }))).toEqual(['skin.cold.frostbite:warning']);
    expect(ids(skinColdNotes({ minTempC: 0, contactMin: 15, skinContact: 'direct' }))).toEqual(['skin.cold.numbness:caution']);
  });
  it('numbness below 7 °C becomes a warning when contact exceeds 20 min', () => {
    expect(ids(skinColdNotes({ minTempC: 6.99, contactMin: 20, skinContact: 'possible' }))).toEqual(['skin.cold.numbness:caution']);
    expect(ids(skinColdNotes({ minTempC: 6.99, contactMin: 20.1, skinContact: 'possible' }))).toEqual(['skin.cold.numbness:warning']);
    expect(ids(skinColdNotes({ minTempC: 7, contactMin: 30, skinContact: 'possible' }))).toEqual(['skin.cold.pain:info']);
  });
  it('15 °C and above: nothing; no skin contact: only below 0 °C, as a caution', () => {
    expect(skinColdNotes({ minTempC: 15, contactMin: 30, skinContact: 'direct' })).toEqual([]);
    expect(ids(skinColdNotes({ minTempC: -1, contactMin: 30, skinContact: 'none' }))).toEqual(['skin.cold.handling:caution']);
    expect(skinColdNotes({ minTempC: 2, contactMin: 30, skinContact: 'none' })).toEqual([]);
  });
});

describe('gases', () => {
  const mg = { kind: 'reaction' as const, reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' };
  const water = { kind: 'inert' as const, role: 'water' as const };
  it('molar volume at 25 °C, 1 atm is 24.465 L/mol (ideal gas, CODATA R; NIST, ±0.001 L)', () => {
    expect(Math.abs(MOLAR_VOLUME_25C_L_PER_MOL - 24.465)).toBeLessThan(0.001);
  });
  it('Mg + 2 H2O → Mg(OH)2 + H2: 24.305 g Mg with excess water gives 1 mol H2 (CIAAW 2021 Mg 24.305)', () => {
    const g = gasesEvolved([{ name: 'Mg', massG: 24.305, process: mg }, { name: 'water', massG: 100, process: water }]);
    expect(g).toHaveLength(1);
    expect(g[0]!.mol).toBeCloseTo(1, 9);
  });
  it('water limits the extent when short: 18.015 g water (1 mol) → 0.5 mol H2', () => {
    const g = gasesEvolved([{ name: 'Mg', massG: 24.305, process: mg }, { name: 'water', massG: 18.015, process: water }]);
    expect(g[0]!.mol).toBeCloseTo(0.5, 3);
  });
  it('hydrogen at 4 % of the headspace is a flammable warning; just below, a caution (LFL 4 %, from memory)', () => {
    // x = V/(V + H): V = 4/96 × H gives exactly 4 %.
    const H = 1;
    const at = gasNotes({ gases: [{ species: 'H2(g)', mol: 0, litres: (4 / 96) * H, from: 'Mg' }], headspaceL: H, vented: true });
    expect(ids(at)).toEqual(['gas.hydrogen.flammable:warning']);
    const below = gasNotes({ gases: [{ species: 'H2(g)', mol: 0, litres: (3.99 / 96.01) * H, from: 'Mg' }], headspaceL: H, vented: true });
    expect(ids(below)).toEqual(['gas.hydrogen:caution']);
  });
  it('ammonia: ≥ 300 ppm in 1 m³ (0.3 L) → warning; ≥ 25 ppm (0.025 L) → caution; less → info', () => {
    const n = (L: number) => ids(gasNotes({ gases: [{ species: 'NH3(g)', mol: 0, litres: L, from: 'x' }], headspaceL: 10, vented: false }));
    expect(n(0.3)).toEqual(['gas.ammonia:warning']);
    expect(n(0.2999)).toEqual(['gas.ammonia:caution']);
    expect(n(0.025)).toEqual(['gas.ammonia:caution']);
    expect(n(0.0249)).toEqual(['gas.ammonia:info']);
  });
  it('gas beyond the headspace: blocker when sealed, caution when vented; equal to it: no note', () => {
    const g = (L: number) => [{ species: 'CO2(g)', mol: 0, litres: L, from: 'x' }];
    expect(ids(gasNotes({ gases: g(0.101), headspaceL: 0.1, vented: false }))).toEqual(['gas.overpressure:blocker']);
    expect(ids(gasNotes({ gases: g(0.101), headspaceL: 0.1, vented: true }))).toEqual(['gas.overpressure:caution']);
    expect(gasNotes({ gases: g(0.1), headspaceL: 0.1, vented: false })).toEqual([]);
  });
});

describe('incompatible pairs', () => {
  it('oxidiser + fuel → warning; acid + base → caution; water-reactive + water → caution; a lone group → nothing', () => {
    const fuel = hd({ incompatibilityGroups: ['fuel'] });
    expect(ids(incompatibilityNotes([{ name: 'AN', massG: 1, hazardData: an }, { name: 'Fe', massG: 1, hazardData: fuel }]))).toEqual(['incompat.oxidiser-fuel:warning']);
    expect(ids(incompatibilityNotes([{ name: 'a', massG: 1, hazardData: hd({ incompatibilityGroups: ['acid'] }) }, { name: 'b', massG: 1, hazardData: hd({ incompatibilityGroups: ['base'] }) }]))).toEqual(['incompat.acid-base:caution']);
    expect(ids(incompatibilityNotes([{ name: 'Mg', massG: 1, hazardData: hd({ incompatibilityGroups: ['water-reactive'] }) }, { name: 'w', massG: 1, hazardData: null, isWater: true }]))).toEqual(['incompat.water-reactive:caution']);
    expect(incompatibilityNotes([{ name: 'AN', massG: 1, hazardData: an }, { name: 'Fe', massG: 0, hazardData: fuel }])).toEqual([]);
  });
});

describe('precursors (Regulation (EU) 2019/1148 Annex I: 16 % N from AN, from memory)', () => {
  it('N from AN = w_AN × 2·14.007/80.043 (CIAAW 2021 atomic weights, ±1e-4)', () => {
    expect(Math.abs(anNitrogenFraction(100, 100) - (2 * 14.007) / 80.043)).toBeLessThan(1e-4);
  });
  it('at the AN fraction that gives 16 % N → warning; just below → info', () => {
    const m = (w: number) => precursorNotes([{ name: 'AN', massG: 100 * w, hazardData: an }, { name: 'water', massG: 100 * (1 - w), hazardData: null }]);
    expect(ids(m(AN_MAX_MASS_FRACTION))).toEqual(['precursor.an-nitrogen:warning']);
    expect(ids(m(AN_MAX_MASS_FRACTION - 0.001))).toEqual(['precursor.an-nitrogen:info']);
  });
});

describe('ingestion and score', () => {
  const e = (hazardClass: string, category: string) => ({ hazardClass, category, hStatements: [], rule: '' });
  it('acute tox 3 or skin corr → warning; acute tox 4 or eye irrit → caution; nothing → info', () => {
    expect(ids(ingestionNotes([e('acute-tox-oral', '3')]))).toEqual(['ingestion.child-access:warning']);
    expect(ids(ingestionNotes([e('skin-corr', '1B')]))).toEqual(['ingestion.child-access:warning']);
    expect(ids(ingestionNotes([e('acute-tox-oral', '4')]))).toEqual(['ingestion.child-access:caution']);
    expect(ids(ingestionNotes([e('eye-irrit', '2')]))).toEqual(['ingestion.child-access:caution']);
    expect(ids(ingestionNotes([]))).toEqual(['ingestion.child-access:info']);
  });
  it('hazardScore = Σ severity weights (100/10/3/0) + Σ class weights (Danger 10, Warning 3)', () => {
    expect(hazardScore([{ severity: 'blocker' }, { severity: 'warning' }, { severity: 'caution' }, { severity: 'info' }], [])).toBe(113);
    expect(hazardScore([], [e('eye-irrit', '2'), e('eye-dam', '1')])).toBe(13);
    expect(hazardScore([], [])).toBe(0);
  });
});
