import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { contactUA } from '@shared/thermal/contact';
import { solveEndState } from '@shared/thermal/end-state';
import { PackModel, type ThermalComponent } from '@shared/thermal/pack-model';
import { simulateTimeProfile } from '@shared/thermal/time-profile';

/**
 * Salt hydrates charged solid melt at their melting point with their heat of fusion. The
 * product's figures are Lane's (1983); checked here against the ranges of the review by Zalba,
 * Marín, Cabeza and Mehling, Appl. Therm. Eng. 23 (2003) 251, Table "inorganic substances with
 * potential use as PCM" (from memory).
 */

const port = defaultChemistryPort();
const hydrate = (solidKey: string, soluteKey: string, h: number, ions: number, massG = 100): ThermalComponent => ({
  key: solidKey,
  massG,
  process: { kind: 'dissolution', solidKey, soluteKey, hydrateWaterPerFormula: h, ionsPerFormulaUnit: ions },
});

/** Where the equilibrium enthalpy jumps within [lo, hi] (0.05 K steps): temperature and J/g. */
function meltingJump(c: ThermalComponent, lo: number, hi: number): { tempC: number; jumpJPerG: number } {
  const m = new PackModel(port, [c]);
  const h = (t: number) => m.enthalpyJ(t, m.equilibriumExtents(t));
  let best = { tempC: lo, jumpJPerG: 0 };
  for (let t = lo; t < hi; t += 0.05) {
    const d = (h(t + 0.05) - h(t)) / c.massG;
    if (d > best.jumpJPerG) best = { tempC: t + 0.025, jumpJPerG: d };
  }
  return best;
}

describe('salt hydrates that melt', () => {
  // [solid, solute, water of crystallisation, ions, published melting range °C, published heat of fusion range J/g (Zalba et al. 2003, from memory)]
  const cases: [string, string, number, number, [number, number], [number, number]][] = [
    ['CaCl2·6H2O(cr)', 'CaCl2(cr)', 6, 3, [29, 30], [170, 192]],
    ['Na2SO4·10H2O(cr)', 'Na2SO4(cr)', 10, 3, [32, 32.5], [251, 254]],
    ['Na2CO3·10H2O(cr)', 'Na2CO3(cr)', 10, 3, [32, 36], [246.5, 267]],
    ['Na2S2O3·5H2O(cr)', 'Na2S2O3(cr)', 5, 3, [48, 55], [187, 210]],
    ['CH3COONa·3H2O(cr)', 'CH3COONa(cr)', 3, 2, [58, 58.5], [226, 265]],
  ];
  for (const [solid, solute, h, ions, [tLo, tHi], [lLo, lHi]] of cases) {
    it(`${solid} melts within ${tLo}–${tHi} °C absorbing ${lLo}–${lHi} J/g`, () => {
      const j = meltingJump(hydrate(solid, solute, h, ions), tLo - 3, tHi + 3);
      // 0.1 K: the scan's step; 1 %: the latent heat is corrected to the 25 °C reference and back.
      expect(j.tempC).toBeGreaterThanOrEqual(tLo - 0.1);
      expect(j.tempC).toBeLessThanOrEqual(tHi + 0.1);
      expect(j.jumpJPerG).toBeGreaterThanOrEqual(lLo * 0.99);
      expect(j.jumpJPerG).toBeLessThanOrEqual(lHi * 1.01);
    });
  }

  it('100 g CaCl2·6H2O warmed in 40 °C still air holds a plateau at its melting point, then passes it', () => {
    const components = [hydrate('CaCl2·6H2O(cr)', 'CaCl2(cr)', 6, 3)];
    const c = contactUA({ case: 'still-air', geometry: { massG: 100 } }, 40, 100);
    const r = simulateTimeProfile(port, {
      components,
      initialTempC: 20,
      envTempC: 40,
      uaWPerK: c.uaWPerK,
      holdMin: 900,
      targetBand: { minC: 29, maxC: 30.5 },
    });
    // Melting 100 g at ~187 J/g with UA·(40 − 29.8) W takes about 18.7 kJ / (UA·10.2 K): the
    // plateau lasts at least half of that (the rest of the heat warms solid and melt).
    const plateauMin = 18700 / (c.uaWPerK * 10.2) / 60;
    expect(r.minutesInBand!).toBeGreaterThan(0.5 * plateauMin);
    expect(r.endTempC).toBeGreaterThan(31);
    expect(r.energy.relativeBalanceError).toBeLessThan(1e-3);
  });

  it('a hydrate alone does not dissolve in its own crystal water below its melting point', () => {
    // Phase rule: below the melting point the solid hydrate is the stable phase (common practice, no source).
    const r = solveEndState(port, { initialTempC: 20, components: [hydrate('Na2S2O3·5H2O(cr)', 'Na2S2O3(cr)', 5, 3)] });
    expect(r.endTempC).toBeCloseTo(20, 9);
    expect(r.solutes[0]!.dissolvedFraction).toBe(0);
  });
});
