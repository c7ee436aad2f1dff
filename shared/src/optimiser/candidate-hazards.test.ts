import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '../chemistry';
import { AN_MAX_MASS_FRACTION } from '../hazards/hazard-notes';
import { DEMO_HAZARD_DATA_BY_ID } from '../hazards/demo-hazard-data';
import { candidateSchema } from '../schemas/briefs';
import { DEMO_LIBRARY } from '../demo/demo-library';
import { enumerateSets } from './enumerate-sets';
import { runOptimisation } from './run-optimisation';

// The demo library with the demo hazard data attached by id (hazards/demo-hazard-data.ts).
const library = DEMO_LIBRARY.map((i) => ({ ...i, hazardData: DEMO_HAZARD_DATA_BY_ID[i.id] ?? null }));
const chemistry = defaultChemistryLibrary();
const coldBrief = {
  name: 'AN cold compress',
  packType: 'cold' as const,
  ambientC: 25,
  targetTempC: 5,
  bandK: 3,
  holdMin: 15,
  maxMassG: 400,
  allowedIngredientIds: ['ammonium-nitrate', 'urea', 'water'],
  maxActives: 1,
};

describe('optimiser hazard hookup', () => {
  it('an excluded hazard class matches the tags of hazardData: `ox-sol` leaves ammonium nitrate out', () => {
    const e = enumerateSets({ allowedIngredientIds: [], excludedIngredientIds: [], excludedHazardClasses: ['ox-sol'], maxActives: 1 }, library, () => null);
    expect(e.excluded.find((x) => x.ingredientId === 'ammonium-nitrate')?.reason).toMatch(/ox-sol/);
    expect(e.actives.some((a) => a.id === 'urea')).toBe(true);
  });

  it('a cap token excludes nothing: `precursor-an` keeps ammonium nitrate in the sets', () => {
    const e = enumerateSets({ allowedIngredientIds: [], excludedIngredientIds: [], excludedHazardClasses: ['precursor-an'], maxActives: 1 }, library, () => null);
    expect(e.actives.some((a) => a.id === 'ammonium-nitrate')).toBe(true);
  });

  it('every candidate carries hazards that parse with candidateSchema, with the score in hazardScore', () => {
    const r = runOptimisation({ brief: coldBrief, ingredients: library, chemistry }, { verifyTop: 2, diagnose: false, sensitivity: false });
    expect(r.candidates.length).toBeGreaterThan(0);
    for (const c of r.candidates) {
      expect(candidateSchema.parse(c).hazards).toBeDefined();
      expect(c.hazardScore).toBe(c.hazards!.score);
    }
    const an = r.candidates.find((c) => c.setIds.join() === 'ammonium-nitrate');
    if (an) expect(an.hazards!.notes.some((n) => n.ruleId === 'precursor.an-nitrogen')).toBe(true);
  });

  it('`precursor-an` caps ammonium nitrate below 16 % N from AN (Regulation (EU) 2019/1148 Annex I, from memory)', () => {
    const r = runOptimisation({ brief: { ...coldBrief, excludedHazardClasses: ['precursor-an'] }, ingredients: library, chemistry }, { verifyTop: 2, diagnose: false, sensitivity: false });
    const an = r.candidates.find((c) => c.setIds.join() === 'ammonium-nitrate');
    expect(an).toBeDefined();
    const w = an!.composition.find((x) => x.ingredientId === 'ammonium-nitrate')!.massG / an!.fillMassG;
    expect(w).toBeLessThan(AN_MAX_MASS_FRACTION);
    const note = an!.hazards!.notes.find((n) => n.ruleId === 'precursor.an-nitrogen')!;
    expect(note.severity).toBe('info');
  });
});
