import { AIR_O2_MOLE_FRACTION, FALLBACK_SOLID_CP_J_PER_GK, STANDARD_ATMOSPHERE_PA } from '../constants';
import { ThermalModelError } from '../errors';
import type { AirOxidationProcess } from '../process';
import type { HeatCapacityParts, MassInventory, ModelContext, ProcessRef } from './common';

/**
 * Air oxidation of a metal powder (DESIGN.md §4.2), by default 4Fe + 3O2 → 2Fe2O3: one extent
 * per metal, the mol of O2 taken up. ΔH per mol O2 from the stored value or Hess's law; O2
 * supply = film permeance × film area × O2 partial-pressure difference, capped by the metal.
 *
 * Three separate inputs: the film's O2 permeance and its area (the process), and the pouch's
 * size (the contact case, which sets the heat loss). Without a film area the breathable film
 * is taken as one face of the pouch (half its surface; assumption, with a warning) — not the
 * whole surface on both faces.
 */

export interface OxidationModel {
  label: string;
  maxO2Mol: number;
  metalPerO2: number;
  oxidePerO2: number;
  metalMolarMass: number;
  oxideMolarMass: number;
  metalCpMolar: number;
  oxideCpMolar: number;
  dH_kJ_per_mol_O2: number;
  /** mol/s, or null when no film area is known (end state only). */
  o2SupplyMolPerS: number | null;
  kPerS: number;
}

/** Molar mass of O2, g/mol (IUPAC 2021 abridged: 2 × 15.999). */
const O2_MOLAR_MASS_G_PER_MOL = 31.998;

export class OxidationProcesses {
  readonly oxidations: OxidationModel[] = [];
  offset = 0;

  constructor(private readonly ctx: ModelContext) {}

  get size(): number {
    return this.oxidations.length;
  }

  refs(): ProcessRef[] {
    return this.oxidations.map((o) => ({ label: o.label, kind: 'air-oxidation' as const }));
  }

  scales(): number[] {
    return this.oxidations.map((o) => Math.max(o.maxO2Mol, 1e-6));
  }

  add(process: AirOxidationProcess, massG: number, label: string, field: string, packAreaM2: number | undefined): void {
    const port = this.ctx.port;
    const metalM = port.molarMass_g_per_mol(process.metalKey);
    const oxideM = port.molarMass_g_per_mol(process.oxideKey);
    let dH = process.dH_kJ_per_mol_O2;
    if (dH === undefined) {
      const hOx = port.formationEnthalpy_kJ_per_mol(process.oxideKey);
      const hMetal = port.formationEnthalpy_kJ_per_mol(process.metalKey) ?? 0;
      if (hOx === null) {
        throw new ThermalModelError(`expected ΔfH° of ${process.oxideKey} (or dH_kJ_per_mol_O2), found none`, { field: `${field}.process.oxideKey` });
      }
      dH = process.oxidePerO2 * hOx - process.metalPerO2 * hMetal;
    }
    const cpMetal = port.heatCapacity_J_per_mol_K(process.metalKey) ?? metalM * FALLBACK_SOLID_CP_J_PER_GK;
    const cpOxide = port.heatCapacity_J_per_mol_K(process.oxideKey) ?? oxideM * FALLBACK_SOLID_CP_J_PER_GK;
    let area = process.filmAreaM2;
    if (area === undefined && packAreaM2 !== undefined) {
      area = packAreaM2 / 2;
      this.ctx.warnings.add(
        {
          code: 'thermal.film-area-assumed',
          message: `${label}: no film area given; the breathable film is taken as one face of the pouch (${(area * 1e4).toFixed(0)} cm²). Give filmAreaM2 for a patch or a pouch breathing on both faces`,
        },
        label,
      );
    }
    const dp = process.o2PressureDifferencePa ?? AIR_O2_MOLE_FRACTION * STANDARD_ATMOSPHERE_PA;
    this.oxidations.push({
      label,
      maxO2Mol: massG / metalM / process.metalPerO2,
      metalPerO2: process.metalPerO2,
      oxidePerO2: process.oxidePerO2,
      metalMolarMass: metalM,
      oxideMolarMass: oxideM,
      metalCpMolar: cpMetal,
      oxideCpMolar: cpOxide,
      dH_kJ_per_mol_O2: dH,
      o2SupplyMolPerS: area === undefined ? null : process.filmO2Permeance_mol_per_m2_s_Pa * area * dp,
      kPerS: process.rateConstantPerMin / 60,
    });
  }

  evaluate(x: readonly number[], parts: HeatCapacityParts, chemOut?: number[]): number {
    let chem = 0;
    for (let o = 0; o < this.oxidations.length; o++) {
      const m = this.oxidations[o]!;
      const xi = x[this.offset + o]!;
      const h = xi * m.dH_kJ_per_mol_O2 * 1000;
      chem += h;
      if (chemOut) chemOut[this.offset + o] = h;
      parts.metalAndOxide += (m.maxO2Mol - xi) * m.metalPerO2 * m.metalCpMolar + xi * m.oxidePerO2 * m.oxideCpMolar;
    }
    return chem;
  }

  mass(x: readonly number[], inv: MassInventory): void {
    this.oxidations.forEach((m, o) => {
      const xi = x[this.offset + o]!;
      inv.metalAndOxideG += (m.maxO2Mol - xi) * m.metalPerO2 * m.metalMolarMass + xi * m.oxidePerO2 * m.oxideMolarMass;
      inv.gainedG += xi * O2_MOLAR_MASS_G_PER_MOL;
    });
  }

  /** At equilibrium the metal is fully oxidised. */
  equilibrium(x: number[]): void {
    for (let o = 0; o < this.oxidations.length; o++) x[this.offset + o] = this.oxidations[o]!.maxO2Mol;
  }

  /** O2 uptake min(film supply, k·remaining metal). */
  rates(x: readonly number[], out: number[]): void {
    for (let o = 0; o < this.oxidations.length; o++) {
      const m = this.oxidations[o]!;
      if (m.o2SupplyMolPerS === null) {
        throw new ThermalModelError(`expected a film area for the air oxidation of ${m.label} (filmAreaM2, or the pack's size), found none`, {
          field: 'contact',
        });
      }
      const remaining = Math.max(0, m.maxO2Mol - x[this.offset + o]!);
      out[this.offset + o] = Math.min(m.o2SupplyMolPerS, m.kPerS * remaining);
    }
  }
}
