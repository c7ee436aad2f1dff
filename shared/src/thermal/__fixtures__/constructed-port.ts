import type { ChemistryPort, EutecticPoint } from '../chemistry-port';
import { WATER_CP_J_PER_GK } from '../constants';

/**
 * A small, smooth, made-up chemistry for unit tests of the thermal model's logic (not data):
 * ΔsolH(n) = ΔH∞ − a/√n, solubility linear in T, constant apparent heat capacity.
 */
export interface ConstructedSolute {
  molarMass: number;
  dHInf_kJ_per_mol: number;
  /** Concentration term a in ΔH∞ − a/√n, kJ/mol. */
  a_kJ_per_mol: number;
  solubilityAt0_gPer100g: number;
  solubilitySlope_gPer100gK: number;
  cpApp_J_per_gK: number;
  solidCp_J_per_molK: number;
  eutectic?: EutecticPoint;
}

export function constructedPort(solutes: Record<string, ConstructedSolute>, extraSpecies: Record<string, { M: number; dfH: number | null; Cp: number | null }> = {}): ChemistryPort {
  const get = (key: string) => {
    const s = solutes[key];
    if (!s) throw new Error(`constructed port: unknown solute ${key}`);
    return s;
  };
  const species: Record<string, { M: number; dfH: number | null; Cp: number | null }> = {
    'H2O(l)': { M: 18.015, dfH: -285.83, Cp: 75.3 },
    ...extraSpecies,
  };
  return {
    molarMass_g_per_mol: (key) => solutes[key]?.molarMass ?? species[key]?.M ?? (() => { throw new Error(`constructed port: no molar mass for ${key}`); })(),
    formationEnthalpy_kJ_per_mol: (key) => species[key]?.dfH ?? null,
    heatCapacity_J_per_mol_K: (key) => solutes[key]?.solidCp_J_per_molK ?? species[key]?.Cp ?? null,
    integralSolutionEnthalpy_kJ_per_mol: (key, n) => {
      const s = get(key);
      return { value: s.dHInf_kJ_per_mol - s.a_kJ_per_mol / Math.sqrt(n), warnings: [] };
    },
    infiniteDilutionEnthalpy_kJ_per_mol: (key) => get(key).dHInf_kJ_per_mol,
    solubility_g_per_100g: (key, t) => {
      const s = get(key);
      return { value: Math.max(0, s.solubilityAt0_gPer100g + s.solubilitySlope_gPer100gK * t), warnings: [] };
    },
    apparentSoluteCp_J_per_gK: (key) => ({ value: get(key).cpApp_J_per_gK, warnings: [] }),
    solutionCp_J_per_gK: (key, w) => ({ value: (1 - w) * WATER_CP_J_PER_GK + w * get(key).cpApp_J_per_gK, warnings: [] }),
    eutectic: (key) => solutes[key]?.eutectic ?? null,
  };
}

/** A cold-pack salt loosely like ammonium nitrate (made-up smooth curves). */
export const COLD_SALT: ConstructedSolute = {
  molarMass: 80,
  dHInf_kJ_per_mol: 25,
  a_kJ_per_mol: 15,
  solubilityAt0_gPer100g: 110,
  solubilitySlope_gPer100gK: 2.5,
  cpApp_J_per_gK: 1.2,
  solidCp_J_per_molK: 140,
  eutectic: { tempC: -17, soluteMassFraction: 0.42, source: 'constructed' },
};

/** A sparingly soluble cold salt loosely like ammonium chloride. */
export const SPARING_SALT: ConstructedSolute = {
  molarMass: 53.5,
  dHInf_kJ_per_mol: 15,
  a_kJ_per_mol: 2,
  solubilityAt0_gPer100g: 29,
  solubilitySlope_gPer100gK: 0.4,
  cpApp_J_per_gK: 0.8,
  solidCp_J_per_molK: 84,
  eutectic: { tempC: -15, soluteMassFraction: 0.2, source: 'constructed' },
};
