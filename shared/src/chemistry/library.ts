import dilutionData from './data/dilution.json';
import eutecticData from './data/eutectic.json';
import freezingData from './data/freezing-point.json';
import solubilityData from './data/solubility.json';
import heatCapacityData from './data/solution-heat-capacity.json';
import speciesData from './data/species.json';
import { hillFormula, parseFormula } from './formula';
import { memo } from './memo';
import type {
  ChemistryLibrary,
  DilutionSeries,
  EutecticPoint,
  FreezingPointSeries,
  Phase,
  SolubilitySeries,
  SolutionHeatCapacityCoefficients,
  SpeciesRecord,
} from './types';

const PHASES: readonly Phase[] = ['cr', 'l', 'g', 'aq', 'ai', 'ao'];

/** A species, series or coefficient set that the library does not hold. */
export class UnknownSpeciesError extends Error {
  override readonly name = 'UnknownSpeciesError';
  readonly formula: string;
  readonly phase: Phase | null;
  constructor(message: string, options: { formula: string; phase: Phase | null }) {
    super(message);
    this.formula = options.formula;
    this.phase = options.phase;
  }
}

/** Library data that breaks a rule (duplicate key, key not `formula(phase)`, unsorted points...). */
export class ChemistryDataError extends Error {
  override readonly name = 'ChemistryDataError';
}

/** `speciesKey('NH4NO3', 'cr')` → `NH4NO3(cr)`. */
export function speciesKey(formula: string, phase: Phase): string {
  return `${formula}(${phase})`;
}

/**
 * Check and normalise library data handed in by a caller (database rows or the bundled JSON):
 * every species key is `formula(phase)` and unique, every formula parses, phases are known, and
 * tabulated points are sorted by their abscissa (n H2O, °C, mass fraction). Returns a new library.
 *
 * @example createChemistryLibrary({ species: [...], dilution: [], solubility: [], solutionHeatCapacity: [] })
 */
export function createChemistryLibrary(data: ChemistryLibrary): ChemistryLibrary {
  const seen = new Set<string>();
  for (const s of data.species) {
    if (!PHASES.includes(s.phase)) {
      throw new ChemistryDataError(`Species "${s.key}": phase must be one of ${PHASES.join(', ')}, found "${s.phase}".`);
    }
    if (s.key !== speciesKey(s.formula, s.phase)) {
      throw new ChemistryDataError(`Species key "${s.key}" does not match formula(phase) = "${speciesKey(s.formula, s.phase)}".`);
    }
    if (seen.has(s.key)) throw new ChemistryDataError(`Duplicate species key "${s.key}".`);
    seen.add(s.key);
    parseFormula(s.formula);
    if (!(s.molarMass_g_per_mol > 0)) throw new ChemistryDataError(`Species "${s.key}": molar mass must be > 0, found ${s.molarMass_g_per_mol}.`);
  }
  const byN = (a: { nH2O_per_mol: number }, b: { nH2O_per_mol: number }) => a.nH2O_per_mol - b.nH2O_per_mol;
  const dilution: DilutionSeries[] = data.dilution.map((d) => ({ ...d, points: [...d.points].sort(byN) }));
  const solubility: SolubilitySeries[] = data.solubility.map((s) => ({ ...s, points: [...s.points].sort((a, b) => a.tempC - b.tempC) }));
  const freezingPoint: FreezingPointSeries[] | undefined = data.freezingPoint?.map((f) => ({
    ...f,
    points: [...f.points].sort((a, b) => a.massFraction - b.massFraction),
  }));
  for (const d of dilution) assertStrictlyIncreasing(d.points.map((p) => p.nH2O_per_mol), `dilution series ${d.solute}`);
  for (const s of solubility) assertStrictlyIncreasing(s.points.map((p) => p.tempC), `solubility series ${s.solute}`);
  const lib: ChemistryLibrary = {
    species: [...data.species],
    dilution,
    solubility,
    solutionHeatCapacity: [...data.solutionHeatCapacity],
  };
  if (freezingPoint) lib.freezingPoint = freezingPoint;
  if (data.eutectics) lib.eutectics = [...data.eutectics];
  return lib;
}

function assertStrictlyIncreasing(xs: number[], what: string): void {
  for (let k = 1; k < xs.length; k++) {
    if (!((xs[k] as number) > (xs[k - 1] as number))) {
      throw new ChemistryDataError(`${what}: abscissae must be strictly increasing, found ${xs[k - 1]} then ${xs[k]}.`);
    }
  }
}

let bundled: ChemistryLibrary | null = null;

/**
 * The library bundled with Packwright, built from the JSON files in ./data (NBS 1982 species and
 * dilution data, CRC solubility and freezing points, Laliberté 2009 heat-capacity coefficients,
 * eutectics); see scripts/data/build-chemistry-data.ts. Created once and shared; treat as read-only.
 *
 * @example findSpecies(defaultChemistryLibrary(), 'NH4NO3', 'cr').dfH_kJ_per_mol // → -365.56
 */
export function defaultChemistryLibrary(): ChemistryLibrary {
  if (!bundled) {
    bundled = createChemistryLibrary({
      species: speciesData as SpeciesRecord[],
      dilution: dilutionData as DilutionSeries[],
      solubility: solubilityData as SolubilitySeries[],
      solutionHeatCapacity: heatCapacityData as SolutionHeatCapacityCoefficients[],
      freezingPoint: freezingData as FreezingPointSeries[],
      eutectics: eutecticData as EutecticPoint[],
    });
  }
  return bundled;
}

interface SpeciesIndex {
  byKey: Map<string, SpeciesRecord>;
  /** Hill formula with charge → records. */
  byComposition: Map<string, SpeciesRecord[]>;
}
const indexCache = new WeakMap<SpeciesRecord[], SpeciesIndex>();

function indexOf(lib: ChemistryLibrary): SpeciesIndex {
  let idx = indexCache.get(lib.species);
  if (!idx) {
    idx = { byKey: new Map(), byComposition: new Map() };
    for (const s of lib.species) {
      idx.byKey.set(s.key, s);
      const comp = compositionKey(s.formula);
      const list = idx.byComposition.get(comp) ?? [];
      list.push(s);
      idx.byComposition.set(comp, list);
    }
    indexCache.set(lib.species, idx);
  }
  return idx;
}

/** Composition key that ignores how a formula is written: hydrates and condensed forms compare equal. */
function compositionKey(formula: string): string {
  const p = parseFormula(formula);
  return hillFormula(p);
}

/** Phases to try, in order, for a requested phase. Aqueous states stand in for each other. */
function phaseCandidates(phase: Phase, charged: boolean): Phase[] {
  if (phase === 'aq' || phase === 'ai' || phase === 'ao') {
    if (charged) return [phase, ...(['ai', 'ao', 'aq'] as Phase[]).filter((p) => p !== phase)];
    if (phase === 'aq') return ['aq', 'ao', 'ai'];
    return [phase];
  }
  return [phase];
}

/**
 * Find a species by formula and phase. The formula may be written in any form the parser reads
 * (`CaCl2.6H2O`, `CH3COONa` or `NaCH3CO2`, `SO4^2-` or `SO4-2`) and may carry its phase tag
 * (`NH3(g)`); an explicit `phase` argument wins over the tag. Matching is exact by key first, then
 * by elemental composition and charge within the phase. `aq` finds the aqueous standard state:
 * `aq`, then undissociated `ao`, then ionised `ai` (so `NaCl(aq)` → `NaCl(ai)`, `NH3(aq)` →
 * `NH3(ao)`); for ions `ai`/`ao`/`aq` are interchangeable.
 *
 * Throws {@link UnknownSpeciesError} naming what was asked for and which phases exist.
 *
 * @example findSpecies(lib, 'CaCl2·6H2O', 'cr').key // → 'CaCl2·6H2O(cr)'
 * @example findSpecies(lib, 'Ca^2+', 'aq').key // → 'Ca^2+(ai)'
 */
export function findSpecies(lib: ChemistryLibrary, formula: string, phase?: Phase | null): SpeciesRecord {
  return memo(lib.species, 'find', `${formula}\u0000${phase ?? ''}`, () => searchSpecies(lib, formula, phase));
}

function searchSpecies(lib: ChemistryLibrary, formula: string, phase?: Phase | null): SpeciesRecord {
  const parsed = parseFormula(formula);
  const wanted = phase ?? parsed.phase;
  const idx = indexOf(lib);
  const comp = hillFormula(parsed);
  const sameComposition = idx.byComposition.get(comp) ?? [];
  const described = `"${formula}"${phase ? ` (${phase})` : ''}`;
  if (wanted === null) {
    if (sameComposition.length === 1) return sameComposition[0] as SpeciesRecord;
    if (sameComposition.length === 0) {
      throw new UnknownSpeciesError(`Unknown species ${described}: no species with composition ${comp} in the library.`, { formula, phase: null });
    }
    throw new UnknownSpeciesError(
      `Species ${described} needs a phase: the library has ${sameComposition.map((s) => s.key).join(', ')}.`,
      { formula, phase: null },
    );
  }
  const normalisedFormula = parsed.formula;
  for (const p of phaseCandidates(wanted, parsed.charge !== 0)) {
    const exact = idx.byKey.get(speciesKey(normalisedFormula, p)) ?? idx.byKey.get(speciesKey(formula.replace(/\(\s*[a-z]{1,2}\s*\)\s*$/, '').trim(), p));
    if (exact) return exact;
    const inPhase = sameComposition.filter((s) => s.phase === p);
    if (inPhase.length === 1) return inPhase[0] as SpeciesRecord;
    if (inPhase.length > 1) {
      throw new UnknownSpeciesError(
        `Species ${described} is ambiguous: ${inPhase.map((s) => s.key).join(', ')} share composition ${comp}; write the formula as one of them.`,
        { formula, phase: wanted },
      );
    }
  }
  const have = sameComposition.map((s) => `(${s.phase})`);
  throw new UnknownSpeciesError(
    have.length
      ? `Unknown species ${parsed.formula}(${wanted}): the library has ${parsed.formula} only as ${have.join(', ')}.`
      : `Unknown species ${parsed.formula}(${wanted}): no species with composition ${comp} in the library.`,
    { formula, phase: wanted },
  );
}

/** Look up a species by its exact key (`NH4NO3(cr)`), or by anything {@link findSpecies} accepts. */
export function findSpeciesByKey(lib: ChemistryLibrary, key: string): SpeciesRecord {
  return indexOf(lib).byKey.get(key) ?? findSpecies(lib, key);
}

/**
 * The dilution series of a dissolving solid, found by the solid's key or formula; a hydrate finds
 * the series of its anhydrous salt (`CaCl2·6H2O(cr)` → series of `CaCl2(cr)`), and the caller adds
 * the hydrate water to n. Throws {@link UnknownSpeciesError} when there is none.
 */
export function findDilutionSeries(lib: ChemistryLibrary, soluteKey: string): DilutionSeries {
  const found = findSeries(lib.dilution, soluteKey);
  if (!found) throw new UnknownSpeciesError(`No dilution data for "${soluteKey}": the library has dilution series for ${lib.dilution.map((d) => d.solute).join(', ')}.`, { formula: soluteKey, phase: null });
  return found;
}

/** The solubility series of a solute (anhydrous basis); hydrates map to their anhydrous salt. */
export function findSolubilitySeries(lib: ChemistryLibrary, soluteKey: string): SolubilitySeries {
  const found = findSeries(lib.solubility, soluteKey);
  if (!found) throw new UnknownSpeciesError(`No solubility data for "${soluteKey}": the library has solubility series for ${lib.solubility.map((d) => d.solute).join(', ')}.`, { formula: soluteKey, phase: null });
  return found;
}

/** Laliberté coefficients of a solute, or null when the library has none. */
export function findHeatCapacityCoefficients(lib: ChemistryLibrary, soluteKey: string): SolutionHeatCapacityCoefficients | null {
  return findSeries(lib.solutionHeatCapacity, soluteKey);
}

/** One empty list for a library without the optional tables (so its lookups are remembered too). */
const NO_SERIES: never[] = [];

/** Freezing-point series of a solute, or null. */
export function findFreezingPointSeries(lib: ChemistryLibrary, soluteKey: string): FreezingPointSeries | null {
  return findSeries(lib.freezingPoint ?? NO_SERIES, soluteKey);
}

/** Eutectic of a solute with water, or null. */
export function findEutectic(lib: ChemistryLibrary, soluteKey: string): EutecticPoint | null {
  return findSeries(lib.eutectics ?? NO_SERIES, soluteKey);
}

/**
 * Match a series by solute: the exact key, else the anhydrous composition of the solute in the
 * solid/liquid/gas phase it was given. The answer (a series or none) is remembered per list and
 * solute, so the formulas are parsed once, not on every lookup.
 */
function findSeries<T extends { solute: string }>(list: T[], soluteKey: string): T | null {
  return memo(list, 'series', soluteKey, () => searchSeries(list, soluteKey));
}

function searchSeries<T extends { solute: string }>(list: T[], soluteKey: string): T | null {
  const exact = list.find((x) => x.solute === soluteKey);
  if (exact) return exact;
  const parsed = parseFormula(soluteKey);
  const anhydrous = anhydrousComposition(parsed.formula);
  for (const x of list) {
    const px = parseFormula(x.solute);
    if (anhydrousComposition(px.formula) === anhydrous && (parsed.phase === null || px.phase === parsed.phase || parsed.phase === 'cr')) {
      return x;
    }
  }
  return null;
}

function anhydrousComposition(formula: string): string {
  const p = parseFormula(formula);
  const water = p.parts.slice(1).filter((q) => q.text === 'H2O').reduce((n, q) => n + q.coefficient, 0);
  const el = { ...p.elements };
  if (water > 0) {
    el.H = (el.H ?? 0) - 2 * water;
    el.O = (el.O ?? 0) - water;
  }
  return hillFormula({ elements: el, charge: p.charge });
}
