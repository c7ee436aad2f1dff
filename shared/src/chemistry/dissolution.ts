import { hillFormula, parseFormula, splitHydrate } from './formula';
import { linear, pchip } from './interpolate';
import {
  findDilutionSeries,
  findEutectic,
  findFreezingPointSeries,
  findSolubilitySeries,
  findSpecies,
  findSpeciesByKey,
  UnknownSpeciesError,
} from './library';
import { memo } from './memo';
import type { ChemistryLibrary, ComputationWarning, EutecticPoint, SpeciesRecord } from './types';

/** Enthalpy of fusion of ice at 0 °C, kJ/mol (from memory; CRC Handbook, IAPWS 6.007 kJ/mol). */
export const WATER_FUSION_ENTHALPY_KJ_PER_MOL = 6.01;
/** Molar mass of water with CIAAW 2021 abridged weights, g/mol. */
export const WATER_MOLAR_MASS_G_PER_MOL = 2 * 1.008 + 15.999;
const R = 8.314462618;

/** The solid (or gas, liquid) that dissolves, resolved from a key like `NH4NO3(cr)` or a formula (remembered per library). */
function resolveSolute(lib: ChemistryLibrary, solute: string | SpeciesRecord): SpeciesRecord {
  if (typeof solute !== 'string') return solute;
  return memo(lib.species, 'solute', solute, () => (parseFormula(solute).phase ? findSpeciesByKey(lib, solute) : findSpecies(lib, solute, 'cr')));
}

/** Anhydrous formula and crystal water of a formula (remembered per library). */
function hydrateOf(lib: ChemistryLibrary, formula: string): { anhydrous: string; waterCount: number } {
  return memo(lib.species, 'hydrate', formula, () => splitHydrate(formula));
}

export interface IonTerm {
  species: SpeciesRecord;
  /** Moles of this ion (or neutral aqueous species) per mole of solute. */
  nu: number;
}

/**
 * Aqueous products of dissolving one mole of a solute: the ions for an electrolyte
 * (`CaCl2` → Ca²⁺ + 2 Cl⁻), the undissociated aqueous species for a non-electrolyte (`CO(NH2)2` →
 * `CO(NH2)2(ao)`), plus the water of crystallisation of a hydrate as H2O(l). Found by matching the
 * anhydrous composition against every cation–anion pair of the library's ionised species.
 *
 * @example dissolutionProducts(lib, 'CH3COONa·3H2O(cr)')
 * // → ions CH3COO-(ai) ×1, Na+(ai) ×1, and waterReleased 3
 */
export function dissolutionProducts(
  lib: ChemistryLibrary,
  solute: string | SpeciesRecord,
): { solute: SpeciesRecord; products: IonTerm[]; waterReleased: number } {
  const s = resolveSolute(lib, solute);
  // The split depends only on the formula and the library's aqueous species: found once per library.
  const found = memo(lib.species, 'products', s.formula, () => splitIntoAqueous(lib, s));
  return { solute: s, products: found.products.map((p) => ({ ...p })), waterReleased: found.waterReleased };
}

function splitIntoAqueous(lib: ChemistryLibrary, s: SpeciesRecord): { products: IonTerm[]; waterReleased: number } {
  const { anhydrous, waterCount } = hydrateOf(lib, s.formula);
  const target = parseFormula(anhydrous);
  const targetKey = hillFormula(target);
  const ions = lib.species.filter((x) => (x.phase === 'ai' || x.phase === 'ao' || x.phase === 'aq') && parseFormula(x.formula).charge !== 0);
  const cations = ions.filter((x) => parseFormula(x.formula).charge > 0 && x.formula !== 'H+');
  const anions = ions.filter((x) => parseFormula(x.formula).charge < 0 && x.formula !== 'OH-');
  // H+ and OH- last, so that e.g. NaOH is Na+ + OH- and acids still resolve.
  const hplus = ions.find((x) => x.formula === 'H+');
  const ohminus = ions.find((x) => x.formula === 'OH-');
  if (hplus) cations.push(hplus);
  if (ohminus) anions.push(ohminus);
  for (const c of cations) {
    const pc = parseFormula(c.formula);
    for (const a of anions) {
      const pa = parseFormula(a.formula);
      // p·zc + q·za = 0 with smallest integers
      const zc = pc.charge;
      const za = -pa.charge;
      const g = gcd(zc, za);
      const p = za / g;
      const q = zc / g;
      const el: Record<string, number> = {};
      for (const [e, n] of Object.entries(pc.elements)) el[e] = (el[e] ?? 0) + p * n;
      for (const [e, n] of Object.entries(pa.elements)) el[e] = (el[e] ?? 0) + q * n;
      if (hillFormula({ elements: el, charge: 0 }) === targetKey) {
        return {
          products: [
            { species: c, nu: p },
            { species: a, nu: q },
          ],
          waterReleased: waterCount,
        };
      }
    }
  }
  // Non-electrolyte: the undissociated aqueous species of the same composition.
  const neutral = lib.species.find((x) => (x.phase === 'ao' || x.phase === 'aq') && hillFormula(parseFormula(x.formula)) === targetKey);
  if (neutral) return { products: [{ species: neutral, nu: 1 }], waterReleased: waterCount };
  throw new UnknownSpeciesError(
    `Cannot split "${s.key}" into aqueous species: no cation–anion pair or aqueous species in the library has composition ${targetKey}.`,
    { formula: s.formula, phase: s.phase },
  );
}

function gcd(a: number, b: number): number {
  return b === 0 ? Math.abs(a) : gcd(b, a % b);
}

export interface InfiniteDilutionResult {
  /** ΔsolH at infinite dilution, kJ per mole of solute (positive = heat absorbed). */
  dH_kJ_per_mol: number;
  solute: SpeciesRecord;
  products: IonTerm[];
  waterReleased: number;
  warnings: ComputationWarning[];
}

/**
 * Enthalpy of solution at infinite dilution from formation enthalpies (Hess's law):
 *   ΔsolH∞ = Σ νᵢ·ΔfH°(ion i, aq) + w·ΔfH°(H2O, l) − ΔfH°(solid),
 * w = water of crystallisation released by a hydrate. kJ/mol, positive = endothermic (cold pack).
 * Source of the data: NBS 1982 (Wagman et al.) via the library.
 *
 * @example enthalpyOfSolutionInfinite(lib, 'NH4NO3(cr)').dH_kJ_per_mol // → 25.69
 */
export function enthalpyOfSolutionInfinite(lib: ChemistryLibrary, solute: string | SpeciesRecord): InfiniteDilutionResult {
  const { solute: s, products, waterReleased } = dissolutionProducts(lib, solute);
  const warnings: ComputationWarning[] = [];
  if (s.dfH_kJ_per_mol === null) throw new UnknownSpeciesError(`ΔfH° of "${s.key}" is not in the library.`, { formula: s.formula, phase: s.phase });
  let sum = 0;
  for (const p of products) {
    if (p.species.dfH_kJ_per_mol === null) {
      throw new UnknownSpeciesError(`ΔfH° of "${p.species.key}" is not in the library.`, { formula: p.species.formula, phase: p.species.phase });
    }
    sum += p.nu * p.species.dfH_kJ_per_mol;
  }
  if (waterReleased > 0) sum += waterReleased * waterFormationEnthalpy(lib);
  return { dH_kJ_per_mol: sum - s.dfH_kJ_per_mol, solute: s, products, waterReleased, warnings };
}

function waterFormationEnthalpy(lib: ChemistryLibrary): number {
  const w = findSpecies(lib, 'H2O', 'l');
  if (w.dfH_kJ_per_mol === null) throw new UnknownSpeciesError('ΔfH° of H2O(l) is not in the library.', { formula: 'H2O', phase: 'l' });
  return w.dfH_kJ_per_mol;
}

export interface IntegralEnthalpyResult {
  /** Integral ΔsolH for dissolving 1 mol of solute into water to give n mol H2O per mol solute, kJ/mol. */
  dH_kJ_per_mol: number;
  /** Infinite-dilution value (from the dilution data's ∞ row, else from the ions), kJ/mol. */
  dH_infinite_kJ_per_mol: number;
  nH2O_per_mol: number;
  warnings: ComputationWarning[];
  source: string;
}

/**
 * Integral enthalpy of solution at finite concentration, from the tabulated "solute in n H2O"
 * formation enthalpies (NBS 1982):
 *   ΔsolH(n) = ΔfH(solute in n H2O) + w·ΔfH°(H2O, l) − ΔfH°(solid),
 * n = total mol of water per mol of anhydrous solute in the final solution, including the w mol
 * of crystal water a hydrate brings (so n ≥ w).
 * Interpolation: monotone piecewise cubic (PCHIP) in ln n between tabulated points; between the
 * most dilute point and infinite dilution, linear in n^(−1/2) (the Debye–Hückel limiting form,
 * relative apparent enthalpy ∝ √m). Below the most concentrated point the end segment is
 * extended linearly in ln n, with a warning (`below-dilution-data`). `n = Infinity` gives the
 * infinite-dilution value.
 *
 * @example integralEnthalpyOfSolution(lib, 'NH4NO3(cr)', 10).dH_kJ_per_mol // → 20.51 (vs 25.69 at ∞)
 */
export function integralEnthalpyOfSolution(
  lib: ChemistryLibrary,
  solute: string | SpeciesRecord,
  nH2O_per_mol: number,
): IntegralEnthalpyResult {
  const s = resolveSolute(lib, solute);
  const { anhydrous, waterCount } = hydrateOf(lib, s.formula);
  const anhydrousKey = `${anhydrous}(${s.phase})`;
  const series = findDilutionSeries(lib, anhydrousKey);
  const warnings: ComputationWarning[] = [];
  if (!(nH2O_per_mol >= waterCount) || Number.isNaN(nH2O_per_mol)) {
    throw new RangeError(
      `n must be at least the ${waterCount} mol of crystal water that "${s.key}" brings (n counts all water per mol of solute); found ${nH2O_per_mol}.`,
    );
  }
  if (s.dfH_kJ_per_mol === null) throw new UnknownSpeciesError(`ΔfH° of "${s.key}" is not in the library.`, { formula: s.formula, phase: s.phase });
  const offset = waterCount * (waterCount > 0 ? waterFormationEnthalpy(lib) : 0) - s.dfH_kJ_per_mol;

  let dfHInf = series.dfH_infinite_kJ_per_mol ?? null;
  if (dfHInf === null) {
    // Without the series' ∞ row, the anchor comes from the ions (Hess's law): once per library and solute.
    dfHInf = memo(lib.species, 'dfH-infinite', anhydrousKey, () => {
      const inf = enthalpyOfSolutionInfinite(lib, anhydrousKey);
      const solid = findSpeciesByKey(lib, anhydrousKey);
      return inf.dH_kJ_per_mol + (solid.dfH_kJ_per_mol as number);
    });
  }
  const ns = series.points.map((p) => p.nH2O_per_mol);
  const hs = series.points.map((p) => p.dfH_kJ_per_mol);
  const nMin = ns[0] as number;
  const nMax = ns[ns.length - 1] as number;
  let dfH: number;
  if (nH2O_per_mol === Infinity) {
    dfH = dfHInf;
  } else if (nH2O_per_mol > nMax) {
    // Linear in n^(-1/2) from the last point to infinite dilution.
    const xLast = 1 / Math.sqrt(nMax);
    const x = 1 / Math.sqrt(nH2O_per_mol);
    dfH = dfHInf + ((hs[hs.length - 1] as number) - dfHInf) * (x / xLast);
  } else if (nH2O_per_mol < nMin) {
    dfH = linear(ns.slice(0, 2).map(Math.log), hs.slice(0, 2), Math.log(nH2O_per_mol));
    warnings.push({
      code: 'below-dilution-data',
      message: `n = ${round(nH2O_per_mol, 3)} mol H2O per mol is more concentrated than the dilution data for ${series.solute} (n ≥ ${nMin}); extrapolated from the first two points.`,
    });
  } else {
    dfH = memo(series, 'pchip', '', () => pchip(ns.map(Math.log), hs))(Math.log(nH2O_per_mol));
  }
  return {
    dH_kJ_per_mol: dfH + offset,
    dH_infinite_kJ_per_mol: dfHInf + offset,
    nH2O_per_mol,
    warnings,
    source: series.source,
  };
}

/**
 * Moles of water per mole of solute when `soluteMassG` of a solute (anhydrous or hydrate) is
 * dissolved in `waterMassG` of free water: n = (m_w/M_w + w·m_s/M_s)/(m_s/M_s), M_w from CIAAW 2021.
 *
 * @example nH2OPerMol(lib, 'NH4NO3(cr)', 40, 100) // → 11.11
 */
export function nH2OPerMol(lib: ChemistryLibrary, solute: string | SpeciesRecord, soluteMassG: number, waterMassG: number): number {
  const s = resolveSolute(lib, solute);
  if (!(soluteMassG > 0)) throw new RangeError(`Solute mass must be > 0 g, found ${soluteMassG}.`);
  if (!(waterMassG >= 0)) throw new RangeError(`Water mass must be ≥ 0 g, found ${waterMassG}.`);
  const { waterCount } = hydrateOf(lib, s.formula);
  const molSolute = soluteMassG / s.molarMass_g_per_mol;
  return (waterMassG / WATER_MOLAR_MASS_G_PER_MOL + waterCount * molSolute) / molSolute;
}

/**
 * Heat absorbed (positive) or released (negative) when `soluteMassG` of a solute dissolves
 * completely in `waterMassG` of water at 25 °C, kJ: Q = n_solute · ΔsolH(n), with the integral
 * enthalpy of solution of {@link integralEnthalpyOfSolution}.
 *
 * @example dissolutionHeat(lib, 'NH4NO3(cr)', 80.043, 180.15).dH_kJ // ≈ 20.5 kJ absorbed (n = 10)
 */
export function dissolutionHeat(
  lib: ChemistryLibrary,
  solute: string | SpeciesRecord,
  soluteMassG: number,
  waterMassG: number,
): { dH_kJ: number; nH2O_per_mol: number; dH_kJ_per_mol: number; warnings: ComputationWarning[] } {
  const s = resolveSolute(lib, solute);
  const n = nH2OPerMol(lib, s, soluteMassG, waterMassG);
  const r = integralEnthalpyOfSolution(lib, s, n);
  return { dH_kJ: (soluteMassG / s.molarMass_g_per_mol) * r.dH_kJ_per_mol, nH2O_per_mol: n, dH_kJ_per_mol: r.dH_kJ_per_mol, warnings: r.warnings };
}

export interface SolubilityResult {
  /** Grams of anhydrous solute per 100 g of water in the saturated solution. */
  gPer100gWater: number;
  /** Mass fraction of anhydrous solute in the saturated solution, w = g/(100 + g). */
  massFraction: number;
  tempC: number;
  warnings: ComputationWarning[];
  source: string;
}

/**
 * Solubility at a temperature, by monotone piecewise cubic (PCHIP) interpolation in the tabulated
 * points (CRC Handbook, 0–100 °C; urea from handbook values). It passes through every tabulated
 * point. Outside the tabulated range the end segment is extended linearly (never below 0) and a
 * warning `outside-solubility-data` is returned. A hydrate gives the solubility of its anhydrous
 * salt (grams of anhydrous salt).
 *
 * @example solubility(lib, 'NH4NO3(cr)', 20).gPer100gWater // → 189.86 (CRC: 65.5 mass %)
 */
export function solubility(lib: ChemistryLibrary, solute: string, tempC: number): SolubilityResult {
  const series = findSolubilitySeries(lib, solute);
  const ts = series.points.map((p) => p.tempC);
  const gs = series.points.map((p) => p.gPer100gWater);
  const warnings: ComputationWarning[] = [];
  let g: number;
  const tMin = ts[0] as number;
  const tMax = ts[ts.length - 1] as number;
  if (ts.length === 1) {
    g = gs[0] as number;
    if (tempC !== tMin) warnings.push({ code: 'outside-solubility-data', message: `Only one solubility point (${tMin} °C) for ${series.solute}; used at ${tempC} °C.` });
  } else if (tempC < tMin || tempC > tMax) {
    g = Math.max(0, linear(ts, gs, tempC));
    warnings.push({
      code: 'outside-solubility-data',
      message: `${tempC} °C is outside the solubility data for ${series.solute} (${tMin}–${tMax} °C); extrapolated linearly from the end segment.`,
    });
  } else {
    g = memo(series, 'pchip', '', () => pchip(ts, gs))(tempC);
  }
  return { gPer100gWater: g, massFraction: g / (100 + g), tempC, warnings, source: series.source };
}

export interface FreezingPointResult {
  /** Temperature at which ice starts to form from the solution, °C. */
  tempC: number;
  depressionK: number;
  basis: 'tabulated' | 'colligative';
  warnings: ComputationWarning[];
  source: string;
}

/**
 * Freezing point of an aqueous solution (the ice line), from the tabulated freezing-point
 * depression vs mass fraction of anhydrous solute (CRC Handbook "Concentrative Properties of
 * Aqueous Solutions"), PCHIP through (0, 0) and the points. Without data, the ideal dilute
 * (colligative) estimate ΔT = K_f·ν·m, K_f = R·T_f²·M_w/ΔfusH = 1.86 K·kg/mol (ΔfusH = 6.01 kJ/mol),
 * ν = number of dissolved particles per formula unit, with a warning `colligative-estimate`.
 * Beyond the eutectic composition ice is not the first solid: warning `beyond-eutectic`.
 *
 * @example freezingPoint(lib, 'NaCl(cr)', 0.10).tempC // → about −6.6 °C
 */
export function freezingPoint(lib: ChemistryLibrary, solute: string, massFraction: number): FreezingPointResult {
  if (!(massFraction >= 0 && massFraction < 1)) throw new RangeError(`Mass fraction must be in [0, 1), found ${massFraction}.`);
  const warnings: ComputationWarning[] = [];
  const eut = findEutectic(lib, solute);
  if (eut && massFraction > eut.massFraction) {
    warnings.push({
      code: 'beyond-eutectic',
      message: `w = ${round(massFraction, 4)} is beyond the eutectic composition of ${eut.solute} (w = ${eut.massFraction}, ${eut.tempC} °C): the salt, not ice, crystallises first on cooling.`,
    });
  }
  const series = findFreezingPointSeries(lib, solute);
  if (series && series.points.length >= 2) {
    const ws = [0, ...series.points.map((p) => p.massFraction)];
    const ds = [0, ...series.points.map((p) => p.depressionK)];
    const wMax = ws[ws.length - 1] as number;
    let dT: number;
    if (massFraction > wMax) {
      dT = linear(ws, ds, massFraction);
      warnings.push({
        code: 'outside-freezing-data',
        message: `w = ${round(massFraction, 4)} is above the freezing-point data for ${series.solute} (w ≤ ${wMax}); extrapolated linearly.`,
      });
    } else dT = memo(series, 'pchip', '', () => pchip(ws, ds))(massFraction);
    return { tempC: -dT, depressionK: dT, basis: 'tabulated', warnings, source: series.source };
  }
  const { solute: s, products } = dissolutionProducts(lib, solute);
  const { anhydrous } = hydrateOf(lib, s.formula);
  const M = molarMassOfAnhydrous(lib, anhydrous, s);
  const nu = products.reduce((n, p) => n + p.nu, 0);
  const molality = massFraction / (1 - massFraction) / (M / 1000);
  const dT = cryoscopicConstant() * nu * molality;
  warnings.push({
    code: 'colligative-estimate',
    message: `No freezing-point data for ${s.key}; ideal dilute-solution estimate K_f·ν·m with ν = ${nu}.`,
  });
  return { tempC: -dT, depressionK: dT, basis: 'colligative', warnings, source: 'Ideal dilute solution, K_f = R·T_f²·M_w/ΔfusH' };
}

function molarMassOfAnhydrous(lib: ChemistryLibrary, anhydrous: string, s: SpeciesRecord): number {
  if (anhydrous === s.formula) return s.molarMass_g_per_mol;
  try {
    return findSpecies(lib, anhydrous, s.phase).molarMass_g_per_mol;
  } catch {
    const { waterCount } = splitHydrate(s.formula);
    return s.molarMass_g_per_mol - waterCount * WATER_MOLAR_MASS_G_PER_MOL;
  }
}

/**
 * Cryoscopic constant of water, K·kg/mol: K_f = R·T_f²·M_w/ΔfusH with T_f = 273.15 K,
 * M_w = 0.018015 kg/mol, ΔfusH = 6.01 kJ/mol → 1.859. Standard colligative relation.
 */
export function cryoscopicConstant(): number {
  const Tf = 273.15;
  return (R * Tf * Tf * (WATER_MOLAR_MASS_G_PER_MOL / 1000)) / (WATER_FUSION_ENTHALPY_KJ_PER_MOL * 1000);
}

/**
 * The salt–water eutectic of a solute (temperature and composition of the liquid where ice and the
 * salt or its hydrate crystallise together), or null when the library has none. Values from the
 * library's eutectic table (approximate handbook values; see its source field).
 *
 * @example eutectic(lib, 'NaCl(cr)') // → { tempC: -21.1, massFraction: 0.233, ... }
 */
export function eutectic(lib: ChemistryLibrary, solute: string): EutecticPoint | null {
  return findEutectic(lib, solute);
}

function round(x: number, d: number): number {
  const f = 10 ** d;
  return Math.round(x * f) / f;
}
