import type { EutecticPoint } from '../chemistry-port';
import { FALLBACK_SOLID_CP_J_PER_GK, REFERENCE_TEMP_C, WATER_CP_J_PER_GK, WATER_CRYOSCOPIC_K_KG_PER_MOL, WATER_MOLAR_MASS_G_PER_MOL } from '../constants';
import { ThermalModelError } from '../errors';
import type { DissolutionProcess } from '../process';
import type { HeatCapacityParts, MassInventory, ModelContext, ProcessRef } from './common';
import { hydrateFamily, meltingHydrate, stablePhaseIndex, type HydrateFamily } from './hydrates';

/**
 * Dissolution of solids in the pack's water (DESIGN.md §4.2): one extent per solute, the mol
 * of the charged solid dissolved. Owns the solution: its enthalpy (integral enthalpy of
 * solution at the current concentration plus the enthalpy of releasing the hydrate water,
 * Hess's law), its heat capacity (Laliberté's mixing rule), solubility, the freezing-point
 * depression the ice module reads, rates and equilibrium extents.
 *
 * A salt leaves solution as the solid stable at the temperature (hydrates.ts): MgSO4·7H2O,
 * Na2SO4·10H2O below 32.4 °C, CaCl2·6H2O below 29.8 °C, …, binding its crystal water. Each such
 * phase other than the charged solid has its own extent p (mol precipitated). With d the mol
 * of the charged solid dissolved, the solution holds D = d − Σp mol of solute and the liquid
 * gains h_c·d − Σ h_p·p mol of water; the enthalpy at 25 °C is
 *   D·ΔsolH(n) + d·ΔH_dehyd(charged) − Σ p·ΔH_dehyd(phase),
 *   ΔH_dehyd(phase) = ΔfH(anhydrous) + h·ΔfH(H2O, l) − ΔfH(phase)   (Hess's law, NBS 1982),
 * so a solution that cools below saturation gives back the heat of crystallising the hydrate,
 * not that of the anhydrous salt. A charged solid that is not the stable phase at T (anhydrous
 * MgSO4 in water) dissolves completely and the stable phase precipitates to saturation.
 */

/** Molar heat capacity of water of crystallisation, J/(mol·K): Kopp–Neumann additivity with ice's Cp (≈ 38 J/(mol·K), CRC Handbook). Assumption for hydrates without Cp°. */
const CRYSTAL_WATER_CP_J_PER_MOL_K = 38;
/** Liquid water, g, below which a metastable solid's dissolution slows to a stop (smooth switch). Assumption. */
const DISSOLVE_WATER_SCALE_G = 0.01;

export interface PrecipitateModel {
  label: string;
  /** Index of the solute it comes from. */
  solute: number;
  /** Index of the phase in the solute's family. */
  phaseIndex: number;
  key: string;
  hydrateWater: number;
  molarMass: number;
  cpJPerGK: number;
  dehydration_kJ_per_mol: number;
}

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
  /** The solid phases the solute can leave solution as, or null (it returns as the charged solid). */
  family: HydrateFamily | null;
  /** Index of the charged solid in the family, or −1. */
  chargedPhaseIndex: number;
  /** Index into `precipitates` per family phase, or −1 (the charged solid itself). */
  precipitateIndex: number[];
}

export class DissolutionProcesses {
  readonly solutes: SoluteModel[] = [];
  readonly precipitates: PrecipitateModel[] = [];
  offset = 0;

  constructor(private readonly ctx: ModelContext) {}

  get size(): number {
    return this.solutes.length + this.precipitates.length;
  }

  /** Offset of precipitate q in x. */
  private pOff(q: number): number {
    return this.offset + this.solutes.length + q;
  }

  refs(): ProcessRef[] {
    return [
      ...this.solutes.map((s) => ({ label: s.label, kind: 'dissolution' as const })),
      ...this.precipitates.map((p) => ({ label: p.label, kind: 'precipitation' as const })),
    ];
  }

  scales(): number[] {
    return [...this.solutes.map((s) => Math.max(s.availableMol, 1e-6)), ...this.precipitates.map((p) => Math.max(this.solutes[p.solute]!.availableMol, 1e-6))];
  }

  /** Build the precipitate extents once every solute is known (their offsets follow the solutes). */
  private addPrecipitates(j: number, field: string): void {
    const s = this.solutes[j]!;
    const family = s.family;
    if (!family) return;
    const port = this.ctx.port;
    const hAnh = port.formationEnthalpy_kJ_per_mol(s.soluteKey);
    const hWater = port.formationEnthalpy_kJ_per_mol('H2O(l)');
    family.phases.forEach((ph, k) => {
      if (k === s.chargedPhaseIndex) return;
      const hPhase = ph.key === s.soluteKey ? hAnh : port.formationEnthalpy_kJ_per_mol(ph.key);
      if (hAnh === null || hWater === null || hPhase === null) {
        throw new ThermalModelError(`expected ΔfH° of ${s.soluteKey}, ${ph.key} and H2O(l) for the solid that leaves solution, found none`, {
          field: `${field}.process.soluteKey`,
        });
      }
      const molarMass = port.molarMass_g_per_mol(ph.key);
      const cpMolar = port.heatCapacity_J_per_mol_K(ph.key) ?? (port.heatCapacity_J_per_mol_K(s.soluteKey) ?? s.soluteMolarMass * FALLBACK_SOLID_CP_J_PER_GK) + ph.hydrateWater * CRYSTAL_WATER_CP_J_PER_MOL_K;
      s.precipitateIndex[k] = this.precipitates.length;
      this.precipitates.push({
        label: `${s.label} → ${ph.key}`,
        solute: j,
        phaseIndex: k,
        key: ph.key,
        hydrateWater: ph.hydrateWater,
        molarMass,
        cpJPerGK: cpMolar / molarMass,
        dehydration_kJ_per_mol: hAnh + ph.hydrateWater * hWater - hPhase,
      });
    });
  }

  /** True when the charged solid of solute j is the phase stable at `tempC` (or the solute has no hydrate family). */
  chargedIsStable(j: number, tempC: number): boolean {
    const s = this.solutes[j]!;
    return !s.family || s.chargedPhaseIndex === stablePhaseIndex(s.family, tempC);
  }

  /** The precipitate that forms from solute j at `tempC`, or −1 when it returns as the charged solid. */
  private stablePrecipitate(j: number, tempC: number): number {
    const s = this.solutes[j]!;
    if (!s.family) return -1;
    const k = stablePhaseIndex(s.family, tempC);
    const gap = s.family.phases[k]!.gap;
    if (gap && tempC >= gap.fromC && tempC < gap.toC) {
      this.ctx.warnings.add(
        {
          code: 'thermal.hydrate-phase-substituted',
          message: `${s.soluteKey} leaves solution as ${gap.realPhase} between ${gap.fromC} and ${gap.toC === Infinity ? '…' : gap.toC} °C, which the species data lack; ${s.family.phases[k]!.key} stands in for it`,
        },
        s.soluteKey,
      );
    }
    return s.precipitateIndex[k] ?? -1;
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
    if (solidCp === undefined && port.heatCapacity_J_per_mol_K(process.solidKey) === null) solidCp = meltingHydrate(process.solidKey)?.solidCpJPerGK;
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
      family: null,
      chargedPhaseIndex: -1,
      precipitateIndex: [],
    });
    this.pendingFamilies.push({ j: this.solutes.length - 1, field });
  }

  private readonly pendingFamilies: { j: number; field: string }[] = [];

  /** Called once all components are added: attach each solute's hydrate family and its precipitates. */
  finish(): void {
    for (const { j, field } of this.pendingFamilies) {
      const s = this.solutes[j]!;
      // A hydrate that melts keeps its own identity (the melt module takes it through its melting point).
      const family = meltingHydrate(s.solidKey) ? null : hydrateFamily(s.soluteKey);
      if (!family) continue;
      s.family = family;
      s.chargedPhaseIndex = family.phases.findIndex((p) => p.key === s.solidKey);
      s.precipitateIndex = family.phases.map(() => -1);
      this.addPrecipitates(j, field);
    }
    this.pendingFamilies.length = 0;
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
    for (let j = 0; j < this.solutes.length; j++) w += this.solutes[j]!.hydrateWater * x[this.offset + j]!;
    for (let q = 0; q < this.precipitates.length; q++) w -= this.precipitates[q]!.hydrateWater * x[this.pOff(q)]!;
    return w * WATER_MOLAR_MASS_G_PER_MOL;
  }

  /** Net water of solute j (released by its charged solid less bound in its precipitates), g. */
  private netWaterG(x: readonly number[], j: number): number {
    const s = this.solutes[j]!;
    let w = s.hydrateWater * x[this.offset + j]!;
    for (const q of s.precipitateIndex) if (q >= 0) w -= this.precipitates[q]!.hydrateWater * x[this.pOff(q)]!;
    return w * WATER_MOLAR_MASS_G_PER_MOL;
  }

  /** Mol of solute j's charged solid not dissolved. */
  undissolvedMol(x: readonly number[], j: number): number {
    return this.solutes[j]!.availableMol - x[this.offset + j]!;
  }

  /** Mol of solute j precipitated (all phases). */
  private precipitatedMol(x: readonly number[], j: number): number {
    let p = 0;
    for (const q of this.solutes[j]!.precipitateIndex) if (q >= 0) p += x[this.pOff(q)]!;
    return p;
  }

  /** Mol of solute j in solution: d − Σp. */
  dissolvedMol(x: readonly number[], j: number): number {
    return x[this.offset + j]! - this.precipitatedMol(x, j);
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
      const xi = Math.max(0, this.dissolvedMol(x, j));
      dissolvedMol += xi;
      const g = xi * this.solutes[j]!.soluteMolarMass;
      dissolvedGs[j] = g;
      dissolvedG += g;
    }
    let chem = 0;
    const port = this.ctx.port;
    const nH2O = dissolvedMol > 1e-15 ? Math.max(waterG, 1e-9) / WATER_MOLAR_MASS_G_PER_MOL / dissolvedMol : Infinity;
    const dsolOf = (s: SoluteModel): number => {
      if (nH2O === Infinity) return port.infiniteDilutionEnthalpy_kJ_per_mol(s.soluteKey);
      const r = port.integralSolutionEnthalpy_kJ_per_mol(s.soluteKey, nH2O);
      if (r.warnings.length) this.ctx.warnings.addAll(r.warnings, s.soluteKey);
      return r.value;
    };
    const dsols: (number | null)[] = new Array<number | null>(ns).fill(null);
    for (let j = 0; j < ns; j++) {
      const s = this.solutes[j]!;
      const xi = x[this.offset + j]!;
      let h = 0;
      if (xi !== 0) {
        const dsol = (dsols[j] = dsolOf(s));
        h = xi * (dsol + s.dehydration_kJ_per_mol) * 1000;
      }
      chem += h;
      if (chemOut) chemOut[this.offset + j] = h;
      parts.undissolvedSolids += (s.availableMol - xi) * s.solidMolarMass * s.solidCpJPerGK;
    }
    for (let q = 0; q < this.precipitates.length; q++) {
      const p = this.precipitates[q]!;
      const pq = x[this.pOff(q)]!;
      let h = 0;
      if (pq !== 0) {
        const s = this.solutes[p.solute]!;
        const dsol = dsols[p.solute] ?? (dsols[p.solute] = dsolOf(s));
        h = -pq * (dsol + p.dehydration_kJ_per_mol) * 1000;
      }
      chem += h;
      if (chemOut) chemOut[this.pOff(q)] = h;
      parts.undissolvedSolids += pq * p.molarMass * p.cpJPerGK;
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
      dissolved += this.dissolvedMol(x, j) * s.soluteMolarMass;
      inv.undissolvedG += (s.availableMol - xi) * s.solidMolarMass;
    });
    this.precipitates.forEach((p, q) => {
      inv.undissolvedG += x[this.pOff(q)]! * p.molarMass;
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
   * Equilibrium without ice at `tempC` given `waterG` of other liquid water: fixed point over
   * the solutes, each with the net water of the others. A solute whose charged solid is stable
   * at T dissolves up to its solubility (ξ = min(available, capacity)); otherwise the charged
   * solid dissolves and the stable phase precipitates to saturation (stableEquilibrium).
   */
  equilibriumNoIce(tempC: number, x: number[], waterG: number): void {
    const ns = this.solutes.length;
    const o = this.offset;
    const netOthers = (except: number) => {
      let g = 0;
      for (let k = 0; k < ns; k++) if (k !== except) g += this.netWaterG(x, k);
      return g;
    };
    for (let iter = 0; iter < 50; iter++) {
      let change = 0;
      for (let j = 0; j < ns; j++) {
        const s = this.solutes[j]!;
        const other = waterG + netOthers(j);
        const before = [x[o + j]!, ...s.precipitateIndex.map((q) => (q >= 0 ? x[this.pOff(q)]! : 0))];
        for (const q of s.precipitateIndex) if (q >= 0) x[this.pOff(q)] = 0;
        const qs = this.stablePrecipitate(j, tempC);
        if (qs < 0) {
          x[o + j] = Math.min(s.availableMol, this.capacityMol(j, tempC, other));
        } else {
          const r = this.stableEquilibrium(j, qs, tempC, s.availableMol, 0, other);
          x[o + j] = r.d;
          x[this.pOff(qs)] = r.p;
        }
        const after = [x[o + j]!, ...s.precipitateIndex.map((q) => (q >= 0 ? x[this.pOff(q)]! : 0))];
        for (let k = 0; k < after.length; k++) change = Math.max(change, Math.abs(after[k]! - before[k]!));
      }
      if (change <= 1e-13) break;
    }
  }

  /**
   * Charged solid d (up to `availableMol`) dissolved, stable phase q precipitated to saturation:
   * (d − P_o − p)·M_a = s/100·(W + h_c·d·M_w − h_o − h_q·p·M_w), W the other liquid water, P_o
   * and h_o (g) the mol and water of other precipitates of the solute held fixed. Water-limited
   * (no liquid left): D = 0 and the hydrate takes all the water. A hydrate more dilute than the
   * saturated solution (above its congruent melting point) cannot precipitate: p = 0.
   */
  private stableEquilibrium(j: number, q: number, tempC: number, dMax: number, fixedP: number, otherG: number, fixedWaterG = 0): { d: number; p: number } {
    const s = this.solutes[j]!;
    const ph = this.precipitates[q]!;
    const mw = WATER_MOLAR_MASS_G_PER_MOL;
    const sol = this.solubilityGPer100g(j, tempC);
    const hc = s.hydrateWater;
    const hq = ph.hydrateWater;
    let d = dMax;
    const w0 = otherG + hc * d * mw - fixedWaterG;
    if (w0 <= 0 && hc === 0) return { d: 0, p: 0 };
    const avail = d - fixedP;
    const denom = s.soluteMolarMass - (sol * hq * mw) / 100;
    let p = denom > 0 ? Math.max(0, (avail * s.soluteMolarMass - (sol * Math.max(w0, 0)) / 100) / denom) : 0;
    p = Math.min(p, Math.max(0, avail));
    if (w0 - hq * p * mw < 0) {
      // No liquid left: every mol in solution goes into the hydrate, which takes all the water.
      if (hq > hc) {
        d = Math.min(dMax, Math.max(0, (otherG - fixedWaterG + hq * fixedP * mw) / ((hq - hc) * mw)));
        p = Math.max(0, d - fixedP);
      } else p = Math.max(0, avail);
    }
    return { d, p };
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
    for (let q = 0; q < this.precipitates.length; q++) x[this.pOff(q)] = 0;
  }

  /**
   * Rates: first-order approach of each dissolved amount to the solubility-limited amount at T
   * in the current liquid water (k per solute). A charged solid that is not stable at T
   * dissolves towards completion while there is liquid water; the stable phase grows towards
   * saturation and the other phases re-dissolve, with the solute's k (assumption).
   */
  rates(tempC: number, x: readonly number[], liquidG: number, out: number[]): void {
    for (let j = 0; j < this.solutes.length; j++) {
      const s = this.solutes[j]!;
      const xi = x[this.offset + j]!;
      const qs = this.stablePrecipitate(j, tempC);
      for (const q of s.precipitateIndex) if (q >= 0 && q !== qs) out[this.pOff(q)] = -s.kPerS * x[this.pOff(q)]!;
      if (qs < 0) {
        const own = this.netWaterG(x, j);
        const target = Math.max(0, Math.min(s.availableMol, this.capacityMol(j, tempC, liquidG - own) + this.precipitatedMol(x, j)));
        out[this.offset + j] = s.kPerS * (target - xi);
        continue;
      }
      const wet = Math.max(0, liquidG) / (Math.max(0, liquidG) + DISSOLVE_WATER_SCALE_G);
      out[this.offset + j] = s.kPerS * Math.max(0, s.availableMol - xi) * wet;
      // Stable phase: its saturation target with d and the other precipitates as they are.
      const pq = x[this.pOff(qs)]!;
      let otherP = 0;
      let otherWaterG = 0;
      for (const q of s.precipitateIndex) {
        if (q < 0 || q === qs) continue;
        otherP += x[this.pOff(q)]!;
        otherWaterG += this.precipitates[q]!.hydrateWater * x[this.pOff(q)]! * WATER_MOLAR_MASS_G_PER_MOL;
      }
      // Liquid water other than solute j's own net water.
      const otherG = liquidG - this.netWaterG(x, j) ;
      const r = this.stableEquilibrium(j, qs, tempC, xi, otherP, otherG, otherWaterG);
      out[this.pOff(qs)] = s.kPerS * (r.p - pq);
    }
  }
}
