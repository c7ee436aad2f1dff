import { describe, expect, it } from 'vitest';
import { contactUA, packAreaM2, radiativeCoefficientWPerM2K } from './contact';

describe('contact cases', () => {
  it('h_rad = 4εσT³ is about 6.1 W/(m²·K) for a black body at 25 °C (Stefan–Boltzmann; textbook figure ~6)', () => {
    // Incropera & DeWitt, Fundamentals of Heat and Mass Transfer: h_r ≈ 6 W/(m²·K) near room temperature for ε = 1 (from memory).
    expect(radiativeCoefficientWPerM2K(1, 25)).toBeCloseTo(6.0, 0);
  });

  it('a flat pouch of 195 g at 1.3 g/cm³ and 15 mm has two faces of 100 cm²', () => {
    expect(packAreaM2({ massG: 195, densityGPerCm3: 1.3, thicknessMm: 15 })).toBeCloseTo(0.02, 12);
  });

  it('UA is monotone in area for every contact case', () => {
    for (const c of ['still-air', 'skin-fabric', 'insulated'] as const) {
      let prev = 0;
      for (const areaM2 of [0.005, 0.01, 0.02, 0.05]) {
        const ua = contactUA({ case: c, geometry: { areaM2 } }, 25).uaWPerK;
        expect(ua).toBeGreaterThan(prev);
        prev = ua;
      }
    }
  });

  it('an insulated pack exchanges less heat than one in still air, which exchanges less than one on skin', () => {
    const g = { areaM2: 0.02 };
    const insulated = contactUA({ case: 'insulated', geometry: g }, 25).uaWPerK;
    const air = contactUA({ case: 'still-air', geometry: g }, 25).uaWPerK;
    const skin = contactUA({ case: 'skin-fabric', geometry: g }, 25).uaWPerK;
    expect(insulated).toBeLessThan(air);
    expect(air).toBeLessThan(skin);
  });

  it('on skin the pack exchanges with a temperature between ambient and skin', () => {
    const r = contactUA({ case: 'skin-fabric', geometry: { areaM2: 0.02 }, skinTempC: 33 }, 20);
    expect(r.envTempC).toBeGreaterThan(20);
    expect(r.envTempC).toBeLessThan(33);
    expect(r.terms.reduce((a, t) => a + t.uaWPerK, 0)).toBeCloseTo(r.uaWPerK, 12);
  });

  it('estimating the area without a mass is an error that names the field', () => {
    expect(() => packAreaM2({ thicknessMm: 10 })).toThrow(/massG/);
  });
});
