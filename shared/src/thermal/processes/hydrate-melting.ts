import { DEFAULT_CRYSTALLISATION_DRIVING_K, DEFAULT_CRYSTALLISATION_RATE_PER_MIN, REFERENCE_TEMP_C } from '../constants';
import type { CrystallisationProcess } from '../process';
import type { HeatCapacityParts, MassInventory, ProcessRef } from './common';
import type { DissolutionProcesses } from './dissolution';
import { meltingHydrate, type MeltingHydrate } from './hydrates';

/**
 * Melts and their crystals (DESIGN.md §4.2). A supercooled melt (sodium acetate trihydrate)
 * charged liquid crystallises below its melting point: one extent per melt, the crystallised
 * fraction f. Its enthalpy at 25 °C is −f·m·L₂₅ with L₂₅ = L(T_m) − (c_l − c_s)(T_m − 25 °C)
 * (Kirchhoff's law); the growth rate is driven by the undercooling, a plateau at T_m.
 */

export interface CrystalModel {
  label: string;
  massG: number;
  meltingPointC: number;
  latentRefJPerG: number;
  liquidCp: number;
  solidCp: number;
  kPerS: number;
  drivingK: number;
}

export class MeltProcesses {
  readonly crystals: CrystalModel[] = [];
  offset = 0;

  get size(): number {
    return this.crystals.length;
  }

  refs(): ProcessRef[] {
    return this.crystals.map((c) => ({ label: c.label, kind: 'crystallisation' as const }));
  }

  scales(): number[] {
    return this.crystals.map(() => 1);
  }

  add(process: CrystallisationProcess, massG: number, label: string): void {
    const latentRef =
      process.latentHeat_J_per_g - (process.liquidCp_J_per_gK - process.solidCp_J_per_gK) * (process.meltingPointC - REFERENCE_TEMP_C);
    this.crystals.push({
      label,
      massG,
      meltingPointC: process.meltingPointC,
      latentRefJPerG: latentRef,
      liquidCp: process.liquidCp_J_per_gK,
      solidCp: process.solidCp_J_per_gK,
      kPerS: process.rateConstantPerMin / 60,
      drivingK: process.drivingRangeK,
    });
  }

  evaluate(x: readonly number[], parts: HeatCapacityParts, chemOut?: number[]): number {
    let chem = 0;
    for (let c = 0; c < this.crystals.length; c++) {
      const m = this.crystals[c]!;
      const f = x[this.offset + c]!;
      const h = -f * m.massG * m.latentRefJPerG;
      chem += h;
      if (chemOut) chemOut[this.offset + c] = h;
      parts.melt += m.massG * (f * m.solidCp + (1 - f) * m.liquidCp);
    }
    return chem;
  }

  mass(inv: MassInventory): void {
    for (const m of this.crystals) inv.meltG += m.massG;
  }

  /** At equilibrium a melt is crystallised below its melting point. */
  equilibrium(tempC: number, x: number[]): void {
    for (let c = 0; c < this.crystals.length; c++) x[this.offset + c] = tempC < this.crystals[c]!.meltingPointC ? 1 : 0;
  }

  rates(tempC: number, x: readonly number[], out: number[]): void {
    for (let c = 0; c < this.crystals.length; c++) {
      const m = this.crystals[c]!;
      const f = x[this.offset + c]!;
      const drive = Math.min(1, Math.max(0, (m.meltingPointC - tempC) / m.drivingK));
      out[this.offset + c] = m.kPerS * Math.max(0, 1 - f) * drive;
    }
  }
}

/**
 * Salt hydrates charged solid that melt at their melting point (phase-change packs): one
 * extent per such dissolving solid, the molten fraction φ of its undissolved part U (g; the
 * dissolution module owns how much is dissolved, and a hydrate cannot dissolve in its own
 * crystal water). Enthalpy at 25 °C: +φ·U·L₂₅, L₂₅ = L(T_m) − (c_l − c_s)(T_m − 25 °C)
 * (Kirchhoff's law), heat capacity U·(φ·c_l + (1 − φ)·c_s); data in hydrates.ts. Melting and
 * freezing run at k·min(1, |T − T_m|/ΔT) (k, ΔT as for crystallisation, constants.ts), so the
 * temperature holds at T_m while heat flows (a plateau). Freezing back is taken without
 * supercooling (assumption; the supercooled-melt process above models a triggered melt).
 */
export interface HydrateMeltModel {
  label: string;
  /** Index of the dissolving solid in the dissolution module. */
  solute: number;
  data: MeltingHydrate;
  solidMolarMass: number;
  latentRefJPerG: number;
  kPerS: number;
  drivingK: number;
}

export class HydrateMelts {
  readonly melts: HydrateMeltModel[] = [];
  offset = 0;

  constructor(private readonly dissolution: DissolutionProcesses) {}

  /** Attach a melt extent to every dissolving solid that is a melting hydrate. */
  finish(): void {
    this.dissolution.solutes.forEach((s, j) => {
      const data = meltingHydrate(s.solidKey);
      if (!data) return;
      this.melts.push({
        label: `${s.label} (melting)`,
        solute: j,
        data,
        solidMolarMass: s.solidMolarMass,
        latentRefJPerG: data.latentHeatJPerG - (data.liquidCpJPerGK - s.solidCpJPerGK) * (data.meltingPointC - REFERENCE_TEMP_C),
        kPerS: DEFAULT_CRYSTALLISATION_RATE_PER_MIN / 60,
        drivingK: DEFAULT_CRYSTALLISATION_DRIVING_K,
      });
    });
  }

  get size(): number {
    return this.melts.length;
  }

  refs(): ProcessRef[] {
    return this.melts.map((m) => ({ label: m.label, kind: 'hydrate-melting' as const }));
  }

  scales(): number[] {
    return this.melts.map(() => 1);
  }

  private undissolvedG(x: readonly number[], m: HydrateMeltModel): number {
    return Math.max(0, this.dissolution.undissolvedMol(x, m.solute)) * m.solidMolarMass;
  }

  evaluate(x: readonly number[], parts: HeatCapacityParts, chemOut?: number[]): number {
    let chem = 0;
    for (let i = 0; i < this.melts.length; i++) {
      const m = this.melts[i]!;
      const phi = x[this.offset + i]!;
      const u = this.undissolvedG(x, m);
      const h = phi * u * m.latentRefJPerG;
      chem += h;
      if (chemOut) chemOut[this.offset + i] = h;
      const cs = this.dissolution.solutes[m.solute]!.solidCpJPerGK;
      parts.undissolvedSolids -= phi * u * cs;
      parts.melt += phi * u * m.data.liquidCpJPerGK;
    }
    return chem;
  }

  mass(x: readonly number[], inv: MassInventory): void {
    for (let i = 0; i < this.melts.length; i++) {
      const m = this.melts[i]!;
      const g = x[this.offset + i]! * this.undissolvedG(x, m);
      inv.undissolvedG -= g;
      inv.meltG += g;
    }
  }

  /** Molten above the melting point, solid below. */
  equilibrium(tempC: number, x: number[]): void {
    for (let i = 0; i < this.melts.length; i++) x[this.offset + i] = tempC >= this.melts[i]!.data.meltingPointC ? 1 : 0;
  }

  rates(tempC: number, x: readonly number[], out: number[]): void {
    for (let i = 0; i < this.melts.length; i++) {
      const m = this.melts[i]!;
      const phi = x[this.offset + i]!;
      const drive = Math.max(-1, Math.min(1, (tempC - m.data.meltingPointC) / m.drivingK));
      out[this.offset + i] = drive >= 0 ? m.kPerS * Math.max(0, 1 - phi) * drive : m.kPerS * Math.max(0, phi) * drive;
    }
  }
}
