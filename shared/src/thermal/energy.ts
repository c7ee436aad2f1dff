import { REFERENCE_TEMP_C } from './constants';
import type { HeatCapacityParts, PackModel, ProcessRef } from './pack-model';

export interface ProcessHeat extends ProcessRef {
  /** Heat released by the process, J (negative: absorbed), at the 25 °C reference. */
  heatReleasedJ: number;
}

export interface SensibleHeat {
  part: keyof HeatCapacityParts;
  /** Heat stored as sensible heat of the part, J: C_part(end)·(T_end − T_start). */
  heatStoredJ: number;
}

/**
 * Where the heat went between two states of the pack.
 *
 * released = stored + lost, with
 *   released = −Σ_i [H_i(x_end) − H_i(x_start)]  (process enthalpies at 25 °C),
 *   stored   = Σ_parts C_part(x_end)·(T_end − T_start) + heatCapacityChangeJ,
 *   heatCapacityChangeJ = [C(x_end) − C(x_start)]·(T_start − 25 °C)  (Kirchhoff term: the
 *     processes happen at T_start, not at the 25 °C of the data),
 *   lost     = heat given to the surroundings.
 * `balanceErrorJ` = released − stored − lost is zero for an exact solution.
 */
export interface EnergyBreakdown {
  processes: ProcessHeat[];
  sensible: SensibleHeat[];
  heatCapacityChangeJ: number;
  heatReleasedJ: number;
  heatStoredJ: number;
  heatLostJ: number;
  balanceErrorJ: number;
  /** |balanceErrorJ| divided by the largest of |released|, |stored|, |lost| and 1 mJ (a floor for empty packs). */
  relativeBalanceError: number;
}

export function energyBreakdown(
  model: PackModel,
  start: { tempC: number; x: readonly number[] },
  end: { tempC: number; x: readonly number[] },
  heatLostJ: number,
): EnergyBreakdown {
  const chem0 = new Array<number>(model.size).fill(0);
  const chem1 = new Array<number>(model.size).fill(0);
  const e0 = model.evaluate(start.x, chem0);
  const e1 = model.evaluate(end.x, chem1);
  const processes: ProcessHeat[] = model.processes.map((p, i) => ({
    ...p,
    heatReleasedJ: -(chem1[i]! - chem0[i]!),
  }));
  const dT = end.tempC - start.tempC;
  const sensible: SensibleHeat[] = (Object.keys(e1.parts) as (keyof HeatCapacityParts)[])
    .map((part) => ({ part, heatStoredJ: e1.parts[part] * dT }))
    .filter((s) => s.heatStoredJ !== 0 || e1.parts[s.part] !== 0);
  const heatCapacityChangeJ = (e1.cJPerK - e0.cJPerK) * (start.tempC - REFERENCE_TEMP_C);
  const released = processes.reduce((a, p) => a + p.heatReleasedJ, 0);
  const stored = sensible.reduce((a, s) => a + s.heatStoredJ, 0) + heatCapacityChangeJ;
  const balance = released - stored - heatLostJ;
  const scale = Math.max(Math.abs(released), Math.abs(stored), Math.abs(heatLostJ), 1e-3);
  return {
    processes,
    sensible,
    heatCapacityChangeJ,
    heatReleasedJ: released,
    heatStoredJ: stored,
    heatLostJ,
    balanceErrorJ: balance,
    relativeBalanceError: Math.abs(balance) / scale,
  };
}
