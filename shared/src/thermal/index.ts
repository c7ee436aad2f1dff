/** Public API of the thermal model: processes, contact cases, end state, time profile, mixture evaluation. */
export * from './process';
export * from './constants';
export type { ChemistryPort, EutecticPoint as ThermalEutecticPoint, PortValue } from './chemistry-port';
export { chemistryPort, defaultChemistryPort } from './chemistry-adapter';
export {
  contactSchema,
  contactUA,
  packAreaM2,
  packGeometrySchema,
  radiativeCoefficientWPerM2K,
  POUCH_EMISSIVITY,
  STILL_AIR_CONVECTION_W_PER_M2K,
  FABRIC_THICKNESS_MM,
  FABRIC_CONDUCTIVITY_W_PER_MK,
  TISSUE_RESISTANCE_M2K_PER_W,
  SKIN_TEMP_C,
  INSULATION_THICKNESS_MM,
  INSULATION_CONDUCTIVITY_W_PER_MK,
  PACK_DENSITY_G_PER_CM3,
  POUCH_THICKNESS_MM,
} from './contact';
export type { ContactCase, ContactResult, PackGeometry } from './contact';
export { ThermalModelError } from './errors';
export { PackModel } from './pack-model';
export type { ThermalComponent, HeatCapacityParts, MassInventory, ProcessRef } from './pack-model';
export type { EnergyBreakdown, ProcessHeat, SensibleHeat } from './energy';
export { solveEndState, END_STATE_MIN_TEMP_C, END_STATE_MAX_TEMP_C } from './end-state';
export type { EndStateInput, EndStateResult, SoluteEndState, DissolutionLimit } from './end-state';
export { simulateTimeProfile, TIME_PROFILE_DEFAULTS } from './time-profile';
export type { TimeProfileInput, TimeProfileResult, CurvePoint, TargetBand, SoluteProgress } from './time-profile';
export { integrateDormandPrince } from './rk45';
export type { OdeOptions, OdeSolution, OdeRhs } from './rk45';
export { brentRoot } from './root';
export { FORMULA_PROCESS_KINDS, formulaProcessOptions, processForFormula } from './formula-process';
export type { FormulaProcessKind, FormulaProcessOption } from './formula-process';
export { mixturePrecipitation } from './mixture-precipitation';
export { mixtureInputProblems } from './mixture-input-checks';
