import { describe, expect, it } from 'vitest';
import { DEMO_INGREDIENTS } from '@shared/demo/ingredients';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { solveEndState } from '@shared/thermal/end-state';
import { PackModel, type ThermalComponent } from '@shared/thermal/pack-model';
import type { IngredientProcessInput } from '@shared/thermal/process';

/**
 * Reactions take their reactants from the pack: the barium hydroxide–ammonium chloride reaction
 * against a hand balance with the published reaction enthalpy, the limiting reactant, a partner
 * listed as its own ingredient, and the phase of the products.
 */

const port = defaultChemistryPort();
const barium = DEMO_INGREDIENTS.find((i) => i.key === 'barium-hydroxide-8h2o')!.process as IngredientProcessInput;
const water = (massG: number): ThermalComponent => ({ key: 'water', massG, process: { kind: 'inert', role: 'water' } });
const ba = (massG: number): ThermalComponent => ({ key: 'Ba(OH)2·8H2O', massG, process: barium });
const nh4cl = (massG: number): ThermalComponent => ({ key: 'NH4Cl', massG, process: { kind: 'dissolution', solidKey: 'NH4Cl(cr)' } });

// Ba(OH)2·8H2O + 2 NH4Cl → BaCl2·2H2O + 2 NH3(aq) + 8 H2O: ΔrH ≈ +63.6 kJ/mol (Shakhashiri,
// Chemical Demonstrations vol. 1 (1983), "Endothermic reactions of hydrated barium hydroxide and
// ammonium salts"; from memory). M: 315.46 and 53.49 g/mol (CIAAW 2021). cp of water 4.18 J/(g·K)
// (common textbook value); the solids' heat capacity is left out of the hand balance (≈ 5 % of
// the total here), hence a 10 % tolerance on the temperature drop.
const DH_KJ = 63.6;
const MOL_BA = 31.546 / 315.46; // 0.1 mol

describe('reaction partners from the pack', () => {
  it('barium hydroxide alone does not react: the end temperature is the start, and a warning says why', () => {
    const r = solveEndState(port, { initialTempC: 20, components: [ba(31.546), water(100)] });
    expect(r.endTempC).toBeCloseTo(20, 6);
    const model = new PackModel(port, [ba(31.546), water(100)]);
    expect(model.warnings.list().map((w) => w.code)).toContain('thermal.reaction-partner-missing');
  });

  it('with its partner in 200 g water the drop matches the hand balance ξ·ΔrH / (m_w·cp_w)', () => {
    // Water at the end: 200 g + 8 × 18.015 × 0.1 = 214.4 g.
    const hand = (MOL_BA * DH_KJ * 1000) / ((200 + 8 * 18.015 * MOL_BA) * 4.18);
    const r = solveEndState(port, { initialTempC: 25, components: [ba(31.546), nh4cl(2 * MOL_BA * 53.49), water(200)] });
    expect(Math.abs(25 - r.endTempC - hand) / hand).toBeLessThan(0.1);
  });

  it('the scarcer reactant limits: half the ammonium chloride gives half the drop', () => {
    const full = solveEndState(port, { initialTempC: 25, components: [ba(31.546), nh4cl(2 * MOL_BA * 53.49), water(200)] });
    const half = solveEndState(port, { initialTempC: 25, components: [ba(31.546), nh4cl(MOL_BA * 53.49), water(200)] });
    // Stoichiometry: ξ = n(NH4Cl)/2 halves; the unreacted Ba(OH)2·8H2O only adds heat capacity (≈ 2 %).
    expect(Math.abs((25 - half.endTempC) / (25 - full.endTempC) - 0.5)).toBeLessThan(0.03);
  });

  it('a partner listed as its own ingredient with the same reaction is counted once', () => {
    const asReaction: ThermalComponent = { key: 'NH4Cl', massG: 2 * MOL_BA * 53.49, process: { ...(barium as object), ingredientKey: 'NH4Cl(cr)' } as IngredientProcessInput };
    const a = solveEndState(port, { initialTempC: 25, components: [ba(31.546), nh4cl(2 * MOL_BA * 53.49), water(200)] });
    const b = solveEndState(port, { initialTempC: 25, components: [ba(31.546), asReaction, water(200)] });
    expect(b.endTempC).toBeCloseTo(a.endTempC, 2);
  });

  it('ammonia written as a gas dissolves while there is water; hydrogen from magnesium leaves the pack', () => {
    // Henry's law constants at 25 °C (Sander, Atmos. Chem. Phys. 15 (2015) 4399; from memory):
    // NH3 ≈ 59 mol/(kg·bar), H2 ≈ 7.8e-4 mol/(kg·bar). From NBS ΔfG°: ≈ 58 and ≈ 8e-4.
    const gasWritten = { ...(barium as object), products: [{ key: 'BaCl2·2H2O(cr)', coef: 1 }, { key: 'NH3(g)', coef: 2 }, { key: 'H2O(l)', coef: 8 }] } as IngredientProcessInput;
    const m = new PackModel(port, [{ key: 'Ba', massG: 31.546, process: gasWritten }, nh4cl(2 * MOL_BA * 53.49), water(100)]);
    expect(m.reactions[0]!.gasMolPerExtent).toBe(0);
    const mg: IngredientProcessInput = { kind: 'reaction', reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' };
    const h = new PackModel(port, [{ key: 'Mg', massG: 2.43, process: mg }, water(100)]);
    expect(h.reactions[0]!.gasMolPerExtent).toBeGreaterThan(0.999);
  });
});
