import {
  defaultChemistryLibrary,
  enthalpyOfSolutionInfinite,
  eutectic as findEutecticPoint,
  findHeatCapacityCoefficients,
  findSolubilitySeries,
  findSpecies,
  freezingPoint,
  integralEnthalpyOfSolution,
  molarMass,
  pchip,
  solubility,
  soluteApparentHeatCapacity_J_per_gK,
  type ChemistryLibrary,
  type ComputationWarning,
  type SpeciesRecord,
} from '../chemistry';
import type { ChemistryPort, EutecticPoint, PortValue } from './chemistry-port';
import { WATER_CP_J_PER_GK } from './constants';

const NO_WARNINGS: ComputationWarning[] = [];
const FREEZING_W_MAX = 0.6;
/** How far below its lowest tabulated temperature a solubility is extrapolated before the warning says it is uncertain, K. Assumption. */
const SOLUBILITY_EXTRAPOLATION_K = 15;

/**
 * Binds the chemistry layer's functions to the thermal model's {@link ChemistryPort}.
 *
 * The thermal model evaluates enthalpies of solution and solubilities thousands of times per
 * time profile, so each solute's curve is sampled once from the chemistry functions on a dense
 * grid (ln n from the most concentrated tabulated point to 10⁵ mol/mol; the tabulated temperatures within 0–100 °C in 0.5 K) and
 * re-interpolated with the chemistry layer's own monotone cubic (PCHIP). The sampled curves
 * reproduce the chemistry functions to better than 0.01 % (tested); outside the grids the
 * chemistry functions are called directly and their warnings passed on.
 *
 * Apparent solute heat capacities use the Laliberté coefficients with the total solute mass
 * fraction and temperature clamped to the fitted range (continuous in composition, so the
 * enthalpy stays differentiable), with a warning when clamped; solutes without coefficients
 * use their solid Cp°/M (mixing rule), also with a warning.
 *
 * @example const port = chemistryPort(); port.integralSolutionEnthalpy_kJ_per_mol('NH4NO3(cr)', 10).value // ≈ 20.5
 */
export function chemistryPort(lib: ChemistryLibrary = defaultChemistryLibrary()): ChemistryPort {
  const speciesCache = new Map<string, SpeciesRecord | null>();
  const species = (key: string): SpeciesRecord | null => {
    if (!speciesCache.has(key)) {
      let s: SpeciesRecord | null = null;
      try {
        s = findSpecies(lib, key);
      } catch {
        s = null;
      }
      speciesCache.set(key, s);
    }
    return speciesCache.get(key) ?? null;
  };

  interface DilutionCurve {
    lnNMin: number;
    lnNMax: number;
    f: (lnN: number) => number;
    infinite: number;
    /** Below the dilution data: the chemistry layer's line in ln n through the first two tabulated points. */
    below: { lnN1: number; lnN2: number; h1: number; h2: number; nMin: number; solute: string } | null;
  }
  const dilutionCache = new Map<string, DilutionCurve>();
  const dilution = (key: string): DilutionCurve => {
    let c = dilutionCache.get(key);
    if (!c) {
      const series = lib.dilution.find((d) => d.solute === key);
      const nMin = series?.points[0]?.nH2O_per_mol ?? 1;
      const lnNMin = Math.log(nMin);
      const lnNMax = Math.log(1e5);
      const xs: number[] = [];
      const ys: number[] = [];
      const count = 400;
      for (let i = 0; i <= count; i++) {
        const lnN = lnNMin + ((lnNMax - lnNMin) * i) / count;
        xs.push(lnN);
        ys.push(integralEnthalpyOfSolution(lib, key, Math.exp(lnN)).dH_kJ_per_mol);
      }
      const n1 = series?.points[0]?.nH2O_per_mol;
      const n2 = series?.points[1]?.nH2O_per_mol;
      const below =
        series && n1 !== undefined && n2 !== undefined
          ? { lnN1: Math.log(n1), lnN2: Math.log(n2), h1: integralEnthalpyOfSolution(lib, key, n1).dH_kJ_per_mol, h2: integralEnthalpyOfSolution(lib, key, n2).dH_kJ_per_mol, nMin: n1, solute: series.solute }
          : null;
      c = { lnNMin, lnNMax, f: pchip(xs, ys), infinite: integralEnthalpyOfSolution(lib, key, Infinity).dH_kJ_per_mol, below };
      dilutionCache.set(key, c);
    }
    return c;
  };

  interface SolubilityCurve {
    tMin: number;
    tMax: number;
    f: (t: number) => number;
    /** The two lowest tabulated points, for the van 't Hoff extrapolation below the data. */
    low: { t1: number; s1: number; t2: number; s2: number; solute: string } | null;
  }
  const solubilityCache = new Map<string, SolubilityCurve>();
  const solubilityCurve = (key: string): SolubilityCurve => {
    let c = solubilityCache.get(key);
    if (!c) {
      const series = findSolubilitySeries(lib, key);
      const pts = series.points;
      const tMin = Math.max(0, pts[0]!.tempC);
      const tMax = Math.min(100, pts[pts.length - 1]!.tempC);
      const xs: number[] = [];
      const ys: number[] = [];
      for (let t = tMin; t <= tMax + 1e-9; t += 0.5) {
        xs.push(t);
        ys.push(solubility(lib, key, t).gPer100gWater);
      }
      const p1 = pts[0];
      const p2 = pts[1];
      const low = p1 && p2 && p1.gPer100gWater > 0 && p2.gPer100gWater > 0 ? { t1: p1.tempC, s1: p1.gPer100gWater, t2: p2.tempC, s2: p2.gPer100gWater, solute: series.solute } : null;
      c = { tMin, tMax, f: xs.length > 1 ? pchip(xs, ys) : () => ys[0] ?? 0, low };
      solubilityCache.set(key, c);
    }
    return c;
  };

  interface FreezingCurve {
    molarMass: number;
    f: (w: number) => number;
  }
  const freezingCache = new Map<string, FreezingCurve | null>();
  const freezingCurve = (key: string): FreezingCurve | null => {
    if (!freezingCache.has(key)) {
      let c: FreezingCurve | null = null;
      const s = species(key);
      if (s && freezingPoint(lib, key, 0.01).basis === 'tabulated') {
        const xs: number[] = [];
        const ys: number[] = [];
        for (let i = 0; i <= 600; i++) {
          const w = (FREEZING_W_MAX * i) / 600;
          xs.push(w);
          ys.push(freezingPoint(lib, key, w).depressionK);
        }
        c = { molarMass: s.molarMass_g_per_mol, f: pchip(xs, ys) };
      }
      freezingCache.set(key, c);
    }
    return freezingCache.get(key) ?? null;
  };

  const cpFallbackCache = new Map<string, PortValue>();
  const molarMassCache = new Map<string, number>();

  const port: ChemistryPort = {
    molarMass_g_per_mol(formulaOrKey) {
      let m = molarMassCache.get(formulaOrKey);
      if (m === undefined) {
        m = molarMass(formulaOrKey.replace(/\((cr|l|g|aq|ai|ao)\)$/, ''));
        molarMassCache.set(formulaOrKey, m);
      }
      return m;
    },
    formationEnthalpy_kJ_per_mol(key) {
      return species(key)?.dfH_kJ_per_mol ?? null;
    },
    formationGibbs_kJ_per_mol(key) {
      return species(key)?.dfG_kJ_per_mol ?? null;
    },
    heatCapacity_J_per_mol_K(key) {
      return species(key)?.Cp_J_per_mol_K ?? null;
    },
    integralSolutionEnthalpy_kJ_per_mol(key, n): PortValue {
      const c = dilution(key);
      if (n === Infinity) return { value: c.infinite, warnings: NO_WARNINGS };
      const lnN = Math.log(n);
      if (lnN >= c.lnNMin && lnN <= c.lnNMax) return { value: c.f(lnN), warnings: NO_WARNINGS };
      const b = c.below;
      if (b && n > 0 && lnN < b.lnN1) {
        // The chemistry layer's own extrapolation (dissolution.ts), from the two end values it gave once.
        return {
          value: b.h1 + ((b.h2 - b.h1) * (lnN - b.lnN1)) / (b.lnN2 - b.lnN1),
          warnings: [
            {
              code: 'below-dilution-data',
              message: `n = ${Math.round(n * 1000) / 1000} mol H2O per mol is more concentrated than the dilution data for ${b.solute} (n ≥ ${b.nMin}); extrapolated from the first two points.`,
            },
          ],
        };
      }
      const r = integralEnthalpyOfSolution(lib, key, n);
      return { value: r.dH_kJ_per_mol, warnings: r.warnings };
    },
    infiniteDilutionEnthalpy_kJ_per_mol(key) {
      return dilutionCache.has(key) || lib.dilution.some((d) => d.solute === key)
        ? dilution(key).infinite
        : enthalpyOfSolutionInfinite(lib, key).dH_kJ_per_mol;
    },
    solubility_g_per_100g(key, tempC): PortValue {
      const c = solubilityCurve(key);
      if (tempC >= c.tMin && tempC <= c.tMax) return { value: c.f(tempC), warnings: NO_WARNINGS };
      if (tempC < c.tMin && c.low) {
        // Below the table: van 't Hoff form, ln s linear in 1/T through the two lowest points
        // (d ln s/d(1/T) = −ΔsolH_eff/(ν·R), held constant), not a straight line in T that
        // runs to zero (sodium sulfate: 1.5 g/100 g at 10 °C linear, ≈ 9 on the decahydrate curve).
        const { t1, s1, t2, s2, solute } = c.low;
        const inv = (t: number) => 1 / (t + 273.15);
        const slope = (Math.log(s2) - Math.log(s1)) / (inv(t2) - inv(t1));
        const value = s1 * Math.exp(slope * (inv(tempC) - inv(t1)));
        const far = t1 - tempC > SOLUBILITY_EXTRAPOLATION_K;
        return {
          value,
          warnings: [
            {
              code: far ? 'thermal.solubility-far-below-data' : 'thermal.solubility-extrapolated',
              message: far
                ? `the solubility data of ${solute} start at ${t1} °C; at ${tempC.toFixed(0)} °C, more than ${SOLUBILITY_EXTRAPOLATION_K} K below them, the extrapolated value (${value.toFixed(1)} g/100 g water, van 't Hoff form) is uncertain: measure it or add data`
                : `the solubility data of ${solute} start at ${t1} °C; below that the value is extrapolated in van 't Hoff form (ln s linear in 1/T) from the two lowest points`,
            },
          ],
        };
      }
      const r = solubility(lib, key, tempC);
      return { value: r.gPer100gWater, warnings: r.warnings };
    },
    apparentSoluteCp_J_per_gK(key, w, tempC): PortValue {
      const c = findHeatCapacityCoefficients(lib, key);
      if (!c) {
        // Independent of w and T: worked out once per solute.
        const known = cpFallbackCache.get(key);
        if (known) return known;
        const s = species(key);
        const cp = s?.Cp_J_per_mol_K != null ? s.Cp_J_per_mol_K / s.molarMass_g_per_mol : 1.2;
        const fallback: PortValue = {
          value: cp,
          warnings: [
            {
              code: 'heat-capacity-fallback',
              message: `No Laliberté coefficients for ${key}; its apparent heat capacity in solution is taken as the solid's Cp° (${cp.toFixed(2)} J/(g·K), mixing rule, assumption).`,
            },
          ],
        };
        cpFallbackCache.set(key, fallback);
        return fallback;
      }
      const wc = Math.min(Math.max(w, 0), c.massFractionMax);
      const tc = Math.min(Math.max(tempC, c.tempMinC), c.tempMaxC);
      const value = soluteApparentHeatCapacity_J_per_gK(c, tc, 1 - wc);
      const warnings =
        wc !== w || tc !== tempC
          ? [
              {
                code: 'heat-capacity-clamped',
                message: `Solution of ${key} outside the Laliberté fitted range (w ≤ ${c.massFractionMax.toFixed(3)}, ${c.tempMinC}–${c.tempMaxC} °C); the solute's apparent heat capacity is held at the edge of the range.`,
              },
            ]
          : NO_WARNINGS;
      return { value, warnings };
    },
    solutionCp_J_per_gK(key, w, tempC): PortValue {
      const app = port.apparentSoluteCp_J_per_gK(key, w, tempC);
      return { value: (1 - w) * WATER_CP_J_PER_GK + w * app.value, warnings: app.warnings };
    },
    freezingPointDepression_K(key, molality) {
      const c = freezingCurve(key);
      if (!c) return null;
      const w = (molality * c.molarMass) / 1000 / (1 + (molality * c.molarMass) / 1000);
      return w <= FREEZING_W_MAX ? c.f(w) : freezingPoint(lib, key, w).depressionK;
    },
    eutectic(key): EutecticPoint | null {
      const e = findEutecticPoint(lib, key);
      return e ? { tempC: e.tempC, soluteMassFraction: e.massFraction, source: e.source } : null;
    },
  };
  return port;
}

let shared: ChemistryPort | null = null;

/** One port over the bundled chemistry library, built on first use and shared (its curve caches are reused). */
export function defaultChemistryPort(): ChemistryPort {
  shared ??= chemistryPort();
  return shared;
}
