import { ICE_CP_J_PER_GK, ICE_FUSION_J_PER_G, ICE_RATE_PER_MIN, REFERENCE_TEMP_C, WATER_CP_J_PER_GK } from '../constants';
import { brentRoot } from '../root';
import type { HeatCapacityParts, MassInventory, ProcessRef } from './common';
import type { DissolutionProcesses } from './dissolution';

/**
 * The pack's water as ice: one extent, the ice formed (g) — negative when ice charged into the
 * pack (`H2O(cr)`, ice as an ingredient) has melted. Its enthalpy at 25 °C is −ξ·L₂₅,
 * L₂₅ = L_fus(0 °C) + (c_water − c_ice)·(25 − 0) K (Kirchhoff's law; L_fus = 333.6 J/g, IAPWS /
 * CRC, constants.ts); ice forms where the solution's freezing point (dissolution module) lies
 * above T and melts where it lies below, so ice with a salt melts down towards the eutectic
 * (a freezing mixture).
 */

const L_ICE_REF_J_PER_G = ICE_FUSION_J_PER_G + (WATER_CP_J_PER_GK - ICE_CP_J_PER_GK) * (REFERENCE_TEMP_C - 0);
const ICE_SMOOTHING_K = 0.2;

export class WaterPhases {
  offset = 0;
  readonly size = 1;
  /** Ice charged into the pack, g. */
  chargedIceG = 0;

  constructor(private readonly dissolution: DissolutionProcesses) {}

  /** Ice as an ingredient (`H2O(cr)`). */
  addIce(massG: number): void {
    this.chargedIceG += massG;
  }

  refs(): ProcessRef[] {
    return [{ label: 'water', kind: 'freezing' }];
  }

  scales(waterBaseG: number): number[] {
    return [Math.max(waterBaseG + this.chargedIceG, 1e-3)];
  }

  /** Net water frozen since charging, g (negative: charged ice melted). */
  frozenG(x: readonly number[]): number {
    return x[this.offset]!;
  }

  /** Ice present, g. */
  iceG(x: readonly number[]): number {
    return this.chargedIceG + x[this.offset]!;
  }

  evaluate(x: readonly number[], parts: HeatCapacityParts, chemOut?: number[]): number {
    const h = -x[this.offset]! * L_ICE_REF_J_PER_G;
    if (chemOut) chemOut[this.offset] = h;
    parts.ice += this.iceG(x) * ICE_CP_J_PER_GK;
    return h;
  }

  mass(x: readonly number[], inv: MassInventory): void {
    inv.iceG += this.iceG(x);
  }

  /** Before the equilibrium search: all charged ice taken as melted (the search refreezes what it must). */
  meltAll(x: number[]): void {
    x[this.offset] = -this.chargedIceG;
  }

  /**
   * Equilibrium of the solution with ice at `tempC` (after the no-ice dissolution equilibrium
   * has been set in x): find the liquid water W_l at which the liquid's freezing point equals
   * T, each solute dissolved up to solubility in W_l; below the eutectic no liquid remains.
   * `liquidNoIce` is the liquid water without ice, `waterG` the other water (charged water less
   * what reactions took).
   */
  equilibrium(tempC: number, x: number[], liquidNoIce: number, waterG: number): void {
    const d = this.dissolution;
    const ns = d.size;
    if (tempC >= 0) return;
    const noIceDepression = d.freezingDepressionK(d.dissolvedMols(x), liquidNoIce);
    if (noIceDepression >= -tempC) return;
    const sol = d.solutes.map((_, j) => d.solubilityGPer100g(j, tempC));
    const residual = (wl: number) => d.freezingDepressionK(d.dissolvedInLiquid(sol, wl), wl) + tempC;
    // As W_l → 0 every solute saturates: the depression tends to that of the saturated solution.
    const tiny = Math.max(liquidNoIce * 1e-9, 1e-12);
    const fSat = residual(tiny);
    if (ns === 0 || fSat <= 0) {
      d.setDissolved(x, new Array<number>(ns).fill(0));
      x[this.offset] = Math.max(0, waterG) - this.chargedIceG;
      return;
    }
    const fTop = residual(liquidNoIce);
    if (fTop >= 0) return;
    const root = brentRoot(residual, tiny, liquidNoIce, { fa: fSat, fb: fTop, xTol: 1e-9 * liquidNoIce });
    const wl = root.x;
    const xi = d.dissolvedInLiquid(sol, wl);
    d.setDissolved(x, xi);
    const allWater = waterG + d.waterReleasedG(x);
    x[this.offset] = Math.max(0, allWater - wl) - this.chargedIceG;
  }

  /** Ice relaxes to the ice mass at which the current solution freezes at T. */
  rates(tempC: number, x: readonly number[], liquidG: number, out: number[]): void {
    const d = this.dissolution;
    const ice = this.iceG(x);
    const allWater = liquidG + ice;
    let iceEq = 0;
    if (tempC < 0 && allWater > 0) {
      const xs = d.dissolvedMols(x);
      const dissolved = xs.reduce((a, b) => a + b, 0);
      if (dissolved <= 1e-12) {
        iceEq = allWater * Math.min(1, -tempC / ICE_SMOOTHING_K);
      } else {
        const dtAll = d.freezingDepressionK(xs, allWater);
        if (dtAll < -tempC) {
          const residual = (wl: number) => d.freezingDepressionK(xs, wl) + tempC;
          const lo = allWater * 1e-9;
          const fLo = residual(lo);
          if (fLo <= 0) iceEq = allWater;
          else {
            const root = brentRoot(residual, lo, allWater, { fa: fLo, fb: dtAll + tempC, xTol: 1e-8 * allWater });
            iceEq = allWater - root.x;
          }
        }
      }
    }
    out[this.offset] = (ICE_RATE_PER_MIN / 60) * (iceEq - ice);
  }
}
