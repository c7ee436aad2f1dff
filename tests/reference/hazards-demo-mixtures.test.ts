import { describe, expect, it } from 'vitest';
import { candidateHazards, type HazardCompositionEntry } from '@shared/hazards/evaluate-candidate-hazards';
import { DEMO_HAZARD_DATA as D } from '@shared/hazards/demo-hazard-data';
import { HAZARD_STANDING_CAUTION } from '@shared/schemas/hazards';

// The five packs the hazard notes must get right. Compositions are typical of each kind of pack
// (common practice, from memory); the hazard data are the demo data (typical SDS, from memory).
// Expected gas volumes follow from the stoichiometry and the ideal-gas molar volume at 25 °C,
// 1 atm (24.465 L/mol); the expected classes from the GHS cut-off tables as pinned in
// hazards-mixture-classification.test.ts.

const water = (massG: number): HazardCompositionEntry => ({ name: 'Water', massG, hazardData: D.Water!, process: { kind: 'inert', role: 'water' } });
const rules = (r: ReturnType<typeof candidateHazards>) => r.notes.map((n) => `${n.ruleId}:${n.severity}`);
const classes = (r: ReturnType<typeof candidateHazards>) => r.classification.map((c) => `${c.hazardClass} ${c.category}`);

describe('hazard notes of the five reference packs', () => {
  it('ammonium nitrate cold pack (120 g AN, 120 g water, 2 °C, held 15 min): precursor flag (17.5 % N ≥ 16 %), oxidiser carried over, eye irritation, cold caution', () => {
    const r = candidateHazards({
      composition: [{ name: 'Ammonium nitrate', massG: 120, hazardData: D['Ammonium nitrate']!, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } }, water(120)],
      predicted: { minTempC: 2, maxTempC: 25, contact: 'possible', holdMin: 15 },
      packType: 'cold',
    });
    expect(rules(r)).toContain('precursor.an-nitrogen:warning');
    expect(rules(r)).toContain('classification.carried.ox-sol:caution');
    expect(rules(r)).toContain('skin.cold.numbness:caution');
    expect(classes(r)).toEqual(expect.arrayContaining(['ox-sol 3', 'eye-irrit 2']));
    expect(r.label.pictograms).toEqual(['GHS03', 'GHS07']);
    expect(r.label.hStatements).toEqual(['H272', 'H319']);
    expect(r.standingCaution).toBe(HAZARD_STANDING_CAUTION);
  });

  it('barium hydroxide + ammonium chloride (32 g + 10.9 g, 2:1 molar): acute toxicity 4, corrosive, ammonia ≈ 4.96 L and a sealed pack that cannot hold it', () => {
    // Ba(OH)2·8H2O 315.46 g/mol: 32 g = 0.1014 mol; 2 NH4Cl per mol: 10.85 g; NH3 = 0.2029 mol × 24.465 = 4.96 L.
    const r = candidateHazards({
      composition: [
        {
          name: 'Barium hydroxide octahydrate',
          massG: 32,
          hazardData: D['Barium hydroxide octahydrate']!,
          process: { kind: 'reaction', reactants: [{ key: 'Ba(OH)2·8H2O(cr)', coef: 1 }, { key: 'NH4Cl(cr)', coef: 2 }], products: [{ key: 'BaCl2·2H2O(cr)', coef: 1 }, { key: 'NH3(g)', coef: 2 }, { key: 'H2O(l)', coef: 8 }], ingredientKey: 'Ba(OH)2·8H2O(cr)' },
        },
        { name: 'Ammonium chloride', massG: 10.85, hazardData: D['Ammonium chloride']!, process: { kind: 'dissolution', solidKey: 'NH4Cl(cr)' } },
      ],
      predicted: { minTempC: -10, maxTempC: 22, contact: 'possible', holdMin: 10 },
      packType: 'cold',
    });
    const nh3 = r.gases.find((g) => g.species === 'NH3(g)')!;
    expect(Math.abs(nh3.litres - 4.96)).toBeLessThan(0.01);
    expect(rules(r)).toEqual(expect.arrayContaining(['gas.ammonia:warning', 'gas.overpressure:blocker', 'ingestion.child-access:warning', 'skin.cold.frostbite:warning', 'incompat.acid-base:caution']));
    expect(classes(r)).toEqual(expect.arrayContaining(['acute-tox-oral 4', 'skin-corr 1B', 'eye-dam 1']));
    expect(r.label.signalWord).toBe('Danger');
  });

  it('magnesium + water heater (8 g Mg, 60 g water, vented): hydrogen 8.05 L, flammable in the headspace; water-reactive carried over', () => {
    // 8 g / 24.305 g/mol = 0.329 mol H2 × 24.465 L/mol = 8.05 L.
    const r = candidateHazards({
      composition: [
        { name: 'Magnesium powder', massG: 8, hazardData: D['Magnesium powder']!, densityGPerMl: 1.738, process: { kind: 'reaction', reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' } },
        water(60),
      ],
      predicted: { minTempC: 15, maxTempC: 95, contact: 'none', holdMin: 10 },
      packType: 'warm',
      vented: true,
    });
    expect(Math.abs(r.gases[0]!.litres - 8.05)).toBeLessThan(0.01);
    expect(rules(r)).toEqual(expect.arrayContaining(['gas.hydrogen.flammable:warning', 'gas.overpressure:caution', 'incompat.water-reactive:caution', 'classification.carried.water-react:caution', 'skin.hot-surface:caution']));
    expect(r.label.pictograms).toEqual(['GHS02']);
  });

  it('calcium chloride warm pack (40 g CaCl2, 100 g water, peak 52 °C, 20 min): eye irritation and the burn threshold', () => {
    const r = candidateHazards({
      composition: [{ name: 'Calcium chloride', massG: 40, hazardData: D['Calcium chloride']!, process: { kind: 'dissolution', solidKey: 'CaCl2(cr)' } }, water(100)],
      predicted: { minTempC: 25, maxTempC: 52, contact: 'possible', holdMin: 20 },
      packType: 'warm',
    });
    expect(classes(r)).toEqual(['eye-irrit 2']);
    expect(rules(r)).toContain('skin.burn:warning');
    expect(r.label.hStatements).toEqual(['H319']);
  });

  it('iron-powder warmer (43 °C for 6 h through fabric): low-temperature burn caution, flammable solid carried over, no gas', () => {
    const r = candidateHazards({
      composition: [
        { name: 'Iron powder', massG: 20, hazardData: D['Iron powder']!, process: { kind: 'air-oxidation' } },
        { name: 'Sodium chloride', massG: 1.5, hazardData: D['Sodium chloride']! },
        { name: 'Activated carbon', massG: 6, hazardData: D['Activated carbon']! },
        { name: 'Vermiculite', massG: 5, hazardData: D.Vermiculite! },
        water(7),
      ],
      predicted: { minTempC: 15, maxTempC: 43, contact: 'through-fabric', holdMin: 360 },
      packType: 'warm',
    });
    expect(rules(r)).toContain('skin.low-temperature-burn:caution');
    expect(rules(r)).not.toContain('skin.burn:warning');
    expect(r.gases).toEqual([]);
    expect(classes(r)).toEqual(['flam-sol 2']);
  });
});
