import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '../chemistry';
import { briefSchema } from '../schemas/briefs';
import { DEMO_LIBRARY } from '../demo/demo-library';
import { runOptimisation } from './run-optimisation';

describe('candidates are the simplest set of their mixture', () => {
  it('no candidate lists an active ingredient at 0 g, and no two candidates are the same mixture', () => {
    const brief = briefSchema.parse({ name: 'Sideline compress', packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60', contact: 'still-air', maxActives: 2 });
    const result = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: defaultChemistryLibrary() });
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      for (const id of c.setIds) {
        const entry = c.composition.find((e) => e.ingredientId === id);
        expect(entry?.massG ?? 0).toBeGreaterThan(0.01);
      }
    }
    const keys = result.candidates.map((c) => [...c.setIds].sort().join('+'));
    expect(new Set(keys).size).toBe(keys.length);
  });
});
