import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { DEMO_LIBRARY } from '@shared/demo/demo-library';
import { GAS_MOLAR_VOLUME_L_PER_MOL, ingredientCoefficients, parseIngredient } from '@shared/optimiser/linear-model';
import { runOptimisation } from '@shared/optimiser/run-optimisation';
import { chemistryPort } from '@shared/thermal/chemistry-adapter';
import { solveEndState } from '@shared/thermal/end-state';

const lib = defaultChemistryLibrary();
const port = chemistryPort(lib);
const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));
const coeff = (id: string, n = Infinity, w = 0.01) => ingredientCoefficients(parseIngredient(port, byId.get(id)!, 0.03), 20, { nH2O_per_mol: n, soluteMassFraction: w }, port);

describe('per-gram coefficients of the linear model match published thermochemistry', () => {
  it('ammonium nitrate absorbs ΔsolH∞/M per gram at infinite dilution', () => {
    // NBS 1982 (Wagman et al.), from memory: ΔfH° NH4+(ai) −132.51, NO3−(ai) −205.0,
    // NH4NO3(cr) −365.56 kJ/mol → ΔsolH∞ = +25.69 kJ/mol; M = 80.043 g/mol.
    expect(coeff('ammonium-nitrate').heatAbsorbedJPerG).toBeCloseTo((25.69 * 1000) / 80.043, 0);
  });

  it('a concentrated ammonium nitrate solution absorbs less per gram than the infinite-dilution figure', () => {
    // NBS 1982 dilution table (from memory): ΔsolH ≈ +20.5 kJ/mol at n = 10 mol H2O per mol.
    const c = coeff('ammonium-nitrate', 10);
    expect(c.heatAbsorbedJPerG).toBeGreaterThan((19.5 * 1000) / 80.043);
    expect(c.heatAbsorbedJPerG).toBeLessThan((21.5 * 1000) / 80.043);
  });

  it('quicklime releases ΔrH/M per gram and takes one water per CaO', () => {
    // NBS 1982, from memory: ΔfH° CaO(cr) −635.09, H2O(l) −285.83, Ca(OH)2(cr) −986.09 kJ/mol
    // → ΔrH = −65.17 kJ/mol; M(CaO) = 56.077, M(H2O) = 18.015 g/mol.
    const c = coeff('quicklime');
    expect(c.heatAbsorbedJPerG).toBeCloseTo((-65.17 * 1000) / 56.077, 0);
    expect(c.liquidWaterGPerG).toBeCloseTo(-18.015 / 56.077, 4);
  });

  it('iron powder releases the heat of 4Fe + 3O2 → 2Fe2O3 per gram of iron', () => {
    // NBS 1982, from memory: ΔfH° Fe2O3(cr) −824.2 kJ/mol → −1648.4 kJ per 4 mol Fe (M = 55.845).
    expect(coeff('iron-powder').heatAbsorbedJPerG).toBeCloseTo((-1648.4 * 1000) / (4 * 55.845), -1);
    expect(coeff('iron-powder').o2MolPerG).toBeCloseTo(3 / (4 * 55.845), 8);
  });

  it('magnesium with water evolves one mole of hydrogen per mole, at the ideal-gas molar volume', () => {
    // Ideal gas at 298.15 K and 101.325 kPa: V_m = RT/p = 24.465 L/mol (CODATA R); M(Mg) = 24.305 g/mol.
    expect(GAS_MOLAR_VOLUME_L_PER_MOL).toBeCloseTo(24.465, 3);
    expect(coeff('magnesium-powder').gasLPerG).toBeCloseTo(24.465 / 24.305, 3);
  });

  it('a hydrate releases its crystal water: sodium thiosulfate pentahydrate gives 5·M_w/M g of water per gram', () => {
    // M(Na2S2O3·5H2O) = 248.18 g/mol (CIAAW 2021 weights), 5 × 18.015 g of water.
    expect(coeff('sodium-thiosulfate-5h2o', 20, 0.3).liquidWaterGPerG).toBeCloseTo((5 * 18.015) / 248.18, 3);
  });
});

describe('the heat budget is the thermal model’s own energy balance', () => {
  it('a least-cost single-salt pack with the budget binding and no heat exchange ends, adiabatically, at the target', () => {
    // Identity: with UA = 0 the budget row reads Σu_i·m_i = C_pack·(T₀ − T*), i.e. H(T*, all
    // dissolved) = H(T₀, charged); the end-state solver must close the same balance at T*.
    const brief = {
      name: 'identity',
      packType: 'cold' as const,
      ambientC: 25,
      targetTempC: 5,
      uaWPerK: 0,
      minSurfaceTempC: null,
      maxActives: 1,
      allowedIngredientIds: ['ammonium-nitrate'],
      packaging: { massG: 10, heatCapacityJPerK: 20, cost: '0.05' },
    };
    const run = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 0 });
    const best = run.candidates[0]!;
    expect(best.bindingConstraints.map((b) => b.kind)).toContain('heat-budget');
    expect(best.enthalpyIteration.settled).toBe(true);
    const components = best.composition.map((c) => ({ key: c.ingredientId, massG: c.massG, process: byId.get(c.ingredientId)!.process! }));
    const end = solveEndState(port, { components, initialTempC: 25, packHeatCapacityJPerK: 20 });
    expect(end.endTempC).toBeCloseTo(5, 1);
  });
});
