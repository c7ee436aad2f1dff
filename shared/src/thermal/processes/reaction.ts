import { FALLBACK_SOLID_CP_J_PER_GK, WATER_MOLAR_MASS_G_PER_MOL } from '../constants';
import { ThermalModelError } from '../errors';
import type { ReactionProcess } from '../process';
import { phaseOf, type HeatCapacityParts, type MassInventory, type ModelContext, type ProcessRef } from './common';

/**
 * Reactions (DESIGN.md §4.2): one extent per reaction, mol of reaction as written. ΔrH from the
 * stored value or by Hess's law from ΔfH° (NBS 1982 via the chemistry port); `H2O(l)` among the
 * reactants is drawn from the pack's liquid water, gas products leave the pack.
 */

export interface ReactionModel {
  label: string;
  maxExtentMol: number;
  /** Net mol of liquid water consumed per mol of reaction (negative: produced). */
  waterPerExtent: number;
  dH_kJ_per_mol: number;
  countedReactantMassPerExtentG: number;
  countedReactantCpPerExtent: number;
  productMassPerExtentG: number;
  productCpPerExtent: number;
  gasMassPerExtentG: number;
  gasMolPerExtent: number;
  externalReactantMassPerExtentG: number;
  kPerS: number;
}

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

  add(process: ReactionProcess, massG: number, label: string, field: string): void {
    const port = this.ctx.port;
    const termMass = (key: string) => port.molarMass_g_per_mol(key);
    const ing = process.reactants.find((t) => t.key === process.ingredientKey);
    if (!ing) {
      throw new ThermalModelError(
        `expected ingredientKey ${process.ingredientKey} among the reactants, found ${process.reactants.map((t) => t.key).join(', ')}`,
        { field: `${field}.process.ingredientKey` },
      );
    }
    const isWater = (key: string) => key === 'H2O(l)';
    let counted = 0;
    let countedCp = 0;
    let external = 0;
    let waterPerExtent = 0;
    const cpOf = (key: string, coef: number) => {
      const cp = port.heatCapacity_J_per_mol_K(key);
      if (cp === null) {
        this.ctx.warnings.add({ code: 'thermal.solid-cp-assumed', message: `no Cp° for ${key}; ${FALLBACK_SOLID_CP_J_PER_GK} J/(g·K) assumed` }, key);
        return coef * termMass(key) * FALLBACK_SOLID_CP_J_PER_GK;
      }
      return coef * cp;
    };
    for (const t of process.reactants) {
      if (isWater(t.key)) {
        waterPerExtent += t.coef;
        continue;
      }
      const m = t.coef * termMass(t.key);
      if (t.key === process.ingredientKey || process.basis === 'premix') {
        counted += m;
        countedCp += cpOf(t.key, t.coef);
      } else external += m;
    }
    let productMass = 0;
    let productCp = 0;
    let gasMass = 0;
    let gasMol = 0;
    for (const t of process.products) {
      if (isWater(t.key)) {
        waterPerExtent -= t.coef;
        continue;
      }
      const m = t.coef * termMass(t.key);
      if (phaseOf(t.key) === 'g') {
        gasMass += m;
        gasMol += t.coef;
      } else {
        productMass += m;
        productCp += cpOf(t.key, t.coef);
      }
    }
    let dH = process.dH_kJ_per_mol;
    if (dH === undefined) {
      // Hess's law: ΔrH = Σ ν·ΔfH(products) − Σ ν·ΔfH(reactants).
      let sum = 0;
      const missing: string[] = [];
      for (const [terms, sign] of [
        [process.products, 1],
        [process.reactants, -1],
      ] as const) {
        for (const t of terms) {
          const h = port.formationEnthalpy_kJ_per_mol(t.key);
          if (h === null) missing.push(t.key);
          else sum += sign * t.coef * h;
        }
      }
      if (missing.length) {
        throw new ThermalModelError(`expected ΔfH° of every species of the reaction (or dH_kJ_per_mol), found none for ${missing.join(', ')}`, {
          field: `${field}.process`,
        });
      }
      dH = sum;
    }
    if (external > 0) {
      this.ctx.warnings.add(
        {
          code: 'thermal.reaction-partners-external',
          message: `${label}: reactants other than ${process.ingredientKey} and water are assumed present in excess in other components; their consumption is counted as drawn from outside`,
        },
        label,
      );
    }
    this.reactions.push({
      label,
      maxExtentMol: counted > 0 ? massG / counted : 0,
      waterPerExtent,
      dH_kJ_per_mol: dH,
      countedReactantMassPerExtentG: counted,
      countedReactantCpPerExtent: countedCp,
      productMassPerExtentG: productMass,
      productCpPerExtent: productCp,
      gasMassPerExtentG: gasMass,
      gasMolPerExtent: gasMol,
      externalReactantMassPerExtentG: external,
      kPerS: process.rateConstantPerMin / 60,
    });
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
