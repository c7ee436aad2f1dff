import { resolveHeatExchange } from '../optimiser/heat-exchange';
import type { ContactCase as BriefContactCase } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import { ingredientProcessSchema, type IngredientProcessInput } from '../thermal/process';
import { PackModel, type ThermalComponent } from '../thermal/pack-model';
import { simulateModel, type TargetBand, type TimeProfileResult } from '../thermal/time-profile';
import { scaledEnthalpyPort, soluteKeyOf, withRateConstant } from './calibrations';

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
  horizonMin: number;
  targetTempC?: number;
  targetBand?: TargetBand;
}

/** The model's adjustable parameters: multipliers on the nominal figures (1 = as modelled). */
export interface ModelParameters {
  uaMultiplier: number;
  /** On every dissolving solute's enthalpy of solution. */
  enthalpyFactor: number;
  /** On every process's rate constant. */
  rateMultiplier: number;
  /** On the pack's total heat capacity. */
  heatCapacityFactor: number;
}

export const NOMINAL_PARAMETERS: ModelParameters = { uaMultiplier: 1, enthalpyFactor: 1, rateMultiplier: 1, heatCapacityFactor: 1 };

/** Nominal UA of a scenario, W/K, and the temperature it exchanges with, °C (optimiser/heat-exchange.ts). */
export function scenarioExchange(s: LabScenario): { uaWPerK: number; envTempC: number } {
  const e = resolveHeatExchange({ uaWPerK: s.uaWPerK ?? null, contact: s.contact, packAreaM2: s.packAreaM2, ambientC: s.ambientC });
  return { uaWPerK: e.uaWPerK * (s.uaMultiplier ?? 1), envTempC: e.envTempC };
}

/** The nominal rate constant of the first process that has one, 1/min (what a fitted rate multiplier multiplies). */
export function nominalRateConstantPerMin(s: LabScenario): number | null {
  for (const c of s.components) {
    const k = rateOf(c.process);
    if (k !== null) return k;
  }
  return null;
}

/** A process's rate constant with the schema's default applied, 1/min. */
function rateOf(process: IngredientProcessInput): number | null {
  const parsed = ingredientProcessSchema.parse(process);
  return parsed.kind === 'inert' ? null : parsed.rateConstantPerMin;
}

/**
 * The time profile of a scenario under parameters p: UA × p.ua, each solute's enthalpy of
 * solution × p.enthalpy (through {@link scaledEnthalpyPort}), each rate constant × p.rate, the
 * heat capacity × p.cp (PackModel's heatCapacityFactor); lumped capacitance as in
 * thermal/time-profile.ts.
 *
 * @example simulateScenario(port, scenario, NOMINAL_PARAMETERS).curve // the nominal prediction
 */
export function simulateScenario(
  port: ChemistryPort,
  s: LabScenario,
  p: ModelParameters = NOMINAL_PARAMETERS,
  options: { rtol?: number; curveStepMin?: number } = {},
): TimeProfileResult {
  const exchange = scenarioExchange(s);
  const factors = new Map<string, number>();
  const components = s.components.map((c) => {
    const key = soluteKeyOf(c.process);
    if (key && p.enthalpyFactor !== 1) factors.set(key, p.enthalpyFactor);
    if (p.rateMultiplier === 1 || c.process.kind === 'inert') return c;
    const k0 = rateOf(c.process);
    return k0 === null ? c : { ...c, process: withRateConstant(c.process, k0 * p.rateMultiplier) };
  });
  const model = new PackModel(scaledEnthalpyPort(port, factors), components, {
    packHeatCapacityJPerK: s.packHeatCapacityJPerK,
    packAreaM2: s.packAreaM2,
    heatCapacityFactor: p.heatCapacityFactor,
  });
  return simulateModel(model, {
    initialTempC: s.initialTempC,
    envTempC: exchange.envTempC,
    uaWPerK: exchange.uaWPerK * p.uaMultiplier,
    holdMin: s.horizonMin,
    ...(s.targetTempC !== undefined ? { targetTempC: s.targetTempC } : {}),
    ...(s.targetBand ? { targetBand: s.targetBand } : {}),
    curveStepMin: options.curveStepMin ?? Math.max(0.05, s.horizonMin / 240),
    rtol: options.rtol ?? 1e-5,
  });
}
