/** Public API of the optimiser: candidate sets, the linear model at the target, LP per set, ranking and sweeps. */
export type { IngredientNeed, IngredientSet, OptimiserIngredient, OptimiserWarning } from './types';
export { enumerateSets, isWaterIngredient } from './enumerate-sets';
export type { ExcludedIngredient, SetEnumeration } from './enumerate-sets';
export { resolveHeatExchange } from '../evaluation/heat-exchange';
export type { HeatExchange } from '../evaluation/heat-exchange';
export {
  GAS_MOLAR_VOLUME_L_PER_MOL,
  buildLinearModel,
  concentrationOf,
  ingredientCoefficients,
  isWater,
  objectiveValue,
  parseIngredient,
  rowValue,
  rowViolation,
  thermalContext,
  usefulHeatJPerG,
} from './linear-model';
export type {
  ConcentrationEstimate,
  IngredientCoefficients,
  LinearConstraint,
  LinearModel,
  LinearObjective,
  ParsedIngredient,
  ThermalContext,
} from './linear-model';
export { BINDING_TOLERANCE, bindingConstraints, solveLp, solveSet, toLpProblem } from './solve-set';
export type { LpCounter, LpProblem, LpRow, LpSolution, LpStatus, SetSolution } from './solve-set';
export { saturationEstimate, solveSetIterated } from './iterate-enthalpy';
export type { EnthalpyIterationOptions, IteratedSet } from './iterate-enthalpy';
export { diagnoseInfeasible } from './diagnose-infeasible';
export { VERIFY_TOLERANCE_K, VERIFY_TOLERANCE_MIN, holdBand, verificationHorizonMin, verifyComposition } from '../evaluation/verify';
export type { VerifyOptions } from '../evaluation/verify';
export { TIE_TOLERANCE, orderByObjective, paretoFlags, rankCandidates } from './rank';
export type { RankItem } from './rank';
export { sensitivityOf } from './sensitivity';
export { sweepTarget } from './sweep';
export type { SweepOptions, SweepPoint, SweepResult } from './sweep';
export { runOptimisation, uselessReason } from './run-optimisation';
export type { RunOptimisationInput, RunOptimisationOptions, RunOptimisationOutput } from './run-optimisation';
