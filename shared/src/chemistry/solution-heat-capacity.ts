import { findHeatCapacityCoefficients, findSpeciesByKey } from './library';
import type { ChemistryLibrary, ComputationWarning, SolutionHeatCapacityCoefficients } from './types';

/** Molar mass of water used to convert the molar correlation, g/mol (CIAAW 2021 abridged). */
const WATER_M_G_PER_MOL = 2 * 1.008 + 15.999;

/**
 * Specific heat capacity of liquid water at saturation pressure (≈ 1 bar below 100 °C), J/(g·K):
 *   Cp = 276370 − 2090.1·T + 8.125·T² − 0.014116·T³ + 9.3701·10⁻⁶·T⁴  J/(kmol·K), T in K,
 * divided by M_w. Valid 273.16–533.15 K; within about 0.2 % of IAPWS-95 between 0 and 100 °C.
 * Below 0 °C (supercooled) and above 100 °C the value is an extrapolation of the polynomial.
 *
 * Source: DIPPR equation 100 coefficients for water, Perry's Chemical Engineers' Handbook, 8th ed.,
 * Table 2-153 (coefficients from memory).
 *
 * @example waterHeatCapacity_J_per_gK(25) // → 4.184
 */
export function waterHeatCapacity_J_per_gK(tempC: number): number {
  const T = tempC + 273.15;
  const cp_J_per_kmolK = 276370 - 2090.1 * T + 8.125 * T ** 2 - 0.014116 * T ** 3 + 9.3701e-6 * T ** 4;
  return cp_J_per_kmolK / 1000 / WATER_M_G_PER_MOL;
}

/**
 * Apparent specific heat capacity of one solute in water, Laliberté (2009) eq. 9–10, J/(g·K):
 *   cp_app,i = a1·e^α + a5·(1 − w_w)^a6,   α = a2·t + a3·e^(0.01·t) + a4·(1 − w_w),
 * t in °C, w_w = mass fraction of water in the solution. The correlation gives kJ/(kg·K), which
 * equals J/(g·K). Source: Laliberté, J. Chem. Eng. Data 54 (2009) 1725, doi:10.1021/je8008123
 * (the same form is used by the CalebBell/chemicals `Laliberte_heat_capacity_i`).
 *
 * @example soluteApparentHeatCapacity_J_per_gK(naclCoefficients, 25, 0.9) // ≈ −0.31
 */
export function soluteApparentHeatCapacity_J_per_gK(c: SolutionHeatCapacityCoefficients, tempC: number, waterMassFraction: number): number {
  const x = 1 - waterMassFraction;
  const alpha = c.a2 * tempC + c.a3 * Math.exp(0.01 * tempC) + c.a4 * x;
  return c.a1 * Math.exp(alpha) + c.a5 * x ** c.a6;
}

export interface SoluteFraction {
  /** Species key of the dissolved (anhydrous) solute, e.g. `NaCl(cr)`. */
  solute: string;
  /** Mass fraction of this solute in the solution. */
  massFraction: number;
}

export interface SolutionHeatCapacityResult {
  /** Specific heat capacity of the solution, J/(g·K). */
  cp_J_per_gK: number;
  /** `laliberte` when every solute is inside its fitted range, else `mixing-rule` for the whole result. */
  basis: 'laliberte' | 'mixing-rule';
  warnings: ComputationWarning[];
}

/**
 * Specific heat capacity of an aqueous solution of one or more solutes, J/(g·K).
 *
 * Inside every solute's fitted range (temperature between its tempMinC and tempMaxC, total solute
 * mass fraction 1 − w_w not above its massFractionMax), the Laliberté (2009) mixture rule:
 *   cp = w_w·cp_w(t) + Σ w_i·cp_app,i(t, w_w).
 * Otherwise (or when a solute has no coefficients) a documented fallback, an assumption rather
 * than a correlation: the mass-weighted mixing rule of pure water and the solid solutes,
 *   cp = w_w·cp_w(t) + Σ w_i·Cp°_i/M_i   (Cp° at 298.15 K from the species table),
 * with a warning `heat-capacity-fallback`. Real solutions usually lie below this estimate
 * (apparent heat capacities of ions are small or negative), so it errs on the side of more heat
 * capacity. cp_w from {@link waterHeatCapacity_J_per_gK}.
 *
 * @example solutionHeatCapacity(lib, [{ solute: 'NaCl(cr)', massFraction: 0.035 }], 25).cp_J_per_gK // ≈ 4.00
 */
export function solutionHeatCapacity(lib: ChemistryLibrary, solutes: SoluteFraction[], tempC: number): SolutionHeatCapacityResult {
  const totalSolute = solutes.reduce((s, x) => s + x.massFraction, 0);
  if (solutes.some((s) => !(s.massFraction >= 0)) || !(totalSolute < 1)) {
    throw new RangeError(`Solute mass fractions must be ≥ 0 and sum to less than 1; found a sum of ${totalSolute}.`);
  }
  const ww = 1 - totalSolute;
  const cpw = waterHeatCapacity_J_per_gK(tempC);
  const warnings: ComputationWarning[] = [];
  const outside: string[] = [];
  const coeffs = solutes.map((s) => {
    const c = findHeatCapacityCoefficients(lib, s.solute);
    if (!c) outside.push(`${s.solute}: no Laliberté coefficients`);
    else {
      if (tempC < c.tempMinC - 1e-9 || tempC > c.tempMaxC + 1e-9) outside.push(`${s.solute}: ${tempC} °C outside ${c.tempMinC}–${c.tempMaxC} °C`);
      if (totalSolute > c.massFractionMax + 1e-12) outside.push(`${s.solute}: solute mass fraction ${round(totalSolute, 4)} above ${round(c.massFractionMax, 4)}`);
    }
    return c;
  });
  if (outside.length === 0) {
    let cp = ww * cpw;
    solutes.forEach((s, k) => {
      cp += s.massFraction * soluteApparentHeatCapacity_J_per_gK(coeffs[k] as SolutionHeatCapacityCoefficients, tempC, ww);
    });
    return { cp_J_per_gK: cp, basis: 'laliberte', warnings };
  }
  let cp = ww * cpw;
  for (const s of solutes) {
    const sp = findSpeciesByKey(lib, s.solute);
    if (sp.Cp_J_per_mol_K === null) {
      throw new RangeError(`Heat capacity fallback needs Cp° of ${sp.key}, which the species table lacks.`);
    }
    cp += (s.massFraction * sp.Cp_J_per_mol_K) / sp.molarMass_g_per_mol;
  }
  warnings.push({
    code: 'heat-capacity-fallback',
    message: `Outside the Laliberté fitted range (${outside.join('; ')}); assumed mixing rule of pure water and solid Cp° instead.`,
  });
  return { cp_J_per_gK: cp, basis: 'mixing-rule', warnings };
}

function round(x: number, d: number): number {
  const f = 10 ** d;
  return Math.round(x * f) / f;
}
