import { waterHeatCapacity_J_per_gK } from './solution-heat-capacity';
import type { Phase } from './types';

/**
 * What a reaction does inside a pack: the heat of a given charge, per gram of the fill and of the
 * limiting reagent, the adiabatic temperature change with a chosen amount of water as heat sink,
 * the gas it gives off at 1 atm, and whether it runs on its own at room temperature.
 * Pure; the reaction thermodynamics come from evaluateReaction (reaction.ts).
 */

/** Molar gas constant, J/(mol·K): CODATA 2018 exact value (NIST SP 961). */
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618;
/** One standard atmosphere, Pa (exact by definition, NIST SP 811 appendix B). */
export const ATM_PA = 101325;
/** Enthalpy of vaporisation of water at 100 °C, J/g (IAPWS-95, as tabulated in the NIST Chemistry WebBook). */
export const WATER_VAP_J_PER_G = 2256.4;
const KELVIN = 273.15;

/** One species of the reaction as the pack sees it (the API's reaction terms carry these). */
export interface PackTerm {
  key: string;
  formula: string;
  phase: Phase;
  /** Signed stoichiometric number: reactants −, products +. */
  nu: number;
  molarMass_g_per_mol: number;
  Cp_J_per_mol_K: number | null;
}

export interface PackChargeInput {
  terms: PackTerm[];
  /** ΔrH at the start temperature, kJ per mole of reaction as written (negative = releases heat). */
  dH_kJ: number;
  /** Grams of each reactant in the charge, by term key; a reactant left out is taken as in excess. */
  chargeG: Record<string, number>;
  /** Extra liquid water in the pack as heat sink, g per g of the reagents charged. */
  waterRatio_g_per_g: number;
  /** Pack and room temperature before the reaction, °C. */
  startTempC: number;
  /** Pressure the gas volume is reported at, Pa (default 1 atm). */
  pressure_Pa?: number;
}

export interface PackChargeResult {
  /** Moles of reaction as written that the charge can run (extent ξ = min nᵢ/|νᵢ|). */
  extent_mol: number;
  /** Key of the reagent that runs out first (null without a charged reactant). */
  limitingKey: string | null;
  reagentsG: number;
  waterG: number;
  /** Reagents plus added water. */
  fillG: number;
  /** Heat given off by the whole charge, J (negative when the reaction takes heat up). */
  heat_J: number;
  heatPerFill_J_per_g: number;
  heatPerLimiting_J_per_g: number | null;
  /** Heat capacity of what is in the pack after the reaction, J/K. */
  heatCapacity_J_per_K: number;
  /** ΔT = Q / ΣCp (no losses, no phase change), K. */
  adiabaticDeltaT_K: number;
  /** start + ΔT; when liquid water would pass 100 °C the pack stays at 100 °C while water boils off. */
  packTempC: number;
  /** Grams of water that boil off (0 when the pack stays below 100 °C). */
  boiledOffG: number;
  /** Net moles of gas made (negative = taken up, e.g. oxygen from air). */
  gas_mol: number;
  /** Ideal-gas volume of the net gas at the pack temperature and the pressure, L. */
  gasVolumeL: number;
  /** Species whose heat capacity was missing and which the sum leaves out. */
  missingCpKeys: string[];
}

/**
 * Ideal-gas volume V = nRT/p, in litres (n mol, T in °C, p in Pa). Source: the ideal-gas law,
 * with R from CODATA 2018.
 *
 * @example idealGasVolumeL(1, 0) // ≈ 22.414 (molar volume at 273.15 K, 1 atm)
 */
export function idealGasVolumeL(n_mol: number, tempC: number, pressure_Pa = ATM_PA): number {
  return ((n_mol * GAS_CONSTANT_J_PER_MOL_K * (tempC + KELVIN)) / pressure_Pa) * 1000;
}

/**
 * Adiabatic temperature change ΔT = −ΔH/ΣCp, K: heat released (−ΔH, J) over the heat capacity of
 * the contents (J/K), with no losses and no phase change. Source: first law at constant pressure
 * (the adiabatic-temperature balance of Atkins' Physical Chemistry, thermochemistry chapter).
 */
export function adiabaticDeltaT_K(dH_J: number, heatCapacity_J_per_K: number): number {
  if (!(heatCapacity_J_per_K > 0)) throw new RangeError('The heat capacity of the contents must be greater than 0.');
  return -dH_J / heatCapacity_J_per_K;
}

/** Aqueous species (ions, solutes) count at water's specific heat by mass: the dilute-solution approximation (common practice, no source). */
function isAqueous(phase: Phase): boolean {
  return phase === 'aq' || phase === 'ai' || phase === 'ao';
}

/**
 * The pack view of a reaction for a given charge. Heat Q = −ΔrH·ξ; ΣCp = Σ nⱼ·Cp°ⱼ over the
 * products and the unreacted reagents plus the added water at cp(T) (waterHeatCapacity_J_per_gK);
 * ΔT = Q/ΣCp; above 100 °C with liquid water the excess heat boils water off (ΔvapH) instead;
 * gas V = n·R·T/p at the pack temperature.
 */
export function packCharge(input: PackChargeInput): PackChargeResult {
  const reactants = input.terms.filter((t) => t.nu < 0);
  const products = input.terms.filter((t) => t.nu > 0);
  let extent = Number.POSITIVE_INFINITY;
  let limitingKey: string | null = null;
  let reagentsG = 0;
  for (const t of reactants) {
    const g = input.chargeG[t.key];
    if (g === undefined) continue;
    if (!(g >= 0)) throw new RangeError(`The charge of ${t.key} must be 0 g or more.`);
    reagentsG += g;
    const xi = g / t.molarMass_g_per_mol / -t.nu;
    if (xi < extent) {
      extent = xi;
      limitingKey = t.key;
    }
  }
  if (!Number.isFinite(extent)) extent = 0;
  if (!(input.waterRatio_g_per_g >= 0)) throw new RangeError('The water ratio must be 0 or more.');
  const waterG = input.waterRatio_g_per_g * reagentsG;
  const fillG = reagentsG + waterG;
  const heat_J = -input.dH_kJ * 1000 * extent;

  const missingCpKeys: string[] = [];
  const cpOf = (t: PackTerm, n_mol: number): number => {
    if (n_mol <= 0) return 0;
    if (isAqueous(t.phase)) return n_mol * t.molarMass_g_per_mol * waterHeatCapacity_J_per_gK(input.startTempC);
    if (t.Cp_J_per_mol_K === null) {
      missingCpKeys.push(t.key);
      return 0;
    }
    return n_mol * t.Cp_J_per_mol_K;
  };
  let heatCapacity = waterG * waterHeatCapacity_J_per_gK(input.startTempC);
  let liquidWaterG = waterG;
  for (const t of products) {
    heatCapacity += cpOf(t, t.nu * extent);
    if (t.formula === 'H2O' && t.phase === 'l') liquidWaterG += t.nu * extent * t.molarMass_g_per_mol;
  }
  for (const t of reactants) {
    const g = input.chargeG[t.key];
    if (g === undefined) continue;
    const left = g / t.molarMass_g_per_mol + t.nu * extent;
    heatCapacity += cpOf(t, left);
    if (t.formula === 'H2O' && t.phase === 'l') liquidWaterG += Math.max(0, left) * t.molarMass_g_per_mol;
  }

  const dT = heatCapacity > 0 ? adiabaticDeltaT_K(-heat_J, heatCapacity) : 0;
  let packTempC = input.startTempC + dT;
  let boiledOffG = 0;
  if (packTempC > 100 && liquidWaterG > 0 && input.startTempC < 100) {
    const excess_J = heat_J - heatCapacity * (100 - input.startTempC);
    boiledOffG = Math.min(liquidWaterG, excess_J / WATER_VAP_J_PER_G);
    // All the water gone: the rest heats the dry contents further (their Cp without the water).
    if (boiledOffG >= liquidWaterG) {
      const dryCp = heatCapacity - liquidWaterG * waterHeatCapacity_J_per_gK(input.startTempC);
      const rest_J = excess_J - liquidWaterG * WATER_VAP_J_PER_G;
      packTempC = dryCp > 0 ? 100 + rest_J / dryCp : packTempC;
    } else packTempC = 100;
  }

  const gasNu = input.terms.filter((t) => t.phase === 'g').reduce((s, t) => s + t.nu, 0);
  const gas_mol = gasNu * extent;
  return {
    extent_mol: extent,
    limitingKey,
    reagentsG,
    waterG,
    fillG,
    heat_J,
    heatPerFill_J_per_g: fillG > 0 ? heat_J / fillG : 0,
    heatPerLimiting_J_per_g: limitingKey === null ? null : heat_J / (input.chargeG[limitingKey] as number),
    heatCapacity_J_per_K: heatCapacity,
    adiabaticDeltaT_K: dT,
    packTempC,
    boiledOffG,
    gas_mol,
    gasVolumeL: idealGasVolumeL(gas_mol, packTempC, input.pressure_Pa ?? ATM_PA),
    missingCpKeys,
  };
}

/** Whether the reaction runs on its own at a temperature: ΔrG < 0 there (standard states; kinetics are not modelled). */
export function runsUntriggered(dG_kJ: number | null): 'yes' | 'no' | 'unknown' {
  if (dG_kJ === null) return 'unknown';
  return dG_kJ < 0 ? 'yes' : 'no';
}

/**
 * Grams of each reactant for a stoichiometric charge with `limitingG` grams of the first reactant:
 * mᵢ = ξ·|νᵢ|·Mᵢ with ξ = limitingG / (|ν₁|·M₁).
 */
export function stoichiometricCharge(terms: PackTerm[], firstG: number): Record<string, number> {
  const reactants = terms.filter((t) => t.nu < 0);
  const first = reactants[0];
  if (!first) return {};
  const xi = firstG / (-first.nu * first.molarMass_g_per_mol);
  return Object.fromEntries(reactants.map((t) => [t.key, xi * -t.nu * t.molarMass_g_per_mol]));
}
