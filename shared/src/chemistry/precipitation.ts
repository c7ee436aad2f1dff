import { dissolutionProducts } from './dissolution';
import { UnknownSpeciesError } from './library';
import { memo } from './memo';
import { T0_K } from './reaction';
import type { ChemistryLibrary, ComputationWarning, SpeciesRecord } from './types';

/**
 * Precipitation when the ions of two or more ingredients meet in the pack's water.
 *
 * Solubility product of a solid MₐXᵦ·nH2O ⇌ a M + b X + n H2O(l) from the species data:
 *   ΔrG° = Σ νᵢ ΔfG°(ionᵢ) + n ΔfG°(H2O, l) − ΔfG°(solid),  log10 Ksp(25 °C) = −ΔrG° / (RT ln 10)
 * and at another temperature by van 't Hoff with ΔrH° held constant:
 *   ln Ksp(T) = ln Ksp(298.15 K) − ΔrH°/R · (1/T − 1/298.15 K)
 * (Atkins, Physical Chemistry, §6.2 and §6.3). ΔfG°, ΔfH° of ions at infinite dilution: NBS 1982.
 *
 * The ion activity product Q = Π (γᵢ mᵢ)^νᵢ · a_w^n, molalities mᵢ in mol/kg of liquid water,
 * water activity a_w taken as 1, activity coefficients by the Davies equation
 *   log10 γᵢ = −A zᵢ² (√I / (1 + √I) − 0.3 I),  I = ½ Σ mᵢ zᵢ²,  A = 0.509 (kg/mol)^½ at 25 °C
 * (Davies, Ion Association, 1962; A from Robinson & Stokes, Electrolyte Solutions), held at its
 * 25 °C value. Davies is meant for I ≲ 0.5 mol/kg; above it the amounts are estimates and a
 * warning says so (a solid supersaturated by orders of magnitude still precipitates).
 * A solid precipitates while its saturation index SI = log10(Q / Ksp) > 0; the one with the
 * largest SI goes first, and each is taken out until SI = 0 (found by bisection), then the
 * others are checked again.
 *
 * Only sparingly soluble solids are considered (log10 Ksp < {@link SPARINGLY_SOLUBLE_LOG_KSP}):
 * the solubility of soluble salts comes from the handbook solubility data, not from here.
 * Acid–base side equilibria (CO3²⁻ + H2O ⇌ HCO3⁻ + OH⁻) are not modelled: carbonate is taken as
 * free CO3²⁻, which overstates carbonate precipitation at low concentrations.
 *
 * Heat: precipitating ξ mol releases ξ · ΔrH°(dissolution) (positive ΔrH° of dissolution →
 * precipitation releases heat), from ΔfH° at infinite dilution (Hess's law).
 */

const R_J_PER_MOL_K = 8.314462618; // CODATA 2018
const LN10 = Math.log(10);
/** Davies A at 25 °C, (kg/mol)^½ (Robinson & Stokes; from memory). */
export const DAVIES_A = 0.509;
/** Ionic strength above which the Davies equation is extrapolated, mol/kg (Davies 1962: I ≲ 0.5). */
export const DAVIES_MAX_IONIC_STRENGTH = 0.5;
/** Solids with log10 Ksp below this are the sparingly soluble ones this module decides on. */
export const SPARINGLY_SOLUBLE_LOG_KSP = -3;
export const PRECIPITATION_SOURCE =
  'Ksp from ΔfG° of the solid and its ions (NBS 1982), van ’t Hoff with ΔrH°; Davies activity coefficients';

const WATER_MOLAR_MASS = 18.015;

/** A sparingly soluble solid and what it dissolves into, with its Ksp data at 25 °C. */
export interface SparinglySolubleSolid {
  solid: SpeciesRecord;
  ions: { key: string; nu: number; charge: number }[];
  waterNu: number;
  log10Ksp25: number;
  /** ΔrH° of dissolution, kJ/mol, or null when a ΔfH° is missing. */
  dissolution_dH_kJ_per_mol: number | null;
}

function chargeOf(s: SpeciesRecord): number {
  const m = /\^?(\d*)([+-])$/.exec(s.formula);
  if (!m) return 0;
  const n = m[1] ? Number(m[1]) : 1;
  return m[2] === '+' ? n : -n;
}

/**
 * Every crystal of the library that dissolves into aqueous species and has log10 Ksp (from ΔfG°)
 * below {@link SPARINGLY_SOLUBLE_LOG_KSP}, found once per library.
 *
 * @example sparinglySolubleSolids(lib).find((s) => s.solid.key === 'CaCO3(cr)')?.log10Ksp25 // ≈ −8.30
 */
export function sparinglySolubleSolids(lib: ChemistryLibrary): SparinglySolubleSolid[] {
  return memo(lib.species, 'sparingly-soluble', '', () => {
    const water = lib.species.find((s) => s.key === 'H2O(l)');
    const out: SparinglySolubleSolid[] = [];
    for (const solid of lib.species) {
      // Ice is not a salt: its "Ksp" is the ion product of water.
      if (solid.phase !== 'cr' || solid.dfG_kJ_per_mol === null || solid.formula === 'H2O') continue;
      let split;
      try {
        split = dissolutionProducts(lib, solid);
      } catch {
        continue; // no aqueous species for it: not a salt this module can decide on
      }
      const ions = split.products.map((p) => ({ key: p.species.key, nu: p.nu, charge: chargeOf(p.species), species: p.species }));
      if (ions.length < 2 || ions.some((i) => i.charge === 0 || i.species.dfG_kJ_per_mol === null)) continue;
      if (split.waterReleased > 0 && (water?.dfG_kJ_per_mol ?? null) === null) continue;
      const dG = ions.reduce((a, i) => a + i.nu * i.species.dfG_kJ_per_mol!, 0) + split.waterReleased * (water?.dfG_kJ_per_mol ?? 0) - solid.dfG_kJ_per_mol;
      const log10Ksp25 = (-dG * 1000) / (R_J_PER_MOL_K * T0_K * LN10);
      if (!(log10Ksp25 < SPARINGLY_SOLUBLE_LOG_KSP)) continue;
      let dH: number | null = null;
      if (solid.dfH_kJ_per_mol !== null && ions.every((i) => i.species.dfH_kJ_per_mol !== null) && (split.waterReleased === 0 || water?.dfH_kJ_per_mol != null)) {
        dH = ions.reduce((a, i) => a + i.nu * i.species.dfH_kJ_per_mol!, 0) + split.waterReleased * (water?.dfH_kJ_per_mol ?? 0) - solid.dfH_kJ_per_mol;
      }
      out.push({ solid, ions: ions.map(({ key, nu, charge }) => ({ key, nu, charge })), waterNu: split.waterReleased, log10Ksp25, dissolution_dH_kJ_per_mol: dH });
    }
    return out;
  });
}

/**
 * log10 Ksp of a solid at `tempC` (van 't Hoff from 25 °C with ΔrH° constant; see the module comment).
 *
 * @example log10Ksp(solid('BaSO4(cr)'), 25) // ≈ −9.97
 */
export function log10Ksp(s: SparinglySolubleSolid, tempC: number): number {
  if (s.dissolution_dH_kJ_per_mol === null) return s.log10Ksp25;
  const T = tempC + 273.15;
  return s.log10Ksp25 - ((s.dissolution_dH_kJ_per_mol * 1000) / (R_J_PER_MOL_K * LN10)) * (1 / T - 1 / T0_K);
}

/**
 * The aqueous species (ions) a set of dissolved solutes puts into the water, mol, from each
 * solute's dissolution products (e.g. 1 mol Na2CO3(cr) → 2 mol Na+(ai) + 1 mol CO3^2-(ai)).
 * A solute the library cannot split is skipped and named in the warnings.
 *
 * @example ionsFromSolutes(lib, [{ soluteKey: 'CaCl2(cr)', mol: 0.1 }]).ionsMol // → { 'Ca^2+(ai)': 0.1, 'Cl-(ai)': 0.2 }
 */
export function ionsFromSolutes(lib: ChemistryLibrary, solutes: readonly { soluteKey: string; mol: number }[]): { ionsMol: Record<string, number>; warnings: ComputationWarning[] } {
  const ionsMol: Record<string, number> = {};
  const warnings: ComputationWarning[] = [];
  for (const s of solutes) {
    if (!(s.mol > 0)) continue;
    try {
      for (const p of dissolutionProducts(lib, s.soluteKey).products) ionsMol[p.species.key] = (ionsMol[p.species.key] ?? 0) + p.nu * s.mol;
    } catch (error) {
      if (!(error instanceof UnknownSpeciesError)) throw error;
      warnings.push({ code: 'precipitation.ions-unknown', message: `the ions of ${s.soluteKey} are not in the species data; it is left out of the precipitation check` });
    }
  }
  return { ionsMol, warnings };
}

export interface Precipitate {
  solidKey: string;
  name: string;
  mol: number;
  massG: number;
  /** log10 Ksp at the temperature of the check. */
  log10Ksp: number;
  /** Saturation index log10(Q/Ksp) before anything precipitated. */
  saturationIndex: number;
  /** Heat released by the precipitation, J (negative: absorbed); null when a ΔfH° is missing. */
  heatReleasedJ: number | null;
  /** The ions it took out of solution, mol. */
  ionsMol: Record<string, number>;
}

export interface PrecipitationResult {
  precipitates: Precipitate[];
  /** Ions left in solution, mol. */
  remainingIonsMol: Record<string, number>;
  /** Liquid water left (hydrate water of a precipitate is taken from it), g. */
  waterG: number;
  /** Ionic strength before precipitation, mol/kg. */
  ionicStrength: number;
  /** Σ heat released, J (0 when nothing precipitates). */
  heatReleasedJ: number;
  /** One plain sentence for the result. */
  statement: string;
  warnings: ComputationWarning[];
  source: string;
}

function chargeByKey(lib: ChemistryLibrary, key: string): number {
  const s = lib.species.find((x) => x.key === key);
  return s ? chargeOf(s) : 0;
}

function ionicStrength(ionsMol: Record<string, number>, charges: Record<string, number>, waterKg: number): number {
  let i = 0;
  for (const [k, n] of Object.entries(ionsMol)) i += (Math.max(0, n) / waterKg) * (charges[k] ?? 0) ** 2;
  return i / 2;
}

function log10Gamma(z: number, I: number): number {
  const r = Math.sqrt(I);
  return -DAVIES_A * z * z * (r / (1 + r) - 0.3 * I);
}

/** log10 of the ion activity product of `s` when ξ mol of it has precipitated. */
function log10Q(s: SparinglySolubleSolid, ionsMol: Record<string, number>, charges: Record<string, number>, waterG: number, xi: number): number {
  const after: Record<string, number> = { ...ionsMol };
  for (const ion of s.ions) after[ion.key] = (after[ion.key] ?? 0) - ion.nu * xi;
  const waterKg = (waterG - s.waterNu * xi * WATER_MOLAR_MASS) / 1000;
  if (!(waterKg > 0)) return Number.NEGATIVE_INFINITY;
  const I = ionicStrength(after, charges, waterKg);
  let q = 0;
  for (const ion of s.ions) {
    const m = (after[ion.key] ?? 0) / waterKg;
    if (!(m > 0)) return Number.NEGATIVE_INFINITY;
    q += ion.nu * (Math.log10(m) + log10Gamma(ion.charge, I));
  }
  return q;
}

const fmt = (x: number, d = 2) => (Math.abs(x) >= 100 ? x.toFixed(0) : x.toFixed(d));
const capitalise = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

/**
 * What precipitates from the dissolved ions of a pack (see the module comment for the method).
 *
 * @param dissolvedIonsMol aqueous species keys → mol in solution, e.g. `{ 'Ca^2+(ai)': 0.2, 'CO3^2-(ai)': 0.1, … }`
 * @param waterG liquid water the ions are in, g (> 0)
 * @param tempC temperature of the check, °C
 * @example findPrecipitates({ 'Ba^2+(ai)': 0.01, 'Cl-(ai)': 0.02, 'Na+(ai)': 0.02, 'SO4^2-(ai)': 0.01 }, 100, 25, lib)
 * // → precipitates: [{ solidKey: 'BaSO4(cr)', mol ≈ 0.0100, massG ≈ 2.33, … }], statement: 'Barium sulfate (barite) precipitates: …'
 */
export function findPrecipitates(dissolvedIonsMol: Readonly<Record<string, number>>, waterG: number, tempC: number, lib: ChemistryLibrary): PrecipitationResult {
  const warnings: ComputationWarning[] = [];
  const ions: Record<string, number> = {};
  for (const [k, n] of Object.entries(dissolvedIonsMol)) if (n > 0) ions[k] = n;
  const charges: Record<string, number> = {};
  for (const k of Object.keys(ions)) charges[k] = chargeByKey(lib, k);
  const empty = (statement: string): PrecipitationResult => ({
    precipitates: [],
    remainingIonsMol: ions,
    waterG: Math.max(0, waterG),
    ionicStrength: waterG > 0 ? ionicStrength(ions, charges, waterG / 1000) : 0,
    heatReleasedJ: 0,
    statement,
    warnings,
    source: PRECIPITATION_SOURCE,
  });
  if (!(waterG > 0)) return empty('No liquid water: nothing is dissolved, so nothing precipitates.');
  const I0 = ionicStrength(ions, charges, waterG / 1000);
  if (I0 > DAVIES_MAX_IONIC_STRENGTH) {
    warnings.push({
      code: 'precipitation.activity-extrapolated',
      message: `ionic strength ${I0.toFixed(2)} mol/kg is above the ${DAVIES_MAX_IONIC_STRENGTH} mol/kg the Davies activity coefficients are meant for: the amounts precipitated are estimates`,
    });
  }
  const candidates = sparinglySolubleSolids(lib).filter((s) => s.ions.every((i) => (ions[i.key] ?? 0) > 0));
  if (!candidates.length) return empty('Nothing precipitates: no two dissolved ions form a sparingly soluble solid in the species data.');

  const byKey = new Map<string, Precipitate>();
  let water = waterG;
  for (let round = 0; round < 20; round++) {
    let best: { s: SparinglySolubleSolid; si: number; logK: number } | null = null;
    for (const s of candidates) {
      const logK = log10Ksp(s, tempC);
      const si = log10Q(s, ions, charges, water, 0) - logK;
      if (si > 1e-6 && (!best || si > best.si)) best = { s, si, logK };
    }
    if (!best) break;
    const { s, si, logK } = best;
    // Largest ξ that keeps every ion (and the water) positive; Q falls towards −∞ there.
    let hi = Math.min(...s.ions.map((i) => ions[i.key]! / i.nu), s.waterNu > 0 ? water / (s.waterNu * WATER_MOLAR_MASS) : Number.POSITIVE_INFINITY);
    let lo = 0;
    for (let it = 0; it < 200 && hi - lo > 1e-12 * Math.max(1, hi); it++) {
      const mid = (lo + hi) / 2;
      if (log10Q(s, ions, charges, water, mid) - logK > 0) lo = mid;
      else hi = mid;
    }
    const xi = lo;
    if (!(xi > 0)) break;
    const taken: Record<string, number> = {};
    for (const ion of s.ions) {
      ions[ion.key] = Math.max(0, ions[ion.key]! - ion.nu * xi);
      taken[ion.key] = ion.nu * xi;
    }
    water -= s.waterNu * xi * WATER_MOLAR_MASS;
    const prev = byKey.get(s.solid.key);
    const heat = s.dissolution_dH_kJ_per_mol === null ? null : s.dissolution_dH_kJ_per_mol * 1000 * xi;
    if (prev) {
      prev.mol += xi;
      prev.massG += xi * s.solid.molarMass_g_per_mol;
      prev.heatReleasedJ = prev.heatReleasedJ === null || heat === null ? null : prev.heatReleasedJ + heat;
      for (const [k, n] of Object.entries(taken)) prev.ionsMol[k] = (prev.ionsMol[k] ?? 0) + n;
    } else {
      byKey.set(s.solid.key, {
        solidKey: s.solid.key,
        name: s.solid.name,
        mol: xi,
        massG: xi * s.solid.molarMass_g_per_mol,
        log10Ksp: logK,
        saturationIndex: si,
        heatReleasedJ: heat,
        ionsMol: taken,
      });
    }
  }
  const precipitates = [...byKey.values()];
  for (const p of precipitates) {
    if (p.heatReleasedJ === null) warnings.push({ code: 'precipitation.heat-unknown', message: `no ΔfH° for ${p.solidKey} or its ions: the heat of its precipitation is not known` });
  }
  const heatReleasedJ = precipitates.reduce((a, p) => a + (p.heatReleasedJ ?? 0), 0);
  const statement = precipitates.length
    ? precipitates
        .map((p) => {
          const from = Object.keys(p.ionsMol).map((k) => k.replace(/\(ai\)$/, '')).join(' and ');
          const heat = p.heatReleasedJ === null ? 'its heat is not known' : p.heatReleasedJ >= 0 ? `releasing ${fmt(p.heatReleasedJ / 1000)} kJ` : `absorbing ${fmt(-p.heatReleasedJ / 1000)} kJ`;
          return `${capitalise(p.name)} (${p.solidKey.replace(/\(cr\)$/, '')}) precipitates from ${from}: ${fmt(p.massG)} g (${fmt(p.mol, 3)} mol), log10 Ksp ${p.log10Ksp.toFixed(2)} at ${fmt(tempC, 1)} °C, ${heat}.`;
        })
        .join(' ')
    : 'Nothing precipitates: every ion product is below the solubility product of its solid.';
  return { precipitates, remainingIonsMol: ions, waterG: water, ionicStrength: I0, heatReleasedJ, statement, warnings, source: PRECIPITATION_SOURCE };
}
