import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import { incompatibilityNotes } from '@shared/hazards/hazard-notes';
import { candidateIncompatibilities } from '@shared/optimiser/incompatible-sets';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import type { BriefInput } from '@shared/schemas/briefs';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';

// Calcium carbonate is sparingly soluble: Ksp ≈ 3.4e-9 at 25 °C (calcite; CRC Handbook,
// "Solubility Product Constants", from memory), so Ca²⁺ from calcium chloride and CO3²⁻ from
// sodium carbonate in one pack's water precipitate it.
const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const brief: BriefInput = {
  name: 'incompatible',
  ambientC: 25,
  targetTempC: 15,
  holdMin: 5,
  reachWithinMin: 10,
  maxActives: 2,
  allowedIngredientIds: ['sodium-carbonate-10h2o', 'calcium-chloride-6h2o', 'urea', 'ammonium-chloride'],
};

describe('incompatible sets are marked in words and ranked after the compatible ones unless the brief allows them', () => {
  const apart = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false, diagnose: false });
  const allowed = runOptimisation({ brief: { ...brief, allowIncompatible: true }, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false, diagnose: false });

  it('the soda and calcium chloride set carries a precipitation of calcium carbonate, named in words', { timeout: 60_000 }, () => {
    const c = apart.candidates.find((x) => x.setIds.includes('sodium-carbonate-10h2o') && x.setIds.includes('calcium-chloride-6h2o'));
    expect(c, 'the soda + calcium chloride set is listed').toBeDefined();
    const p = c!.incompatibilities!.find((i) => i.kind === 'precipitation')!;
    expect(p.subject).toBe('CaCO3(cr)');
    expect(p.between).toHaveLength(2);
    expect(p.message).toMatch(/precipitates/);
    // A single salt in water meets nothing.
    for (const x of apart.candidates.filter((y) => y.setIds.length === 1)) expect(x.incompatibilities).toEqual([]);
  });

  it('within each verification group no compatible candidate ranks below an incompatible one; allowed, they mix by the objective', () => {
    const groups = (cs: typeof apart.candidates) => [...new Set(cs.map((c) => c.verification.status))].map((s) => cs.filter((c) => c.verification.status === s));
    let sawIncompatible = false;
    for (const g of groups(apart.candidates)) {
      const firstBad = g.findIndex((c) => (c.incompatibilities?.length ?? 0) > 0);
      if (firstBad < 0) continue;
      sawIncompatible = true;
      for (const c of g.slice(firstBad)) expect(c.incompatibilities!.length, c.setIds.join('+')).toBeGreaterThan(0);
    }
    expect(sawIncompatible).toBe(true);
    // Same candidates either way; with the brief's permission the order within a group is the objective's alone.
    expect(allowed.candidates.map((c) => c.setIds.join('+')).sort()).toEqual(apart.candidates.map((c) => c.setIds.join('+')).sort());
    for (const g of groups(allowed.candidates)) {
      for (let i = 1; i < g.length; i++) expect(g[i]!.objectiveValue).toBeGreaterThanOrEqual(g[i - 1]!.objectiveValue - 1e-9 * Math.max(1, Math.abs(g[i - 1]!.objectiveValue)));
    }
  });
});

describe('a chemistry that reacts by design is not marked incompatible', () => {
  it('barium hydroxide with the ammonium chloride it takes, and quicklime with water, carry no mark', { timeout: 60_000 }, () => {
    const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));
    const line = (id: string, massG: number) => ({ ingredientId: id, name: byId.get(id)!.name, role: byId.get(id)!.role, massG });
    // 31.5 g Ba(OH)2·8H2O (0.1 mol) with 10.7 g NH4Cl (0.2 mol): the stoichiometric pair.
    const pair = { composition: [line('barium-hydroxide-8h2o', 31.5), line('ammonium-chloride', 10.7), line('water', 20)] };
    expect(candidateIncompatibilities(pair, byId, lib, 10)).toEqual([]);
    // Its hazard notes still carry the acid–base caution (ammonia): only the mark is spared.
    const notes = incompatibilityNotes(pair.composition.map((c) => ({ name: c.name, massG: c.massG, hazardData: byId.get(c.ingredientId)!.hazardData ?? null, isWater: c.ingredientId === 'water' })));
    expect(notes.map((n) => n.ruleId)).toContain('incompat.acid-base');
    const warm = runOptimisation(
      { brief: { name: 'lime', packType: 'warm', targetTempC: 40, holdMin: 5, maxActives: 1, maxGasL: 0, allowedIngredientIds: ['quicklime'] }, ingredients: DEMO_LIBRARY, chemistry: lib },
      { port, sensitivity: false, diagnose: false },
    );
    expect(warm.candidates.length).toBeGreaterThan(0);
    for (const c of warm.candidates) expect(c.incompatibilities).toEqual([]);
  });
});
