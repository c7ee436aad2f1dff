import type { ComputationWarning } from '../chemistry/types';
import type { ChemistryPort, EutecticPoint } from './chemistry-port';
import {
  AIR_O2_MOLE_FRACTION,
  FALLBACK_SOLID_CP_J_PER_GK,
  ICE_CP_J_PER_GK,
  ICE_FUSION_J_PER_G,
  ICE_RATE_PER_MIN,
  INERT_CP_J_PER_GK,
  REFERENCE_TEMP_C,
  STANDARD_ATMOSPHERE_PA,
  WATER_CP_J_PER_GK,
  WATER_CRYOSCOPIC_K_KG_PER_MOL,
  WATER_MOLAR_MASS_G_PER_MOL,
} from './constants';
import { ThermalModelError } from './errors';
import { ingredientProcessSchema, type IngredientProcess, type IngredientProcessInput, type ProcessKind } from './process';
import { setUpReactions, type ReactionModel } from './reaction-partners';
import { brentRoot } from './root';

/**
 * The pack as a thermodynamic system: a state function H(T, x) (enthalpy, J, relative to the
 * charged materials at the 25 °C reference), its heat capacity C(x) = ∂H/∂T, the equilibrium
 * extents at a temperature (for the end state) and the kinetic rates (for the time profile).
 *
 * State x (all extents, in this order):
 *   dissolved mol of each dissolving solid · reaction extent (mol) of each reaction ·
 *   crystallised fraction of each supercooled melt · mol O2 taken up by each oxidising metal ·
 *   ice (g).
 *
 * H(T, x) = Σ_i H_i(x) + C(x)·(T − 25 °C), where H_i is the enthalpy change of process i at
 * 25 °C (integral enthalpy of solution at the current concentration, ΔrH, latent heats
 * corrected to 25 °C by Kirchhoff's law) and C(x) sums the heat capacities of the phases
 * present (solution by the Laliberté mixing rule, undissolved solids from Cp°, ice, melt,
 * metal and oxide, inert parts, packaging). Heat capacities are taken at 25 °C and held
 * constant in T (assumption: water's cp varies < 1 % over 0–80 °C, IAPWS-95).
 */

export interface ThermalComponent {
  /** Label for breakdowns: an ingredient key, id or formula. */
  key?: string;
  formula?: string;
  massG: number;
  process: IngredientProcessInput;
}

interface SoluteModel {
  label: string;
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

interface CrystalModel {
  label: string;
  massG: number;
  meltingPointC: number;
  latentRefJPerG: number;
  liquidCp: number;
  solidCp: number;
  kPerS: number;
  drivingK: number;
}

interface OxidationModel {
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

interface InertModel {
  label: string;
  massG: number;
  cpJPerGK: number;
}

export interface ProcessRef {
  label: string;
  kind: ProcessKind | 'freezing';
}

const L_ICE_REF_J_PER_G = ICE_FUSION_J_PER_G + (WATER_CP_J_PER_GK - ICE_CP_J_PER_GK) * (REFERENCE_TEMP_C - 0);
const ICE_SMOOTHING_K = 0.2;

/** Heat capacity of each kind of part, J/K. */
export interface HeatCapacityParts {
  solution: number;
  undissolvedSolids: number;
  ice: number;
  reactionSolids: number;
  melt: number;
  metalAndOxide: number;
  inert: number;
  packaging: number;
}

export interface MassInventory {
  solutionG: number;
  undissolvedG: number;
  iceG: number;
  reactionSolidsG: number;
  meltG: number;
  metalAndOxideG: number;
  inertG: number;
  /** Taken up from air (O2) or drawn from other components (excess reactants). */
  gainedG: number;
  /** Evolved as gas and left the pack. */
  lostAsGasG: number;
}

/** Collects warnings once per code and subject, so a long integration does not repeat them. */
export class WarningCollector {
  private readonly seen = new Map<string, ComputationWarning>();

  add(warning: ComputationWarning, subject = ''): void {
    const id = `${warning.code}|${subject}`;
    if (!this.seen.has(id)) this.seen.set(id, warning);
  }

  addAll(warnings: readonly ComputationWarning[], subject = ''): void {
    for (const w of warnings) this.add(w, subject);
  }

  list(): ComputationWarning[] {
    return [...this.seen.values()];
  }
}

export interface PackModelOptions {
  packHeatCapacityJPerK?: number;
  /** Pack surface area, m²: the default O2 film area of air-oxidation processes. */
  packAreaM2?: number;
  /**
   * Multiplier on the pack's total heat capacity C(x) (default 1): how the uncertainty of the
   * heat-capacity data is propagated (lab-logs/monte-carlo.ts). H(T, x) stays a state function.
   */
  heatCapacityFactor?: number;
  /**
   * Where a reaction's partners come from (reaction-partners.ts): `from-pack` (default), or
   * `assumed` in excess when no component brings them (one ingredient's per-gram coefficients).
   */
  reactionPartners?: 'from-pack' | 'assumed';
}

export class PackModel {
  readonly solutes: SoluteModel[] = [];
  readonly reactions: ReactionModel[] = [];
  readonly crystals: CrystalModel[] = [];
  readonly oxidations: OxidationModel[] = [];
  readonly inerts: InertModel[] = [];
  readonly processes: ProcessRef[] = [];
  readonly warnings = new WarningCollector();
  readonly waterBaseG: number;
  readonly totalMassG: number;
  readonly packHeatCapacityJPerK: number;
  readonly heatCapacityFactor: number;
  readonly size: number;
  readonly iceIndex: number;
  private readonly offReaction: number;
  private readonly offCrystal: number;
  private readonly offOxidation: number;

  constructor(
    private readonly port: ChemistryPort,
    components: readonly ThermalComponent[],
    options: PackModelOptions = {},
  ) {
    if (components.length === 0) {
      throw new ThermalModelError('expected at least one component in the pack, found none', { field: 'components' });
    }
    let water = 0;
    let total = 0;
    const parsedComponents = components.map((component, i) => {
      const field = `components.${i}`;
      if (!(Number.isFinite(component.massG) && component.massG >= 0)) {
        throw new ThermalModelError(`expected massG ≥ 0 g, found ${component.massG}`, { field: `${field}.massG` });
      }
      const parsed = ingredientProcessSchema.safeParse(component.process);
      if (!parsed.success) {
        const issue = parsed.error.issues[0];
        throw new ThermalModelError(
          `expected a valid ingredient process, found: ${issue?.path.join('.') ?? ''} ${issue?.message ?? ''}`.trim(),
          { field: `${field}.process${issue && issue.path.length ? '.' + issue.path.join('.') : ''}` },
        );
      }
      total += component.massG;
      if (parsed.data.kind === 'inert' && parsed.data.role === 'water') water += component.massG;
      return { label: component.key ?? component.formula ?? `component ${i + 1}`, massG: component.massG, process: parsed.data, field };
    });
    // Reactions first: they take their partners from the pack's components (reaction-partners.ts).
    const reactionSetup = setUpReactions(this.port, parsedComponents, water, options.reactionPartners ?? 'from-pack');
    for (const w of reactionSetup.warnings) this.warnings.add(w.warning, w.subject);
    this.reactions.push(...reactionSetup.reactions);
    this.inerts.push(...reactionSetup.leftovers);
    parsedComponents.forEach((c, i) => {
      if (c.process.kind === 'reaction' || (c.process.kind === 'inert' && c.process.role === 'water')) return;
      this.addProcess(c.process, reactionSetup.massLeftG[i]!, c.label, options, c.field);
    });
    this.waterBaseG = water;
    this.totalMassG = total;
    this.packHeatCapacityJPerK = options.packHeatCapacityJPerK ?? 0;
    this.heatCapacityFactor = options.heatCapacityFactor ?? 1;
    if (!(Number.isFinite(this.heatCapacityFactor) && this.heatCapacityFactor > 0)) {
      throw new ThermalModelError(`expected heatCapacityFactor > 0, found ${this.heatCapacityFactor}`, { field: 'heatCapacityFactor' });
    }
    if (!(Number.isFinite(this.packHeatCapacityJPerK) && this.packHeatCapacityJPerK >= 0)) {
      throw new ThermalModelError(`expected packHeatCapacityJPerK ≥ 0 J/K, found ${this.packHeatCapacityJPerK}`, {
        field: 'packHeatCapacityJPerK',
      });
    }
    this.offReaction = this.solutes.length;
    this.offCrystal = this.offReaction + this.reactions.length;
    this.offOxidation = this.offCrystal + this.crystals.length;
    this.iceIndex = this.offOxidation + this.oxidations.length;
    this.size = this.iceIndex + 1;
    for (const s of this.solutes) this.processes.push({ label: s.label, kind: 'dissolution' });
    for (const r of this.reactions) this.processes.push({ label: r.label, kind: 'reaction' });
    for (const c of this.crystals) this.processes.push({ label: c.label, kind: 'crystallisation' });
    for (const o of this.oxidations) this.processes.push({ label: o.label, kind: 'air-oxidation' });
    this.processes.push({ label: 'water', kind: 'freezing' });
    if (this.solutes.length > 1) {
      this.warnings.add({
        code: 'thermal.mixed-solutes',
        message:
          'more than one solute: each solute\'s solubility is taken as in water alone (no common-ion effect) and its enthalpy of solution at the total solute concentration',
      });
    }
  }

  private addProcess(process: IngredientProcess, massG: number, label: string, options: PackModelOptions, field: string): void {
    const port = this.port;
    switch (process.kind) {
      case 'inert': {
        const cp = process.cp_J_per_gK ?? (process.role === 'packaging' ? INERT_CP_J_PER_GK.packaging : INERT_CP_J_PER_GK.additive);
        this.inerts.push({ label, massG, cpJPerGK: cp });
        return;
      }
      case 'dissolution': {
        const soluteKey = process.soluteKey ?? process.solidKey;
        const solidMolarMass = port.molarMass_g_per_mol(process.solidKey);
        const soluteMolarMass = port.molarMass_g_per_mol(soluteKey);
        const hydrate = process.hydrateWaterPerFormula;
        let dehydration = 0;
        if (soluteKey !== process.solidKey) {
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
        if (solidCp === undefined) {
          const cpMolar = port.heatCapacity_J_per_mol_K(process.solidKey);
          if (cpMolar === null) {
            solidCp = FALLBACK_SOLID_CP_J_PER_GK;
            this.warnings.add(
              {
                code: 'thermal.solid-cp-assumed',
                message: `no Cp° for ${process.solidKey}; its heat capacity is taken as ${FALLBACK_SOLID_CP_J_PER_GK} J/(g·K) (assumption)`,
              },
              process.solidKey,
            );
          } else solidCp = cpMolar / solidMolarMass;
        }
        const eutectic = process.eutectic ?? port.eutectic?.(soluteKey) ?? null;
        const ions = process.ionsPerFormulaUnit;
        let b = 0;
        if (eutectic) {
          const mE = (eutectic.soluteMassFraction / soluteMolarMass / (1 - eutectic.soluteMassFraction)) * 1000;
          const ideal = ions * WATER_CRYOSCOPIC_K_KG_PER_MOL * mE;
          b = Math.max(0, (ideal / -eutectic.tempC - 1) / mE);
        }
        this.solutes.push({
          label,
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
        return;
      }
      case 'reaction':
        // Set up with their partners before the other processes (setUpReactions).
        return;
      case 'crystallisation': {
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
        return;
      }
      case 'air-oxidation': {
        const metalM = port.molarMass_g_per_mol(process.metalKey);
        const oxideM = port.molarMass_g_per_mol(process.oxideKey);
        let dH = process.dH_kJ_per_mol_O2;
        if (dH === undefined) {
          const hOx = port.formationEnthalpy_kJ_per_mol(process.oxideKey);
          const hMetal = port.formationEnthalpy_kJ_per_mol(process.metalKey) ?? 0;
          if (hOx === null) {
            throw new ThermalModelError(`expected ΔfH° of ${process.oxideKey} (or dH_kJ_per_mol_O2), found none`, {
              field: `${field}.process.oxideKey`,
            });
          }
          dH = process.oxidePerO2 * hOx - process.metalPerO2 * hMetal;
        }
        const cpMetal = port.heatCapacity_J_per_mol_K(process.metalKey) ?? metalM * FALLBACK_SOLID_CP_J_PER_GK;
        const cpOxide = port.heatCapacity_J_per_mol_K(process.oxideKey) ?? oxideM * FALLBACK_SOLID_CP_J_PER_GK;
        const area = process.filmAreaM2 ?? options.packAreaM2;
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
        return;
      }
    }
  }

  /** Index of the first reaction, crystal and oxidation extent in x. */
  get offsets(): { reaction: number; crystal: number; oxidation: number; ice: number } {
    return { reaction: this.offReaction, crystal: this.offCrystal, oxidation: this.offOxidation, ice: this.iceIndex };
  }

  /** The charged state: nothing dissolved, reacted, crystallised, oxidised or frozen. */
  initialExtents(): number[] {
    return new Array<number>(this.size).fill(0);
  }

  /** Liquid water, g: charged water + hydrate water released − water consumed by reactions − ice. */
  liquidWaterG(x: readonly number[]): number {
    let w = this.waterBaseG;
    for (let j = 0; j < this.solutes.length; j++) w += this.solutes[j]!.hydrateWater * x[j]! * WATER_MOLAR_MASS_G_PER_MOL;
    for (let r = 0; r < this.reactions.length; r++) w -= this.reactions[r]!.waterPerExtent * x[this.offReaction + r]! * WATER_MOLAR_MASS_G_PER_MOL;
    return w - x[this.iceIndex]!;
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
      const app = this.port.apparentSoluteCp_J_per_gK(s.soluteKey, wTotal, REFERENCE_TEMP_C);
      if (app.warnings.length) this.warnings.addAll(app.warnings, s.soluteKey);
      cp += (m / solutionG) * app.value;
    }
    return cp;
  }

  /**
   * Enthalpy terms of the processes at 25 °C, J (index as in `processes`), and the heat
   * capacities of the parts, J/K, at extents x.
   */
  evaluate(x: readonly number[], chemOut?: number[]): { chemJ: number; cJPerK: number; parts: HeatCapacityParts } {
    const ns = this.solutes.length;
    const waterG = this.liquidWaterG(x);
    let dissolvedMol = 0;
    let dissolvedG = 0;
    const dissolvedGs: number[] = new Array<number>(ns);
    for (let j = 0; j < ns; j++) {
      const xi = x[j]!;
      dissolvedMol += xi;
      const g = xi * this.solutes[j]!.soluteMolarMass;
      dissolvedGs[j] = g;
      dissolvedG += g;
    }
    let chem = 0;
    const parts: HeatCapacityParts = {
      solution: 0,
      undissolvedSolids: 0,
      ice: 0,
      reactionSolids: 0,
      melt: 0,
      metalAndOxide: 0,
      inert: 0,
      packaging: this.packHeatCapacityJPerK,
    };
    // Dissolution: ξ_j·(ΔsolH(n) + ΔH of releasing the hydrate water), n = mol water per mol dissolved solute.
    const nH2O = dissolvedMol > 1e-15 ? Math.max(waterG, 1e-9) / WATER_MOLAR_MASS_G_PER_MOL / dissolvedMol : Infinity;
    for (let j = 0; j < ns; j++) {
      const s = this.solutes[j]!;
      const xi = x[j]!;
      let h = 0;
      if (xi !== 0) {
        let dsol: number;
        if (nH2O === Infinity) dsol = this.port.infiniteDilutionEnthalpy_kJ_per_mol(s.soluteKey);
        else {
          const r = this.port.integralSolutionEnthalpy_kJ_per_mol(s.soluteKey, nH2O);
          if (r.warnings.length) this.warnings.addAll(r.warnings, s.soluteKey);
          dsol = r.value;
        }
        h = xi * (dsol + s.dehydration_kJ_per_mol) * 1000;
      }
      chem += h;
      if (chemOut) chemOut[j] = h;
      parts.undissolvedSolids += (s.availableMol - xi) * s.solidMolarMass * s.solidCpJPerGK;
    }
    parts.solution = this.solutionCp(Math.max(waterG, 0), dissolvedGs, dissolvedG) * (Math.max(waterG, 0) + dissolvedG);
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      const xi = x[this.offReaction + r]!;
      const h = xi * m.dH_kJ_per_mol * 1000;
      chem += h;
      if (chemOut) chemOut[this.offReaction + r] = h;
      parts.reactionSolids += (m.maxExtentMol - xi) * m.countedReactantCpPerExtent + xi * m.productCpPerExtent;
    }
    for (let c = 0; c < this.crystals.length; c++) {
      const m = this.crystals[c]!;
      const f = x[this.offCrystal + c]!;
      const h = -f * m.massG * m.latentRefJPerG;
      chem += h;
      if (chemOut) chemOut[this.offCrystal + c] = h;
      parts.melt += m.massG * (f * m.solidCp + (1 - f) * m.liquidCp);
    }
    for (let o = 0; o < this.oxidations.length; o++) {
      const m = this.oxidations[o]!;
      const xi = x[this.offOxidation + o]!;
      const h = xi * m.dH_kJ_per_mol_O2 * 1000;
      chem += h;
      if (chemOut) chemOut[this.offOxidation + o] = h;
      parts.metalAndOxide += (m.maxO2Mol - xi) * m.metalPerO2 * m.metalCpMolar + xi * m.oxidePerO2 * m.oxideCpMolar;
    }
    const ice = x[this.iceIndex]!;
    const hIce = -ice * L_ICE_REF_J_PER_G;
    chem += hIce;
    if (chemOut) chemOut[this.iceIndex] = hIce;
    parts.ice = ice * ICE_CP_J_PER_GK;
    for (const m of this.inerts) parts.inert += m.massG * m.cpJPerGK;
    const c =
      (parts.solution +
        parts.undissolvedSolids +
        parts.ice +
        parts.reactionSolids +
        parts.melt +
        parts.metalAndOxide +
        parts.inert +
        parts.packaging) *
      this.heatCapacityFactor;
    return { chemJ: chem, cJPerK: c, parts };
  }

  /** H(T, x), J, relative to the charged materials at 25 °C. */
  enthalpyJ(tempC: number, x: readonly number[]): number {
    const e = this.evaluate(x);
    return e.chemJ + e.cJPerK * (tempC - REFERENCE_TEMP_C);
  }

  /** Mass of each part, g. */
  massInventory(x: readonly number[]): MassInventory {
    const inv: MassInventory = {
      solutionG: 0,
      undissolvedG: 0,
      iceG: x[this.iceIndex]!,
      reactionSolidsG: 0,
      meltG: 0,
      metalAndOxideG: 0,
      inertG: 0,
      gainedG: 0,
      lostAsGasG: 0,
    };
    let dissolved = 0;
    this.solutes.forEach((s, j) => {
      dissolved += x[j]! * s.soluteMolarMass;
      inv.undissolvedG += (s.availableMol - x[j]!) * s.solidMolarMass;
    });
    inv.solutionG = this.liquidWaterG(x) + dissolved;
    this.reactions.forEach((m, r) => {
      const xi = x[this.offReaction + r]!;
      inv.reactionSolidsG += (m.maxExtentMol - xi) * m.countedReactantMassPerExtentG + xi * m.productMassPerExtentG;
      inv.gainedG += xi * m.externalReactantMassPerExtentG;
      inv.lostAsGasG += xi * m.gasMassPerExtentG;
    });
    for (const m of this.crystals) inv.meltG += m.massG;
    this.oxidations.forEach((m, o) => {
      const xi = x[this.offOxidation + o]!;
      inv.metalAndOxideG += (m.maxO2Mol - xi) * m.metalPerO2 * m.metalMolarMass + xi * m.oxidePerO2 * m.oxideMolarMass;
      inv.gainedG += xi * 31.998;
    });
    for (const m of this.inerts) inv.inertG += m.massG;
    return inv;
  }

  /**
   * Solubility of solute j at `tempC`, g anhydrous per 100 g water. Below 0 °C, when the
   * eutectic is known, interpolated linearly from the 0 °C value to the eutectic composition
   * (the solubility curve ends at the eutectic; the tables stop at 0 °C).
   */
  solubilityGPer100g(j: number, tempC: number): number {
    const s = this.solutes[j]!;
    if (tempC < 0 && s.eutectic) {
      const at0 = this.port.solubility_g_per_100g(s.soluteKey, 0);
      if (at0.warnings.length) this.warnings.addAll(at0.warnings, s.soluteKey);
      const w = s.eutectic.soluteMassFraction;
      const sE = (100 * w) / (1 - w);
      const t = Math.min(1, tempC / s.eutectic.tempC);
      return at0.value + (sE - at0.value) * t;
    }
    const r = this.port.solubility_g_per_100g(s.soluteKey, tempC);
    if (r.warnings.length) this.warnings.addAll(r.warnings, s.soluteKey);
    return Math.max(0, r.value);
  }

  /**
   * Most mol of solid j that can be dissolved at `tempC` when `otherWaterG` of liquid water
   * is present besides j's own released hydrate water: ξ·M_a = s/100·(W + h·ξ·M_w).
   */
  private capacityMol(j: number, tempC: number, otherWaterG: number): number {
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
      if (s.portFreezing) d = this.port.freezingPointDepression_K!(s.soluteKey, m);
      if (d === null) {
        // Colligative estimate ΔTf = ν·Kf·m / (1 + b·m); b = 0 (ideal) unless anchored to the eutectic.
        d = (s.ions * WATER_CRYOSCOPIC_K_KG_PER_MOL * m) / (1 + s.colligativeB * m);
        if (!s.eutectic) {
          this.warnings.add(
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

  /**
   * Equilibrium extents at `tempC` (end state): reactions complete (limited by water),
   * melts crystallised below their melting point, metals fully oxidised, solutes dissolved up
   * to solubility at `tempC`, and ice where the solution would freeze; below the eutectic
   * no liquid remains.
   */
  equilibriumExtents(tempC: number): number[] {
    const x = this.initialExtents();
    let water = this.waterBaseG;
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      let xi = m.maxExtentMol;
      if (m.waterPerExtent > 0) xi = Math.min(xi, water / (m.waterPerExtent * WATER_MOLAR_MASS_G_PER_MOL));
      xi = Math.max(0, xi);
      x[this.offReaction + r] = xi;
      water -= m.waterPerExtent * xi * WATER_MOLAR_MASS_G_PER_MOL;
    }
    for (let c = 0; c < this.crystals.length; c++) x[this.offCrystal + c] = tempC < this.crystals[c]!.meltingPointC ? 1 : 0;
    for (let o = 0; o < this.oxidations.length; o++) x[this.offOxidation + o] = this.oxidations[o]!.maxO2Mol;
    const ns = this.solutes.length;
    if (water <= 0) {
      // No liquid water left (all consumed by reactions): nothing dissolves, nothing freezes.
      return x;
    }
    // No ice: fixed point of ξ_j = min(available, capacity with the hydrate water of the others).
    const hydrateG = (xs: readonly number[], except: number) => {
      let g = 0;
      for (let k = 0; k < ns; k++) if (k !== except) g += this.solutes[k]!.hydrateWater * xs[k]! * WATER_MOLAR_MASS_G_PER_MOL;
      return g;
    };
    for (let iter = 0; iter < 50; iter++) {
      let change = 0;
      for (let j = 0; j < ns; j++) {
        const cap = this.capacityMol(j, tempC, water + hydrateG(x, j));
        const xi = Math.min(this.solutes[j]!.availableMol, cap);
        change = Math.max(change, Math.abs(xi - x[j]!));
        x[j] = xi;
      }
      if (change <= 1e-13) break;
    }
    if (tempC >= 0) return x;
    const liquidNoIce = this.liquidWaterG(x);
    const noIceDepression = this.freezingDepressionK(x.slice(0, ns), liquidNoIce);
    if (noIceDepression >= -tempC) return x;
    // Ice forms. Find the liquid water Wl at which the liquid's freezing point equals tempC,
    // with each solute dissolved up to solubility in Wl: ξ_j(Wl) = min(available, s_j·Wl/(100·M_j)).
    const sol = this.solutes.map((_, j) => this.solubilityGPer100g(j, tempC));
    const dissolvedAt = (wl: number): number[] =>
      this.solutes.map((s, j) => Math.min(s.availableMol, (sol[j]! * wl) / (100 * s.soluteMolarMass)));
    const residual = (wl: number) => this.freezingDepressionK(dissolvedAt(wl), wl) + tempC;
    // As Wl → 0 every solute saturates: the depression tends to that of the saturated solution.
    const tiny = Math.max(liquidNoIce * 1e-9, 1e-12);
    const fSat = residual(tiny);
    const fullyFrozen = () => {
      const y = x.slice();
      for (let j = 0; j < ns; j++) y[j] = 0;
      y[this.iceIndex] = Math.max(0, water);
      return y;
    };
    if (ns === 0 || fSat <= 0) return fullyFrozen();
    const fTop = residual(liquidNoIce);
    if (fTop >= 0) return x;
    const root = brentRoot(residual, tiny, liquidNoIce, { fa: fSat, fb: fTop, xTol: 1e-9 * liquidNoIce });
    const wl = root.x;
    const xi = dissolvedAt(wl);
    for (let j = 0; j < ns; j++) x[j] = xi[j]!;
    let allWater = water;
    for (let j = 0; j < ns; j++) allWater += this.solutes[j]!.hydrateWater * xi[j]! * WATER_MOLAR_MASS_G_PER_MOL;
    x[this.iceIndex] = Math.max(0, allWater - wl);
    return x;
  }

  /**
   * Rates dx/dt (per second) of every extent at temperature T and extents x: first-order
   * approach of each dissolved amount to the solubility-limited amount at T (k per solute),
   * of each reaction to completion (limited by liquid water), crystal growth driven by the
   * undercooling below the melting point, O2 uptake min(film supply, k·remaining metal), and
   * ice relaxing to the water–ice equilibrium of the current solution.
   */
  rates(tempC: number, x: readonly number[], out: number[]): void {
    const ns = this.solutes.length;
    const liquid = this.liquidWaterG(x);
    for (let j = 0; j < ns; j++) {
      const s = this.solutes[j]!;
      const own = s.hydrateWater * x[j]! * WATER_MOLAR_MASS_G_PER_MOL;
      const target = Math.max(0, Math.min(s.availableMol, this.capacityMol(j, tempC, liquid - own)));
      out[j] = s.kPerS * (target - x[j]!);
    }
    for (let r = 0; r < this.reactions.length; r++) {
      const m = this.reactions[r]!;
      const xi = x[this.offReaction + r]!;
      let target = m.maxExtentMol;
      if (m.waterPerExtent > 0) target = Math.min(target, xi + Math.max(0, liquid) / (m.waterPerExtent * WATER_MOLAR_MASS_G_PER_MOL));
      out[this.offReaction + r] = m.kPerS * Math.max(0, target - xi);
    }
    for (let c = 0; c < this.crystals.length; c++) {
      const m = this.crystals[c]!;
      const f = x[this.offCrystal + c]!;
      const drive = Math.min(1, Math.max(0, (m.meltingPointC - tempC) / m.drivingK));
      out[this.offCrystal + c] = m.kPerS * Math.max(0, 1 - f) * drive;
    }
    for (let o = 0; o < this.oxidations.length; o++) {
      const m = this.oxidations[o]!;
      if (m.o2SupplyMolPerS === null) {
        throw new ThermalModelError(
          `expected a film area for the air oxidation of ${m.label} (filmAreaM2, or the pack's size), found none`,
          { field: 'contact' },
        );
      }
      const remaining = Math.max(0, m.maxO2Mol - x[this.offOxidation + o]!);
      out[this.offOxidation + o] = Math.min(m.o2SupplyMolPerS, m.kPerS * remaining);
    }
    // Ice: relax to the ice mass at which the current solution freezes at T.
    const ice = x[this.iceIndex]!;
    const allWater = liquid + ice;
    let iceEq = 0;
    if (tempC < 0 && allWater > 0) {
      let dissolved = 0;
      for (let j = 0; j < ns; j++) dissolved += Math.max(0, x[j]!);
      if (dissolved <= 1e-12) {
        iceEq = allWater * Math.min(1, -tempC / ICE_SMOOTHING_K);
      } else {
        const xs = x.slice(0, ns).map((v) => Math.max(0, v));
        const dtAll = this.freezingDepressionK(xs, allWater);
        if (dtAll < -tempC) {
          const residual = (wl: number) => this.freezingDepressionK(xs, wl) + tempC;
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
    out[this.iceIndex] = (ICE_RATE_PER_MIN / 60) * (iceEq - ice);
  }
}
