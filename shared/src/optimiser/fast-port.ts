import { integralEnthalpyOfSolution } from '../chemistry/dissolution';
import type { ChemistryLibrary } from '../chemistry/types';
import type { ChemistryPort, PortValue } from '../thermal/chemistry-port';

/**
 * A ChemistryPort that answers two slow paths of the chemistry layer from memory, with the
 * chemistry layer's own values; every other call passes straight through.
 *
 * 1. Apparent heat capacity of a solute the port reports as the documented fallback
 *    (`heat-capacity-fallback`: no Laliberté coefficients, so the solid's Cp°/M, which does not
 *    depend on concentration): remembered per solute.
 * 2. Integral enthalpy of solution more concentrated than the dilution data (n below the first
 *    tabulated point). The chemistry layer extrapolates there linearly in ln n through the
 *    first two tabulated points (dissolution.ts), but recomputes the infinite-dilution anchor
 *    on each call; here the two end values are computed once per solute with
 *    `integralEnthalpyOfSolution` and the same line is evaluated:
 *      ΔsolH(n) = ΔsolH(n₁) + [ΔsolH(n₂) − ΔsolH(n₁)]·(ln n − ln n₁)/(ln n₂ − ln n₁), n < n₁,
 *    with the chemistry layer's `below-dilution-data` warning.
 * The optimiser and its verification ask for these thousands of times per run.
 *
 * @example const port = fastPort(chemistryPort(lib), lib); port.integralSolutionEnthalpy_kJ_per_mol('NaHCO3(cr)', 10)
 */
export function fastPort(port: ChemistryPort, lib?: ChemistryLibrary): ChemistryPort {
  const constantCp = new Map<string, PortValue | null>();
  interface Low {
    lnN1: number;
    lnN2: number;
    h1: number;
    h2: number;
    warning: PortValue['warnings'];
  }
  const low = new Map<string, Low | null>();
  const lowOf = (key: string): Low | null => {
    if (low.has(key)) return low.get(key)!;
    let entry: Low | null = null;
    const series = lib?.dilution.find((d) => d.solute === key);
    if (lib && series && series.points.length >= 2) {
      const n1 = series.points[0]!.nH2O_per_mol;
      const n2 = series.points[1]!.nH2O_per_mol;
      const probe = integralEnthalpyOfSolution(lib, key, n1 / 2);
      entry = {
        lnN1: Math.log(n1),
        lnN2: Math.log(n2),
        h1: integralEnthalpyOfSolution(lib, key, n1).dH_kJ_per_mol,
        h2: integralEnthalpyOfSolution(lib, key, n2).dH_kJ_per_mol,
        warning: probe.warnings,
      };
    }
    low.set(key, entry);
    return entry;
  };
  return {
    ...port,
    apparentSoluteCp_J_per_gK(key, w, tempC) {
      const known = constantCp.get(key);
      if (known) return known;
      const v = port.apparentSoluteCp_J_per_gK(key, w, tempC);
      if (known === undefined) constantCp.set(key, v.warnings.some((x) => x.code === 'heat-capacity-fallback') ? v : null);
      return v;
    },
    integralSolutionEnthalpy_kJ_per_mol(key, n) {
      const l = Number.isFinite(n) && n > 0 ? lowOf(key) : null;
      if (l && Math.log(n) < l.lnN1) {
        const value = l.h1 + ((l.h2 - l.h1) * (Math.log(n) - l.lnN1)) / (l.lnN2 - l.lnN1);
        return { value, warnings: l.warning };
      }
      return port.integralSolutionEnthalpy_kJ_per_mol(key, n);
    },
  };
}
