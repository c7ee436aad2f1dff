import type { ComputationWarning } from '../chemistry/types';
import type { ChemistryPort } from './chemistry-port';
import { energyBreakdown, type EnergyBreakdown } from './energy';
import { WATER_BOILING_POINT_C } from './constants';
import { ThermalModelError } from './errors';
import { PackModel, type MassInventory, type ThermalComponent } from './pack-model';
import { brentRoot } from './root';

export interface EndStateInput {
  components: ThermalComponent[];
  initialTempC: number;
  /** Heat given to the surroundings between start and end, J (0: adiabatic). */
  heatLostJ?: number;
  /** Heat capacity of pouch, inner bag and anything else not listed as a component, J/K. */
  packHeatCapacityJPerK?: number;
}

export type DissolutionLimit = 'none' | 'solubility' | 'ice';

export interface SoluteEndState {
  label: string;
  soluteKey: string;
  dissolvedFraction: number;
  /** What stopped the solute dissolving completely: nothing, its solubility, or water frozen out as ice. */
  limitedBy: DissolutionLimit;
}

export interface EndStateResult {
  endTempC: number;
  solutes: SoluteEndState[];
  iceG: number;
  /** Water boiled off as steam that left the pack, g (a scald hazard; hazard input). */
  steamLostG: number;
  /** True when the end state sits on a plateau where two phases coexist (eutectic, 0 °C, melting point). */
  onPlateau: boolean;
  energy: EnergyBreakdown;
  massInventory: MassInventory;
  massG: number;
  warnings: ComputationWarning[];
  /** Equilibrium extents at the end (internal layout of PackModel). */
  extents: number[];
}

/** Search range of the end temperature, °C. Beyond it the model's data do not reach anyway. */
export const END_STATE_MIN_TEMP_C = -80;
export const END_STATE_MAX_TEMP_C = 400;

/**
 * Temperature at which the pack's enthalpy balance closes once every process has reached its
 * equilibrium extent:
 *
 *   H(T, x_eq(T)) = H(T₀, x₀) − Q_lost
 *
 * with H the pack's enthalpy (PackModel), x_eq(T) the equilibrium extents at T (solubility
 * at T, ice below the solution's freezing point, no liquid below the eutectic), T₀ the
 * initial temperature and x₀ the charged state. The root is bracketed by stepping outwards
 * from T₀ in the direction the balance points (1, 2, 4 … K), then found by Brent's method.
 * Where H jumps (a plateau: eutectic, ice at 0 °C, a melting point) the bracket closes on
 * the jump and the end state is the mixture of the two coexisting states that closes the
 * balance exactly.
 *
 * Example: 40 g NH4NO3 in 100 g water from 25 °C → about 2 °C (ΔsolH ≈ +21 kJ/mol at this
 * concentration).
 */
export function solveEndState(port: ChemistryPort, input: EndStateInput): EndStateResult {
  const t0 = input.initialTempC;
  if (!Number.isFinite(t0) || t0 < END_STATE_MIN_TEMP_C || t0 > END_STATE_MAX_TEMP_C) {
    throw new ThermalModelError(
      `expected initialTempC between ${END_STATE_MIN_TEMP_C} and ${END_STATE_MAX_TEMP_C} °C, found ${t0}`,
      { field: 'initialTempC' },
    );
  }
  const lost = input.heatLostJ ?? 0;
  if (!Number.isFinite(lost)) throw new ThermalModelError(`expected a finite heatLostJ, found ${lost}`, { field: 'heatLostJ' });
  const model = new PackModel(port, input.components, { packHeatCapacityJPerK: input.packHeatCapacityJPerK ?? 0 });
  return solveModelEndState(model, t0, lost);
}

/** The end state of an already built PackModel (used by the time profile to compare). */
/**
 * `outOfRange`: what to do when the balance does not close within −80…400 °C — `throw` a
 * ThermalModelError (default), or `limit`: report the limit with the warning
 * `thermal.end-state-out-of-range` (for callers whose response must carry a number; the
 * warning must then be shown beside it).
 */
export function solveModelEndState(model: PackModel, t0: number, heatLostJ: number, options: { outOfRange?: 'throw' | 'limit' } = {}): EndStateResult {
  const x0 = model.initialExtents();
  const target = model.enthalpyJ(t0, x0) - heatLostJ;
  const g = (t: number) => model.enthalpyJ(t, model.equilibriumExtents(t)) - target;
  const g0 = g(t0);
  let lo = t0;
  let hi = t0;
  let gLo = g0;
  let gHi = g0;
  let clamped: 'low' | 'high' | null = null;
  if (g0 > 0) {
    // Too much enthalpy at T0 once the processes have run (endothermic): the end lies below.
    let step = 1;
    for (;;) {
      const t = Math.max(END_STATE_MIN_TEMP_C, t0 - step);
      const gt = g(t);
      hi = lo;
      gHi = gLo;
      lo = t;
      gLo = gt;
      if (gt <= 0) break;
      if (t === END_STATE_MIN_TEMP_C) {
        clamped = 'low';
        break;
      }
      step *= 2;
    }
  } else if (g0 < 0) {
    let step = 1;
    for (;;) {
      const t = Math.min(END_STATE_MAX_TEMP_C, t0 + step);
      const gt = g(t);
      lo = hi;
      gLo = gHi;
      hi = t;
      gHi = gt;
      if (gt >= 0) break;
      if (t === END_STATE_MAX_TEMP_C) {
        clamped = 'high';
        break;
      }
      step *= 2;
    }
  }
  let tempC: number;
  let x: number[];
  let onPlateau = false;
  if (g0 === 0) {
    tempC = t0;
    x = model.equilibriumExtents(t0);
  } else if (clamped) {
    if ((options.outOfRange ?? 'throw') === 'throw') {
      throw new ThermalModelError(
        `the pack's enthalpy balance does not close between ${END_STATE_MIN_TEMP_C} and ${END_STATE_MAX_TEMP_C} °C, the range where the model's data hold: its end state would lie ${clamped === 'low' ? 'below' : 'above'} it (for a warmer: more heat than the pack can hold without losses; give the heat exchanged or a contact case)`,
        { field: 'components' },
      );
    }
    tempC = clamped === 'low' ? END_STATE_MIN_TEMP_C : END_STATE_MAX_TEMP_C;
    x = model.equilibriumExtents(tempC);
    model.warnings.add({
      code: 'thermal.end-state-out-of-range',
      message: `the enthalpy balance does not close between ${END_STATE_MIN_TEMP_C} and ${END_STATE_MAX_TEMP_C} °C; the end temperature is reported at the ${clamped === 'low' ? 'lower' : 'upper'} limit`,
    });
  } else {
    const root = brentRoot(g, lo, hi, { fa: gLo, fb: gHi, xTol: 1e-9 });
    if (root.fLo === 0 || root.fHi === 0 || root.lo === root.hi) {
      tempC = root.x;
      x = model.equilibriumExtents(tempC);
    } else {
      // Mix the two states either side of the final bracket so the balance closes exactly.
      const xLo = model.equilibriumExtents(root.lo);
      const xHi = model.equilibriumExtents(root.hi);
      const lambda = root.fLo / (root.fLo - root.fHi);
      tempC = root.lo + lambda * (root.hi - root.lo);
      x = xLo.map((v, i) => v + lambda * (xHi[i]! - v));
      const scale = Math.max(1, Math.abs(target));
      onPlateau = Math.min(Math.abs(root.fLo), Math.abs(root.fHi)) > 1e-6 * scale;
    }
  }
  return describeEndState(model, t0, x0, tempC, x, heatLostJ, onPlateau);
}

export function describeEndState(
  model: PackModel,
  t0: number,
  x0: readonly number[],
  tempC: number,
  x: number[],
  heatLostJ: number,
  onPlateau: boolean,
): EndStateResult {
  const ice = model.iceG(x);
  const steam = model.steamLostG(x);
  noteBoiling(model, steam, tempC);
  const solutes: SoluteEndState[] = model.solutes.map((s, j) => {
    const fraction = model.dissolvedFraction(j, x);
    const limitedBy: DissolutionLimit = fraction >= 1 - 1e-9 ? 'none' : ice > 1e-9 ? 'ice' : 'solubility';
    return { label: s.label, soluteKey: s.soluteKey, dissolvedFraction: fraction, limitedBy };
  });
  return {
    endTempC: tempC,
    solutes,
    iceG: ice,
    steamLostG: steam,
    onPlateau,
    energy: energyBreakdown(model, { tempC: t0, x: x0 }, { tempC, x }, heatLostJ),
    massInventory: model.massInventory(x),
    massG: model.totalMassG,
    warnings: model.warnings.list(),
    extents: x,
  };
}

/** Warnings for steam lost and for a dry pack above the boiling point (shared with the time profile). */
export function noteBoiling(model: PackModel, steamLostG: number, maxTempC: number): void {
  if (steamLostG > 0.01) {
    model.warnings.add({
      code: 'thermal.steam-lost',
      message: `water boils at ${WATER_BOILING_POINT_C} °C (1 atm): ${steamLostG.toFixed(1)} g leaves the pack as steam — a scald hazard; the pouch must vent it (follow the SDS, local codes and licensed practice)`,
    });
  }
  if (maxTempC > WATER_BOILING_POINT_C + 1) {
    model.warnings.add({
      code: 'thermal.above-boiling',
      message: `the pack reaches ${maxTempC.toFixed(0)} °C with no liquid water left (boiled off or consumed): a burn and fire hazard`,
    });
  }
}
