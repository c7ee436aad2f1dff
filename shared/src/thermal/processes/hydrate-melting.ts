import { REFERENCE_TEMP_C } from '../constants';
import type { CrystallisationProcess } from '../process';
import type { HeatCapacityParts, MassInventory, ProcessRef } from './common';

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
