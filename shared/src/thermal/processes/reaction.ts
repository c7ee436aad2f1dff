import type { ReactionModel } from '../reaction-partners';
import { WATER_MOLAR_MASS_G_PER_MOL } from '../constants';
import { type HeatCapacityParts, type MassInventory, type ModelContext, type ProcessRef } from './common';

/**
 * Reactions (DEVELOPERS.md, "The product in brief"): one extent per reaction, mol of reaction as
 * written, set up with their partners from the pack's contents (../reaction-partners.ts: ΔrH
 * from the stored value or by Hess's law, the limiting reactant, product phases); `H2O(l)` among
 * the reactants is drawn from the pack's liquid water.
 */

/** The reaction's model as set up with its partners (../reaction-partners.ts owns its shape). */
export type { ReactionModel } from '../reaction-partners';

export class ReactionProcesses {
  readonly reactions: ReactionModel[] = [];
  offset = 0;

  constructor(private readonly ctx: ModelContext) {}

  get size(): number {
    return this.reactions.length;
  }

  refs(): ProcessRef[] {
    return this.reactions.map((r) => ({ label: r.label, kind: 'reaction' as const }));
  }

  scales(): number[] {
    return this.reactions.map((r) => Math.max(r.maxExtentMol, 1e-6));
  }

  /** Net liquid water consumed by the reactions, g. */
  waterConsumedG(x: readonly number[]): number {
    let w = 0;
    for (let r = 0; r < this.reactions.length; r++) w += this.reactions[r]!.waterPerExtent * x[this.offset + r]! * WATER_MOLAR_MASS_G_PER_MOL;
    return w;
  }

  /** ξ·ΔrH per reaction, J; heat capacity of the unreacted solids and the solid products. */
  evaluate(x: readonly number[], parts: HeatCapacityParts, chemOut?: number[]): number {
    let chem = 0;
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      const xi = x[this.offset + r]!;
      const h = xi * m.dH_kJ_per_mol * 1000;
      chem += h;
      if (chemOut) chemOut[this.offset + r] = h;
      parts.reactionSolids += (m.maxExtentMol - xi) * m.countedReactantCpPerExtent + xi * m.productCpPerExtent;
    }
    return chem;
  }

  mass(x: readonly number[], inv: MassInventory): void {
    this.reactions.forEach((m, r) => {
      const xi = x[this.offset + r]!;
      inv.reactionSolidsG += (m.maxExtentMol - xi) * m.countedReactantMassPerExtentG + xi * m.productMassPerExtentG;
      inv.gainedG += xi * m.externalReactantMassPerExtentG;
      inv.lostAsGasG += xi * m.gasMassPerExtentG;
    });
  }

  /** Reactions complete at equilibrium, limited by the liquid water. Returns the water left, g. */
  equilibrium(x: number[], waterG: number): number {
    let water = waterG;
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      let xi = m.maxExtentMol;
      if (m.waterPerExtent > 0) xi = Math.min(xi, water / (m.waterPerExtent * WATER_MOLAR_MASS_G_PER_MOL));
      xi = Math.max(0, xi);
      x[this.offset + r] = xi;
      water -= m.waterPerExtent * xi * WATER_MOLAR_MASS_G_PER_MOL;
    }
    return water;
  }

  /** First-order approach of each reaction to completion, limited by the liquid water. */
  rates(x: readonly number[], liquidG: number, out: number[]): void {
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      const xi = x[this.offset + r]!;
      let target = m.maxExtentMol;
      if (m.waterPerExtent > 0) target = Math.min(target, xi + Math.max(0, liquidG) / (m.waterPerExtent * WATER_MOLAR_MASS_G_PER_MOL));
      out[this.offset + r] = m.kPerS * Math.max(0, target - xi);
    }
  }
}
