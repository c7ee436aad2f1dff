import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry/library';
import { ReactionBalanceError, evaluateReaction } from '@shared/chemistry/reaction';

const lib = defaultChemistryLibrary();

// Reference values: textbook worked examples computed from the NBS 1982 tables (e.g. general
// chemistry texts quoting Wagman et al.); they share the NBS data, so they check the Hess's-law
// arithmetic, the species selection and the phases rather than the data themselves.
describe('reaction thermodynamics against textbook values', () => {
  it('CaO(cr) + H2O(l) → Ca(OH)2(cr): ΔrH° ≈ −65.2 kJ', () => {
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 1 }],
      products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }],
    });
    expect(Math.abs(r.dH298_kJ - -65.2)).toBeLessThan(1);
    expect(r.dG298_kJ as number).toBeLessThan(0);
  });

  it('4 Fe(cr) + 3 O2(g) → 2 Fe2O3(cr): ΔrH° ≈ −1648 kJ', () => {
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'Fe', phase: 'cr', coef: 4 }, { formula: 'O2', phase: 'g', coef: 3 }],
      products: [{ formula: 'Fe2O3', phase: 'cr', coef: 2 }],
    });
    expect(Math.abs(r.dH298_kJ - -1648)).toBeLessThan(1);
    expect(r.favourability).toBe('below');
  });

  it('Ba(OH)2·8H2O + 2 NH4Cl → BaCl2·2H2O + 2 NH3(aq) + 8 H2O(l): ΔH ≈ +63.7 kJ, ΔS ≈ +368 J/K, ΔG ≈ −46 kJ', () => {
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'Ba(OH)2·8H2O', phase: 'cr', coef: 1 }, { formula: 'NH4Cl', phase: 'cr', coef: 2 }],
      products: [
        { formula: 'BaCl2·2H2O', phase: 'cr', coef: 1 },
        { formula: 'NH3', phase: 'aq', coef: 2 },
        { formula: 'H2O', phase: 'l', coef: 8 },
      ],
      tempC: 25,
    });
    expect(Math.abs(r.dH_kJ - 63.7)).toBeLessThan(1);
    expect(Math.abs((r.dS_J_per_K as number) - 368)).toBeLessThan(2);
    expect(Math.abs((r.dG_kJ as number) - -46)).toBeLessThan(1);
    // Endothermic yet spontaneous: entropy-driven, favourable above about −100 °C.
    expect(r.favourability).toBe('above');
    expect(r.crossoverC as number).toBeLessThan(-90);
  });

  it('CaCO3 → CaO + CO2 becomes favourable above about 840 °C', () => {
    // Common practice: limestone calcines above roughly 840–900 °C at 1 bar CO2 (textbook
    // estimate ΔH/ΔS ≈ 1110 K from the NBS values).
    const r = evaluateReaction(lib, {
      reactants: [{ formula: 'CaCO3', phase: 'cr', coef: 1 }],
      products: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'CO2', phase: 'g', coef: 1 }],
    });
    expect(r.favourability).toBe('above');
    expect(r.crossoverC as number).toBeGreaterThan(800);
    expect(r.crossoverC as number).toBeLessThan(900);
    expect(r.favourabilityText).toMatch(/^favourable above 8\d\d °C/);
  });

  it('an unbalanced reaction is an error that names the imbalance', () => {
    expect(() =>
      evaluateReaction(lib, {
        reactants: [{ formula: 'Fe', phase: 'cr', coef: 2 }, { formula: 'O2', phase: 'g', coef: 1 }],
        products: [{ formula: 'Fe2O3', phase: 'cr', coef: 1 }],
      }),
    ).toThrow(ReactionBalanceError);
    expect(() =>
      evaluateReaction(lib, {
        reactants: [{ formula: 'Fe', phase: 'cr', coef: 2 }, { formula: 'O2', phase: 'g', coef: 1 }],
        products: [{ formula: 'Fe2O3', phase: 'cr', coef: 1 }],
      }),
    ).toThrow('O: 2 on the left, 3 on the right');
  });
});
