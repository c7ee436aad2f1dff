import type { ChemistryPort } from '../thermal/chemistry-port';
import { WATER_MOLAR_MASS_G_PER_MOL } from '../thermal/constants';
import {
  buildLinearModel,
  concentrationOf,
  ingredientCoefficients,
  type ConcentrationEstimate,
  type LinearModel,
  type ParsedIngredient,
  type ThermalContext,
} from './linear-model';
import { solveSet, type LpCounter, type SetSolution } from './solve-set';
import type { IngredientSet } from './types';

export interface EnthalpyIterationOptions {
  /** Most LP passes (default 25). */
  maxIterations?: number;
  /** Settled when n and w_s change by less than this, relative (default 1e-6). */
  tolerance?: number;
  /** From this pass on, the next estimate is damped (geometric mean in n, mean in w) to stop oscillation (default 6). */
  dampFrom?: number;
}

export interface IteratedSet {
  set: IngredientSet;
  /** The last LP solved (its coefficients are those the reported composition was solved with). */
  model: LinearModel;
  solution: SetSolution;
  iterations: number;
  settled: boolean;
  /** Largest relative change of n or w_s in the last pass (0 when nothing dissolves). */
  lastRelativeChange: number;
  lpsSolved: number;
}

/**
 * Saturation estimate at the target: each dissolving member at its solubility s(T*) in water
 * alone, n = (100/s)·M_a/M_w, w_s = s/(100 + s); with several solutes the most concentrated.
 * Returns null when no member dissolves.
 */
export function saturationEstimate(parsed: readonly ParsedIngredient[], targetTempC: number): ConcentrationEstimate | null {
  let best: ConcentrationEstimate | null = null;
  for (const p of parsed) {
    const s = p.model.solutes[0];
    if (!s) continue;
    const sol = Math.max(p.model.solubilityGPer100g(0, targetTempC), 1e-6);
    const n = (100 / sol) * (s.soluteMolarMass / WATER_MOLAR_MASS_G_PER_MOL);
    const est = { nH2O_per_mol: n, soluteMassFraction: sol / (100 + sol) };
    if (!best || est.nH2O_per_mol < best.nH2O_per_mol) best = est;
  }
  return best;
}

/**
 * Solve a set with the concentration-dependent enthalpy of solution:
 *
 *   estimate (n, w_s) → per-gram coefficients → LP → composition → new (n, w_s) → …
 *
 * The enthalpy of solution per mole depends on how much water there is per mole of salt (an
 * NH4NO3 pack at n ≈ 11 absorbs ≈ 20.7 kJ/mol, at infinite dilution 25.7 kJ/mol) and the
 * solution's heat capacity on its solute fraction, so the LP's coefficients are fixed at the
 * current estimate and updated from the composition the LP returns, until n and w_s change by
 * less than `tolerance` (relative). The first estimate is the saturated solution at the target
 * (the least-cost optimum of a single salt is usually saturated, which settles in two passes).
 * If that LP is infeasible the pass is repeated at infinite dilution (the most heat per mole
 * for the usual salts) before the set is called infeasible. The iteration is bounded
 * (`maxIterations`); a set that has not settled is reported with `settled: false`.
 */
export function solveSetIterated(
  set: IngredientSet,
  parsed: readonly ParsedIngredient[],
  ctx: ThermalContext,
  port: ChemistryPort,
  options: EnthalpyIterationOptions = {},
  counter?: LpCounter,
): IteratedSet {
  const maxIterations = options.maxIterations ?? 25;
  const tol = options.tolerance ?? 1e-6;
  const dampFrom = options.dampFrom ?? 6;
  const build = (est: ConcentrationEstimate) =>
    buildLinearModel(
      set,
      parsed.map((p) => ingredientCoefficients(p, ctx.targetTempC, est, port)),
      ctx,
      est,
    );
  const local: LpCounter = { count: 0 };
  const sat = saturationEstimate(parsed, ctx.targetTempC);
  let estimate: ConcentrationEstimate = sat ?? { nH2O_per_mol: Infinity, soluteMassFraction: 0 };
  let model = build(estimate);
  let solution = solveSet(model, local);
  if (solution.status !== 'optimal' && sat) {
    const dilute: ConcentrationEstimate = { nH2O_per_mol: Infinity, soluteMassFraction: 0 };
    const m2 = build(dilute);
    const s2 = solveSet(m2, local);
    if (s2.status === 'optimal') {
      estimate = dilute;
      model = m2;
      solution = s2;
    }
  }
  let iterations = 1;
  let lastChange = 0;
  let settled = true;
  if (sat && solution.status === 'optimal') {
    settled = false;
    while (iterations < maxIterations) {
      const next = concentrationOf(model.coefficients, solution.massesG);
      if (!next) {
        settled = true;
        lastChange = 0;
        break;
      }
      lastChange = relativeChange(estimate, next);
      if (lastChange <= tol) {
        settled = true;
        break;
      }
      const damped: ConcentrationEstimate =
        iterations >= dampFrom && Number.isFinite(estimate.nH2O_per_mol)
          ? { nH2O_per_mol: Math.sqrt(estimate.nH2O_per_mol * next.nH2O_per_mol), soluteMassFraction: (estimate.soluteMassFraction + next.soluteMassFraction) / 2 }
          : next;
      const m = build(damped);
      const s = solveSet(m, local);
      iterations++;
      if (s.status !== 'optimal') {
        // The new coefficients make the set infeasible: keep the last feasible pass, unsettled.
        break;
      }
      estimate = damped;
      model = m;
      solution = s;
    }
  }
  if (counter) counter.count += local.count;
  return { set, model, solution, iterations, settled, lastRelativeChange: lastChange, lpsSolved: local.count };
}

function relativeChange(a: ConcentrationEstimate, b: ConcentrationEstimate): number {
  const dn = Number.isFinite(a.nH2O_per_mol) ? Math.abs(b.nH2O_per_mol - a.nH2O_per_mol) / Math.max(b.nH2O_per_mol, 1e-12) : 1;
  const dw = Math.abs(b.soluteMassFraction - a.soluteMassFraction) / Math.max(b.soluteMassFraction, 1e-12);
  return Math.max(dn, dw);
}
