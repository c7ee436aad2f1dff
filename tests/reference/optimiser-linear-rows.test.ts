import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import {
  buildLinearModel,
  parseIngredient,
  rowValue,
  setCoefficients,
  thermalContext,
  type ConcentrationEstimate,
} from '@shared/optimiser/linear-model';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { briefSchema, type BriefInput } from '@shared/schemas/briefs';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';

// Hand computations from /work/shared/data/nbs-1982/nbs-tables.csv (NBS 1982, Wagman et al.,
// the project's published table): ΔfH° Ba(OH)2·8H2O(cr) −3342.2, NH4Cl(cr) −314.43,
// BaCl2·2H2O(cr) −1460.13, NH3(ao) −80.29, H2O(l) −285.830 kJ/mol; molar masses 315.478,
// 53.4917, 18.0154 g/mol from the same rows.
const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));
const parsed = (ids: string[]) => ids.map((id) => parseIngredient(port, byId.get(id)!, 0.03));
const DILUTE: ConcentrationEstimate = { nH2O_per_mol: Infinity, soluteMassFraction: 0.01 };
const cold = thermalContext(briefSchema.parse({ name: 'rows' }));

const DR_H_BA_KJ = -1460.13 + 2 * -80.29 + 8 * -285.83 - (-3342.2 + 2 * -314.43); // +63.71 kJ/mol
const M_BA = 315.478;
const NH4CL_PER_G_BA = (2 * 53.4917) / M_BA; // 0.3391 g NH4Cl per g Ba(OH)2·8H2O

describe('a reaction takes its partner from the set, and the partner limits nothing', () => {
  const members = parsed(['barium-hydroxide-8h2o', 'ammonium-chloride', 'water']);
  const [ba, nh4cl] = setCoefficients(members, cold, DILUTE, port);

  it('with its partner in the set, the barium reaction absorbs ΔrH per gram (Hess, NBS 1982) beside what the ammonium chloride it takes would have absorbed dissolving', () => {
    expect(DR_H_BA_KJ).toBeCloseTo(63.71, 2);
    expect(ba!.reactionPartners).toEqual([expect.objectContaining({ ingredientId: 'ammonium-chloride', reactantKey: 'NH4Cl(cr)' })]);
    expect(ba!.reactionPartners![0]!.gPerG).toBeCloseTo(NH4CL_PER_G_BA, 4);
    // Per gram of Ba(OH)2·8H2O: the reaction's heat less the dissolution the consumed NH4Cl no longer makes.
    expect(ba!.heatAbsorbedJPerG + NH4CL_PER_G_BA * nh4cl!.heatAbsorbedJPerG).toBeCloseTo((DR_H_BA_KJ * 1000) / M_BA, 0);
    // The eight crystal waters join the liquid water (NH3 dissolves in them).
    expect(ba!.liquidWaterGPerG).toBeCloseTo((8 * 18.0154) / M_BA, 3);
    // The consumed NH4Cl does not dissolve.
    expect(ba!.soluteGPerG).toBeCloseTo(-NH4CL_PER_G_BA, 5);
  });

  it('a linear row keeps the reaction member the limiting reagent, and the solubility row counts only the partner left over', () => {
    const model = buildLinearModel({ activeIds: ['ammonium-chloride', 'barium-hydroxide-8h2o'], members: members.map((p) => p.ingredient), key: 'x' }, setCoefficients(members, cold, DILUTE, port), cold, DILUTE);
    const row = model.constraints.find((r) => r.id === 'partner-stoichiometry:ammonium-chloride')!;
    expect(row.sense).toBe('ge');
    expect(row.coefficients[0]).toBeCloseTo(-NH4CL_PER_G_BA, 5);
    expect(row.coefficients[1]).toBe(1);
    // 10 g Ba(OH)2·8H2O needs 3.391 g NH4Cl: 3.3 g violates the row, 3.4 g holds it.
    expect(rowValue(row, [10, 3.3, 50])).toBeLessThan(0);
    expect(rowValue(row, [10, 3.4, 50])).toBeGreaterThan(0);
    const sol = model.constraints.find((r) => r.id === 'solubility:ammonium-chloride')!;
    // Σ a·m of the solubility row at 10 g Ba + 5 g NH4Cl and no water: the 5 − 3.391 g left over (NH4Cl is anhydrous, a = 1),
    // less s/100 × the 8 waters the reaction frees.
    const freed = (10 * 8 * 18.0154) / M_BA;
    const s = model.coefficients[1]!.solubilityGPer100g!;
    expect(rowValue(sol, [10, 5, 0])).toBeCloseTo(5 - 10 * NH4CL_PER_G_BA - (s / 100) * freed, 3);
  });

  it('without its partner the reaction contributes no heat, and the set says why', () => {
    const [alone] = setCoefficients(parsed(['barium-hydroxide-8h2o', 'water']), cold, DILUTE, port);
    expect(alone!.heatAbsorbedJPerG).toBe(0);
    expect(alone!.reactionPartners).toBeUndefined();
    expect(alone!.warnings.map((w) => w.code)).toContain('thermal.reaction-partner-missing');
  });

  it('a run lists no barium set without ammonium chloride, and every barium candidate has at least the partner it needs', { timeout: 60_000 }, () => {
    const run = runOptimisation(
      { brief: { name: 'partner', allowedIngredientIds: ['barium-hydroxide-8h2o', 'ammonium-chloride', 'urea'], maxActives: 2, holdMin: 5, targetTempC: 10 }, ingredients: DEMO_LIBRARY, chemistry: lib },
      { port, sensitivity: false, diagnose: false },
    );
    for (const c of run.candidates) {
      const g = (id: string) => c.composition.find((e) => e.ingredientId === id)?.massG ?? 0;
      if (g('barium-hydroxide-8h2o') > 0) {
        expect(c.setIds).toContain('ammonium-chloride');
        expect(g('ammonium-chloride')).toBeGreaterThanOrEqual(NH4CL_PER_G_BA * g('barium-hydroxide-8h2o') - 1e-6);
      }
    }
    expect(run.candidates.some((c) => c.setIds.join('+') === 'barium-hydroxide-8h2o')).toBe(false);
  });
});

describe('a salt hydrate melts in the linear model only when it ends molten', () => {
  // CaCl2·6H2O: heat of fusion 170–192 J/g at 29–30 °C (published range for the phase-change
  // salt: Kenisarin & Mahkamov, "Salt hydrates as latent heat storage materials", Solar Energy Materials & Solar Cells 145 (2016), review tables; from memory).
  const warm = (target: number, initial: number) => thermalContext(briefSchema.parse({ name: 'pcm', packType: 'warm', ambientC: initial, targetTempC: target }));

  it('a warm target above the melting point (20 → 35 °C, crossing 29.8 °C) adds a melting column absorbing the heat of fusion', () => {
    const cs = setCoefficients(parsed(['calcium-chloride-6h2o', 'water']), warm(35, 20), DILUTE, port);
    const melt = cs.find((c) => c.kind === 'hydrate-melting')!;
    expect(melt).toBeDefined();
    expect(melt.ingredient.id).toBe('calcium-chloride-6h2o');
    expect(melt.meltOf).toBe(0);
    expect(melt.heatAbsorbedJPerG).toBeGreaterThan(165);
    expect(melt.heatAbsorbedJPerG).toBeLessThan(195);
    expect(melt.liquidWaterGPerG).toBe(0);
  });

  it('a target below the melting point has no melting column: charged solid, it ends solid (a melt on the way refreezes, net 0)', () => {
    // Sodium sulfate decahydrate melts at 32.4 °C (Glauber's salt, 32.38 °C transition: CRC Handbook, from memory).
    const hot = thermalContext(briefSchema.parse({ name: 'c', ambientC: 40, targetTempC: 30 }));
    expect(setCoefficients(parsed(['sodium-sulfate-10h2o', 'water']), hot, DILUTE, port).some((c) => c.kind === 'hydrate-melting')).toBe(false);
    expect(setCoefficients(parsed(['calcium-chloride-6h2o', 'water']), cold, DILUTE, port).some((c) => c.kind === 'hydrate-melting')).toBe(false);
  });

  it('the melting column and the dissolving column are one ingredient in the candidate and in the simulation', { timeout: 60_000 }, () => {
    // A cooling pack in 40 °C heat, at most 34 °C: above 29.8 °C the hexahydrate absorbs its heat of fusion without water.
    const brief: BriefInput = { name: 'pcm', ambientC: 40, targetTempC: 34, holdMin: 10, reachWithinMin: 10, allowedIngredientIds: ['calcium-chloride-6h2o'], maxActives: 1 };
    const run = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, sensitivity: false, diagnose: false });
    expect(run.candidates).toHaveLength(1);
    const [c] = run.candidates;
    // It melts rather than dissolves: no water, and the simulation agrees it holds the target.
    expect(c!.composition.find((e) => e.ingredientId === 'water')?.massG ?? 0).toBeLessThan(1e-6);
    expect(c!.verification.status).toBe('passed');
    for (const c of run.candidates) {
      const ids = c.composition.map((e) => e.ingredientId);
      expect(new Set(ids).size).toBe(ids.length);
    }
  });
});
