import { parseFormula } from './formula';
import { findSpecies } from './library';
import type { ChemistryLibrary, ComputationWarning, Phase, SpeciesRecord } from './types';

/** Standard reference temperature of the tables, K. */
export const T0_K = 298.15;
const KELVIN = 273.15;

/** One species in a reaction: `coef` moles of `formula` in `phase` (the phase may be a tag in the formula). */
export interface ReactionTerm {
  formula: string;
  phase?: Phase;
  coef: number;
}

export interface ReactionInput {
  reactants: ReactionTerm[];
  products: ReactionTerm[];
  /** Temperature at which ΔrG and the Kirchhoff-corrected ΔrH, ΔrS are reported, °C (default 25). */
  tempC?: number;
}

/** A reaction whose elements or charge do not balance. `imbalances` lists every mismatch. */
export class ReactionBalanceError extends Error {
  override readonly name = 'ReactionBalanceError';
  readonly imbalances: { what: string; left: number; right: number }[];
  constructor(message: string, imbalances: { what: string; left: number; right: number }[]) {
    super(message);
    this.imbalances = imbalances;
  }
}

/** A reaction that cannot be evaluated because a species lacks a needed value (ΔfH°). */
export class MissingThermoDataError extends Error {
  override readonly name = 'MissingThermoDataError';
}

export type Favourability = 'always' | 'never' | 'above' | 'below';

export interface ReactionResult {
  /** ΔrH at tempC (Kirchhoff-corrected when ΔrCp is known), kJ per mole of reaction as written. */
  dH_kJ: number;
  /** ΔrS at tempC, J/K per mole of reaction, or null when entropies are missing. */
  dS_J_per_K: number | null;
  /** ΔrG(T) = ΔrH(T) − T·ΔrS(T), kJ, or null when entropies are missing. */
  dG_kJ: number | null;
  /** Standard values at 298.15 K. */
  dH298_kJ: number;
  dS298_J_per_K: number | null;
  dG298_kJ: number | null;
  /** ΔrCp = Σν·Cp°, J/K (constant), or null when a Cp° is missing. */
  dCp_J_per_K: number | null;
  tempC: number;
  /** Temperature where ΔrG changes sign, ΔrH°/ΔrS° (constant ΔH, ΔS), °C; null when the signs allow none. */
  crossoverC: number | null;
  /** Root of ΔrG(T) = 0 with constant ΔrCp (Kirchhoff), found by bracketing in 100–3000 K, °C; null if none. */
  crossoverKirchhoffC: number | null;
  favourability: Favourability;
  /** Plain-language statement, e.g. "favourable above 412 °C". */
  favourabilityText: string;
  warnings: ComputationWarning[];
  /** Resolved species with signed stoichiometric numbers (products +, reactants −). */
  terms: { species: SpeciesRecord; nu: number }[];
}

function fmt(x: number, digits = 0): string {
  const r = Number(x.toFixed(digits));
  return (Object.is(r, -0) ? 0 : r).toString();
}

/**
 * Check element and charge balance of a reaction. Throws {@link ReactionBalanceError} naming every
 * imbalance, e.g. `O: 3 on the left, 2 on the right`. Coefficients must be finite and > 0.
 *
 * @example checkReactionBalance({ reactants: [{ formula: 'CaO', coef: 1 }, { formula: 'H2O', coef: 1 }],
 *   products: [{ formula: 'Ca(OH)2', coef: 1 }] }) // passes
 */
export function checkReactionBalance(input: Pick<ReactionInput, 'reactants' | 'products'>): void {
  if (input.reactants.length === 0 || input.products.length === 0) {
    throw new ReactionBalanceError(
      `A reaction needs at least one reactant and one product; found ${input.reactants.length} reactant(s) and ${input.products.length} product(s).`,
      [],
    );
  }
  const left: Record<string, number> = {};
  const right: Record<string, number> = {};
  let qL = 0;
  let qR = 0;
  const add = (terms: ReactionTerm[], side: Record<string, number>): number => {
    let q = 0;
    for (const t of terms) {
      if (!Number.isFinite(t.coef) || t.coef <= 0) {
        throw new ReactionBalanceError(`Coefficient of "${t.formula}" must be a positive number, found ${t.coef}.`, []);
      }
      const p = parseFormula(t.formula);
      for (const [el, n] of Object.entries(p.elements)) side[el] = (side[el] ?? 0) + n * t.coef;
      q += p.charge * t.coef;
    }
    return q;
  };
  qL = add(input.reactants, left);
  qR = add(input.products, right);
  const imbalances: { what: string; left: number; right: number }[] = [];
  const elements = [...new Set([...Object.keys(left), ...Object.keys(right)])];
  for (const el of elements) {
    const l = left[el] ?? 0;
    const r = right[el] ?? 0;
    if (Math.abs(l - r) > 1e-9 * Math.max(1, Math.abs(l), Math.abs(r))) imbalances.push({ what: el, left: l, right: r });
  }
  if (Math.abs(qL - qR) > 1e-9) imbalances.push({ what: 'charge', left: qL, right: qR });
  if (imbalances.length) {
    const text = imbalances.map((i) => `${i.what}: ${fmt(i.left, 6)} on the left, ${fmt(i.right, 6)} on the right`).join('; ');
    throw new ReactionBalanceError(`Reaction is not balanced: ${text}.`, imbalances);
  }
}

/** ΔrG(T) in kJ with constant ΔrCp: ΔrH° + ΔrCp(T−T0) − T[ΔrS° + ΔrCp·ln(T/T0)]. */
function gibbsKirchhoff_kJ(dH0_kJ: number, dS0_J_per_K: number, dCp_J_per_K: number, T_K: number): number {
  const dH = dH0_kJ * 1000 + dCp_J_per_K * (T_K - T0_K);
  const dS = dS0_J_per_K + dCp_J_per_K * Math.log(T_K / T0_K);
  return (dH - T_K * dS) / 1000;
}

/**
 * Thermodynamics of a balanced reaction from the species table (Hess's law):
 *   ΔrH° = Σν·ΔfH°, ΔrS° = Σν·S°, ΔrCp = Σν·Cp° (ν > 0 for products),
 *   Kirchhoff with constant ΔrCp: ΔrH(T) = ΔrH° + ΔrCp(T − T0), ΔrS(T) = ΔrS° + ΔrCp·ln(T/T0),
 *   ΔrG(T) = ΔrH(T) − T·ΔrS(T), T0 = 298.15 K.
 * Where a species lacks S° but every species has ΔfG°, ΔrS° = (ΔrH° − ΔrG°)/T0 (warning
 * `entropy-from-gibbs`). A missing Cp° skips the Kirchhoff correction (warning `missing-cp`).
 * Crossover: T* = ΔrH°/ΔrS° when both have the same sign; favourability is stated for standard
 * states (1 bar, unit activities) from the signs of ΔrH° and ΔrS°.
 *
 * Source: NBS 1982 tables (Wagman et al.) via the library; standard relations (e.g. Atkins,
 * Physical Chemistry, ch. 2–3).
 *
 * @example evaluateReaction(lib, { reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 },
 *   { formula: 'H2O', phase: 'l', coef: 1 }], products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }] })
 * // → { dH_kJ: -65.17, dS_J_per_K: -26.27, dG_kJ: -57.34, favourability: 'below', ... }
 */
export function evaluateReaction(lib: ChemistryLibrary, input: ReactionInput): ReactionResult {
  checkReactionBalance(input);
  const tempC = input.tempC ?? T0_K - KELVIN;
  const T = tempC + KELVIN;
  if (!(T > 0)) throw new RangeError(`Temperature must be above absolute zero, found ${tempC} °C.`);
  const warnings: ComputationWarning[] = [];
  const terms = [
    ...input.reactants.map((t) => ({ species: findSpecies(lib, t.formula, t.phase ?? null), nu: -t.coef })),
    ...input.products.map((t) => ({ species: findSpecies(lib, t.formula, t.phase ?? null), nu: t.coef })),
  ];

  const missingH = terms.filter((t) => t.species.dfH_kJ_per_mol === null).map((t) => t.species.key);
  if (missingH.length) {
    throw new MissingThermoDataError(`ΔfH° is needed for every species; missing for ${missingH.join(', ')}.`);
  }
  const dH298 = terms.reduce((s, t) => s + t.nu * (t.species.dfH_kJ_per_mol as number), 0);

  let dS298: number | null = null;
  const missingS = terms.filter((t) => t.species.S_J_per_mol_K === null).map((t) => t.species.key);
  if (missingS.length === 0) {
    dS298 = terms.reduce((s, t) => s + t.nu * (t.species.S_J_per_mol_K as number), 0);
  } else if (terms.every((t) => t.species.dfG_kJ_per_mol !== null)) {
    const dG0 = terms.reduce((s, t) => s + t.nu * (t.species.dfG_kJ_per_mol as number), 0);
    dS298 = ((dH298 - dG0) * 1000) / T0_K;
    warnings.push({
      code: 'entropy-from-gibbs',
      message: `S° missing for ${missingS.join(', ')}; ΔrS° taken from ΔrH° and ΔrG° at 298.15 K.`,
    });
  } else {
    warnings.push({ code: 'missing-entropy', message: `S° (and ΔfG°) missing for ${missingS.join(', ')}; ΔrS and ΔrG not computed.` });
  }

  const missingCp = terms.filter((t) => t.species.Cp_J_per_mol_K === null).map((t) => t.species.key);
  let dCp: number | null = null;
  if (missingCp.length === 0) {
    dCp = terms.reduce((s, t) => s + t.nu * (t.species.Cp_J_per_mol_K as number), 0);
  } else {
    warnings.push({
      code: 'missing-cp',
      message: `Cp° missing for ${missingCp.join(', ')}; Kirchhoff correction skipped, 298.15 K values of ΔrH and ΔrS used at ${fmt(tempC, 1)} °C.`,
    });
  }

  const cp = dCp ?? 0;
  const dH = dH298 + (cp * (T - T0_K)) / 1000;
  const dS = dS298 === null ? null : dS298 + cp * Math.log(T / T0_K);
  const dG = dS === null ? null : dH - (T * dS) / 1000;
  const dG298 = dS298 === null ? null : dH298 - (T0_K * dS298) / 1000;
  if (dCp !== null && Math.abs(T - T0_K) > 200) {
    warnings.push({ code: 'kirchhoff-range', message: `ΔrCp is taken as constant over ${fmt(T - T0_K)} K from 25 °C; treat the result as an estimate.` });
  }

  let crossoverC: number | null = null;
  let favourability: Favourability;
  let favourabilityText: string;
  let crossoverKirchhoffC: number | null = null;
  if (dS298 === null) {
    favourability = dH298 < 0 ? 'always' : 'never';
    favourabilityText = `cannot be judged without entropies (ΔrH° = ${fmt(dH298, 1)} kJ)`;
  } else {
    const hNeg = dH298 < 0;
    const sPos = dS298 > 0;
    if (dS298 !== 0 && hNeg !== sPos && dH298 !== 0) {
      crossoverC = (dH298 * 1000) / dS298 - KELVIN;
    }
    if (hNeg && dS298 >= 0) {
      favourability = 'always';
      favourabilityText = 'favourable at all temperatures';
    } else if (!hNeg && dS298 <= 0) {
      favourability = 'never';
      favourabilityText = 'not favourable at any temperature';
    } else if (hNeg) {
      favourability = 'below';
      favourabilityText = `favourable below ${fmt(crossoverC as number)} °C`;
    } else {
      favourability = 'above';
      favourabilityText = `favourable above ${fmt(crossoverC as number)} °C`;
    }
    if (dCp !== null) crossoverKirchhoffC = kirchhoffRoot(dH298, dS298, dCp, crossoverC);
    const far = [crossoverC, crossoverKirchhoffC].some((c) => c !== null && Math.abs(c - 25) > 200);
    if (far) {
      warnings.push({
        code: 'crossover-extrapolated',
        message: 'The crossover temperature lies far from 25 °C, where the tabulated data and a constant ΔrCp are only estimates (phase changes are not modelled).',
      });
    }
    favourabilityText += ' (standard states)';
  }

  return {
    dH_kJ: dH,
    dS_J_per_K: dS,
    dG_kJ: dG,
    dH298_kJ: dH298,
    dS298_J_per_K: dS298,
    dG298_kJ: dG298,
    dCp_J_per_K: dCp,
    tempC,
    crossoverC,
    crossoverKirchhoffC,
    favourability,
    favourabilityText,
    warnings,
    terms,
  };
}

/** Root of ΔrG(T) = 0 with constant ΔrCp in [100, 3000] K by scanning and bisection, °C. */
function kirchhoffRoot(dH0: number, dS0: number, dCp: number, simpleC: number | null): number | null {
  const g = (T: number) => gibbsKirchhoff_kJ(dH0, dS0, dCp, T);
  const roots: number[] = [];
  const lo = 100;
  const hi = 3000;
  const steps = 580;
  let a = lo;
  let ga = g(a);
  for (let k = 1; k <= steps; k++) {
    const b = lo + ((hi - lo) * k) / steps;
    const gb = g(b);
    if (ga === 0) roots.push(a);
    else if (ga * gb < 0) {
      let x0 = a;
      let x1 = b;
      let g0 = ga;
      for (let it = 0; it < 100 && x1 - x0 > 1e-9; it++) {
        const m = 0.5 * (x0 + x1);
        const gm = g(m);
        if (g0 * gm <= 0) x1 = m;
        else {
          x0 = m;
          g0 = gm;
        }
      }
      roots.push(0.5 * (x0 + x1));
    }
    a = b;
    ga = gb;
  }
  if (roots.length === 0) return null;
  const target = simpleC === null ? T0_K : simpleC + KELVIN;
  roots.sort((x, y) => Math.abs(x - target) - Math.abs(y - target));
  return (roots[0] as number) - KELVIN;
}

/**
 * ΔrH(T) in kJ and ΔrS(T) in J/K with constant ΔrCp (Kirchhoff): the same formulas as
 * {@link evaluateReaction}, for callers that evaluate many temperatures.
 *
 * @example reactionAtTemperature({ dH298_kJ: -65.17, dS298_J_per_K: -26.27, dCp_J_per_K: 2.4 }, 80)
 */
export function reactionAtTemperature(
  r: Pick<ReactionResult, 'dH298_kJ' | 'dS298_J_per_K' | 'dCp_J_per_K'>,
  tempC: number,
): { dH_kJ: number; dS_J_per_K: number | null; dG_kJ: number | null } {
  const T = tempC + KELVIN;
  const cp = r.dCp_J_per_K ?? 0;
  const dH = r.dH298_kJ + (cp * (T - T0_K)) / 1000;
  const dS = r.dS298_J_per_K === null ? null : r.dS298_J_per_K + cp * Math.log(T / T0_K);
  return { dH_kJ: dH, dS_J_per_K: dS, dG_kJ: dS === null ? null : dH - (T * dS) / 1000 };
}
