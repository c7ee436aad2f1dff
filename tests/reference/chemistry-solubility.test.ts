import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { solubility } from '@shared/chemistry/dissolution';
import { defaultChemistryLibrary } from '@shared/chemistry/library';

const lib = defaultChemistryLibrary();
const dataDir = fileURLToPath(new URL('../../../shared/data/', import.meta.url));

describe('solubility against the CRC Handbook table', () => {
  // CRC Handbook of Chemistry and Physics, 98th ed., "Aqueous Solubility of Inorganic Compounds at
  // Various Temperatures": mass % of anhydrous solute; g per 100 g water = 100·w/(100 − w).
  const text = readFileSync(`${dataDir}solubility/aqueous-solubility-mass-percent.csv`, 'utf8').replace(/^\uFEFF/, '');
  const rows = Papa.parse<string[]>(text, { skipEmptyLines: true }).data;
  const temps = (rows[0] as string[]).slice(2).map(Number);
  const cases: [string, string][] = [
    ['NH4NO3', 'NH4NO3(cr)'],
    ['NH4Cl', 'NH4Cl(cr)'],
    ['KCl', 'KCl(cr)'],
    ['KNO3', 'KNO3(cr)'],
    ['NaCl', 'NaCl(cr)'],
    ['NaC2H3O2', 'CH3COONa(cr)'],
    ['Na2S2O3', 'Na2S2O3(cr)'],
    ['CaCl2', 'CaCl2(cr)'],
    ['MgSO4', 'MgSO4(cr)'],
    ['Na2CO3', 'Na2CO3(cr)'],
  ];
  it.each(cases)('hits every tabulated point of %s exactly', (crc, key) => {
    const row = rows.find((r) => r[1] === crc) as string[];
    let checked = 0;
    temps.forEach((t, k) => {
      const cell = (row[k + 2] ?? '').trim();
      if (cell === '') return;
      const w = Number(cell);
      const r = solubility(lib, key, t);
      expect(r.gPer100gWater).toBeCloseTo((100 * w) / (100 - w), 9);
      expect(r.massFraction * 100).toBeCloseTo(w, 9);
      expect(r.warnings).toEqual([]);
      checked++;
    });
    expect(checked).toBeGreaterThan(5);
  });

  it('hydrates report the solubility of the anhydrous salt', () => {
    expect(solubility(lib, 'CaCl2·6H2O(cr)', 20).gPer100gWater).toBeCloseTo(solubility(lib, 'CaCl2(cr)', 20).gPer100gWater, 12);
  });

  it('warns below 0 °C and above 100 °C, where the table ends', () => {
    expect(solubility(lib, 'NH4NO3(cr)', -10).warnings[0]?.code).toBe('outside-solubility-data');
    expect(solubility(lib, 'KNO3(cr)', 105).warnings[0]?.code).toBe('outside-solubility-data');
  });
});

describe('solubility against other published values', () => {
  it('NaCl at 25 °C is about 36.0 g per 100 g water', () => {
    // Common handbook value (from memory; e.g. Lange's Handbook, 35.9–36.0 g/100 g water at 25 °C).
    expect(Math.abs(solubility(lib, 'NaCl(cr)', 25).gPer100gWater - 36.0)).toBeLessThan(0.3);
  });
  it('KNO3 at 20 °C is about 31.6 g per 100 g water', () => {
    // Textbook solubility-curve value (from memory).
    expect(Math.abs(solubility(lib, 'KNO3(cr)', 20).gPer100gWater - 31.6)).toBeLessThan(1.0);
  });
  it('urea at 20 °C is about 108 g per 100 g water and rises steeply with temperature', () => {
    // Handbook value 107.9 g/100 mL at 20 °C (from memory; the bundled urea series is itself from memory).
    expect(Math.abs(solubility(lib, 'CO(NH2)2(cr)', 20).gPer100gWater - 108)).toBeLessThan(3);
    expect(solubility(lib, 'CO(NH2)2(cr)', 40).gPer100gWater).toBeGreaterThan(solubility(lib, 'CO(NH2)2(cr)', 20).gPer100gWater);
  });
});
