import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal';
import { calibrateToLog, DEFAULT_SPREADS, monteCarloBand, type LabScenario } from '@shared/lab-logs';
import { syntheticSamples } from '@shared/lab-logs/__fixtures__/synthetic-log';

const port = defaultChemistryPort();
// 80 g NH4NO3 in 120 g water, still air over 0.03 m², from 24 °C: a cold pack that bottoms out and warms back.
const scenario: LabScenario = {
  components: [
    { key: 'water', massG: 120, process: { kind: 'inert', role: 'water' } },
    { key: 'NH4NO3', massG: 80, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } },
  ],
  initialTempC: 24,
  ambientC: 24,
  contact: 'still-air',
  packAreaM2: 0.03,
  packHeatCapacityJPerK: 24,
  horizonMin: 60,
};

describe('calibrateToLog recovers the parameters a curve was made with', () => {
  // Truths span the plausible range; noise 0.1 K is a typical thermocouple logger's resolution
  // and scatter (common practice). Tolerances: 3 % on UA and rate, 1 % on the enthalpy factor —
  // several standard errors at this noise, so a correct fit passes and a biased one does not.
  const truths = [
    { uaMultiplier: 1.4, enthalpyFactor: 0.92, rateMultiplier: 0.5, heatCapacityFactor: 1 },
    { uaMultiplier: 0.7, enthalpyFactor: 1.05, rateMultiplier: 2, heatCapacityFactor: 1 },
  ];
  for (const [k, truth] of truths.entries()) {
    it(`UA ×${truth.uaMultiplier}, ΔH ×${truth.enthalpyFactor}, k ×${truth.rateMultiplier} with 0.1 K noise`, () => {
      const samples = syntheticSamples(port, scenario, truth, { everySec: 15, noiseK: 0.1, seed: 11 + k });
      const fit = calibrateToLog(port, scenario, samples);
      expect(Math.abs(fit.uaMultiplier.value / truth.uaMultiplier - 1)).toBeLessThan(0.03);
      expect(Math.abs(fit.enthalpyFactor.value / truth.enthalpyFactor - 1)).toBeLessThan(0.01);
      expect(Math.abs(fit.rateMultiplier.value / truth.rateMultiplier - 1)).toBeLessThan(0.03);
      // The residual scatter of a right fit is the noise put in.
      expect(fit.rmseK).toBeGreaterThan(0.08);
      expect(fit.rmseK).toBeLessThan(0.12);
      expect(fit.rSquared).toBeGreaterThan(0.99);
      // The truth lies within 4 standard errors of each fitted value.
      expect(Math.abs(fit.uaMultiplier.value - truth.uaMultiplier)).toBeLessThan(4 * fit.uaMultiplier.standardError + 1e-3);
      expect(Math.abs(fit.enthalpyFactor.value - truth.enthalpyFactor)).toBeLessThan(4 * fit.enthalpyFactor.standardError + 1e-3);
      expect(fit.rateConstantPerMin!.value).toBeCloseTo(fit.rateMultiplier.value * fit.nominal.rateConstantPerMin!, 10);
    }, 60_000);
  }

  it('standard errors grow with the noise (s² = SSR/(n − p))', () => {
    const truth = { uaMultiplier: 1.2, enthalpyFactor: 1, rateMultiplier: 1, heatCapacityFactor: 1 };
    const quiet = calibrateToLog(port, scenario, syntheticSamples(port, scenario, truth, { everySec: 20, noiseK: 0.05, seed: 3 }), { fit: ['ua'] });
    const noisy = calibrateToLog(port, scenario, syntheticSamples(port, scenario, truth, { everySec: 20, noiseK: 0.5, seed: 3 }), { fit: ['ua'] });
    expect(noisy.uaMultiplier.standardError).toBeGreaterThan(5 * quiet.uaMultiplier.standardError);
  }, 60_000);
});

describe('monteCarloBand', () => {
  it('the 5–95 % band contains the nominal curve, and narrows as the spreads shrink', () => {
    const wide = monteCarloBand(port, scenario, { samples: 120, seed: 5 });
    const narrow = monteCarloBand(port, scenario, {
      samples: 120,
      seed: 5,
      spreads: { enthalpyRel: DEFAULT_SPREADS.enthalpyRel / 3, heatCapacityRel: DEFAULT_SPREADS.heatCapacityRel / 3, uaRel: DEFAULT_SPREADS.uaRel / 3 },
    });
    // Integration tolerance of the samples (rtol 1e-4) allows a few hundredths of a kelvin.
    wide.band.forEach((b, i) => {
      expect(b.p5).toBeLessThanOrEqual(wide.nominal[i]!.tempC + 0.05);
      expect(b.p95).toBeGreaterThanOrEqual(wide.nominal[i]!.tempC - 0.05);
    });
    const width = (r: typeof wide) => r.band.reduce((a, b) => a + (b.p95 - b.p5), 0) / r.band.length;
    expect(width(narrow)).toBeLessThan(0.5 * width(wide));
    expect(width(wide)).toBeGreaterThan(0.2);
  }, 60_000);

  it('is reproducible for a seed and counts the samples meeting a criterion', () => {
    const meets = (p: { minTempC: number }) => p.minTempC < 0;
    const a = monteCarloBand(port, scenario, { samples: 40, seed: 9, meets });
    const b = monteCarloBand(port, scenario, { samples: 40, seed: 9, meets });
    expect(a.band).toEqual(b.band);
    expect(a.probabilityMeetsBrief).toBe(b.probabilityMeetsBrief);
    expect(a.probabilityMeetsBrief).toBeGreaterThanOrEqual(0);
    expect(a.probabilityMeetsBrief).toBeLessThanOrEqual(1);
  }, 60_000);
});
