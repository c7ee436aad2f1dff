import { describe, expect, it } from 'vitest';
import { evaluateMixtureRequestSchema, evaluateMixtureResponseSchema, type ResolvedMixture } from '../schemas/mixtures';
import { defaultChemistryPort } from '../thermal/chemistry-adapter';
import { solveEndState } from '../thermal/end-state';
import { evaluateMixture } from './evaluate-mixture';
import { ThermalModelError } from '../thermal/errors';

const port = defaultChemistryPort();
const components: ResolvedMixture['components'] = [
  { key: 'water', massG: 100, process: { kind: 'inert', role: 'water' } },
  { key: 'ammonium nitrate', formula: 'NH4NO3', massG: 40, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } },
  { key: 'pouch', massG: 8, process: { kind: 'inert', role: 'packaging' } },
];

describe('evaluateMixture', () => {
  it('uaWPerK 0 and packHeatCapacityJPerK 0 give the adiabatic case, ending at the end-state temperature', () => {
    const r = evaluateMixture(port, { components, initialTempC: 25, ambientC: 25, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 30 });
    const end = solveEndState(port, { initialTempC: 25, components });
    expect(Math.abs(r.endTempC - end.endTempC)).toBeLessThan(0.02);
    expect(r.adiabaticEndTempC).toBeCloseTo(end.endTempC, 9);
    expect(r.energy.heatLostJ).toBe(0);
    expect(r.massG).toBe(148);
    expect(r.dissolvedFraction).toBeCloseTo(1, 9);
  });

  it('answers in the shape of the response schema', () => {
    const r = evaluateMixture(port, {
      components,
      initialTempC: 25,
      ambientC: 30,
      contact: { case: 'skin-fabric', geometry: {} },
      packHeatCapacityJPerK: 20,
      holdMin: 20,
      targetBand: { minC: 5, maxC: 15 },
    });
    expect(evaluateMixtureResponseSchema.safeParse(r).success).toBe(true);
    expect(r.areaM2).toBeGreaterThan(0);
    expect(r.minutesInBand).not.toBeNull();
  });

  it('a quicklime–water reaction heats the pack (CaO + H2O → Ca(OH)2) and its adiabatic profile meets the end state', () => {
    const mix: ResolvedMixture = {
      components: [
        { key: 'water', massG: 60, process: { kind: 'inert', role: 'water' } },
        { key: 'quicklime', massG: 20, process: { kind: 'reaction', reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)' } },
      ],
      initialTempC: 20,
      ambientC: 20,
      uaWPerK: 0,
      holdMin: 90,
    };
    const r = evaluateMixture(port, mix);
    expect(r.adiabaticEndTempC).toBeGreaterThan(50);
    expect(Math.abs(r.endTempC - r.adiabaticEndTempC)).toBeLessThan(0.05);
    expect(r.energy.relativeBalanceError).toBeLessThan(0.005);
  });

  it('needs exactly one of contact and uaWPerK', () => {
    expect(() => evaluateMixture(port, { components, initialTempC: 25, ambientC: 25, holdMin: 10 })).toThrow(ThermalModelError);
    const ok = evaluateMixtureRequestSchema.safeParse({ components: [{ ingredientId: 3, massG: 10 }], initialTempC: 25, ambientC: 25, uaWPerK: 0.2, holdMin: 10 });
    expect(ok.success).toBe(true);
    const both = evaluateMixtureRequestSchema.safeParse({
      components: [{ ingredientId: 3, massG: 10 }],
      initialTempC: 25,
      ambientC: 25,
      uaWPerK: 0.2,
      contact: { case: 'still-air', geometry: { areaM2: 0.02 } },
      holdMin: 10,
    });
    expect(both.success).toBe(false);
  });
});
