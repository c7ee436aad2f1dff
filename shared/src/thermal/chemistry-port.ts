import type { ComputationWarning } from '../chemistry/types';

/** A computed value together with the warnings raised while computing it. */
export interface PortValue {
  value: number;
  warnings: ComputationWarning[];
}

/** A salt–water eutectic: the lowest temperature at which a liquid solution of the solute exists. */
export interface EutecticPoint {
  tempC: number;
  /** Mass of anhydrous solute divided by the mass of the eutectic solution. */
  soluteMassFraction: number;
  source: string;
}

/**
 * Everything the thermal model asks of the chemistry layer. The thermal model is written
 * against this small interface so that it can be tested with constructed data and bound to
 * the chemistry module's functions by an adapter (see `chemistry-adapter.ts`).
 *
 * Species are addressed by their key `formula(phase)`, e.g. `NH4NO3(cr)`, `H2O(l)`.
 * All enthalpies are at 298.15 K.
 */
export interface ChemistryPort {
  /** Molar mass of a formula or species key, g/mol (IUPAC 2021 abridged atomic weights). */
  molarMass_g_per_mol(formulaOrKey: string): number;
  /** ΔfH° of a species, kJ/mol, or null when the species data hold none. */
  formationEnthalpy_kJ_per_mol(speciesKey: string): number | null;
  /** ΔfG° of a species, kJ/mol, or null when the species data hold none (optional: gas–liquid partition of reaction products). */
  formationGibbs_kJ_per_mol?(speciesKey: string): number | null;
  /** Cp° of a species, J/(mol·K), or null when the species data hold none. */
  heatCapacity_J_per_mol_K(speciesKey: string): number | null;
  /**
   * Integral enthalpy of solution, kJ per mol of solute, of one mole of `soluteKey` dissolved
   * in `nH2O_per_mol` mol of water: ΔsolH(n) = ΔfH(solute in n H2O) − ΔfH(solid).
   */
  integralSolutionEnthalpy_kJ_per_mol(soluteKey: string, nH2O_per_mol: number): PortValue;
  /** ΔsolH at infinite dilution, kJ/mol. */
  infiniteDilutionEnthalpy_kJ_per_mol(soluteKey: string): number;
  /** Solubility as grams of anhydrous solute per 100 g of water at `tempC`. */
  solubility_g_per_100g(soluteKey: string, tempC: number): PortValue;
  /**
   * Apparent specific heat capacity of the solute in solution, J/(g·K), at a total solute mass
   * fraction and temperature (Laliberté 2009: cp = w_w·cp_w + Σ w_i·cp_app,i). Must be continuous
   * in the mass fraction (clamp to the fitted range rather than switch formulas).
   */
  apparentSoluteCp_J_per_gK(soluteKey: string, totalSoluteMassFraction: number, tempC: number): PortValue;
  /**
   * Specific heat capacity of a binary solution of the solute, J/(g·K):
   * (1 − w)·cp_w + w·cp_app(w), cp_w = WATER_CP_J_PER_GK (constants.ts), so that
   * (cp − (1 − w)·cp_w)/w returns the apparent value exactly.
   */
  solutionCp_J_per_gK(soluteKey: string, massFraction: number, tempC: number): PortValue;
  /** Freezing-point depression of a binary solution, K (positive), or null when not tabulated. */
  freezingPointDepression_K?(soluteKey: string, molality_mol_per_kg: number): number | null;
  /** The solute–water eutectic, or null when not known. */
  eutectic?(soluteKey: string): EutecticPoint | null;
}
