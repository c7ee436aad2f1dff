import { INERT_CP_J_PER_GK } from '../constants';
import type { InertProcess } from '../process';
import type { HeatCapacityParts, MassInventory } from './common';

/** Inert parts (additives, packaging): heat capacity only, no extent. Water as solvent is counted by the pack model. */
export interface InertModel {
  label: string;
  massG: number;
  cpJPerGK: number;
}

export class InertParts {
  readonly inerts: InertModel[] = [];

  add(process: InertProcess, massG: number, label: string): void {
    const cp = process.cp_J_per_gK ?? (process.role === 'packaging' ? INERT_CP_J_PER_GK.packaging : INERT_CP_J_PER_GK.additive);
    this.inerts.push({ label, massG, cpJPerGK: cp });
  }

  evaluate(parts: HeatCapacityParts): void {
    for (const m of this.inerts) parts.inert += m.massG * m.cpJPerGK;
  }

  mass(inv: MassInventory): void {
    for (const m of this.inerts) inv.inertG += m.massG;
  }
}
