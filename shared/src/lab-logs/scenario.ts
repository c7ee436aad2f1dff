import { NOMINAL_PARAMETERS, type ModelCalibrations, type ModelParameters } from '../calibration/calibrations';
import { evaluate, rateConstantOf, type EvaluationConditions } from '../evaluation/evaluate';
import { resolveHeatExchange, thermalContactCase } from '../evaluation/heat-exchange';
import type { ContactCase as BriefContactCase, Load } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { ThermalComponent } from '../thermal/pack-model';
import type { TargetBand, TimeProfileResult } from '../thermal/time-profile';

/**
 * What the time model needs to predict one recorded test: the mixture, where it started, what
 * it exchanged heat with (the brief's contact cases over the pack's area, or a UA given
 * directly) and how long to run.
 */
export interface LabScenario {
  components: ThermalComponent[];
  initialTempC: number;
  ambientC: number;
  contact: BriefContactCase;
  packAreaM2: number;
  /** When given, wins over the contact case (with the ambient as exchange temperature). */
  uaWPerK?: number | null;
  packHeatCapacityJPerK: number;
  /** A calibration of the contact case already applied (default 1). */
  uaMultiplier?: number;
  /**
   * Lab calibrations to apply (a candidate's prediction under its run's data): the contact
   * case's UA multiplier, rate constants and enthalpy factors by component key (ingredient id).
   * A recorded test's own scenario carries none: it is what a calibration is fitted to.
   */
  calibrations?: ModelCalibrations | null;
  /** What the pack heats or cools (a brief's load); the target and band then apply to it. */
  load?: Load | null;
  horizonMin: number;
  targetTempC?: number;
  targetBand?: TargetBand;
}

export { NOMINAL_PARAMETERS, type ModelParameters } from '../calibration/calibrations';

/** Nominal UA of a scenario, W/K, and the temperature it exchanges with, °C (evaluation/heat-exchange.ts). */
export function scenarioExchange(s: LabScenario): { uaWPerK: number; envTempC: number } {
  const e = resolveHeatExchange({ uaWPerK: s.uaWPerK ?? null, contact: s.contact, packAreaM2: s.packAreaM2, ambientC: s.ambientC });
  return { uaWPerK: e.uaWPerK * (s.uaMultiplier ?? 1), envTempC: e.envTempC };
}

/** The nominal rate constant of the first process that has one, 1/min (what a fitted rate multiplier multiplies). */
export function nominalRateConstantPerMin(s: LabScenario): number | null {
  for (const c of s.components) {
    const k = rateConstantOf(c.process);
    if (k !== null) return k;
  }
  return null;
}

/** The evaluation core's conditions of a scenario (the UA given directly wins over the contact case). */
export function scenarioConditions(s: LabScenario): EvaluationConditions {
  const direct = s.uaWPerK !== null && s.uaWPerK !== undefined;
  return {
    initialTempC: s.initialTempC,
    ambientC: s.ambientC,
    exchange: direct ? { uaWPerK: s.uaWPerK! } : { contact: { case: thermalContactCase(s.contact), geometry: { areaM2: s.packAreaM2 } } },
    ...(!direct && s.calibrations ? { calibratedContact: s.contact } : {}),
    packHeatCapacityJPerK: s.packHeatCapacityJPerK,
    packAreaM2: s.packAreaM2,
    horizonMin: s.horizonMin,
    ...(s.targetTempC !== undefined ? { targetTempC: s.targetTempC } : {}),
    ...(s.targetBand ? { targetBand: s.targetBand } : {}),
    ...(s.load ? { load: s.load } : {}),
  };
}

/**
 * The time profile of a scenario under parameters p, through the evaluation core
 * (evaluation/evaluate.ts): UA × the scenario's applied calibration × p.ua, each solute's
 * enthalpy of solution × p.enthalpy, each rate constant × p.rate, the heat capacity × p.cp.
 *
 * @example simulateScenario(port, scenario, NOMINAL_PARAMETERS).curve // the nominal prediction
 */
export function simulateScenario(
  port: ChemistryPort,
  s: LabScenario,
  p: ModelParameters = NOMINAL_PARAMETERS,
  options: { rtol?: number; curveStepMin?: number } = {},
): TimeProfileResult {
  return evaluate({
    lines: s.components.map((c, k) => ({ id: c.key ?? c.formula ?? `component ${k + 1}`, name: c.key ?? c.formula ?? `component ${k + 1}`, ...(c.formula ? { formula: c.formula } : {}), massG: c.massG, process: c.process })),
    conditions: scenarioConditions(s),
    chemistry: port,
    calibrations: s.calibrations ?? null,
    parameters: { ...p, uaMultiplier: p.uaMultiplier * (s.uaMultiplier ?? 1) },
    options: { curveStepMin: options.curveStepMin ?? Math.max(0.05, s.horizonMin / 240), rtol: options.rtol ?? 1e-5 },
  }).profile;
}
