import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '../chemistry';
import { briefSchema } from '../schemas/briefs';
import { chemistryModelFor, libraryRevision } from './chemistry-cache';
import { evaluate } from './evaluate';
import { hazardTemperatures } from './hazards';
import { conditionsFromBrief, verifyComposition } from './verify';

const lib = defaultChemistryLibrary();
const an = { id: 'an', name: 'ammonium nitrate', massG: 40, role: 'active', process: { kind: 'dissolution' as const, solidKey: 'NH4NO3(cr)' } };
const water = { id: 'water', name: 'water', massG: 100, role: 'solvent', process: null };

describe('the evaluation core', () => {
  it('one chemistry model per library revision: an equal copy shares it, a changed species does not', () => {
    const copy = JSON.parse(JSON.stringify(lib)) as typeof lib;
    expect(libraryRevision(copy)).toBe(libraryRevision(lib));
    expect(chemistryModelFor(copy)).toBe(chemistryModelFor(lib));
    const edited = { ...copy, species: copy.species.map((s, i) => (i === 0 ? { ...s, dfH_kJ_per_mol: (s.dfH_kJ_per_mol ?? 0) + 1 } : s)) };
    expect(libraryRevision(edited)).not.toBe(libraryRevision(lib));
    expect(chemistryModelFor(edited)).not.toBe(chemistryModelFor(lib));
  });

  it('applies a contact calibration and an enthalpy factor of the ingredient', () => {
    const brief = briefSchema.parse({ name: 'compress', packType: 'cold', targetTempC: 5, holdMin: 15 });
    const nominal = evaluate({ lines: [an, water], conditions: conditionsFromBrief(brief), chemistry: lib });
    const calibrated = evaluate({
      lines: [an, water],
      conditions: conditionsFromBrief(brief),
      chemistry: lib,
      calibrations: { contacts: { 'still-air': { uaMultiplier: 2 } }, ingredients: { an: { enthalpyFactor: 0.9 } } },
    });
    expect(calibrated.exchange.uaWPerK).toBeCloseTo(2 * nominal.exchange.uaWPerK, 12);
    // Less heat absorbed, more heat leaking in: a warmer coldest point.
    expect(calibrated.figures.minTempC).toBeGreaterThan(nominal.figures.minTempC + 0.5);
    // A UA given directly is not re-calibrated.
    const direct = evaluate({ lines: [an, water], conditions: conditionsFromBrief({ ...brief, uaWPerK: 0.3 }), chemistry: lib, calibrations: { contacts: { 'still-air': { uaMultiplier: 2 } } } });
    expect(direct.exchange.uaWPerK).toBe(0.3);
    // The verification runs the same path (at its looser integrator tolerance, 1e-5: within 0.05 K).
    expect(verifyComposition(lib, brief, [an, water]).minTempC).toBeCloseTo(nominal.figures.minTempC, 1);
  });

  it('hazard temperatures: one fallback order', () => {
    const cold = { packType: 'cold' as const, targetTempC: 5, initialTempC: 25 };
    expect(hazardTemperatures(cold, { verified: { minTempC: 2, maxTempC: 25 } })).toEqual({ minTempC: 2, maxTempC: 25 });
    expect(hazardTemperatures(cold, { predictedExtremeTempC: 1 })).toEqual({ minTempC: 1, maxTempC: 25 });
    expect(hazardTemperatures(cold, {})).toEqual({ minTempC: 5, maxTempC: 25 });
    expect(hazardTemperatures({ ...cold, packType: 'warm', targetTempC: 40 }, {})).toEqual({ minTempC: 25, maxTempC: 40 });
  });
});
