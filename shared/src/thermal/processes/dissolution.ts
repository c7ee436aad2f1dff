import type { EutecticPoint } from '../chemistry-port';
import { FALLBACK_SOLID_CP_J_PER_GK, REFERENCE_TEMP_C, WATER_CP_J_PER_GK, WATER_CRYOSCOPIC_K_KG_PER_MOL, WATER_MOLAR_MASS_G_PER_MOL } from '../constants';
import { ThermalModelError } from '../errors';
import type { DissolutionProcess } from '../process';
import type { HeatCapacityParts, MassInventory, ModelContext, ProcessRef } from './common';

/**
 * Dissolution of solids in the pack's water (DESIGN.md §4.2): one extent per solute, the mol
 * of the charged solid dissolved. Owns the solution: its enthalpy (integral enthalpy of
 * solution at the current concentration plus the enthalpy of releasing the hydrate water,
 * Hess's law), its heat capacity (Laliberté's mixing rule), solubility, the freezing-point
 * depression the ice module reads, rates and equilibrium extents.
 */

export interface SoluteModel {
  label: string;
  solidKey: string;
  soluteKey: string;
  availableMol: number;
  solidMolarMass: number;
  soluteMolarMass: number;
  hydrateWater: number;
  ions: number;
  kPerS: number;
  solidCpJPerGK: number;
  dehydration_kJ_per_mol: number;
  eutectic: EutecticPoint | null;
  /** Anchoring coefficient of the colligative estimate, kg/mol (0 = ideal). */
  colligativeB: number;
  portFreezing: boolean;
}

export class DissolutionProcesses {
  readonly solutes: SoluteModel[] = [];
  offset = 0;

  constructor(private readonly ctx: ModelContext) {}

  get size(): number {
    return this.solutes.length;
  }

  refs(): ProcessRef[] {
    return this.solutes.map((s) => ({ label: s.label, kind: 'dissolution' as const }));
  }

  scales(): number[] {
    return this.solutes.map((s) => Math.max(s.availableMol, 1e-6));
  }

  add(process: DissolutionProcess, massG: number, label: string, field: string): void {
    const port = this.ctx.port;
    const soluteKey = process.soluteKey ?? process.solidKey;
    const solidMolarMass = port.molarMass_g_per_mol(process.solidKey);
    const soluteMolarMass = port.molarMass_g_per_mol(soluteKey);
    const hydrate = process.hydrateWaterPerFormula;
    let dehydration = 0;
    if (soluteKey !== process.solidKey) {
      // ΔH of releasing the crystal water = ΔfH(anhydrous) + h·ΔfH(H2O, l) − ΔfH(hydrate) (Hess's law, NBS 1982 data).
      const hSolid = port.formationEnthalpy_kJ_per_mol(process.solidKey);
      const hSolute = port.formationEnthalpy_kJ_per_mol(soluteKey);
      const hWater = port.formationEnthalpy_kJ_per_mol('H2O(l)');
      if (hSolid === null || hSolute === null || hWater === null) {
        throw new ThermalModelError(
          `expected ΔfH° of ${process.solidKey}, ${soluteKey} and H2O(l) to split the hydrate's enthalpy of solution, found none for ${[
            hSolid === null ? process.solidKey : null,
            hSolute === null ? soluteKey : null,
            hWater === null ? 'H2O(l)' : null,
          ]
            .filter(Boolean)
            .join(', ')}`,
          { field: `${field}.process.solidKey` },
        );
      }
      dehydration = hSolute + hydrate * hWater - hSolid;
      const massCheck = soluteMolarMass + hydrate * WATER_MOLAR_MASS_G_PER_MOL;
      if (Math.abs(massCheck - solidMolarMass) > 0.05 * solidMolarMass) {
        throw new ThermalModelError(
          `expected the molar mass of ${process.solidKey} (${solidMolarMass.toFixed(2)} g/mol) to equal ${soluteKey} + ${hydrate} H2O (${massCheck.toFixed(2)} g/mol)`,
          { field: `${field}.process.hydrateWaterPerFormula` },
        );
      }
    }
    let solidCp = process.solidCp_J_per_gK;
    if (solidCp === undefined) solidCp = this.solidCpJPerGK(process.solidKey, solidMolarMass);
    const eutectic = process.eutectic ?? port.eutectic?.(soluteKey) ?? null;
    const ions = process.ionsPerFormulaUnit;
    let b = 0;
    if (eutectic) {
      // Anchor ΔTf = ν·Kf·m/(1 + b·m) so that it passes through the eutectic point.
      const mE = (eutectic.soluteMassFraction / soluteMolarMass / (1 - eutectic.soluteMassFraction)) * 1000;
      const ideal = ions * WATER_CRYOSCOPIC_K_KG_PER_MOL * mE;
      b = Math.max(0, (ideal / -eutectic.tempC - 1) / mE);
    }
    this.solutes.push({
      label,
      solidKey: process.solidKey,
      soluteKey,
      availableMol: massG / solidMolarMass,
      solidMolarMass,
      soluteMolarMass,
      hydrateWater: hydrate,
      ions,
      kPerS: process.rateConstantPerMin / 60,
      solidCpJPerGK: solidCp,
      dehydration_kJ_per_mol: dehydration,
      eutectic,
      colligativeB: b,
      portFreezing: typeof port.freezingPointDepression_K === 'function',
    });
  }

  /** Specific heat of a solid from its Cp°/M, or the fallback with a warning. */
  solidCpJPerGK(key: string, molarMass: number): number {
    const cpMolar = this.ctx.port.heatCapacity_J_per_mol_K(key);
    if (cpMolar !== null) return cpMolar / molarMass;
    this.ctx.warnings.add(
      {
        code: 'thermal.solid-cp-assumed',
        message: `no Cp° for ${key}; its heat capacity is taken as ${FALLBACK_SOLID_CP_J_PER_GK} J/(g·K) (assumption)`,
      },
      key,
    );
    return FALLBACK_SOLID_CP_J_PER_GK;
  }

  /** Liquid water released by the dissolved hydrates, g. */
  waterReleasedG(x: readonly number[]): number {
    let w = 0;
    for (let j = 0; j < this.solutes.length; j++) w += this.solutes[j]!.hydrateWater * x[this.offset + j]! * WATER_MOLAR_MASS_G_PER_MOL;
    return w;
  }

  /** Mol of solute j in solution. */
  dissolvedMol(x: readonly number[], j: number): number {
    return x[this.offset + j]!;
  }

  /** Fraction of solute j's charged solid that is in solution. */
  dissolvedFraction(x: readonly number[], j: number): number {
    const s = this.solutes[j]!;
    return s.availableMol > 0 ? Math.min(1, Math.max(0, this.dissolvedMol(x, j) / s.availableMol)) : 1;
  }

  /**
   * Enthalpy of the solution and the undissolved solids at 25 °C, J, and their heat capacities.
   * Dissolution: ξ_j·(ΔsolH(n) + ΔH of releasing the hydrate water), n = mol water per mol dissolved solute.
   */
  evaluate(x: readonly number[], waterG: number, parts: HeatCapacityParts, chemOut?: number[]): number {
    const ns = this.solutes.length;
    let dissolvedMol = 0;
    let dissolvedG = 0;
    const dissolvedGs: number[] = new Array<number>(ns);
    for (let j = 0; j < ns; j++) {
      const xi = this.dissolvedMol(x, j);
      dissolvedMol += xi;
      const g = xi * this.solutes[j]!.soluteMolarMass;
      dissolvedGs[j] = g;
      dissolvedG += g;
    }
    let chem = 0;
    const port = this.ctx.port;
    const nH2O = dissolvedMol > 1e-15 ? Math.max(waterG, 1e-9) / WATER_MOLAR_MASS_G_PER_MOL / dissolvedMol : Infinity;
    for (let j = 0; j < ns; j++) {
      const s = this.solutes[j]!;
      const xi = x[this.offset + j]!;
      let h = 0;
      if (xi !== 0) {
        let dsol: number;
        if (nH2O === Infinity) dsol = port.infiniteDilutionEnthalpy_kJ_per_mol(s.soluteKey);
        else {
          const r = port.integralSolutionEnthalpy_kJ_per_mol(s.soluteKey, nH2O);
          if (r.warnings.length) this.ctx.warnings.addAll(r.warnings, s.soluteKey);
          dsol = r.value;
        }
        h = xi * (dsol + s.dehydration_kJ_per_mol) * 1000;
      }
      chem += h;
      if (chemOut) chemOut[this.offset + j] = h;
      parts.undissolvedSolids += (s.availableMol - xi) * s.solidMolarMass * s.solidCpJPerGK;
    }
    const w = Math.max(waterG, 0);
    parts.solution += this.solutionCp(w, dissolvedGs, dissolvedG) * (w + dissolvedG);
    return chem;
  }

  /**
   * Specific heat of the solution, J/(g·K), by Laliberté's mixing rule
   * cp = w_w·cp_w + Σ w_j·cp_app,j(w_total), the apparent specific heats from the chemistry
   * layer (Laliberté, J. Chem. Eng. Data 54 (2009) 1725).
   */
  private solutionCp(waterG: number, dissolvedG: readonly number[], totalDissolvedG: number): number {
    const solutionG = waterG + totalDissolvedG;
    if (totalDissolvedG <= 0 || solutionG <= 0) return WATER_CP_J_PER_GK;
    const wTotal = Math.min(totalDissolvedG / solutionG, 0.95);
    let cp = (waterG / solutionG) * WATER_CP_J_PER_GK;
    for (let j = 0; j < this.solutes.length; j++) {
      const m = dissolvedG[j]!;
      if (m <= 0) continue;
      const s = this.solutes[j]!;
      const app = this.ctx.port.apparentSoluteCp_J_per_gK(s.soluteKey, wTotal, REFERENCE_TEMP_C);
      if (app.warnings.length) this.ctx.warnings.addAll(app.warnings, s.soluteKey);
      cp += (m / solutionG) * app.value;
    }
    return cp;
  }

  mass(x: readonly number[], waterG: number, inv: MassInventory): void {
    let dissolved = 0;
    this.solutes.forEach((s, j) => {
      const xi = x[this.offset + j]!;
      dissolved += xi * s.soluteMolarMass;
      inv.undissolvedG += (s.availableMol - xi) * s.solidMolarMass;
    });
    inv.solutionG += waterG + dissolved;
  }

  /**
   * Solubility of solute j at `tempC`, g anhydrous per 100 g water. Below 0 °C, when the
   * eutectic is known, interpolated linearly from the 0 °C value to the eutectic composition
   * (the solubility curve ends at the eutectic; the tables stop at 0 °C).
   */
  solubilityGPer100g(j: number, tempC: number): number {
    const s = this.solutes[j]!;
    const port = this.ctx.port;
    if (tempC < 0 && s.eutectic) {
      const at0 = port.solubility_g_per_100g(s.soluteKey, 0);
      if (at0.warnings.length) this.ctx.warnings.addAll(at0.warnings, s.soluteKey);
      const w = s.eutectic.soluteMassFraction;
      const sE = (100 * w) / (1 - w);
      const t = Math.min(1, tempC / s.eutectic.tempC);
      return at0.value + (sE - at0.value) * t;
    }
    const r = port.solubility_g_per_100g(s.soluteKey, tempC);
    if (r.warnings.length) this.ctx.warnings.addAll(r.warnings, s.soluteKey);
    return Math.max(0, r.value);
  }

  /**
   * Most mol of solid j that can be dissolved at `tempC` when `otherWaterG` of liquid water
   * is present besides j's own released hydrate water: ξ·M_a = s/100·(W + h·ξ·M_w).
   */
  capacityMol(j: number, tempC: number, otherWaterG: number): number {
    const s = this.solutes[j]!;
    if (otherWaterG <= 0) return 0;
    const sol = this.solubilityGPer100g(j, tempC);
    const denom = 100 * s.soluteMolarMass - sol * s.hydrateWater * WATER_MOLAR_MASS_G_PER_MOL;
    if (denom <= 0) return Infinity;
    return (sol * otherWaterG) / denom;
  }

  /** Freezing-point depression, K, of a solution of the dissolved mol in `waterG` of liquid water. */
  freezingDepressionK(dissolvedMol: readonly number[], waterG: number): number {
    if (waterG <= 0) return Infinity;
    let dt = 0;
    for (let j = 0; j < this.solutes.length; j++) {
      const n = dissolvedMol[j]!;
      if (n <= 0) continue;
      const s = this.solutes[j]!;
      const m = (n * 1000) / waterG;
      let d: number | null = null;
      if (s.portFreezing) d = this.ctx.port.freezingPointDepression_K!(s.soluteKey, m);
      if (d === null) {
        // Colligative estimate ΔTf = ν·Kf·m / (1 + b·m); b = 0 (ideal) unless anchored to the eutectic.
        d = (s.ions * WATER_CRYOSCOPIC_K_KG_PER_MOL * m) / (1 + s.colligativeB * m);
        if (!s.eutectic) {
          this.ctx.warnings.add(
            {
              code: 'thermal.freezing-colligative',
              message: `no freezing-point or eutectic data for ${s.soluteKey}; freezing estimated as ν·Kf·m (Kf = 1.86 K·kg/mol, CRC Handbook), which overstates the depression of concentrated solutions`,
            },
            s.soluteKey,
          );
        }
      }
      dt += d;
    }
    return dt;
  }

  /** Dissolved mol of every solute (clamped at 0), in solute order. */
  dissolvedMols(x: readonly number[]): number[] {
    return this.solutes.map((_, j) => Math.max(0, this.dissolvedMol(x, j)));
  }

  /**
   * Equilibrium without ice at `tempC` given `waterG` of other liquid water: fixed point of
   * ξ_j = min(available, capacity with the hydrate water of the others).
   */
  equilibriumNoIce(tempC: number, x: number[], waterG: number): void {
    const ns = this.solutes.length;
    const o = this.offset;
    const hydrateG = (except: number) => {
      let g = 0;
      for (let k = 0; k < ns; k++) if (k !== except) g += this.solutes[k]!.hydrateWater * x[o + k]! * WATER_MOLAR_MASS_G_PER_MOL;
      return g;
    };
    for (let iter = 0; iter < 50; iter++) {
      let change = 0;
      for (let j = 0; j < ns; j++) {
        const cap = this.capacityMol(j, tempC, waterG + hydrateG(j));
        const xi = Math.min(this.solutes[j]!.availableMol, cap);
        change = Math.max(change, Math.abs(xi - x[o + j]!));
        x[o + j] = xi;
      }
      if (change <= 1e-13) break;
    }
  }

  /**
   * With ice present: each solute dissolved up to its solubility in `liquidG` of liquid water,
   * ξ_j(W_l) = min(available, s_j·W_l/(100·M_j)). Returns the dissolved mol in solute order.
   */
  dissolvedInLiquid(solubilities: readonly number[], liquidG: number): number[] {
    return this.solutes.map((s, j) => Math.min(s.availableMol, (solubilities[j]! * liquidG) / (100 * s.soluteMolarMass)));
  }

  /** Set the dissolved mol (solute order) into x. */
  setDissolved(x: number[], mol: readonly number[]): void {
    for (let j = 0; j < this.solutes.length; j++) x[this.offset + j] = mol[j]!;
  }

  /**
   * Rates: first-order approach of each dissolved amount to the solubility-limited amount at T
   * in the current liquid water (k per solute).
   */
  rates(tempC: number, x: readonly number[], liquidG: number, out: number[]): void {
    for (let j = 0; j < this.solutes.length; j++) {
      const s = this.solutes[j]!;
      const xi = x[this.offset + j]!;
      const own = s.hydrateWater * xi * WATER_MOLAR_MASS_G_PER_MOL;
      const target = Math.max(0, Math.min(s.availableMol, this.capacityMol(j, tempC, liquidG - own)));
      out[this.offset + j] = s.kPerS * (target - xi);
    }
  }
}
