import type { Brief, ConcentrationCap, ConstraintKind } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import { INERT_CP_J_PER_GK, REFERENCE_TEMP_C, WATER_CP_J_PER_GK, WATER_MOLAR_MASS_G_PER_MOL } from '../thermal/constants';
import { PackModel } from '../thermal/pack-model';
import { ingredientProcessSchema, type IngredientProcess, type ReactionProcess } from '../thermal/process';
import { reactionSignature, suppliesReactant } from '../thermal/reaction-partners';
import { resolveHeatExchange } from '../evaluation/heat-exchange';
import { lumpedLoad } from '../evaluation/load';
import type { IngredientSet, OptimiserIngredient, OptimiserWarning } from './types';

/**
 * The optimiser's linear model of one ingredient set at the target temperature.
 *
 * Variables: grams m_i of each ingredient of the set. Every coefficient below is "per gram of
 * ingredient i" and is read from the same PackModel the time model integrates (one PackModel of
 * 1 g per ingredient), so the linear model and the simulation share their thermodynamics.
 *
 * Energy. The pack's enthalpy relative to the charged materials at 25 °C is (PackModel)
 *   H(T, x) = Σ_i H_i(x) + C(x)·(T − 25 °C).
 * With every process complete (all salt dissolved, reactions done, melt crystallised, metal
 * oxidised) at the end temperature T, and Q_in the heat gained from the surroundings
 * (negative when lost), the first law H(T, x_end) = H(T₀, x₀) + Q_in gives, per gram,
 *   s·h_i − s·[c_f,i·(T₀ − T) + (c_f,i − c_0,i)·(25 − T₀)]      ("useful heat" u_i(T), J/g)
 * where h_i is the heat the process absorbs at 25 °C (J/g; negative = released), c_0,i and
 * c_f,i the ingredient's heat capacity before and after (J/(g·K)), and s = +1 for a cold pack,
 * −1 for a warm one. The pack is at or beyond T at the end of the hold exactly when
 *   Σ u_i(T)·m_i ≥ Q_ex + s·C_pack·(T₀ − T),   Q_ex = s·UA·(T_env − T)·t_hold
 * (the heat budget; the second term is the packaging's sensible heat).
 * Example: 40 g NH4NO3 (ΔsolH ≈ 21 kJ/mol at n ≈ 11) in 100 g water: h = 21e3/80.04 ≈ 262 J/g;
 * a 5 °C target from 25 °C leaves u ≈ 262 − 1.6·20 ≈ 230 J/g for the salt and −4.18·20 ≈ −84
 * J/g for the water.
 *
 * Every linearisation: see {@link ingredientCoefficients} (per-gram figures) and
 * {@link buildLinearModel} (the rows).
 */

/** Molar volume of an ideal gas at 25 °C and 1 atm, L/mol: R·T/p = 8.314462618·298.15/101325 × 1000. */
export const GAS_MOLAR_VOLUME_L_PER_MOL = (8.314462618 * 298.15) / 101325 * 1000;

/** Lowest solute mass fraction the apparent heat capacity is evaluated at (see ingredientCoefficients). */
export const MIN_CP_MASS_FRACTION = 0.01;

/** The concentration the enthalpy of solution and the solution heat capacity are evaluated at. */
export interface ConcentrationEstimate {
  /** Mol of liquid water per mol of dissolved solute (all solutes together); Infinity: infinite dilution. */
  nH2O_per_mol: number;
  /** Mass fraction of all dissolved (anhydrous) solute in the solution. */
  soluteMassFraction: number;
}

/** What a brief asks, in the linear model's terms (SI-adjacent, units in names). */
export interface ThermalContext {
  packType: 'cold' | 'warm';
  /** +1 cold (heat absorbed is useful), −1 warm (heat released is useful). */
  sign: 1 | -1;
  targetTempC: number;
  initialTempC: number;
  /** Temperature the pack exchanges heat with, °C (ambient, or skin and ambient for skin contact). */
  envTempC: number;
  uaWPerK: number;
  holdS: number;
  reachWithinS: number;
  packAreaM2: number;
  packaging: { massG: number; heatCapacityJPerK: number; cost: number };
  /** The brief's load as a heat budget: its heat capacity, start and leak to its surroundings (evaluation/load.ts); null without one. */
  load: { heatCapacityJPerK: number; initialTempC: number; uaToEnvWPerK: number; envTempC: number } | null;
  maxMassG: number;
  maxUnitCost: number | null;
  maxGasL: number;
  /** Cold packs: coldest allowed; warm packs: warmest allowed; null: none. */
  surfaceLimitC: number | null;
  caps: ConcentrationCap[];
  objective: Brief['objective'];
  /**
   * Heat added to the heat-budget row's right-hand side, J (default 0): the correction a set's
   * simulated shortfall asks for (run-optimisation.ts, "closing the loop"). The objective keeps
   * the uncorrected budget, so objective values stay comparable across sets.
   */
  heatBudgetCorrectionJ?: number;
}

/**
 * The linear model's view of a brief: UA and exchange temperature from the contact case
 * ({@link resolveHeatExchange}), times
 * in seconds, money as numbers (decimal strings parsed once here), the surface limit that
 * matters for the pack type (cold: minSurfaceTempC; warm: maxSurfaceTempC) and any extra
 * concentration caps (from the hazards module).
 *
 * @example thermalContext(briefSchema.parse({ name: 'x' })).uaWPerK // ≈ 0.28 (still air, about 9.4 W/(m²·K) × 0.03 m²)
 */
export function thermalContext(brief: Brief, extraCaps: readonly ConcentrationCap[] = [], uaMultiplier = 1): ThermalContext {
  const sign = brief.packType === 'cold' ? 1 : -1;
  const exchange = resolveHeatExchange(brief, uaMultiplier);
  return {
    packType: brief.packType,
    sign,
    targetTempC: brief.targetTempC,
    initialTempC: brief.initialTempC,
    envTempC: exchange.envTempC,
    uaWPerK: exchange.uaWPerK,
    holdS: brief.holdMin * 60,
    reachWithinS: brief.reachWithinMin * 60,
    packAreaM2: brief.packAreaM2,
    packaging: { massG: brief.packaging.massG, heatCapacityJPerK: brief.packaging.heatCapacityJPerK, cost: Number(brief.packaging.cost) },
    load: brief.load ? lumpedLoad(brief.load, brief.ambientC) : null,
    maxMassG: brief.maxMassG,
    maxUnitCost: brief.maxUnitCost === null ? null : Number(brief.maxUnitCost),
    maxGasL: brief.maxGasL,
    surfaceLimitC: brief.packType === 'cold' ? brief.minSurfaceTempC : brief.maxSurfaceTempC,
    caps: [...brief.concentrationCaps, ...extraCaps],
    objective: brief.objective,
  };
}

/** Per-gram figures of one ingredient at the target and a concentration estimate. */
export interface IngredientCoefficients {
  ingredient: OptimiserIngredient;
  kind: 'dissolution' | 'reaction' | 'crystallisation' | 'air-oxidation' | 'water' | 'inert' | 'hydrate-melting';
  /** Heat the process absorbs per gram at 25 °C, J/g (negative: released). */
  heatAbsorbedJPerG: number;
  /** Heat capacity per gram as charged, J/(g·K). */
  cpInitialJPerGK: number;
  /** Heat capacity per gram once its process is complete, J/(g·K) (dissolved: apparent cp in the solution). */
  cpFinalJPerGK: number;
  /** Liquid water the ingredient adds (water 1; hydrate water released) or takes (reactions), g per g. */
  liquidWaterGPerG: number;
  /** Anhydrous solute it puts into solution, g per g (dissolving solids). */
  soluteGPerG: number;
  /** Mol of solute it puts into solution per g. */
  soluteMolPerG: number;
  /** Solubility of its solute at the target, g anhydrous per 100 g water (dissolving solids), else null. */
  solubilityGPer100g: number | null;
  /** Gas evolved, L at 25 °C and 1 atm per g. */
  gasLPerG: number;
  /** O2 taken up on full oxidation, mol per g (air oxidation). */
  o2MolPerG: number;
  /** O2 the film can supply, mol/s (air oxidation with a known film area), else null. */
  o2SupplyMolPerS: number | null;
  /** Intrinsic first-order oxidation rate constant, 1/s (air oxidation), else 0. */
  oxidationRatePerS: number;
  /** Melting point, °C (crystallisation): above it the melt cannot crystallise. */
  meltingPointC: number | null;
  costPerG: number;
  warnings: OptimiserWarning[];
  /**
   * A reaction member's partners in its set (set-aware coefficients, {@link setCoefficients}):
   * the member that brings each other reactant and how many grams of it one gram of this one
   * consumes. The partner-stoichiometry row keeps this one the limiting reagent.
   */
  reactionPartners?: ReactionPartner[];
  /**
   * A second column of a dissolving salt hydrate (same ingredient): the grams of it that stay
   * undissolved and melt (hydrate-melting module), by the index of its dissolving column.
   */
  meltOf?: number;
}

/** Who brings a reactant of a reaction member, and how much of it one gram of the member takes. */
export interface ReactionPartner {
  /** Index of the partner in the set's members. */
  index: number;
  ingredientId: string;
  reactantKey: string;
  /** Grams of the partner one gram of the reaction member consumes: ν_t·M_t / (ν_A·M_A). */
  gPerG: number;
}

/** An ingredient parsed once per run: a PackModel holding 1 g of it. */
export interface ParsedIngredient {
  ingredient: OptimiserIngredient;
  model: PackModel;
  costPerG: number;
  /** The ingredient's process as the schema reads it (defaults filled), parsed once per run. */
  process: IngredientProcess;
}

/**
 * Parse an ingredient once: a PackModel of 1 g of it (so every per-gram figure below is the
 * time model's own), and its cost per gram, costPerKg/1000.
 * Throws the PackModel's ThermalModelError when the process is invalid.
 */
export function parseIngredient(port: ChemistryPort, ingredient: OptimiserIngredient, packAreaM2: number): ParsedIngredient {
  const process = ingredient.process ?? {
    kind: 'inert' as const,
    role: ingredient.role === 'solvent' ? ('water' as const) : ingredient.role === 'packaging' ? ('packaging' as const) : ('additive' as const),
    ...(ingredient.cpJPerGK ? { cp_J_per_gK: ingredient.cpJPerGK } : {}),
  };
  // Per gram of this ingredient alone: a reaction's partners are other ingredients with their own
  // coefficients (the ingredient's `needs` bring them), so here they are taken as present.
  const model = new PackModel(port, [{ key: ingredient.id, massG: 1, process }], { packAreaM2, reactionPartners: 'assumed' });
  const cost = Number(ingredient.costPerKg);
  if (!(Number.isFinite(cost) && cost >= 0)) {
    throw new RangeError(`ingredient ${ingredient.id}: expected costPerKg ≥ 0 as a decimal, found ${String(ingredient.costPerKg)}`);
  }
  return { ingredient, model, costPerG: cost / 1000, process: ingredientProcessSchema.parse(process) };
}

/** True when the ingredient is water (the solvent). */
export function isWater(p: ParsedIngredient): boolean {
  return p.model.waterBaseG > 0;
}

/**
 * Per-gram coefficients of a parsed ingredient at the target temperature T* and a concentration
 * estimate. The formulas (J, g, K, mol; 25 °C is the data's reference):
 *
 * - dissolution of a solid of molar mass M_s (anhydrous solute M_a, w mol of crystal water):
 *   h = [ΔsolH(solute, n) + ΔH_dehydration]·1000/M_s, with ΔsolH the integral enthalpy of
 *   solution at the estimate's n (NBS 1982 dilution data via the chemistry layer) and
 *   ΔH_dehydration = ΔfH(anhydrous) + w·ΔfH(H2O,l) − ΔfH(hydrate) (Hess's law);
 *   c_0 = Cp°(solid)/M_s; c_f = (M_a/M_s)·cp_app(w_s) + w·M_w/M_s·cp_w, cp_app the solute's
 *   apparent specific heat in its binary solution at the total solute fraction w_s (Laliberté
 *   2009), cp_w = 4.1813 J/(g·K); water released w·M_w/M_s g/g; solute M_a/M_s g/g;
 *   solubility s(T*) g/100 g water (CRC via the chemistry layer; below 0 °C towards the eutectic).
 *   Example: NH4NO3 at n = 11: h ≈ 20.7e3/80.04 ≈ 259 J/g.
 * - reaction, per gram of the reactant mixture the ingredient holds (M_r g per mol of reaction):
 *   h = ΔrH·1000/M_r (Hess's law from ΔfH°, or the stored ΔrH); water consumed ν_w·M_w/M_r g/g
 *   (taken from the liquid water); gas ν_g·V_m/M_r L/g with V_m = 24.465 L/mol;
 *   c_0 = Cp(reactants)/M_r, c_f = Cp(solid products)/M_r − (ν_w·M_w/M_r)·cp_w (the consumed
 *   water no longer counts as liquid). Example: CaO + H2O → Ca(OH)2, ΔrH ≈ −65.2 kJ/mol,
 *   h ≈ −1163 J/g of CaO, water 0.321 g/g.
 * - crystallisation of a supercooled melt: h = −L₂₅ with L₂₅ = L(T_m) − (c_l − c_s)(T_m − 25)
 *   (Kirchhoff); c_0 = c_l, c_f = c_s; 0 when T* ≥ T_m (a melt cannot crystallise above its
 *   melting point). Example: sodium acetate trihydrate, L = 264 J/g at 58 °C → h ≈ −228 J/g.
 * - air oxidation of a metal: h = ΔH per mol O2 × mol O2 per g (4Fe + 3O2 → 2Fe2O3:
 *   −1648/3 kJ per mol O2, 3/(4·55.845) mol O2 per g → ≈ −7.4 kJ/g); c_0 = Cp(metal)/M,
 *   c_f = Cp(oxide) per g of metal; O2 per g for the supply row.
 * - water: c_0 = c_f = cp_w, adds 1 g/g of liquid water; inert additives: c_0 = c_f = their cp.
 * Cost per gram = costPerKg/1000. Heat capacities are held at their 25 °C values, as in the
 * time model.
 */
export function ingredientCoefficients(p: ParsedIngredient, targetTempC: number, estimate: ConcentrationEstimate, port: ChemistryPort): IngredientCoefficients {
  const m = p.model;
  const base: IngredientCoefficients = {
    ingredient: p.ingredient,
    kind: 'inert',
    heatAbsorbedJPerG: 0,
    cpInitialJPerGK: 0,
    cpFinalJPerGK: 0,
    liquidWaterGPerG: 0,
    soluteGPerG: 0,
    soluteMolPerG: 0,
    solubilityGPer100g: null,
    gasLPerG: 0,
    o2MolPerG: 0,
    o2SupplyMolPerS: null,
    oxidationRatePerS: 0,
    meltingPointC: null,
    costPerG: p.costPerG,
    warnings: [],
  };
  if (m.waterBaseG > 0) {
    return { ...base, kind: 'water', cpInitialJPerGK: WATER_CP_J_PER_GK, cpFinalJPerGK: WATER_CP_J_PER_GK, liquidWaterGPerG: 1 };
  }
  const s = m.solutes[0];
  if (s) {
    const n = estimate.nH2O_per_mol;
    let dsol: number;
    if (n === Infinity) dsol = port.infiniteDilutionEnthalpy_kJ_per_mol(s.soluteKey);
    else {
      const r = port.integralSolutionEnthalpy_kJ_per_mol(s.soluteKey, n);
      base.warnings.push(...r.warnings);
      dsol = r.value;
    }
    // As the time model: the apparent cp at the total solute fraction (at most 0.95), at 25 °C;
    // at least 0.01, since Laliberté's (1 − w_w)^a6 term diverges at infinite dilution for a6 < 0.
    const app = port.apparentSoluteCp_J_per_gK(s.soluteKey, Math.min(Math.max(estimate.soluteMassFraction, MIN_CP_MASS_FRACTION), 0.95), REFERENCE_TEMP_C);
    base.warnings.push(...app.warnings);
    const cpApp = app.value;
    const molPerG = 1 / s.solidMolarMass;
    const waterReleased = s.hydrateWater * WATER_MOLAR_MASS_G_PER_MOL * molPerG;
    const soluteG = s.soluteMolarMass * molPerG;
    return {
      ...base,
      kind: 'dissolution',
      heatAbsorbedJPerG: (dsol + s.dehydration_kJ_per_mol) * 1000 * molPerG,
      cpInitialJPerGK: s.solidCpJPerGK,
      cpFinalJPerGK: soluteG * cpApp + waterReleased * WATER_CP_J_PER_GK,
      liquidWaterGPerG: waterReleased,
      soluteGPerG: soluteG,
      soluteMolPerG: molPerG,
      solubilityGPer100g: m.solubilityGPer100g(0, targetTempC),
      warnings: [...base.warnings, ...m.warnings.list()],
    };
  }
  if (m.reactions.length) return { ...base, ...reactionCoefficients(m) };
  const c = m.crystals[0];
  if (c) {
    const active = targetTempC < c.meltingPointC;
    return {
      ...base,
      kind: 'crystallisation',
      heatAbsorbedJPerG: active ? -c.latentRefJPerG : 0,
      cpInitialJPerGK: c.liquidCp,
      cpFinalJPerGK: active ? c.solidCp : c.liquidCp,
      meltingPointC: c.meltingPointC,
      warnings: m.warnings.list(),
    };
  }
  const o = m.oxidations[0];
  if (o) {
    const o2 = o.maxO2Mol; // mol O2 per g of metal
    return {
      ...base,
      kind: 'air-oxidation',
      heatAbsorbedJPerG: o.dH_kJ_per_mol_O2 * 1000 * o2,
      cpInitialJPerGK: o2 * o.metalPerO2 * o.metalCpMolar,
      cpFinalJPerGK: o2 * o.oxidePerO2 * o.oxideCpMolar,
      o2MolPerG: o2,
      o2SupplyMolPerS: o.o2SupplyMolPerS,
      oxidationRatePerS: o.kPerS,
      warnings: m.warnings.list(),
    };
  }
  const inert = m.inerts[0];
  const cp = inert?.cpJPerGK ?? INERT_CP_J_PER_GK.additive;
  return { ...base, kind: 'inert', cpInitialJPerGK: cp, cpFinalJPerGK: cp };
}

/**
 * The reaction part of a pack model, per gram of what it holds: ΔrH·ξ_max summed over its
 * reactions, the counted reactants' and the products' heat capacities, the water taken and the
 * gas evolved, plus what the reactions leave unused (reaction-partners.ts: an inert solid).
 * With no partner in the model a reaction's ξ_max is 0, and the ingredient is that inert solid.
 */
function reactionCoefficients(m: PackModel): Pick<IngredientCoefficients, 'kind' | 'heatAbsorbedJPerG' | 'cpInitialJPerGK' | 'cpFinalJPerGK' | 'liquidWaterGPerG' | 'gasLPerG' | 'warnings'> {
  let heat = 0;
  let cp0 = 0;
  let cpf = 0;
  let water = 0;
  let gas = 0;
  for (const r of m.reactions) {
    const ext = r.maxExtentMol;
    const waterTaken = r.waterPerExtent * WATER_MOLAR_MASS_G_PER_MOL * ext;
    heat += r.dH_kJ_per_mol * 1000 * ext;
    cp0 += r.countedReactantCpPerExtent * ext;
    cpf += r.productCpPerExtent * ext - waterTaken * WATER_CP_J_PER_GK;
    water -= waterTaken;
    gas += r.gasMolPerExtent * ext * GAS_MOLAR_VOLUME_L_PER_MOL;
  }
  for (const l of m.inerts) {
    cp0 += l.massG * l.cpJPerGK;
    cpf += l.massG * l.cpJPerGK;
  }
  return { kind: 'reaction', heatAbsorbedJPerG: heat, cpInitialJPerGK: cp0, cpFinalJPerGK: cpf, liquidWaterGPerG: water, gasLPerG: gas, warnings: m.warnings.list() };
}

const setModels = new WeakMap<ParsedIngredient, Map<string, PackModel>>();

/** A PackModel of 1 g of a reaction member and its partners at the given grams, partners from the pack (cached per member and partners). */
function reactionModel(port: ChemistryPort, lead: ParsedIngredient, partners: readonly { p: ParsedIngredient; massG: number }[], packAreaM2: number): PackModel {
  const key = partners.map((q) => `${q.p.ingredient.id}:${q.massG}`).join('|');
  let byKey = setModels.get(lead);
  if (!byKey) setModels.set(lead, (byKey = new Map()));
  let m = byKey.get(key);
  if (!m) {
    const components = [lead, ...partners.map((q) => q.p)].map((p, i) => ({ key: p.ingredient.id, massG: i === 0 ? 1 : partners[i - 1]!.massG, process: p.process }));
    m = new PackModel(port, components, { packAreaM2, reactionPartners: 'from-pack' });
    byKey.set(key, m);
  }
  return m;
}

/**
 * Per-gram coefficients of every member of a set, with each reaction's partners taken from the
 * set as the time model takes them from the pack (reaction-partners.ts, one computation):
 *
 * - a reaction member A whose other reactants t are brought by members k (a dissolving solid of
 *   species t, or a member with the same reaction whose own reactant is t) is the limiting
 *   reagent: one gram of A consumes r_k = ν_t·M_t/(ν_A·M_A) g of k, and the row
 *   m_k − Σ_A r_k·m_A ≥ 0 (partner-stoichiometry) keeps it so. A's coefficients are those of a
 *   PackModel of 1 g of A with r_k g of each partner (the reaction at ξ_max = 1/(ν_A·M_A)),
 *   less r_k times k's own coefficients (the partner grams it consumes do not dissolve), so
 *   Σ m·coefficients is the pack's figure whenever the row holds. Example: Ba(OH)2·8H2O +
 *   2 NH4Cl: r = 2 × 53.49 / 315.46 ≈ 0.339 g NH4Cl per g.
 * - a reaction member with a reactant no member brings contributes no reaction heat: its
 *   coefficients are those of a PackModel of it alone with partners from the pack (the reaction
 *   does not run; it stays as an inert solid, and its warning says so).
 * - of several members with the same reaction, the first is the one the row is written for; the
 *   others are its partners.
 * - every other member: {@link ingredientCoefficients}.
 * - a dissolving salt hydrate that melts (hydrate-melting.ts: CaCl2·6H2O, Na2SO4·10H2O, …) gets
 *   a second column, appended after the members, when the module's equilibrium has it molten at
 *   the end temperature T* (T* ≥ T_m): grams that stay undissolved and melt, absorbing
 *   L₂₅ = L(T_m) − (c_l − c_s)(T_m − 25 °C) per gram (Kirchhoff), c_0 = c_s, c_f = c_l, no
 *   water or solute. Charged solid, the hydrate has then crossed its melting point on the way
 *   to T*; with T* below T_m a melt freezes again by the end and its net heat of fusion is 0, so
 *   no column. Example: CaCl2·6H2O, L = 187 J/g at 29.8 °C.
 */
export function setCoefficients(parsed: readonly ParsedIngredient[], ctx: Pick<ThermalContext, 'targetTempC' | 'packAreaM2'>, estimate: ConcentrationEstimate, port: ChemistryPort): IngredientCoefficients[] {
  const processes = parsed.map((p) => p.process);
  const out = parsed.map((p) => ingredientCoefficients(p, ctx.targetTempC, estimate, port));
  const leads = new Map<string, number>();
  const alone = (i: number): IngredientCoefficients => ({ ...out[i]!, ...reactionCoefficients(reactionModel(port, parsed[i]!, [], ctx.packAreaM2)) });
  processes.forEach((q, i) => {
    if (q?.kind !== 'reaction' || q.basis === 'premix') return;
    const sig = reactionSignature(q);
    if (!leads.has(sig)) leads.set(sig, i);
    else out[i] = alone(i);
  });
  for (const i of leads.values()) {
    const q = processes[i] as ReactionProcess;
    const sig = reactionSignature(q);
    const own = q.reactants.find((t) => t.key === q.ingredientKey)!;
    const partners: ReactionPartner[] = [];
    let missing = false;
    for (const t of q.reactants) {
      if (t.key === 'H2O(l)' || t.key === q.ingredientKey) continue;
      const k = processes.findIndex((o, j) => j !== i && suppliesReactant(o, t.key, sig));
      if (k < 0) {
        missing = true;
        break;
      }
      const gPerG = (t.coef * port.molarMass_g_per_mol(t.key)) / (own.coef * port.molarMass_g_per_mol(q.ingredientKey));
      partners.push({ index: k, ingredientId: parsed[k]!.ingredient.id, reactantKey: t.key, gPerG });
    }
    if (missing) {
      out[i] = alone(i);
      continue;
    }
    if (!partners.length) continue;
    const model = reactionModel(port, parsed[i]!, partners.map((r) => ({ p: parsed[r.index]!, massG: r.gPerG })), ctx.packAreaM2);
    const c: IngredientCoefficients = { ...out[i]!, ...reactionCoefficients(model), reactionPartners: partners };
    for (const r of partners) {
      const k = out[r.index]!;
      c.heatAbsorbedJPerG -= r.gPerG * k.heatAbsorbedJPerG;
      c.cpInitialJPerGK -= r.gPerG * k.cpInitialJPerGK;
      c.cpFinalJPerGK -= r.gPerG * k.cpFinalJPerGK;
      c.liquidWaterGPerG -= r.gPerG * k.liquidWaterGPerG;
      c.soluteGPerG -= r.gPerG * k.soluteGPerG;
      c.soluteMolPerG -= r.gPerG * k.soluteMolPerG;
      c.gasLPerG -= r.gPerG * k.gasLPerG;
    }
    out[i] = c;
  }
  // Salt hydrates that melt: a column for the undissolved grams when they are molten at the end.
  const end = new Array<number>(0);
  parsed.forEach((p, j) => {
    const melt = p.model.hydrateMelt.melts[0];
    const solute = p.model.solutes[0];
    if (!melt || !solute || out[j]!.kind !== 'dissolution') return;
    end.length = p.model.size;
    end.fill(0);
    p.model.hydrateMelt.equilibrium(ctx.targetTempC, end);
    if (end[p.model.hydrateMelt.offset] !== 1) return;
    out.push({
      ...out[j]!,
      kind: 'hydrate-melting',
      heatAbsorbedJPerG: melt.latentRefJPerG,
      cpInitialJPerGK: solute.solidCpJPerGK,
      cpFinalJPerGK: melt.data.liquidCpJPerGK,
      liquidWaterGPerG: 0,
      soluteGPerG: 0,
      soluteMolPerG: 0,
      solubilityGPer100g: null,
      meltingPointC: melt.data.meltingPointC,
      meltOf: j,
      warnings: [],
    });
  });
  return out;
}

/**
 * Grams of each ingredient of a composition, in member order: a hydrate's melting column joins
 * its dissolving column (one ingredient, one line).
 */
export function gramsByIngredient(coefficients: readonly IngredientCoefficients[], massesG: readonly number[]): { ingredient: OptimiserIngredient; massG: number }[] {
  const out = new Map<string, { ingredient: OptimiserIngredient; massG: number }>();
  coefficients.forEach((c, i) => {
    const e = out.get(c.ingredient.id);
    if (e) e.massG += massesG[i] ?? 0;
    else out.set(c.ingredient.id, { ingredient: c.ingredient, massG: massesG[i] ?? 0 });
  });
  return [...out.values()];
}

/**
 * Useful heat of one gram at end temperature T, J/g (see the module comment):
 *   u(T) = s·h − s·[c_f·(T₀ − T) + (c_f − c_0)·(25 − T₀)].
 *
 * @example usefulHeatJPerG({ heatAbsorbedJPerG: 262, cpFinalJPerGK: 1.6, cpInitialJPerGK: 1.6, … }, ctx(cold, T₀ = 25), 5) // → 230
 */
export function usefulHeatJPerG(c: Pick<IngredientCoefficients, 'heatAbsorbedJPerG' | 'cpInitialJPerGK' | 'cpFinalJPerGK'>, ctx: Pick<ThermalContext, 'sign' | 'initialTempC'>, endTempC: number): number {
  const t0 = ctx.initialTempC;
  return ctx.sign * c.heatAbsorbedJPerG - ctx.sign * (c.cpFinalJPerGK * (t0 - endTempC) + (c.cpFinalJPerGK - c.cpInitialJPerGK) * (REFERENCE_TEMP_C - t0));
}

/** One linear constraint Σ a_i·m_i (≤ | ≥) rhs, in the constraint's natural unit. */
export interface LinearConstraint {
  id: string;
  kind: ConstraintKind;
  label: string;
  coefficients: number[];
  sense: 'le' | 'ge';
  rhs: number;
  /** Unit of rhs and of Σ a_i·m_i: `J`, `g`, `currency`, `L`, `mol`, `W`. */
  unit: string;
  /** Size of "one unit" for sensitivity, in `unit` (1 kJ = 1000 J, 1 g, 1 currency unit, 1 L, 1 mmol). */
  unitStep: number;
  unitLabel: string;
}

export interface LinearObjective {
  sense: 'min' | 'max';
  coefficients: number[];
  /** Added to Σ c_i·m_i to give the reported value (packaging cost or mass, minus the heat budget). */
  constant: number;
  unit: string;
}

export interface LinearModel {
  set: IngredientSet;
  coefficients: IngredientCoefficients[];
  constraints: LinearConstraint[];
  objective: LinearObjective;
  /** Useful heat per gram at the target, J/g (the heat-budget row). */
  usefulHeatJPerG: number[];
  /** Right-hand side of the heat budget, J. */
  heatBudgetJ: number;
  /** UA·|T_env − T*|·60, J per minute of hold (0: no exchange). */
  exchangeJPerMin: number;
  context: ThermalContext;
  estimate: ConcentrationEstimate;
}

/**
 * The rows of the LP of one set (variables m_i ≥ 0, grams, in set order), all linear at the
 * target T*:
 *
 * - heat-budget (≥, J): Σ u_i(T*)·m_i ≥ s·UA·(T_env − T*)·t_hold + s·UA·(T_env − (T₀ + T*)/2)·t_reach
 *   + s·C_pack·(T₀ − T*): the leak over the hold at the target, the leak while reaching it at
 *   the mean of start and target (not below 0), and the packaging's sensible heat.
 * - solubility, one per dissolving solid j (≤, g): enough liquid water to dissolve it at T*:
 *   a_j·m_j − s_j(T*)/100 · Σ_i w_i·m_i ≤ 0, a_j = anhydrous g per g, w_i = liquid water per g
 *   (water 1, hydrate water released, reaction water taken). Each solute in water alone, as in
 *   the time model (no common-ion effect).
 * - water-for-reaction (≥, g), when a reaction takes water: Σ_i w_i·m_i ≥ 0.
 * - total-mass (≤, g): Σ m_i ≤ maxMassG − packaging.massG.
 * - unit-cost (≤, currency), when limited: Σ p_i·m_i ≤ maxUnitCost − packaging.cost.
 * - gas (≤, L at 25 °C), when a member evolves gas: Σ g_i·m_i ≤ maxGasL.
 * - surface-temperature (≤, J), when limited (cold: minSurfaceTempC, warm: maxSurfaceTempC):
 *   even adiabatically the pack may not pass the limit T_lim:
 *   Σ u_i(T_lim)·m_i ≤ s·C_pack·(T₀ − T_lim). Conservative: it assumes everything dissolves or
 *   reacts before any heat is exchanged. Air oxidation is left out of it (its heat comes at
 *   the film-limited rate over hours); the verification checks its peak.
 * - air oxidation with a known film area (iron warmers): O2 enters at the film's rate Ṅ_O2 =
 *   permeance·area·Δp_O2 while the metal's own rate k·(O2 capacity left) exceeds it, so the
 *   pack gets Ṅ_O2·|ΔH_O2| watts whatever the metal's mass; that heat over reach + hold,
 *   Q_film = Ṅ_O2·|ΔH_O2|·(t_reach + t_hold), joins the heat budget's right-hand side (its
 *   per-gram heat is then only sensible). oxygen-supply (≥, mol): enough metal to stay
 *   film-limited to the end, o_i·m_i ≥ Ṅ_O2·(t_reach + t_hold + 1/k). With a warm pack's
 *   surface limit, the film-limited steady state T_env + Ṅ_O2·|ΔH_O2|/UA must not pass it: a
 *   row with no per-gram terms, 0 ≥ Ṅ_O2·|ΔH_O2| − UA·(T_lim − T_env) (W), that only the
 *   film and the contact can satisfy.
 * - partner-stoichiometry (≥, g), per member k that brings another reactant of reaction members A
 *   ({@link setCoefficients}): m_k − Σ_A r_k·m_A ≥ 0, so the reaction member is the limiting
 *   reagent and the partner's rest dissolves (or stays) as its own process.
 * - concentration-cap (≤, g), per cap on a member: m_k − f_k·Σ m_i ≤ 0.
 * - additive-ratio (≥/≤, g), per need of a member: m_d − r_min·m_a ≥ 0, m_d − r_max·m_a ≤ 0.
 *
 * Objective: least-cost min Σ p_i·m_i (+ packaging cost); least-mass min Σ m_i (+ packaging
 * mass); most-hold-margin max [Σ u_i·m_i − heat budget]/(UA·|T_env − T*|·60) in minutes (in kJ
 * of surplus when UA·ΔT = 0).
 */
export function buildLinearModel(set: IngredientSet, coefficients: IngredientCoefficients[], ctx: ThermalContext, estimate: ConcentrationEstimate): LinearModel {
  const nv = coefficients.length;
  const tStar = ctx.targetTempC;
  const s = ctx.sign;
  const rows: LinearConstraint[] = [];
  const horizonS = ctx.reachWithinS + ctx.holdS;
  // A film-limited oxidiser delivers Ṅ_O2·|ΔH_O2| W for the whole horizon (the oxygen-supply row
  // keeps enough metal for that), whatever its mass: that heat moves to the right-hand side and
  // only its sensible heat stays per gram.
  const filmLimited = coefficients.map((c) => c.kind === 'air-oxidation' && c.o2SupplyMolPerS !== null && c.o2MolPerG > 0 && c.oxidationRatePerS > 0);
  let filmHeatJ = 0;
  coefficients.forEach((c, i) => {
    if (filmLimited[i]) filmHeatJ += (-c.heatAbsorbedJPerG / c.o2MolPerG) * c.o2SupplyMolPerS! * horizonS;
  });
  const useful = coefficients.map((c, i) => usefulHeatJPerG(filmLimited[i] ? { ...c, heatAbsorbedJPerG: 0 } : c, ctx, tStar));
  const exchangeJPerS = ctx.uaWPerK * s * (ctx.envTempC - tStar);
  // Heat also leaks in while the pack is still on its way to the target: over the reach window
  // the pack is, on average, about halfway between its start and the target.
  const reachExchangeJ = ctx.uaWPerK * s * (ctx.envTempC - (ctx.initialTempC + tStar) / 2) * ctx.reachWithinS;
  // A load is brought from its start to the target like the packaging, and leaks to its own surroundings over the hold.
  const loadJ = ctx.load ? s * ctx.load.heatCapacityJPerK * (ctx.load.initialTempC - tStar) + ctx.load.uaToEnvWPerK * s * (ctx.load.envTempC - tStar) * ctx.holdS : 0;
  const heatBudgetJ = exchangeJPerS * ctx.holdS + Math.max(0, reachExchangeJ) + s * ctx.packaging.heatCapacityJPerK * (ctx.initialTempC - tStar) + s * filmHeatJ + loadJ;
  rows.push({
    id: 'heat-budget',
    kind: 'heat-budget',
    label: `heat ${ctx.packType === 'cold' ? 'absorbed' : 'released'} to reach ${tStar} °C and hold it ${ctx.holdS / 60} min`,
    coefficients: useful,
    sense: 'ge',
    rhs: heatBudgetJ + (ctx.heatBudgetCorrectionJ ?? 0),
    unit: 'J',
    unitStep: 1000,
    unitLabel: 'kJ',
  });
  const water = coefficients.map((c) => c.liquidWaterGPerG);
  coefficients.forEach((c, j) => {
    if (c.kind !== 'dissolution' || c.solubilityGPer100g === null) return;
    const sol = c.solubilityGPer100g;
    const row = water.map((w) => (-sol / 100) * w);
    row[j] = (row[j] ?? 0) + c.soluteGPerG;
    // The grams a reaction member consumes of this solid do not dissolve (setCoefficients).
    coefficients.forEach((a, i) => {
      for (const r of a.reactionPartners ?? []) if (r.index === j) row[i] = (row[i] ?? 0) - r.gPerG * c.soluteGPerG;
    });
    rows.push({
      id: `solubility:${c.ingredient.id}`,
      kind: 'solubility',
      label: `water to dissolve ${c.ingredient.name} at ${tStar} °C (${round(sol, 1)} g per 100 g water)`,
      coefficients: row,
      sense: 'le',
      rhs: 0,
      unit: 'g',
      unitStep: 1,
      unitLabel: 'g of solute',
    });
  });
  if (coefficients.some((c) => c.kind === 'reaction' && c.liquidWaterGPerG < 0)) {
    rows.push({ id: 'water-for-reaction', kind: 'water-for-reaction', label: 'water the reactions take', coefficients: water, sense: 'ge', rhs: 0, unit: 'g', unitStep: 1, unitLabel: 'g of water' });
  }
  coefficients.forEach((k, j) => {
    const takers = coefficients.flatMap((a, i) => (a.reactionPartners ?? []).filter((r) => r.index === j).map((r) => ({ i, r, name: a.ingredient.name })));
    if (!takers.length) return;
    const row = new Array<number>(nv).fill(0);
    row[j] = 1;
    for (const t of takers) row[t.i] = (row[t.i] ?? 0) - t.r.gPerG;
    rows.push({
      id: `partner-stoichiometry:${k.ingredient.id}`,
      kind: 'partner-stoichiometry',
      label: `enough ${k.ingredient.name} for the reaction of ${takers.map((t) => `${t.name} (${round(t.r.gPerG, 3)} g per g)`).join(' and ')}`,
      coefficients: row,
      sense: 'ge',
      rhs: 0,
      unit: 'g',
      unitStep: 1,
      unitLabel: 'g',
    });
  });
  const fillMax = ctx.maxMassG - ctx.packaging.massG;
  rows.push({ id: 'total-mass', kind: 'total-mass', label: `pack mass at most ${ctx.maxMassG} g`, coefficients: new Array<number>(nv).fill(1), sense: 'le', rhs: fillMax, unit: 'g', unitStep: 1, unitLabel: 'g' });
  if (ctx.maxUnitCost !== null) {
    rows.push({
      id: 'unit-cost',
      kind: 'unit-cost',
      label: `unit cost at most ${ctx.maxUnitCost}`,
      coefficients: coefficients.map((c) => c.costPerG),
      sense: 'le',
      rhs: ctx.maxUnitCost - ctx.packaging.cost,
      unit: 'currency',
      unitStep: 1,
      unitLabel: 'currency unit',
    });
  }
  if (coefficients.some((c) => c.gasLPerG > 0)) {
    rows.push({ id: 'gas', kind: 'gas', label: `gas evolved at most ${ctx.maxGasL} L`, coefficients: coefficients.map((c) => c.gasLPerG), sense: 'le', rhs: ctx.maxGasL, unit: 'L', unitStep: 1, unitLabel: 'L' });
  }
  if (ctx.surfaceLimitC !== null) {
    const tl = ctx.surfaceLimitC;
    rows.push({
      id: 'surface-temperature',
      kind: 'surface-temperature',
      label: ctx.packType === 'cold' ? `never colder than ${tl} °C (adiabatic)` : `never warmer than ${tl} °C (adiabatic)`,
      // Air oxidation releases its heat at the film-limited rate over hours, not at once: its
      // heat is left out here (its peak, T_env + Ṅ_O2·|ΔH|/UA, is left to the verification).
      coefficients: coefficients.map((c) => usefulHeatJPerG(c.kind === 'air-oxidation' ? { ...c, heatAbsorbedJPerG: 0 } : c, ctx, tl)),
      sense: 'le',
      rhs: s * ctx.packaging.heatCapacityJPerK * (ctx.initialTempC - tl),
      unit: 'J',
      unitStep: 1000,
      unitLabel: 'kJ',
    });
  }
  coefficients.forEach((c, j) => {
    if (!filmLimited[j]) return;
    const supply = c.o2SupplyMolPerS!;
    const row = new Array<number>(nv).fill(0);
    row[j] = c.o2MolPerG;
    rows.push({
      id: `oxygen-supply:${c.ingredient.id}`,
      kind: 'oxygen-supply',
      label: `enough ${c.ingredient.name} to take up O2 at the film's rate for ${horizonS / 60} min`,
      coefficients: row,
      sense: 'ge',
      rhs: supply * (horizonS + 1 / c.oxidationRatePerS),
      unit: 'mol',
      unitStep: 1e-3,
      unitLabel: 'mmol O2',
    });
    if (ctx.surfaceLimitC !== null && ctx.packType === 'warm') {
      // Steady state of a film-limited oxidiser: T = T_env + Ṅ·|ΔH|/UA, whatever its mass.
      const powerW = (-c.heatAbsorbedJPerG / c.o2MolPerG) * supply;
      rows.push({
        id: `surface-temperature:steady:${c.ingredient.id}`,
        kind: 'surface-temperature',
        label: `${c.ingredient.name} at the film's O2 rate settles at most ${ctx.surfaceLimitC} °C`,
        coefficients: new Array<number>(nv).fill(0),
        sense: 'ge',
        rhs: powerW - ctx.uaWPerK * (ctx.surfaceLimitC - ctx.envTempC),
        unit: 'W',
        unitStep: 1,
        unitLabel: 'W',
      });
    }
  });
  for (const cap of ctx.caps) {
    const k = coefficients.findIndex((c) => c.ingredient.id === cap.ingredientId);
    if (k < 0) continue;
    // Every column of the ingredient (a hydrate's melting column too) counts towards its cap.
    const row = coefficients.map((c) => (c.ingredient.id === cap.ingredientId ? 1 - cap.maxMassFraction : -cap.maxMassFraction));
    rows.push({
      id: `concentration-cap:${cap.ingredientId}:${cap.maxMassFraction}`,
      kind: 'concentration-cap',
      label: `${coefficients[k]!.ingredient.name} at most ${round(cap.maxMassFraction * 100, 3)} % of the fill (${cap.reason})`,
      coefficients: row,
      sense: 'le',
      rhs: 0,
      unit: 'g',
      unitStep: 1,
      unitLabel: 'g',
    });
  }
  coefficients.forEach((c, a) => {
    for (const need of c.ingredient.needs ?? []) {
      const d = coefficients.findIndex((x) => x.ingredient.id === need.ingredientId);
      if (d < 0) continue;
      const lo = new Array<number>(nv).fill(0);
      lo[d] = 1;
      lo[a] = (lo[a] ?? 0) - need.minGPerG;
      const name = coefficients[d]!.ingredient.name;
      rows.push({ id: `additive-ratio:${c.ingredient.id}:${need.ingredientId}:min`, kind: 'additive-ratio', label: `at least ${need.minGPerG} g ${name} per g ${c.ingredient.name}`, coefficients: lo, sense: 'ge', rhs: 0, unit: 'g', unitStep: 1, unitLabel: 'g' });
      if (need.maxGPerG !== undefined) {
        const hi = new Array<number>(nv).fill(0);
        hi[d] = 1;
        hi[a] = (hi[a] ?? 0) - need.maxGPerG;
        rows.push({ id: `additive-ratio:${c.ingredient.id}:${need.ingredientId}:max`, kind: 'additive-ratio', label: `at most ${need.maxGPerG} g ${name} per g ${c.ingredient.name}`, coefficients: hi, sense: 'le', rhs: 0, unit: 'g', unitStep: 1, unitLabel: 'g' });
      }
    }
  });
  const exchangeJPerMin = Math.abs(ctx.uaWPerK * (ctx.envTempC - tStar)) * 60;
  let objective: LinearObjective;
  if (ctx.objective === 'least-cost') {
    objective = { sense: 'min', coefficients: coefficients.map((c) => c.costPerG), constant: ctx.packaging.cost, unit: 'currency' };
  } else if (ctx.objective === 'least-mass') {
    objective = { sense: 'min', coefficients: new Array<number>(nv).fill(1), constant: ctx.packaging.massG, unit: 'g' };
  } else if (exchangeJPerMin > 0) {
    objective = { sense: 'max', coefficients: useful.map((u) => u / exchangeJPerMin), constant: -heatBudgetJ / exchangeJPerMin, unit: 'min' };
  } else {
    objective = { sense: 'max', coefficients: useful.map((u) => u / 1000), constant: -heatBudgetJ / 1000, unit: 'kJ' };
  }
  for (const r of rows) {
    const bad = r.coefficients.findIndex((a) => !Number.isFinite(a));
    if (bad >= 0 || !Number.isFinite(r.rhs)) {
      throw new RangeError(
        `linear model of ${set.key}: expected finite coefficients in row ${r.id}, found ${bad >= 0 ? `${r.coefficients[bad]} for ${coefficients[bad]!.ingredient.id}` : `rhs ${r.rhs}`}`,
      );
    }
  }
  return { set, coefficients, constraints: rows, objective, usefulHeatJPerG: useful, heatBudgetJ, exchangeJPerMin, context: ctx, estimate };
}

/** Σ a_i·m_i of a row. */
export function rowValue(row: Pick<LinearConstraint, 'coefficients'>, massesG: readonly number[]): number {
  let v = 0;
  for (let i = 0; i < row.coefficients.length; i++) v += row.coefficients[i]! * (massesG[i] ?? 0);
  return v;
}

/**
 * How far a composition violates a row, in the row's unit (0 when satisfied):
 * ≤ rows: max(0, Σa·m − rhs); ≥ rows: max(0, rhs − Σa·m).
 */
export function rowViolation(row: LinearConstraint, massesG: readonly number[]): number {
  const v = rowValue(row, massesG);
  return Math.max(0, row.sense === 'le' ? v - row.rhs : row.rhs - v);
}

/** Objective value of a composition in the objective's unit (constant included). */
export function objectiveValue(model: LinearModel, massesG: readonly number[]): number {
  return rowValue(model.objective, massesG) + model.objective.constant;
}

/**
 * The concentration a composition gives, for the next pass of the enthalpy iteration:
 * n = (Σ w_i·m_i / M_w) / Σ ν_i·m_i (mol water per mol dissolved solute), w_s = Σ a_i·m_i /
 * (Σ w_i·m_i + Σ a_i·m_i). Returns null when nothing dissolves.
 */
export function concentrationOf(coefficients: readonly IngredientCoefficients[], massesG: readonly number[]): ConcentrationEstimate | null {
  let waterG = 0;
  let mol = 0;
  let solute = 0;
  coefficients.forEach((c, i) => {
    const m = massesG[i] ?? 0;
    waterG += c.liquidWaterGPerG * m;
    mol += c.soluteMolPerG * m;
    solute += c.soluteGPerG * m;
  });
  if (!(mol > 1e-12) || !(waterG > 1e-9)) return null;
  return { nH2O_per_mol: waterG / WATER_MOLAR_MASS_G_PER_MOL / mol, soluteMassFraction: solute / (waterG + solute) };
}

function round(x: number, d: number): number {
  const f = 10 ** d;
  return Math.round(x * f) / f;
}
