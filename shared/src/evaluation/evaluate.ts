import type { ChemistryLibrary } from '../chemistry/types';
import {
  NOMINAL_PARAMETERS,
  scaledEnthalpyPort,
  soluteKeyOf,
  withRateConstant,
  type ModelCalibrations,
  type ModelParameters,
} from '../calibration/calibrations';
import type { ContactCase as BriefContactCase, Load, LoadInput } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import { contactUA, type ContactCase as ThermalContact } from '../thermal/contact';
import { solveModelEndState, type EndStateResult } from '../thermal/end-state';
import { PackModel } from '../thermal/pack-model';
import { ingredientProcessSchema, type IngredientProcessInput } from '../thermal/process';
import { simulateModel, type CurvePoint, type TargetBand, type TimeProfileResult } from '../thermal/time-profile';
import { portOf } from './chemistry-cache';
import { componentsOf, processOfLine, type EvaluationLine } from './components';
import { lumpedLoad } from './load';

/**
 * How the pack exchanges heat: a UA given directly (with the ambient temperature), or a contact
 * case of the thermal model (thermal/contact.ts) over the pack's geometry.
 */
export type Exchange = { uaWPerK: number } | { contact: ThermalContact };

/** Where and how long a pack runs: a brief's conditions, a lab test's, or the bench's. */
export interface EvaluationConditions {
  initialTempC: number;
  ambientC: number;
  exchange: Exchange;
  /**
   * The brief's contact case the exchange came from: its lab calibration (a UA multiplier) then
   * applies. Absent for a UA given directly or a contact the bench specified in full.
   */
  calibratedContact?: BriefContactCase;
  /** Heat capacity of pouch and anything not listed as a line, J/K. */
  packHeatCapacityJPerK: number;
  /** Pack surface area, m² (O2 film area of air oxidation; the contact's area when it gives none). */
  packAreaM2?: number | null;
  horizonMin: number;
  targetTempC?: number;
  targetBand?: TargetBand;
  /** What the pack heats or cools (load.ts); the target and band then apply to it. */
  load?: Load | LoadInput | null;
}

export interface EvaluationInput {
  lines: readonly EvaluationLine[];
  conditions: EvaluationConditions;
  /** A library (its model comes from the one cache, chemistry-cache.ts) or a ready port. */
  chemistry: ChemistryLibrary | ChemistryPort;
  /** Applied lab calibrations: UA per contact case, rate constant and enthalpy factor per ingredient id. */
  calibrations?: ModelCalibrations | null;
  /** Multipliers on top (a lab-log fit, a Monte Carlo sample); default nominal. */
  parameters?: ModelParameters;
  options?: {
    /** Relative tolerance of the integrator (default the time model's, 1e-6). */
    rtol?: number;
    curveStepMin?: number;
    /** Also solve the adiabatic end state (default false). */
    endState?: boolean;
  };
}

/** The temperatures a brief is judged by. */
export interface EvaluationFigures {
  /** The pack's curve. */
  curve: CurvePoint[];
  endTempC: number;
  /** Coldest and warmest the pack's surface gets, °C (surface limits and hazard notes). */
  minTempC: number;
  maxTempC: number;
  /** When the target is reached and how long the band is held: the load's when there is one, else the pack's. */
  timeToTargetMin: number | null;
  minutesInBand: number | null;
  /** The load's temperatures, when there is a load. */
  load: { curve: CurvePoint[]; endTempC: number; minTempC: number; maxTempC: number; heatFromPackJ: number } | null;
}

export interface Evaluation {
  profile: TimeProfileResult;
  model: PackModel;
  figures: EvaluationFigures;
  exchange: { uaWPerK: number; envTempC: number; areaM2: number | null };
  /** Σ line masses, g. */
  massG: number;
  endState: EndStateResult | null;
  /** The port the model ran on (calibrated enthalpies applied). */
  port: ChemistryPort;
}

/** A process's rate constant with the schema's default applied, 1/min (null for inert parts). */
export function rateConstantOf(process: IngredientProcessInput): number | null {
  const parsed = ingredientProcessSchema.parse(process);
  return parsed.kind === 'inert' ? null : parsed.rateConstantPerMin;
}

/**
 * The heat exchange of some conditions: UA, W/K, and the temperature exchanged with, °C. A UA
 * given directly exchanges with the ambient; a contact case is the thermal model's
 * (thermal/contact.ts), its area from the geometry or the fill mass; a calibration of the brief's
 * contact case multiplies the modelled UA (calibration/calibrations.ts).
 */
export function exchangeOf(
  c: EvaluationConditions,
  massG: number,
  calibrations?: ModelCalibrations | null,
): { uaWPerK: number; envTempC: number; areaM2: number | null } {
  if ('uaWPerK' in c.exchange) return { uaWPerK: c.exchange.uaWPerK, envTempC: c.ambientC, areaM2: c.packAreaM2 ?? null };
  const r = contactUA(c.exchange.contact, c.ambientC, massG);
  const k = c.calibratedContact ? (calibrations?.contacts?.[c.calibratedContact]?.uaMultiplier ?? 1) : 1;
  return { uaWPerK: r.uaWPerK * k, envTempC: r.envTempC, areaM2: r.areaM2 };
}

/**
 * THE path from (conditions, lines, chemistry, calibrations, parameters) to a model run
 * (DEVELOPERS.md, "The evaluation core"):
 * 1. each line's process (components.ts), with its calibrated rate constant, × the rate multiplier;
 * 2. the chemistry model of the library from the one cache, its enthalpies of solution scaled by
 *    each solute's calibrated factor × the enthalpy factor;
 * 3. the pack model (thermal/pack-model.ts) with the packaging's heat capacity × the heat-capacity factor;
 * 4. the heat exchange ({@link exchangeOf}) × the UA multiplier;
 * 5. the load, when there is one, as a second lumped node (load.ts) whose temperature the target
 *    and band are judged on;
 * 6. the lumped-capacitance time profile (thermal/time-profile.ts) over the horizon, and on request
 *    the adiabatic end state (thermal/end-state.ts).
 * Throws ThermalModelError when the model cannot run the input.
 *
 * @example evaluate({ lines, conditions: conditionsFromBrief(brief), chemistry: lib, calibrations }).figures.timeToTargetMin
 */
export function evaluate(input: EvaluationInput): Evaluation {
  const p = input.parameters ?? NOMINAL_PARAMETERS;
  const cal = input.calibrations ?? null;
  const factors = new Map<string, number>();
  const lines = input.lines.map((l) => {
    let process = processOfLine(l);
    const c = cal?.ingredients?.[l.id];
    if (c?.rateConstantPerMin !== undefined) process = withRateConstant(process, c.rateConstantPerMin);
    const key = soluteKeyOf(process);
    if (key) {
      const f = (c?.enthalpyFactor ?? 1) * p.enthalpyFactor;
      if (f !== 1) factors.set(key, f);
    }
    if (p.rateMultiplier !== 1 && process.kind !== 'inert') {
      const k0 = rateConstantOf(process);
      if (k0 !== null) process = withRateConstant(process, k0 * p.rateMultiplier);
    }
    return { ...l, process };
  });
  const components = componentsOf(lines);
  const massG = components.reduce((a, c) => a + c.massG, 0);
  const port = scaledEnthalpyPort(portOf(input.chemistry), factors);
  const c = input.conditions;
  const ex = exchangeOf(c, massG, cal);
  const areaM2 = c.packAreaM2 ?? ex.areaM2;
  const model = new PackModel(port, components, {
    packHeatCapacityJPerK: c.packHeatCapacityJPerK,
    ...(areaM2 !== null ? { packAreaM2: areaM2 } : {}),
    ...(p.heatCapacityFactor !== 1 ? { heatCapacityFactor: p.heatCapacityFactor } : {}),
  });
  const uaWPerK = ex.uaWPerK * p.uaMultiplier;
  const o = input.options ?? {};
  const profile = simulateModel(model, {
    initialTempC: c.initialTempC,
    envTempC: ex.envTempC,
    uaWPerK,
    holdMin: c.horizonMin,
    ...(c.targetTempC !== undefined ? { targetTempC: c.targetTempC } : {}),
    ...(c.targetBand ? { targetBand: c.targetBand } : {}),
    ...(o.curveStepMin !== undefined ? { curveStepMin: o.curveStepMin } : {}),
    ...(o.rtol !== undefined ? { rtol: o.rtol } : {}),
    ...(c.load ? { load: lumpedLoad(c.load, c.ambientC) } : {}),
  });
  const l = profile.load;
  const figures: EvaluationFigures = {
    curve: profile.curve,
    endTempC: profile.endTempC,
    minTempC: profile.minTempC,
    maxTempC: profile.maxTempC,
    timeToTargetMin: l ? l.timeToTargetMin : profile.timeToTargetMin,
    minutesInBand: l ? l.minutesInBand : profile.minutesInBand,
    load: l ? { curve: l.curve, endTempC: l.endTempC, minTempC: l.minTempC, maxTempC: l.maxTempC, heatFromPackJ: l.heatFromPackJ } : null,
  };
  return {
    profile,
    model,
    figures,
    exchange: { uaWPerK, envTempC: ex.envTempC, areaM2: ex.areaM2 },
    massG,
    // Outside −80…400 °C the end state is reported at the limit with a warning that says so (thermal/end-state.ts).
    endState: o.endState ? solveModelEndState(model, c.initialTempC, 0, { outOfRange: 'limit' }) : null,
    port,
  };
}
