import type { ChemistryPort } from '../thermal/chemistry-port';
import { WATER_MOLAR_MASS_G_PER_MOL } from '../thermal/constants';
import {
  buildLinearModel,
  concentrationOf,
  setCoefficients,
  type ConcentrationEstimate,
  type LinearModel,
  type ParsedIngredient,
  type ThermalContext,
} from './linear-model';
import { solveSet, type LpCounter, type SetSolution } from './solve-set';
import type { IngredientSet } from './types';

export interface EnthalpyIterationOptions {
  /** Most LP passes (default 16). */
  maxIterations?: number;
  /** Settled when n and w_s change by less than this, relative (default 1e-6). */
  tolerance?: number;
  /** From this pass on, steps are scaled by the observed contraction (accelerated or damped; default 2). */
  accelerateFrom?: number;
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
 * (`maxIterations`); a set that has not settled is reported with `settled: false`. When the
 * composition's own concentration makes the LP infeasible, the estimate steps back towards
 * the last feasible one (three halvings in ln n); if none is feasible the set is infeasible,
 * reported at the composition's own concentration.
 */
export function solveSetIterated(
  set: IngredientSet,
  parsed: readonly ParsedIngredient[],
  ctx: ThermalContext,
  port: ChemistryPort,
  options: EnthalpyIterationOptions = {},
  counter?: LpCounter,
): IteratedSet {
  const maxIterations = options.maxIterations ?? 16;
  const tol = options.tolerance ?? 1e-6;
  const accelerateFrom = options.accelerateFrom ?? 2;
  let previousStep: { x: number; gx: number; xw: number; gw: number } | null = null;
  const build = (est: ConcentrationEstimate) =>
    buildLinearModel(
      set,
      setCoefficients(parsed, ctx, est, port),
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
      // Fixed point of the map g: estimate → composition's concentration, componentwise in
      // (ln n, w_s), by the secant on g: g' ≈ [g(x_k) − g(x_{k−1})]/(x_k − x_{k−1}), next
      // x = x_k + [g(x_k) − x_k]/(1 − g'). This sums the remaining steps of a monotone
      // approach (0 < g' < 1) and damps an oscillation (g' < 0); g' is clamped to [−4, 0.8].
      let damped = next;
      if (Number.isFinite(estimate.nH2O_per_mol)) {
        const here = { x: Math.log(estimate.nH2O_per_mol), gx: Math.log(next.nH2O_per_mol), xw: estimate.soluteMassFraction, gw: next.soluteMassFraction };
        const factor = (x: number, gx: number, x0: number | undefined, g0: number | undefined) => {
          if (x0 === undefined || g0 === undefined || iterations < accelerateFrom || x === x0) return 1;
          return 1 / (1 - Math.min(0.8, Math.max(-4, (gx - g0) / (x - x0))));
        };
        const fLn = factor(here.x, here.gx, previousStep?.x, previousStep?.gx);
        const fW = factor(here.xw, here.gw, previousStep?.xw, previousStep?.gw);
        damped = {
          nH2O_per_mol: Math.exp(here.x + fLn * (here.gx - here.x)),
          soluteMassFraction: Math.min(0.95, Math.max(1e-6, here.xw + fW * (here.gw - here.xw))),
        };
        previousStep = here;
      } else previousStep = null;
      let m = build(damped);
      let s = solveSet(m, local);
      iterations++;
      if (s.status !== 'optimal') {
        // The composition's own concentration makes the set infeasible. Step back towards the
        // last feasible estimate (halving in ln n); if no step is feasible, no self-consistent
        // composition was found: the set is reported infeasible at the composition's own
        // concentration, so the diagnosis names what that concentration leaves short.
        let found = false;
        for (const t of [0.5, 0.25, 0.125]) {
          const between = interpolate(damped, estimate, t);
          const mb = build(between);
          const sb = solveSet(mb, local);
          if (sb.status === 'optimal') {
            m = mb;
            s = sb;
            found = true;
            break;
          }
        }
        if (!found) {
          model = m;
          solution = s;
          lastChange = 0;
          break;
        }
        previousStep = null;
        estimate = m.estimate;
        model = m;
        solution = s;
        continue;
      }
      estimate = damped;
      model = m;
      solution = s;
    }
  }
  if (counter) counter.count += local.count;
  return { set, model, solution, iterations, settled, lastRelativeChange: lastChange, lpsSolved: local.count };
}

/** The estimate a fraction t of the way from `to` back to `from` (in ln n; linear in w_s); an infinite n counts as 100× the other. */
function interpolate(to: ConcentrationEstimate, from: ConcentrationEstimate, t: number): ConcentrationEstimate {
  const nTo = to.nH2O_per_mol;
  const nFrom = Number.isFinite(from.nH2O_per_mol) ? from.nH2O_per_mol : 100 * nTo;
  return {
    nH2O_per_mol: Math.exp((1 - t) * Math.log(nTo) + t * Math.log(nFrom)),
    soluteMassFraction: (1 - t) * to.soluteMassFraction + t * from.soluteMassFraction,
  };
}

function relativeChange(a: ConcentrationEstimate, b: ConcentrationEstimate): number {
  const dn = Number.isFinite(a.nH2O_per_mol) ? Math.abs(b.nH2O_per_mol - a.nH2O_per_mol) / Math.max(b.nH2O_per_mol, 1e-12) : 1;
  const dw = Math.abs(b.soluteMassFraction - a.soluteMassFraction) / Math.max(b.soluteMassFraction, 1e-12);
  return Math.max(dn, dw);
}
