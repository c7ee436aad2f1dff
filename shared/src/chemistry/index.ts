/** Public API of the chemistry layer: formulas, species data, reactions, dissolution, solution heat capacity. */
export * from './types';
export { ATOMIC_WEIGHTS, ATOMIC_WEIGHTS_SOURCE, isElementSymbol } from './atomic-weights';
export type { ElementEntry } from './atomic-weights';
export { FormulaError, parseFormula, molarMass, hillFormula, splitHydrate } from './formula';
export type { FormulaPart, ParsedFormula } from './formula';
export {
  ChemistryDataError,
  UnknownSpeciesError,
  createChemistryLibrary,
  defaultChemistryLibrary,
  findDilutionSeries,
  findEutectic,
  findFreezingPointSeries,
  findHeatCapacityCoefficients,
  findSolubilitySeries,
  findSpecies,
  findSpeciesByKey,
  speciesKey,
} from './library';
export {
  MissingThermoDataError,
  ReactionBalanceError,
  T0_K,
  checkReactionBalance,
  evaluateReaction,
  reactionAtTemperature,
} from './reaction';
export type { Favourability, ReactionInput, ReactionResult, ReactionTerm } from './reaction';
export {
  WATER_FUSION_ENTHALPY_KJ_PER_MOL,
  WATER_MOLAR_MASS_G_PER_MOL,
  cryoscopicConstant,
  dissolutionHeat,
  dissolutionProducts,
  enthalpyOfSolutionInfinite,
  eutectic,
  freezingPoint,
  integralEnthalpyOfSolution,
  nH2OPerMol,
  solubility,
} from './dissolution';
export type { FreezingPointResult, InfiniteDilutionResult, IntegralEnthalpyResult, IonTerm, SolubilityResult } from './dissolution';
export { solutionHeatCapacity, soluteApparentHeatCapacity_J_per_gK, waterHeatCapacity_J_per_gK } from './solution-heat-capacity';
export type { SoluteFraction, SolutionHeatCapacityResult } from './solution-heat-capacity';
export { linear, pchip } from './interpolate';
export {
  ATM_PA,
  GAS_CONSTANT_J_PER_MOL_K,
  WATER_VAP_J_PER_G,
  adiabaticDeltaT_K,
  idealGasVolumeL,
  packCharge,
  runsUntriggered,
  stoichiometricCharge,
} from './pack-reaction';
export type { PackChargeInput, PackChargeResult, PackTerm } from './pack-reaction';
export {
  DAVIES_A,
  DAVIES_MAX_IONIC_STRENGTH,
  PRECIPITATION_SOURCE,
  SPARINGLY_SOLUBLE_LOG_KSP,
  findPrecipitates,
  ionsFromSolutes,
  log10Ksp,
  sparinglySolubleSolids,
} from './precipitation';
export type { Precipitate, PrecipitationResult, SparinglySolubleSolid } from './precipitation';
