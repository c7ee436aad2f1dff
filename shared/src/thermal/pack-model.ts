import { ThermalModelError } from './errors';
import { ingredientProcessSchema, type IngredientProcess, type IngredientProcessInput } from './process';
import { OxidationProcesses, type OxidationModel } from './processes/air-oxidation';
import { emptyInventory, emptyParts, WarningCollector, type HeatCapacityParts, type MassInventory, type ModelContext, type ProcessRef } from './processes/common';
import { DissolutionProcesses, type SoluteModel } from './processes/dissolution';
import { HydrateMelts, MeltProcesses, type CrystalModel } from './processes/hydrate-melting';
import { InertParts, type InertModel } from './processes/inert';
import { ReactionProcesses, type ReactionModel } from './processes/reaction';
import { WaterPhases } from './processes/water-phases';
import type { ChemistryPort } from './chemistry-port';
import { REFERENCE_TEMP_C, WATER_BOILING_POINT_C } from './constants';
import { setUpReactions } from './reaction-partners';

export { WarningCollector } from './processes/common';
export type { HeatCapacityParts, MassInventory, ProcessRef } from './processes/common';
export type { SoluteModel } from './processes/dissolution';
export type { ReactionModel } from './processes/reaction';
export type { CrystalModel } from './processes/hydrate-melting';
export type { OxidationModel } from './processes/air-oxidation';
export type { InertModel } from './processes/inert';

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

/**
 * Composer of the process modules (shared/src/thermal/processes/): it lays their extents out
 * in one state vector, sums their enthalpies, heat capacities and masses, and hands each the
 * pack-wide view it needs (the liquid water). Each module owns its own physics.
 */
export class PackModel {
  readonly warnings = new WarningCollector();
  readonly waterBaseG: number;
  readonly totalMassG: number;
  readonly packHeatCapacityJPerK: number;
  readonly heatCapacityFactor: number;
  readonly size: number;
  readonly iceIndex: number;
  readonly processes: ProcessRef[] = [];
  readonly dissolution: DissolutionProcesses;
  readonly reaction: ReactionProcesses;
  readonly melt: MeltProcesses;
  readonly hydrateMelt: HydrateMelts;
  readonly oxidation: OxidationProcesses;
  readonly inert: InertParts;
  readonly water: WaterPhases;

  constructor(
    port: ChemistryPort,
    components: readonly ThermalComponent[],
    options: PackModelOptions = {},
  ) {
    if (components.length === 0) {
      throw new ThermalModelError('expected at least one component in the pack, found none', { field: 'components' });
    }
    const ctx: ModelContext = { port, warnings: this.warnings };
    this.dissolution = new DissolutionProcesses(ctx);
    this.reaction = new ReactionProcesses(ctx);
    this.melt = new MeltProcesses();
    this.hydrateMelt = new HydrateMelts(this.dissolution);
    this.oxidation = new OxidationProcesses(ctx);
    this.inert = new InertParts();
    this.water = new WaterPhases(this.dissolution);
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
    const reactionSetup = setUpReactions(port, parsedComponents, water, options.reactionPartners ?? 'from-pack');
    for (const w of reactionSetup.warnings) this.warnings.add(w.warning, w.subject);
    this.reaction.reactions.push(...reactionSetup.reactions);
    for (const l of reactionSetup.leftovers) this.inert.add({ kind: 'inert', role: 'additive', cp_J_per_gK: l.cpJPerGK }, l.massG, l.label);
    parsedComponents.forEach((c, i) => {
      if (c.process.kind === 'reaction' || (c.process.kind === 'inert' && c.process.role === 'water')) return;
      this.addProcess(c.process, reactionSetup.massLeftG[i]!, c.label, options, c.field);
    });
    this.dissolution.finish();
    this.hydrateMelt.finish();
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
    // State layout: dissolution (solids, then precipitates) · reactions · melts · oxidations · water phases · hydrate melts.
    let offset = 0;
    for (const group of [this.dissolution, this.reaction, this.melt, this.oxidation, this.water, this.hydrateMelt]) {
      group.offset = offset;
      offset += group.size;
      this.processes.push(...group.refs());
    }
    this.size = offset;
    this.iceIndex = this.water.offset;
    if (this.solutes.length > 1) {
      this.warnings.add({
        code: 'thermal.mixed-solutes',
        message:
          'more than one solute: each solute\'s solubility is taken as in water alone (no common-ion effect) and its enthalpy of solution at the total solute concentration',
      });
    }
  }

  private addProcess(process: IngredientProcess, massG: number, label: string, options: PackModelOptions, field: string): void {
    switch (process.kind) {
      case 'inert':
        this.inert.add(process, massG, label);
        return;
      case 'dissolution':
        // Ice charged as an ingredient melts and joins the solution (water-phases module); it is not a solute.
        if (process.solidKey === 'H2O(cr)') this.water.addIce(massG);
        else this.dissolution.add(process, massG, label, field);
        return;
      case 'reaction':
        // Set up with their partners before the other processes (setUpReactions).
        return;
      case 'crystallisation':
        this.melt.add(process, massG, label);
        return;
      case 'air-oxidation':
        this.oxidation.add(process, massG, label, field, options.packAreaM2);
        return;
    }
  }

  get solutes(): readonly SoluteModel[] {
    return this.dissolution.solutes;
  }

  get reactions(): readonly ReactionModel[] {
    return this.reaction.reactions;
  }

  get crystals(): readonly CrystalModel[] {
    return this.melt.crystals;
  }

  get oxidations(): readonly OxidationModel[] {
    return this.oxidation.oxidations;
  }

  get inerts(): readonly InertModel[] {
    return this.inert.inerts;
  }

  /** Index of the first reaction, crystal and oxidation extent in x. */
  get offsets(): { reaction: number; crystal: number; oxidation: number; ice: number } {
    return { reaction: this.reaction.offset, crystal: this.melt.offset, oxidation: this.oxidation.offset, ice: this.iceIndex };
  }

  /** A size for each extent (its largest possible value), for tolerances and difference steps. */
  extentScales(): number[] {
    return [
      ...this.dissolution.scales(),
      ...this.reaction.scales(),
      ...this.melt.scales(),
      ...this.oxidation.scales(),
      ...this.water.scales(this.waterBaseG),
      ...this.hydrateMelt.scales(),
    ];
  }

  /** The charged state: nothing dissolved, reacted, crystallised, oxidised or frozen. */
  initialExtents(): number[] {
    return new Array<number>(this.size).fill(0);
  }

  /** Liquid water, g: charged water + hydrate water released − water consumed by reactions − water frozen (charged ice melted counts negative) − steam boiled off. */
  liquidWaterG(x: readonly number[]): number {
    return this.waterBaseG + this.dissolution.waterReleasedG(x) - this.reaction.waterConsumedG(x) - this.water.frozenG(x) - this.water.steamLostG(x);
  }

  /** Steam boiled off and gone from the pack at extents x, g. */
  steamLostG(x: readonly number[]): number {
    return this.water.steamLostG(x);
  }

  /** Fraction of solute j's charged solid in solution at extents x. */
  dissolvedFraction(j: number, x: readonly number[]): number {
    return this.dissolution.dissolvedFraction(x, j);
  }

  /** Ice in the pack at extents x, g. */
  iceG(x: readonly number[]): number {
    return this.water.iceG(x);
  }

  /**
   * Enthalpy terms of the processes at 25 °C, J (index as in `processes`), and the heat
   * capacities of the parts, J/K, at extents x.
   */
  evaluate(x: readonly number[], chemOut?: number[]): { chemJ: number; cJPerK: number; parts: HeatCapacityParts } {
    const waterG = this.liquidWaterG(x);
    const parts = emptyParts(this.packHeatCapacityJPerK);
    let chem = this.dissolution.evaluate(x, waterG, parts, chemOut);
    chem += this.reaction.evaluate(x, parts, chemOut);
    chem += this.melt.evaluate(x, parts, chemOut);
    chem += this.oxidation.evaluate(x, parts, chemOut);
    chem += this.water.evaluate(x, parts, chemOut);
    chem += this.hydrateMelt.evaluate(x, parts, chemOut);
    this.inert.evaluate(parts);
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
    const inv = emptyInventory();
    this.dissolution.mass(x, this.liquidWaterG(x), inv);
    this.reaction.mass(x, inv);
    this.melt.mass(inv);
    this.oxidation.mass(x, inv);
    this.water.mass(x, inv);
    this.hydrateMelt.mass(x, inv);
    this.inert.mass(inv);
    return inv;
  }

  /** Solubility of solute j at `tempC`, g anhydrous per 100 g water (dissolution module). */
  solubilityGPer100g(j: number, tempC: number): number {
    return this.dissolution.solubilityGPer100g(j, tempC);
  }

  /** Freezing-point depression, K, of a solution of the dissolved mol in `waterG` of liquid water. */
  freezingDepressionK(dissolvedMol: readonly number[], waterG: number): number {
    return this.dissolution.freezingDepressionK(dissolvedMol, waterG);
  }

  /**
   * Equilibrium extents at `tempC` (end state): reactions complete (limited by water),
   * melts crystallised below their melting point, metals fully oxidised, solutes dissolved up
   * to solubility at `tempC`, and ice where the solution would freeze; below the eutectic
   * no liquid remains; above the boiling point the liquid water has left as steam.
   */
  equilibriumExtents(tempC: number): number[] {
    const x = this.initialExtents();
    this.water.meltAll(x);
    const water = this.reaction.equilibrium(x, this.waterBaseG + this.water.chargedIceG);
    this.melt.equilibrium(tempC, x);
    this.hydrateMelt.equilibrium(tempC, x);
    this.oxidation.equilibrium(x);
    // Above the boiling point (1 atm) the liquid water has boiled off and left as steam.
    if (tempC > WATER_BOILING_POINT_C) {
      this.water.boilAll(x, water);
      return x;
    }
    // No liquid water left (all consumed by reactions): nothing dissolves, nothing freezes.
    if (water <= 0) return x;
    this.dissolution.equilibriumNoIce(tempC, x, water);
    this.water.equilibrium(tempC, x, this.liquidWaterG(x), water);
    return x;
  }

  /** Rates dx/dt (per second) of every extent at temperature T and extents x (each module's kinetics). */
  rates(tempC: number, x: readonly number[], out: number[]): void {
    const liquid = this.liquidWaterG(x);
    this.dissolution.rates(tempC, x, liquid, out);
    this.reaction.rates(x, liquid, out);
    this.melt.rates(tempC, x, out);
    this.oxidation.rates(x, out);
    this.water.rates(tempC, x, liquid, out, () => this.evaluate(x).cJPerK);
    this.hydrateMelt.rates(tempC, x, out);
  }
}
