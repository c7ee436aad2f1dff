/**
 * Data shapes of the chemistry layer. Everything is SI-adjacent and carries its unit in the
 * name. These types are the contract between the species data (seeded into PostgreSQL, and
 * bundled for the browser) and the pure computations in shared/src/chemistry and
 * shared/src/thermal.
 */

/** NBS phase codes: crystal, liquid, gas, aqueous (standard state, ions `ai`, undissociated `ao`). */
export type Phase = 'cr' | 'l' | 'g' | 'aq' | 'ai' | 'ao';

/** One species at 298.15 K and 1 bar. `key` is `formula(phase)`, e.g. `NH4NO3(cr)`, `NH4+(ai)`. */
export interface SpeciesRecord {
  key: string;
  formula: string;
  phase: Phase;
  name: string;
  dfH_kJ_per_mol: number | null;
  dfG_kJ_per_mol: number | null;
  S_J_per_mol_K: number | null;
  Cp_J_per_mol_K: number | null;
  molarMass_g_per_mol: number;
  /** Citation of the row, e.g. "NBS 1982 (Wagman et al.)". */
  source: string;
}

/** ΔfH of one mole of solute dissolved in n mol of water ("solute in n H2O"). */
export interface DilutionPoint {
  nH2O_per_mol: number;
  dfH_kJ_per_mol: number;
}

/** Integral dilution data of a solute, keyed by the species key of the dissolving solid. */
export interface DilutionSeries {
  solute: string;
  points: DilutionPoint[];
  /** ΔfH of the solute at infinite dilution ("in ∞ H2O", or the aqueous standard state), if known. */
  dfH_infinite_kJ_per_mol?: number | null;
  source: string;
}

/** Solubility of a solute, as grams of anhydrous solute per 100 g of water. */
export interface SolubilityPoint {
  tempC: number;
  gPer100gWater: number;
}

export interface SolubilitySeries {
  /** Species key of the anhydrous solute the mass refers to, e.g. `NH4NO3(cr)`. */
  solute: string;
  points: SolubilityPoint[];
  source: string;
}

/** Laliberté (2009) heat-capacity coefficients of an aqueous solution of one solute. */
export interface SolutionHeatCapacityCoefficients {
  solute: string;
  a1: number;
  a2: number;
  a3: number;
  a4: number;
  a5: number;
  a6: number;
  massFractionMax: number;
  tempMinC: number;
  tempMaxC: number;
  /** Number of data points the coefficients were fitted to. */
  pointCount?: number;
  source: string;
}

/** Freezing-point depression of water by one solute vs mass fraction of the anhydrous solute. */
export interface FreezingPointPoint {
  massFraction: number;
  depressionK: number;
}

export interface FreezingPointSeries {
  solute: string;
  points: FreezingPointPoint[];
  source: string;
}

/** Salt–water eutectic: lowest temperature of the liquid, where ice and the salt (hydrate) coexist. */
export interface EutecticPoint {
  solute: string;
  tempC: number;
  /** Mass fraction of anhydrous solute in the eutectic liquid. */
  massFraction: number;
  solidPhases: string;
  source: string;
}

/** Everything the computations read, handed in by the caller (database or bundle). */
export interface ChemistryLibrary {
  species: SpeciesRecord[];
  dilution: DilutionSeries[];
  solubility: SolubilitySeries[];
  solutionHeatCapacity: SolutionHeatCapacityCoefficients[];
  /** Freezing-point depression series (ice line); optional. */
  freezingPoint?: FreezingPointSeries[];
  /** Salt–water eutectics; optional. */
  eutectics?: EutecticPoint[];
}

/** A computed value that went outside its data gets a warning, never a silent extrapolation. */
export interface ComputationWarning {
  code: string;
  message: string;
}
