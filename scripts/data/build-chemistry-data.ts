/**
 * Builds the committed chemistry data files under shared/src/chemistry/data/ from the published
 * reference tables. Run from the repository root:
 *
 *   npx tsx scripts/data/build-chemistry-data.ts [referenceDataDir]
 *
 * referenceDataDir defaults to ../shared/data (the read-only reference tables). The product reads
 * only the JSON files written here, never the reference tables.
 *
 * Inputs:
 *  - nbs-1982/nbs-tables.csv: Wagman et al., The NBS Tables of Chemical Thermodynamic Properties,
 *    J. Phys. Chem. Ref. Data 11, Suppl. 2 (1982). Two header rows; kJ/mol and J/(mol·K); "-" is
 *    no value; "*" marks an erratum value (kept, and noted in the row's source).
 *  - solubility/aqueous-solubility-mass-percent.csv: CRC Handbook of Chemistry and Physics, 98th ed.
 *    (2017), "Aqueous Solubility of Inorganic Compounds at Various Temperatures" (mass % of the
 *    anhydrous solute in the saturated solution).
 *  - solution-heat-capacity/laliberte-2009.tsv: Laliberté, J. Chem. Eng. Data 54 (2009) 1725.
 *  - solution-properties/concentrative-properties-20C.txt: CRC Handbook, 102nd ed. (2021),
 *    "Concentrative Properties of Aqueous Solutions" (freezing-point depression vs mass %).
 */
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { molarMass } from '../../shared/src/chemistry/formula';
import type {
  DilutionSeries,
  FreezingPointSeries,
  EutecticPoint,
  Phase,
  SolubilitySeries,
  SolutionHeatCapacityCoefficients,
  SpeciesRecord,
} from '../../shared/src/chemistry/types';

const here = dirname(fileURLToPath(import.meta.url));
const repoRoot = resolve(here, '../..');
const refDir = resolve(process.argv[2] ?? join(repoRoot, '../shared/data'));
const outDir = join(repoRoot, 'shared/src/chemistry/data');

const NBS_SOURCE = 'NBS 1982 (Wagman et al., J. Phys. Chem. Ref. Data 11, Suppl. 2)';
const CRC_SOLUBILITY_SOURCE =
  'CRC Handbook of Chemistry and Physics, 98th ed. (2017), "Aqueous Solubility of Inorganic Compounds at Various Temperatures"; mass % converted to g per 100 g water as 100·w/(100−w)';
const LALIBERTE_SOURCE = 'Laliberté, J. Chem. Eng. Data 54 (2009) 1725, doi:10.1021/je8008123 (heat-capacity coefficients a1–a6)';
const CRC_FREEZING_SOURCE =
  'CRC Handbook of Chemistry and Physics, 102nd ed. (2021), "Concentrative Properties of Aqueous Solutions" (freezing-point depression at the given mass %)';

// ---------------------------------------------------------------------------------------------
// NBS table
// ---------------------------------------------------------------------------------------------

interface NbsRow {
  formula: string;
  solvent: string;
  name: string;
  stateDescription: string;
  state: string;
  dfH: string;
  dfG: string;
  S: string;
  Cp: string;
}

function readNbs(): NbsRow[] {
  const text = readFileSync(join(refDir, 'nbs-1982/nbs-tables.csv'), 'utf8').replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: true });
  // Two header rows: a units/conditions row and the column-name row.
  return parsed.data.slice(2).map((r) => ({
    formula: normaliseNbsFormula(r[0] ?? ''),
    solvent: (r[1] ?? '').trim(),
    name: (r[2] ?? '').trim(),
    stateDescription: (r[3] ?? '').trim(),
    state: (r[4] ?? '').trim(),
    dfH: (r[7] ?? '').trim(),
    dfG: (r[8] ?? '').trim(),
    S: (r[10] ?? '').trim(),
    Cp: (r[11] ?? '').trim(),
  }));
}

/** `SO4<sup>2-</sup>` → `SO4^2-`. */
function normaliseNbsFormula(f: string): string {
  return f.trim().replace(/<sup>([^<]*)<\/sup>/g, '^$1');
}

/** NBS cell → number or null; "-" and "" are no value, a trailing "*" marks an erratum value. */
function nbsValue(cell: string): { value: number | null; erratum: boolean } {
  const erratum = cell.includes('*');
  const t = cell.replace('*', '').trim();
  if (t === '' || t === '-') return { value: null, erratum };
  const v = Number(t);
  if (!Number.isFinite(v)) throw new Error(`NBS cell "${cell}" is not a number`);
  return { value: v, erratum };
}

interface SpeciesSpec {
  /** Formula as written in the NBS table (after `<sup>` → `^`). */
  nbs: string;
  /** NBS state column. */
  state: string;
  /** Formula used by Packwright (defaults to `nbs`). */
  formula?: string;
  /** Phase used by Packwright (defaults to the NBS state). */
  phase?: Phase;
  name: string;
}

// Ions: NBS lists a single ion in the state "ao" (an ion is not further dissociated); Packwright
// keys them as `(ai)`, the ionised aqueous standard state, e.g. `NH4+(ai)`.
const ION = (nbs: string, name: string, formula?: string): SpeciesSpec => ({ nbs, state: 'ao', phase: 'ai', name, ...(formula ? { formula } : {}) });

const SPECIES: SpeciesSpec[] = [
  // Elements and gases
  { nbs: 'H2', state: 'g', name: 'hydrogen' },
  { nbs: 'O2', state: 'g', name: 'oxygen' },
  { nbs: 'N2', state: 'g', name: 'nitrogen' },
  { nbs: 'Ar', state: 'g', name: 'argon' },
  { nbs: 'Cl2', state: 'g', name: 'chlorine' },
  { nbs: 'C', state: 'cr', name: 'carbon (graphite)' },
  { nbs: 'S', state: 'cr', name: 'sulfur (rhombic)' },
  { nbs: 'Fe', state: 'cr', name: 'iron' },
  { nbs: 'Mg', state: 'cr', name: 'magnesium' },
  { nbs: 'Al', state: 'cr', name: 'aluminium' },
  { nbs: 'Zn', state: 'cr', name: 'zinc' },
  { nbs: 'Cu', state: 'cr', name: 'copper' },
  { nbs: 'Ca', state: 'cr', name: 'calcium' },
  { nbs: 'Na', state: 'cr', name: 'sodium' },
  { nbs: 'K', state: 'cr', name: 'potassium' },
  { nbs: 'Ba', state: 'cr', name: 'barium' },
  { nbs: 'Li', state: 'cr', name: 'lithium' },
  // Water, carbon oxides, ammonia, peroxide
  { nbs: 'H2O', state: 'l', name: 'water' },
  { nbs: 'H2O', state: 'g', name: 'water vapour' },
  { nbs: 'CO2', state: 'g', name: 'carbon dioxide' },
  { nbs: 'CO2', state: 'ao', name: 'carbon dioxide (aqueous)' },
  { nbs: 'CO', state: 'g', name: 'carbon monoxide' },
  { nbs: 'NH3', state: 'g', name: 'ammonia' },
  { nbs: 'NH3', state: 'ao', name: 'ammonia (aqueous)' },
  { nbs: 'H2', state: 'ao', name: 'hydrogen (aqueous)' },
  { nbs: 'O2', state: 'ao', name: 'oxygen (aqueous)' },
  { nbs: 'H2O2', state: 'l', name: 'hydrogen peroxide' },
  { nbs: 'H2O2', state: 'ao', name: 'hydrogen peroxide (aqueous)' },
  { nbs: 'CH3COOH', state: 'l', name: 'acetic acid' },
  { nbs: 'CH3COOH', state: 'ao', name: 'acetic acid (aqueous, undissociated)' },
  // Cold-pack salts and their ionised aqueous states
  { nbs: 'NH4NO3', state: 'cr', name: 'ammonium nitrate' },
  { nbs: 'NH4NO3', state: 'ai', name: 'ammonium nitrate (aqueous, ionised)' },
  { nbs: 'NH4Cl', state: 'cr', name: 'ammonium chloride' },
  { nbs: 'NH4Cl', state: 'ai', name: 'ammonium chloride (aqueous, ionised)' },
  { nbs: 'CO(NH2)2', state: 'cr', name: 'urea' },
  { nbs: 'KCl', state: 'cr', name: 'potassium chloride' },
  { nbs: 'KCl', state: 'ai', name: 'potassium chloride (aqueous, ionised)' },
  { nbs: 'KNO3', state: 'cr', name: 'potassium nitrate' },
  { nbs: 'KNO3', state: 'ai', name: 'potassium nitrate (aqueous, ionised)' },
  { nbs: 'NaCl', state: 'cr', name: 'sodium chloride' },
  { nbs: 'NaCl', state: 'ai', name: 'sodium chloride (aqueous, ionised)' },
  { nbs: 'NaNO3', state: 'cr', name: 'sodium nitrate' },
  { nbs: 'NaNO3', state: 'ai', name: 'sodium nitrate (aqueous, ionised)' },
  { nbs: '(NH4)2SO4', state: 'cr', name: 'ammonium sulfate' },
  { nbs: '(NH4)2SO4', state: 'ai', name: 'ammonium sulfate (aqueous, ionised)' },
  // Heat-pack salts and phase-change salts
  { nbs: 'NaCH3CO2', state: 'cr', formula: 'CH3COONa', name: 'sodium acetate' },
  { nbs: 'NaCH3CO2', state: 'ai', formula: 'CH3COONa', name: 'sodium acetate (aqueous, ionised)' },
  { nbs: 'NaCH3CO2·3H2O', state: 'cr', formula: 'CH3COONa·3H2O', name: 'sodium acetate trihydrate' },
  { nbs: 'Na2S2O3', state: 'cr', name: 'sodium thiosulfate' },
  { nbs: 'Na2S2O3', state: 'ai', name: 'sodium thiosulfate (aqueous, ionised)' },
  { nbs: 'Na2S2O3·5H2O', state: 'cr', name: 'sodium thiosulfate pentahydrate' },
  { nbs: 'CaCl2', state: 'cr', name: 'calcium chloride' },
  { nbs: 'CaCl2', state: 'ai', name: 'calcium chloride (aqueous, ionised)' },
  { nbs: 'CaCl2·2H2O', state: 'cr', name: 'calcium chloride dihydrate' },
  { nbs: 'CaCl2·6H2O', state: 'cr', name: 'calcium chloride hexahydrate' },
  { nbs: 'MgSO4', state: 'cr', name: 'magnesium sulfate' },
  { nbs: 'MgSO4', state: 'ai', name: 'magnesium sulfate (aqueous, ionised)' },
  { nbs: 'MgSO4·7H2O', state: 'cr', name: 'magnesium sulfate heptahydrate' },
  { nbs: 'MgCl2', state: 'cr', name: 'magnesium chloride' },
  { nbs: 'MgCl2', state: 'ai', name: 'magnesium chloride (aqueous, ionised)' },
  { nbs: 'MgCl2·6H2O', state: 'cr', name: 'magnesium chloride hexahydrate' },
  { nbs: 'Na2CO3', state: 'cr', name: 'sodium carbonate' },
  { nbs: 'Na2CO3', state: 'ai', name: 'sodium carbonate (aqueous, ionised)' },
  { nbs: 'Na2CO3·10H2O', state: 'cr', name: 'sodium carbonate decahydrate' },
  { nbs: 'NaHCO3', state: 'cr', name: 'sodium hydrogen carbonate' },
  { nbs: 'Na2SO4', state: 'cr', name: 'sodium sulfate' },
  { nbs: 'Na2SO4', state: 'ai', name: 'sodium sulfate (aqueous, ionised)' },
  { nbs: 'Na2SO4·10H2O', state: 'cr', name: 'sodium sulfate decahydrate' },
  { nbs: 'LiCl', state: 'cr', name: 'lithium chloride' },
  { nbs: 'LiCl', state: 'ai', name: 'lithium chloride (aqueous, ionised)' },
  { nbs: 'NaOH', state: 'cr', name: 'sodium hydroxide' },
  { nbs: 'NaOH', state: 'ai', name: 'sodium hydroxide (aqueous, ionised)' },
  { nbs: 'KOH', state: 'cr', name: 'potassium hydroxide' },
  { nbs: 'KOH', state: 'ai', name: 'potassium hydroxide (aqueous, ionised)' },
  // Hydration and oxidation heaters
  { nbs: 'CaO', state: 'cr', name: 'calcium oxide' },
  { nbs: 'Ca(OH)2', state: 'cr', name: 'calcium hydroxide' },
  { nbs: 'Ca(OH)2', state: 'ai', name: 'calcium hydroxide (aqueous, ionised)' },
  { nbs: 'CaCO3', state: 'cr', name: 'calcium carbonate (calcite)' },
  { nbs: 'CaSO4', state: 'cr', name: 'calcium sulfate (anhydrite)' },
  { nbs: 'CaSO4·2H2O', state: 'cr', name: 'calcium sulfate dihydrate' },
  { nbs: 'MgO', state: 'cr', name: 'magnesium oxide' },
  { nbs: 'Mg(OH)2', state: 'cr', name: 'magnesium hydroxide' },
  { nbs: 'FeO', state: 'cr', name: 'iron(II) oxide' },
  { nbs: 'Fe2O3', state: 'cr', name: 'iron(III) oxide (hematite)' },
  { nbs: 'Fe3O4', state: 'cr', name: 'iron(II,III) oxide (magnetite)' },
  { nbs: 'FeO(OH)', state: 'cr', name: 'iron(III) oxide-hydroxide (goethite)' },
  { nbs: 'Fe(OH)2', state: 'cr', name: 'iron(II) hydroxide' },
  { nbs: 'Fe(OH)3', state: 'cr', name: 'iron(III) hydroxide' },
  { nbs: 'FeCl2', state: 'cr', name: 'iron(II) chloride' },
  { nbs: 'FeCl3', state: 'cr', name: 'iron(III) chloride' },
  { nbs: 'Al2O3', state: 'cr', name: 'aluminium oxide (corundum)' },
  { nbs: 'ZnO', state: 'cr', name: 'zinc oxide' },
  { nbs: 'CuO', state: 'cr', name: 'copper(II) oxide' },
  // Endothermic solid–solid reaction
  { nbs: 'Ba(OH)2·8H2O', state: 'cr', name: 'barium hydroxide octahydrate' },
  { nbs: 'BaCl2', state: 'cr', name: 'barium chloride' },
  { nbs: 'BaCl2', state: 'ai', name: 'barium chloride (aqueous, ionised)' },
  { nbs: 'BaCl2·2H2O', state: 'cr', name: 'barium chloride dihydrate' },
  // Sparingly soluble salts that precipitate when ions of two ingredients meet
  { nbs: 'BaSO4', state: 'cr', name: 'barium sulfate (barite)' },
  { nbs: 'BaCO3', state: 'cr', name: 'barium carbonate (witherite)' },
  // Aqueous ions
  ION('H^+', 'hydrogen ion', 'H+'),
  ION('OH^-', 'hydroxide ion', 'OH-'),
  ION('NH4^+', 'ammonium ion', 'NH4+'),
  ION('NO3^-', 'nitrate ion', 'NO3-'),
  ION('Cl^-', 'chloride ion', 'Cl-'),
  ION('K^+', 'potassium ion', 'K+'),
  ION('Na^+', 'sodium ion', 'Na+'),
  ION('Li^+', 'lithium ion', 'Li+'),
  ION('CH3COO^-', 'acetate ion', 'CH3COO-'),
  ION('S2O3^2-', 'thiosulfate ion', 'S2O3^2-'),
  ION('Ca^2+', 'calcium ion', 'Ca^2+'),
  ION('Mg^2+', 'magnesium ion', 'Mg^2+'),
  ION('Ba^2+', 'barium ion', 'Ba^2+'),
  ION('SO4^2-', 'sulfate ion', 'SO4^2-'),
  ION('HSO4^-', 'hydrogen sulfate ion', 'HSO4-'),
  ION('CO3^2-', 'carbonate ion', 'CO3^2-'),
  ION('HCO3^-', 'hydrogen carbonate ion', 'HCO3-'),
  ION('Fe^2+', 'iron(II) ion', 'Fe^2+'),
  ION('Fe^3+', 'iron(III) ion', 'Fe^3+'),
  ION('Al^3+', 'aluminium ion', 'Al^3+'),
  ION('Zn^2+', 'zinc ion', 'Zn^2+'),
  ION('Cu^2+', 'copper(II) ion', 'Cu^2+'),
];

/** Species whose "in n H2O" rows are read as dilution series; key = dissolving species. */
const DILUTION: { nbs: string; solute: string }[] = [
  { nbs: 'NH4NO3', solute: 'NH4NO3(cr)' },
  { nbs: 'NH4Cl', solute: 'NH4Cl(cr)' },
  { nbs: 'CO(NH2)2', solute: 'CO(NH2)2(cr)' },
  { nbs: 'KCl', solute: 'KCl(cr)' },
  { nbs: 'KNO3', solute: 'KNO3(cr)' },
  { nbs: 'NaCl', solute: 'NaCl(cr)' },
  { nbs: 'NaNO3', solute: 'NaNO3(cr)' },
  { nbs: '(NH4)2SO4', solute: '(NH4)2SO4(cr)' },
  { nbs: 'NaCH3CO2', solute: 'CH3COONa(cr)' },
  { nbs: 'Na2S2O3', solute: 'Na2S2O3(cr)' },
  { nbs: 'CaCl2', solute: 'CaCl2(cr)' },
  { nbs: 'MgSO4', solute: 'MgSO4(cr)' },
  { nbs: 'MgCl2', solute: 'MgCl2(cr)' },
  { nbs: 'Na2CO3', solute: 'Na2CO3(cr)' },
  { nbs: 'NaHCO3', solute: 'NaHCO3(cr)' },
  { nbs: 'Na2SO4', solute: 'Na2SO4(cr)' },
  { nbs: 'LiCl', solute: 'LiCl(cr)' },
  { nbs: 'NaOH', solute: 'NaOH(cr)' },
  { nbs: 'KOH', solute: 'KOH(cr)' },
  { nbs: 'BaCl2', solute: 'BaCl2(cr)' },
  { nbs: 'NH3', solute: 'NH3(g)' },
];

function buildSpecies(rows: NbsRow[]): SpeciesRecord[] {
  const out: SpeciesRecord[] = [];
  for (const spec of SPECIES) {
    const row = rows.find((r) => r.formula.replace(/\*$/, '') === spec.nbs && r.state === spec.state && !r.solvent.startsWith('in '));
    if (!row) throw new Error(`NBS row not found: ${spec.nbs} (${spec.state})`);
    const formula = spec.formula ?? spec.nbs;
    const phase = (spec.phase ?? spec.state) as Phase;
    const dfH = nbsValue(row.dfH);
    const dfG = nbsValue(row.dfG);
    const S = nbsValue(row.S);
    const Cp = nbsValue(row.Cp);
    const errata = (
      [
        ['ΔfH°', dfH],
        ['ΔfG°', dfG],
        ['S°', S],
        ['Cp°', Cp],
      ] as const
    )
      .filter(([, v]) => v.erratum)
      .map(([n]) => n);
    let source = `${NBS_SOURCE}, row ${spec.nbs} (${spec.state})`;
    if (spec.phase && spec.phase !== spec.state) source += `; NBS lists single ions in state "ao", keyed here as (${spec.phase})`;
    if (errata.length) source += `; erratum value(s) for ${errata.join(', ')}`;
    out.push({
      key: `${formula}(${phase})`,
      formula,
      phase,
      name: spec.name,
      dfH_kJ_per_mol: dfH.value,
      dfG_kJ_per_mol: dfG.value,
      S_J_per_mol_K: S.value,
      Cp_J_per_mol_K: Cp.value,
      molarMass_g_per_mol: round(molarMass(formula), 4),
      source,
    });
  }

  // Urea in water at infinite dilution: NBS gives only the "in ∞ H2O" enthalpy row.
  const ureaInf = rows.find((r) => r.formula === 'CO(NH2)2' && r.solvent === 'in ∞ H2O');
  if (!ureaInf) throw new Error('NBS urea "in ∞ H2O" row not found');
  out.push({
    key: 'CO(NH2)2(ao)',
    formula: 'CO(NH2)2',
    phase: 'ao',
    name: 'urea (aqueous, infinite dilution)',
    dfH_kJ_per_mol: nbsValue(ureaInf.dfH).value,
    dfG_kJ_per_mol: null,
    S_J_per_mol_K: null,
    Cp_J_per_mol_K: null,
    molarMass_g_per_mol: round(molarMass('CO(NH2)2'), 4),
    source: `${NBS_SOURCE}, row CO(NH2)2 "in ∞ H2O" (ΔfH° only)`,
  });

  // Ice: NBS gives ΔfH° of H2O(cr) only at 0 K. Derived from the liquid with the enthalpy of
  // fusion of water at 0 °C, ΔfusH = 6.01 kJ/mol (from memory; CRC Handbook "Enthalpy of fusion",
  // 6.00678 kJ/mol in IAPWS/Feistel & Wagner 2006), ΔfusS = ΔfusH/273.15 K = 22.00 J/(mol·K),
  // ΔfusG(298.15 K) ≈ ΔfusH − 298.15·ΔfusS (constant ΔfusH). Cp of ice near 0 °C 38.0 J/(mol·K)
  // (2.11 J/(g·K); from memory, CRC Handbook "Properties of ice"). These describe ice near its
  // melting point, where Packwright uses it.
  const water = out.find((s) => s.key === 'H2O(l)') as SpeciesRecord;
  const fusH = 6.01;
  const fusS = (fusH * 1000) / 273.15;
  out.push({
    key: 'H2O(cr)',
    formula: 'H2O',
    phase: 'cr',
    name: 'ice',
    dfH_kJ_per_mol: round((water.dfH_kJ_per_mol as number) - fusH, 3),
    dfG_kJ_per_mol: round((water.dfG_kJ_per_mol as number) - (fusH - (298.15 * fusS) / 1000), 3),
    S_J_per_mol_K: round((water.S_J_per_mol_K as number) - fusS, 2),
    Cp_J_per_mol_K: 38.0,
    molarMass_g_per_mol: water.molarMass_g_per_mol,
    source:
      'Derived: NBS 1982 H2O(l) minus the enthalpy of fusion of ice at 0 °C, 6.01 kJ/mol (from memory; CRC Handbook, IAPWS value 6.007 kJ/mol); S° via ΔfusS = ΔfusH/273.15 K; Cp 38.0 J/(mol·K) of ice near 0 °C (from memory, CRC Handbook)',
  });
  return out;
}

function buildDilution(rows: NbsRow[], species: SpeciesRecord[]): DilutionSeries[] {
  const out: DilutionSeries[] = [];
  for (const d of DILUTION) {
    const points = rows
      .filter((r) => r.formula === d.nbs)
      .map((r) => ({ m: /^in ([0-9.]+) H2O$/.exec(r.solvent), r }))
      .filter((x): x is { m: RegExpExecArray; r: NbsRow } => x.m !== null)
      .map(({ m, r }) => ({ nH2O_per_mol: Number(m[1]), dfH_kJ_per_mol: nbsValue(r.dfH).value }))
      .filter((p): p is { nH2O_per_mol: number; dfH_kJ_per_mol: number } => p.dfH_kJ_per_mol !== null)
      .sort((a, b) => a.nH2O_per_mol - b.nH2O_per_mol);
    if (points.length < 2) throw new Error(`Too few dilution points for ${d.nbs}`);
    for (let k = 1; k < points.length; k++) {
      if ((points[k] as { nH2O_per_mol: number }).nH2O_per_mol === (points[k - 1] as { nH2O_per_mol: number }).nH2O_per_mol) {
        throw new Error(`Duplicate dilution n for ${d.nbs}`);
      }
    }
    const infRow = rows.find((r) => r.formula === d.nbs && r.solvent === 'in ∞ H2O');
    let dfH_infinite_kJ_per_mol = infRow ? nbsValue(infRow.dfH).value : null;
    let infNote = infRow ? 'infinite dilution from the "in ∞ H2O" row' : '';
    if (dfH_infinite_kJ_per_mol === null) {
      // Fall back on the aqueous standard state of the solute (ionised "ai" or undissociated "ao").
      const formula = d.solute.replace(/\((cr|g|l)\)$/, '');
      const aq = species.find((s) => s.formula === formula && (s.phase === 'ai' || s.phase === 'ao'));
      dfH_infinite_kJ_per_mol = aq?.dfH_kJ_per_mol ?? null;
      infNote = aq ? `infinite dilution from ${aq.key}` : 'no infinite-dilution value';
    }
    out.push({
      solute: d.solute,
      points,
      dfH_infinite_kJ_per_mol,
      source: `${NBS_SOURCE}, rows ${d.nbs} "in n H2O" (ΔfH of 1 mol solute in n mol water); ${infNote}`,
    });
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Solubility
// ---------------------------------------------------------------------------------------------

const SOLUBILITY: { crc: string; solute: string }[] = [
  { crc: 'NH4NO3', solute: 'NH4NO3(cr)' },
  { crc: 'NH4Cl', solute: 'NH4Cl(cr)' },
  { crc: 'KCl', solute: 'KCl(cr)' },
  { crc: 'KNO3', solute: 'KNO3(cr)' },
  { crc: 'NaCl', solute: 'NaCl(cr)' },
  { crc: 'NaNO3', solute: 'NaNO3(cr)' },
  { crc: '(NH4)2SO4', solute: '(NH4)2SO4(cr)' },
  { crc: 'NaC2H3O2', solute: 'CH3COONa(cr)' },
  { crc: 'Na2S2O3', solute: 'Na2S2O3(cr)' },
  { crc: 'CaCl2', solute: 'CaCl2(cr)' },
  { crc: 'MgSO4', solute: 'MgSO4(cr)' },
  { crc: 'MgCl2', solute: 'MgCl2(cr)' },
  { crc: 'Na2CO3', solute: 'Na2CO3(cr)' },
  { crc: 'NaHCO3', solute: 'NaHCO3(cr)' },
  { crc: 'Na2SO4', solute: 'Na2SO4(cr)' },
  { crc: 'LiCl', solute: 'LiCl(cr)' },
  { crc: 'NaOH', solute: 'NaOH(cr)' },
  { crc: 'KOH', solute: 'KOH(cr)' },
  { crc: 'BaCl2', solute: 'BaCl2(cr)' },
  { crc: 'Ba(OH)2', solute: 'Ba(OH)2(cr)' },
];

function buildSolubility(): SolubilitySeries[] {
  const text = readFileSync(join(refDir, 'solubility/aqueous-solubility-mass-percent.csv'), 'utf8').replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: true });
  const header = parsed.data[0] as string[];
  const temps = header.slice(2).map(Number);
  const out: SolubilitySeries[] = [];
  for (const s of SOLUBILITY) {
    const row = parsed.data.find((r) => r[1] === s.crc);
    if (!row) throw new Error(`CRC solubility row not found: ${s.crc}`);
    const points = temps
      .map((t, k) => ({ t, cell: (row[k + 2] ?? '').trim() }))
      .filter((x) => x.cell !== '')
      .map(({ t, cell }) => {
        const w = Number(cell);
        return { tempC: t, gPer100gWater: (100 * w) / (100 - w), massPercent: w };
      });
    out.push({
      solute: s.solute,
      points: points.map(({ tempC, gPer100gWater }) => ({ tempC, gPer100gWater })),
      source: `${CRC_SOLUBILITY_SOURCE}; row ${s.crc}`,
    });
  }
  // Urea is not in the CRC inorganic table. Solubility of urea in water, g per 100 g water,
  // 0–100 °C, as commonly tabulated in handbooks (from memory; e.g. Lange's Handbook of Chemistry,
  // "Solubilities of organic compounds in water"; values rounded).
  out.push({
    solute: 'CO(NH2)2(cr)',
    points: [
      { tempC: 0, gPer100gWater: 67 },
      { tempC: 20, gPer100gWater: 108 },
      { tempC: 40, gPer100gWater: 167 },
      { tempC: 60, gPer100gWater: 251 },
      { tempC: 80, gPer100gWater: 400 },
      { tempC: 100, gPer100gWater: 733 },
    ],
    source: "Handbook values for urea in water (from memory; Lange's Handbook of Chemistry, solubility of organic compounds), rounded",
  });
  return out;
}

// ---------------------------------------------------------------------------------------------
// Laliberté solution heat capacity
// ---------------------------------------------------------------------------------------------

const LALIBERTE: { formula: string; solute: string }[] = [
  { formula: 'NH4NO3', solute: 'NH4NO3(cr)' },
  { formula: 'NH4Cl', solute: 'NH4Cl(cr)' },
  { formula: 'KCl', solute: 'KCl(cr)' },
  { formula: 'KNO3', solute: 'KNO3(cr)' },
  { formula: 'NaCl', solute: 'NaCl(cr)' },
  { formula: 'NaNO3', solute: 'NaNO3(cr)' },
  { formula: 'NaCH3CO2', solute: 'CH3COONa(cr)' },
  { formula: 'Na2S2O3', solute: 'Na2S2O3(cr)' },
  { formula: 'CaCl2', solute: 'CaCl2(cr)' },
  { formula: 'MgSO4', solute: 'MgSO4(cr)' },
  { formula: 'MgCl2', solute: 'MgCl2(cr)' },
  { formula: 'Na2CO3', solute: 'Na2CO3(cr)' },
  { formula: 'NaHCO3', solute: 'NaHCO3(cr)' },
  { formula: 'Na2SO4', solute: 'Na2SO4(cr)' },
  { formula: 'LiCl', solute: 'LiCl(cr)' },
  { formula: 'NaOH', solute: 'NaOH(cr)' },
  { formula: 'KOH', solute: 'KOH(cr)' },
  { formula: 'BaCl2', solute: 'BaCl2(cr)' },
  { formula: 'FeCl2', solute: 'FeCl2(cr)' },
  { formula: 'HCH3CO2', solute: 'CH3COOH(l)' },
  { formula: 'NH3', solute: 'NH3(g)' },
  { formula: 'CO2', solute: 'CO2(g)' },
];

function buildLaliberte(): SolutionHeatCapacityCoefficients[] {
  const text = readFileSync(join(refDir, 'solution-heat-capacity/laliberte-2009.tsv'), 'utf8').replace(/^\uFEFF/, '');
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '');
  const header = (lines[0] as string).split('\t');
  // Heat-capacity block: a1..a6 then Min T, Max T, Max w, No of points (the last of the three blocks).
  const a1Col = header.indexOf('a1');
  if (a1Col < 0 || header[a1Col + 6] !== 'Min T' || header[a1Col + 8] !== 'Max w') {
    throw new Error('Unexpected Laliberté TSV header');
  }
  const out: SolutionHeatCapacityCoefficients[] = [];
  for (const l of LALIBERTE) {
    const cols = lines.map((x) => x.split('\t')).find((c) => c[2] === l.formula);
    if (!cols) throw new Error(`Laliberté row not found: ${l.formula}`);
    const num = (k: number) => {
      const v = Number(cols[a1Col + k]);
      if (!Number.isFinite(v) || (cols[a1Col + k] ?? '').trim() === '') throw new Error(`Laliberté ${l.formula}: no heat-capacity column ${k}`);
      return v;
    };
    out.push({
      solute: l.solute,
      a1: num(0),
      a2: num(1),
      a3: num(2),
      a4: num(3),
      a5: num(4),
      a6: num(5),
      tempMinC: num(6),
      tempMaxC: num(7),
      massFractionMax: num(8),
      pointCount: num(9),
      source: `${LALIBERTE_SOURCE}; row ${cols[0]} (${l.formula}), as tabulated in the CalebBell/chemicals repository`,
    });
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Freezing point of the solution (ice line) and eutectics
// ---------------------------------------------------------------------------------------------

const FREEZING: { crc: string; solute: string }[] = [
  { crc: 'NH4Cl', solute: 'NH4Cl(cr)' },
  { crc: 'KCl', solute: 'KCl(cr)' },
  { crc: 'KNO3', solute: 'KNO3(cr)' },
  { crc: 'NaCl', solute: 'NaCl(cr)' },
  { crc: 'NaNO3', solute: 'NaNO3(cr)' },
  { crc: '(NH4)2SO4', solute: '(NH4)2SO4(cr)' },
  { crc: 'NaC2H3O2', solute: 'CH3COONa(cr)' },
  { crc: 'Na2S2O3', solute: 'Na2S2O3(cr)' },
  { crc: 'CaCl2', solute: 'CaCl2(cr)' },
  { crc: 'MgSO4', solute: 'MgSO4(cr)' },
  { crc: 'MgCl2', solute: 'MgCl2(cr)' },
  { crc: 'Na2CO3', solute: 'Na2CO3(cr)' },
  { crc: 'NaHCO3', solute: 'NaHCO3(cr)' },
  { crc: 'Na2SO4', solute: 'Na2SO4(cr)' },
  { crc: 'LiCl', solute: 'LiCl(cr)' },
  { crc: 'NaOH', solute: 'NaOH(cr)' },
  { crc: 'KOH', solute: 'KOH(cr)' },
  { crc: 'BaCl2', solute: 'BaCl2(cr)' },
  { crc: '(NH2)2CO', solute: 'CO(NH2)2(cr)' },
];

function buildFreezing(): FreezingPointSeries[] {
  const text = readFileSync(join(refDir, 'solution-properties/concentrative-properties-20C.txt'), 'latin1');
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '' && !l.startsWith('#'));
  const header = (lines[0] as string).split('\t');
  const col = (name: string) => {
    const k = header.indexOf(name);
    if (k < 0) throw new Error(`CRC concentrative-properties column ${name} missing`);
    return k;
  };
  const fCol = col('Formula');
  const wCol = col('Mass_fraction');
  const dCol = col('T_freeze_supression');
  const nameCol = col('Solute');
  const rows = lines.slice(1).map((l) => l.split('\t'));
  const out: FreezingPointSeries[] = [];
  for (const f of FREEZING) {
    const mine = rows.filter((r) => (r[fCol] ?? '').trim() === f.crc);
    if (mine.length === 0) throw new Error(`CRC freezing rows not found: ${f.crc}`);
    const points = mine
      .filter((r) => (r[dCol] ?? '').trim() !== '')
      .map((r) => ({ massFraction: Number(r[wCol]), depressionK: Number(r[dCol]) }))
      .sort((a, b) => a.massFraction - b.massFraction);
    out.push({
      solute: f.solute,
      points,
      source: `${CRC_FREEZING_SOURCE}; rows ${(mine[0] as string[])[nameCol]} (${f.crc})`,
    });
  }
  return out;
}

// Salt–water eutectics (ice + salt or salt hydrate + saturated solution). All from memory, as
// commonly printed in handbooks and phase-diagram compilations; rounded.
const EUTECTIC_SOURCE = 'Salt–water eutectic as commonly tabulated (from memory; CRC Handbook and phase-diagram compilations), approximate';
const EUTECTICS: EutecticPoint[] = [
  { solute: 'NaCl(cr)', tempC: -21.1, massFraction: 0.233, solidPhases: 'ice + NaCl·2H2O', source: EUTECTIC_SOURCE },
  { solute: 'KCl(cr)', tempC: -10.7, massFraction: 0.197, solidPhases: 'ice + KCl', source: EUTECTIC_SOURCE },
  { solute: 'NH4Cl(cr)', tempC: -15.4, massFraction: 0.197, solidPhases: 'ice + NH4Cl', source: EUTECTIC_SOURCE },
  { solute: 'NH4NO3(cr)', tempC: -16.9, massFraction: 0.42, solidPhases: 'ice + NH4NO3', source: EUTECTIC_SOURCE },
  { solute: 'CaCl2(cr)', tempC: -49.8, massFraction: 0.298, solidPhases: 'ice + CaCl2·6H2O', source: EUTECTIC_SOURCE },
  { solute: 'CO(NH2)2(cr)', tempC: -11.5, massFraction: 0.325, solidPhases: 'ice + urea', source: EUTECTIC_SOURCE },
  { solute: 'KNO3(cr)', tempC: -2.9, massFraction: 0.11, solidPhases: 'ice + KNO3', source: EUTECTIC_SOURCE },
  { solute: 'MgSO4(cr)', tempC: -3.9, massFraction: 0.17, solidPhases: 'ice + MgSO4·12H2O', source: EUTECTIC_SOURCE },
  { solute: 'Na2CO3(cr)', tempC: -2.1, massFraction: 0.059, solidPhases: 'ice + Na2CO3·10H2O', source: EUTECTIC_SOURCE },
  { solute: 'MgCl2(cr)', tempC: -33.6, massFraction: 0.21, solidPhases: 'ice + MgCl2·12H2O', source: EUTECTIC_SOURCE },
];

// ---------------------------------------------------------------------------------------------

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

function writeJson(name: string, value: unknown): void {
  writeFileSync(join(outDir, name), `${JSON.stringify(value, null, 1)}\n`);
}

function main(): void {
  mkdirSync(outDir, { recursive: true });
  const rows = readNbs();
  const species = buildSpecies(rows);
  const dilution = buildDilution(rows, species);
  const solubility = buildSolubility();
  const heatCapacity = buildLaliberte();
  const freezing = buildFreezing();
  writeJson('species.json', species);
  writeJson('dilution.json', dilution);
  writeJson('solubility.json', solubility);
  writeJson('solution-heat-capacity.json', heatCapacity);
  writeJson('freezing-point.json', freezing);
  writeJson('eutectic.json', EUTECTICS);
  console.log(
    `species ${species.length}, dilution series ${dilution.length} (${dilution.reduce((n, d) => n + d.points.length, 0)} points), solubility ${solubility.length}, heat capacity ${heatCapacity.length}, freezing ${freezing.length}, eutectics ${EUTECTICS.length}`,
  );
}

main();
