import { describe, expect, it } from 'vitest';
import { cryoscopicConstant, eutectic, freezingPoint } from '@shared/chemistry/dissolution';
import { defaultChemistryLibrary } from '@shared/chemistry/library';

const lib = defaultChemistryLibrary();

describe('freezing point of solutions', () => {
  it('the cryoscopic constant of water is 1.86 K·kg/mol', () => {
    // Standard value K_f(water) = 1.86 K·kg/mol (textbook; e.g. CRC Handbook "Cryoscopic constants").
    expect(cryoscopicConstant()).toBeCloseTo(1.86, 2);
  });

  it.each([
    ['NaCl(cr)', 58.44, 2],
    ['KCl(cr)', 74.55, 2],
    ['NH4Cl(cr)', 53.49, 2],
    ['CO(NH2)2(cr)', 60.06, 1],
  ])('%s: dilute depression approaches the ideal colligative limit K_f·ν·m (within 12 %, from below for salts)', (solute, M, nu) => {
    const w = 0.01;
    const m = w / (1 - w) / (M / 1000);
    const ideal = 1.86 * nu * m;
    const r = freezingPoint(lib, solute, w);
    expect(r.basis).toBe('tabulated');
    expect(r.depressionK / ideal).toBeGreaterThan(0.88);
    expect(r.depressionK / ideal).toBeLessThan(1.03);
  });

  // Eutectics (from memory; phase-diagram compilations, CRC Handbook): the tabulated ice line
  // (CRC "Concentrative Properties of Aqueous Solutions", a different table) should reach the
  // eutectic temperature close to the eutectic composition. For CaCl2 the two sources disagree more:
  // the CRC ice line is at −41 °C at 30 % and reaches −49.7 °C only at 32 %, while eutectic
  // tabulations put −49.8 °C at about 29.8 %. The eutectic compositions are from memory and good to
  // about ±2.5 mass %, the tolerance used for all.
  const tolW = 0.025;
  it.each([
    ['NaCl(cr)', -21.1, 0.233],
    ['CaCl2(cr)', -49.8, 0.298],
    ['CO(NH2)2(cr)', -11.5, 0.325],
    ['KNO3(cr)', -2.9, 0.11],
    ['Na2CO3(cr)', -2.1, 0.059],
  ])('%s: the ice line reaches the eutectic temperature within 2.5 mass %% of the eutectic composition', (solute, tempC, w) => {
    const e = eutectic(lib, solute);
    expect(e?.tempC).toBeCloseTo(tempC, 6);
    expect(e?.massFraction).toBeCloseTo(w, 6);
    // Bisection for the composition where the ice line reaches the eutectic temperature.
    let lo = 0;
    let hi = 0.5;
    for (let k = 0; k < 60; k++) {
      const mid = (lo + hi) / 2;
      if (freezingPoint(lib, solute, mid).tempC > tempC) lo = mid;
      else hi = mid;
    }
    expect(Math.abs(lo - w)).toBeLessThan(tolW);
  });

  it('the ammonium nitrate eutectic is about −17 °C', () => {
    // NH4NO3–H2O eutectic ≈ −16.9 °C at about 42 % (from memory).
    expect(Math.abs((eutectic(lib, 'NH4NO3(cr)')?.tempC as number) - -17)).toBeLessThan(0.5);
  });
});
