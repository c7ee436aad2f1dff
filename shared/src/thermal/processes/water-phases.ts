import {
  BOILING_TIME_CONSTANT_S,
  ICE_CP_J_PER_GK,
  ICE_FUSION_J_PER_G,
  ICE_RATE_PER_MIN,
  REFERENCE_TEMP_C,
  WATER_BOILING_POINT_C,
  WATER_CP_J_PER_GK,
  WATER_VAPORISATION_J_PER_G,
} from '../constants';
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
 *
 * Boiling: a second extent, the steam that has left the pack (g). At 1 atm liquid water boils
 * at T_b = 100 °C (constants.ts); the steam leaves carrying its enthalpy relative to liquid at
 * 25 °C, L₂₅ = L_vap(100 °C) + c_water·(100 − 25) K (2256.4 J/g, IAPWS-95), and its liquid's heat
 * capacity leaves with it. Above T_b the steam is boiled off at C·(T − T_b)/(τ·L_vap), so the
 * temperature is held at the boiling point while liquid water is left.
 */

const L_ICE_REF_J_PER_G = ICE_FUSION_J_PER_G + (WATER_CP_J_PER_GK - ICE_CP_J_PER_GK) * (REFERENCE_TEMP_C - 0);
const L_STEAM_REF_J_PER_G = WATER_VAPORISATION_J_PER_G + WATER_CP_J_PER_GK * (WATER_BOILING_POINT_C - REFERENCE_TEMP_C);
/** Liquid water, g, below which boiling slows to a stop (smooth switch). Assumption. */
const BOIL_WATER_SCALE_G = 0.01;

export class WaterPhases {
  offset = 0;
  readonly size = 2;
  /** Ice charged into the pack, g. */
  chargedIceG = 0;

  constructor(private readonly dissolution: DissolutionProcesses) {}

  /** Ice as an ingredient (`H2O(cr)`). */
  addIce(massG: number): void {
    this.chargedIceG += massG;
  }

  refs(): ProcessRef[] {
    return [
      { label: 'water', kind: 'freezing' },
      { label: 'water', kind: 'boiling' },
    ];
  }

  scales(waterBaseG: number): number[] {
    const w = Math.max(waterBaseG + this.chargedIceG, 1e-3);
    return [w, w];
  }

  /** Steam boiled off and gone, g. */
  steamLostG(x: readonly number[]): number {
    return x[this.offset + 1]!;
  }

  /** At equilibrium above the boiling point every gram of liquid water has boiled off. */
  boilAll(x: number[], liquidG: number): void {
    x[this.offset + 1] = Math.max(0, liquidG);
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
    const hSteam = this.steamLostG(x) * L_STEAM_REF_J_PER_G;
    if (chemOut) {
      chemOut[this.offset] = h;
      chemOut[this.offset + 1] = hSteam;
    }
    parts.ice += this.iceG(x) * ICE_CP_J_PER_GK;
    return h + hSteam;
  }

  mass(x: readonly number[], inv: MassInventory): void {
    inv.iceG += this.iceG(x);
    inv.steamLostG += this.steamLostG(x);
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

  /**
   * Ice relaxes to the ice mass at which the current solution freezes at T; above the boiling
   * point liquid water boils off (`heatCapacityJPerK` = the pack's C(x), needed only then).
   */
  rates(tempC: number, x: readonly number[], liquidG: number, out: number[], heatCapacityJPerK: () => number): void {
    const over = tempC - WATER_BOILING_POINT_C;
    const wet = Math.max(0, liquidG) / (Math.max(0, liquidG) + BOIL_WATER_SCALE_G);
    out[this.offset + 1] = over > 0 && wet > 0 ? (heatCapacityJPerK() * over * wet) / (BOILING_TIME_CONSTANT_S * WATER_VAPORISATION_J_PER_G) : 0;
    const d = this.dissolution;
    const ice = this.iceG(x);
    const allWater = liquidG + ice;
    let iceEq = 0;
    const xs = d.dissolvedMols(x);
    const dissolved = xs.reduce((a, b) => a + b, 0);
    if (dissolved <= 1e-12) {
      // Pure water: ice and water coexist at 0 °C. The heat that would move T off 0 °C goes into
      // melting or freezing with time constant τ (as boiling), at most k·(ice or liquid): no stiff
      // relaxation towards an equilibrium that jumps at 0 °C.
      const k = ICE_RATE_PER_MIN / 60;
      let r = 0;
      if (tempC > 0 && ice > 0) r = -Math.min(k * ice, (heatCapacityJPerK() * tempC) / (BOILING_TIME_CONSTANT_S * ICE_FUSION_J_PER_G));
      else if (tempC < 0 && liquidG > 0) r = Math.min(k * liquidG, (heatCapacityJPerK() * -tempC) / (BOILING_TIME_CONSTANT_S * ICE_FUSION_J_PER_G));
      // Salt on ice: the liquid film at the ice's surface starts the freezing mixture (a seed of
      // 0.1 % of the ice rate; assumption); once salt is dissolved the branch below takes over.
      if (ice > 0 && r <= 0 && d.solutes.some((_, j) => d.undissolvedMol(x, j) > 0)) r = Math.min(r, -1e-3 * k * ice);
      out[this.offset] = r;
      return;
    }
    if (tempC < 0 && allWater > 0) {
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
    out[this.offset] = (ICE_RATE_PER_MIN / 60) * (iceEq - ice);
  }
}
