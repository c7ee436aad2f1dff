import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import { lineOf } from '@shared/evaluation/components';
import { conditionsFromBrief, verificationHorizonMin } from '@shared/evaluation/verify';
import { evaluate } from '@shared/evaluation/evaluate';
import { buildLinearModel, parseIngredient, setCoefficients, thermalContext } from '@shared/optimiser/linear-model';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { briefSchema, type BriefInput } from '@shared/schemas/briefs';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';

// A flameless-heater brief that serves an 8-ounce (227 g) entrée: the target (60 °C) and the hold
// apply to the entrée, not the heater. Hand figure: the entrée's sensible heat from 20 to 60 °C,
// m·cp·ΔT = 227 g × 3.6 J/(g·K) × 40 K = 32 688 J (cp of a wet meal about 3.6 J/(g·K): common
// practice, no source).
const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));
const base: BriefInput = {
  name: 'entrée heater',
  packType: 'warm',
  ambientC: 20,
  targetTempC: 60,
  bandK: 5,
  reachWithinMin: 15,
  holdMin: 10,
  contact: 'insulated',
  maxSurfaceTempC: null,
  maxMassG: 600,
  maxGasL: 0,
  maxActives: 1,
  allowedIngredientIds: ['quicklime', 'calcium-chloride'],
};
const withLoad: BriefInput = { ...base, load: { kind: 'food-drink', massG: 227, cpJPerGK: 3.6, initialTempC: 20, contactAreaM2: 0.03, uaToEnvWPerK: 0 } };

describe('a brief with a load is optimised on the load’s temperature', () => {
  it('the heat budget carries the load from its start to the target: 32.7 kJ more for the entrée', () => {
    const members = ['quicklime', 'water'].map((id) => parseIngredient(port, byId.get(id)!, 0.03));
    const est = { nH2O_per_mol: Infinity, soluteMassFraction: 0.01 };
    const budget = (b: BriefInput) => {
      const ctx = thermalContext(briefSchema.parse(b));
      return buildLinearModel({ activeIds: ['quicklime'], members: members.map((p) => p.ingredient), key: 'quicklime' }, setCoefficients(members, ctx, est, port), ctx, est).heatBudgetJ;
    };
    expect(budget(withLoad) - budget(base)).toBeCloseTo(227 * 3.6 * 40, 6);
  });

  it('every candidate listed as meeting it brings the entrée (not only the heater) to 60 °C in time and holds it', { timeout: 60_000 }, () => {
    const brief = briefSchema.parse(withLoad);
    const run = runOptimisation({ brief: withLoad, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false, diagnose: false });
    const passed = run.candidates.filter((c) => c.verification.status === 'passed');
    expect(passed.length).toBeGreaterThan(0);
    for (const c of passed) {
      const ev = evaluate({ lines: c.composition.map((e) => lineOf(byId.get(e.ingredientId)!, e.massG)), conditions: conditionsFromBrief(brief, verificationHorizonMin(brief)), chemistry: port, options: { rtol: 1e-5 } });
      const load = ev.figures.load;
      expect(load, 'the evaluation follows the load').not.toBeNull();
      // With a load, the figures' time to target and minutes in band are the load's (evaluate.ts).
      expect(ev.figures.timeToTargetMin!).toBeLessThanOrEqual(brief.reachWithinMin + 0.05);
      expect(ev.figures.minutesInBand!).toBeGreaterThanOrEqual(brief.holdMin - 0.05);
      expect(load!.maxTempC).toBeGreaterThanOrEqual(brief.targetTempC - 0.05);
      expect(c.verification.timeToTargetMin).toBeCloseTo(ev.figures.timeToTargetMin!, 6);
      // The heater itself runs hotter than the entrée it heats.
      expect(ev.figures.maxTempC).toBeGreaterThan(load!.maxTempC);
    }
  });
});
