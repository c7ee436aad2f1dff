import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry/library';
import { molarMass } from '@shared/chemistry/formula';

const dataDir = fileURLToPath(new URL('../../../shared/data/', import.meta.url));

// CIAAW 2021 abridged standard atomic weights ("asaw" column), read from the published table
// (Prohaska et al., Pure Appl. Chem. 94 (2022) 573, as tabulated in MilanSkocic/ciaaw).
function readCiaaw(): Record<string, number> {
  const text = readFileSync(`${dataDir}ciaaw-2021/standard-atomic-weights-2021.txt`, 'utf8');
  const out: Record<string, number> = {};
  for (const line of text.split(/\r?\n/).slice(4)) {
    const cols = line.trim().split(/\s+/);
    if (cols.length < 5) continue;
    const asaw = Number(cols[cols.length - 2]);
    if (Number.isFinite(asaw)) out[cols[1] as string] = asaw;
  }
  return out;
}
const W = readCiaaw();
const mass = (composition: Record<string, number>) => Object.entries(composition).reduce((s, [el, n]) => s + n * (W[el] as number), 0);

describe('molar masses against CIAAW 2021 abridged atomic weights', () => {
  // Compositions written out by hand, so the parser is checked against the published weights.
  it.each([
    ['NH4NO3', { N: 2, H: 4, O: 3 }, 80.043],
    ['CaCl2·6H2O', { Ca: 1, Cl: 2, H: 12, O: 6 }, 219.07],
    ['CaCl2.6H2O', { Ca: 1, Cl: 2, H: 12, O: 6 }, 219.07],
    ['CO(NH2)2', { C: 1, O: 1, N: 2, H: 4 }, 60.056],
    ['CH3COONa·3H2O', { C: 2, H: 9, O: 5, Na: 1 }, 136.08],
    ['Na2S2O3·5H2O', { Na: 2, S: 2, O: 8, H: 10 }, 248.17],
    ['MgSO4·7H2O', { Mg: 1, S: 1, O: 11, H: 14 }, 246.47],
    ['Ba(OH)2·8H2O', { Ba: 1, O: 10, H: 18 }, 315.46],
    ['Fe2O3', { Fe: 2, O: 3 }, 159.69],
    ['Na2CO3*10H2O', { Na: 2, C: 1, O: 13, H: 20 }, 286.14],
  ])('%s', (formula, composition, rounded) => {
    expect(Math.abs(molarMass(formula) - mass(composition))).toBeLessThan(0.01);
    expect(Math.abs(molarMass(formula) - rounded)).toBeLessThan(0.01);
  });

  it('every bundled species is within 0.05 g/mol of the NBS 1982 molar mass (1975 atomic weights)', () => {
    // NBS 1982 (Wagman et al.) molar-mass column, a different atomic-weight set; the README of the
    // reference data notes differences of about 0.02 g/mol.
    const text = readFileSync(`${dataDir}nbs-1982/nbs-tables.csv`, 'utf8').replace(/^\uFEFF/, '');
    const rows = Papa.parse<string[]>(text, { skipEmptyLines: true }).data.slice(2);
    const nbs = new Map<string, number>();
    for (const r of rows) {
      const key = `${(r[0] ?? '').trim().replace(/<sup>([^<]*)<\/sup>/g, '^$1')} (${(r[4] ?? '').trim()})`;
      if (!nbs.has(key)) nbs.set(key, Number(r[5]));
    }
    let compared = 0;
    for (const s of defaultChemistryLibrary().species) {
      const m = /row (.+?) \(([a-z0-9]+)\)/.exec(s.source);
      if (!m) continue;
      const ref = nbs.get(`${m[1]} (${m[2]})`);
      expect(ref, s.key).toBeDefined();
      expect(Math.abs(s.molarMass_g_per_mol - (ref as number)), s.key).toBeLessThan(0.05);
      compared++;
    }
    expect(compared).toBeGreaterThanOrEqual(80);
  });
});
