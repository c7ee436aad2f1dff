import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { findPrecipitates, ionsFromSolutes, log10Ksp, sparinglySolubleSolids } from '@shared/chemistry/precipitation';
import { defaultChemistryLibrary } from '@shared/chemistry/library';

const lib = defaultChemistryLibrary();
const dataDir = fileURLToPath(new URL('../../../shared/data/', import.meta.url));
const solid = (key: string) => {
  const s = sparinglySolubleSolids(lib).find((x) => x.solid.key === key);
  if (!s) throw new Error(`expected ${key} among the sparingly soluble solids`);
  return s;
};

describe('solubility products from ΔfG° (NBS 1982) against a published Ksp table', () => {
  // CRC Handbook of Chemistry and Physics, "Solubility Product Constants" (values at 25 °C),
  // written FROM MEMORY, not read from the handbook here. Tolerance 0.5 in log10 Ksp: ΔfG° of
  // the ions carries about ±1 kJ/mol each (NBS 1982 uncertainty), which is ±0.2–0.4 in log10 K,
  // and tables of Ksp differ among themselves by a few tenths.
  const table: [string, number][] = [
    ['CaCO3(cr)', 3.36e-9], // calcite
    ['CaSO4·2H2O(cr)', 3.14e-5], // gypsum
    ['BaSO4(cr)', 1.08e-10],
    ['BaCO3(cr)', 2.58e-9],
    ['Mg(OH)2(cr)', 5.61e-12],
    ['Ca(OH)2(cr)', 5.02e-6],
    ['Fe(OH)2(cr)', 4.87e-17],
    ['Fe(OH)3(cr)', 2.79e-39],
  ];
  it.each(table)('log10 Ksp of %s within 0.5 of the table', (key, ksp) => {
    expect(Math.abs(solid(key).log10Ksp25 - Math.log10(ksp))).toBeLessThan(0.5);
  });

  it('calcite is less soluble when warm (retrograde), as published', () => {
    // Plummer & Busenberg, Geochim. Cosmochim. Acta 46 (1982) 1011: log Ksp(calcite) −8.48 at
    // 25 °C and −8.63 at 50 °C (from memory). The direction and a step of the same size
    // (within 0.15) are checked; the van 't Hoff step uses ΔrH° from NBS.
    const step = log10Ksp(solid('CaCO3(cr)'), 50) - log10Ksp(solid('CaCO3(cr)'), 25);
    expect(step).toBeLessThan(0);
    expect(Math.abs(step - (-8.63 + 8.48))).toBeLessThan(0.15);
  });
});

describe('precipitation from mixed ions', () => {
  it('gypsum left in solution matches the handbook solubility of CaSO4 at 25 °C', () => {
    // CRC Handbook 98th ed., "Aqueous Solubility of Inorganic Compounds at Various Temperatures"
    // (../shared/data/solubility): CaSO4 0.205 mass % at 25 °C. Davies activities and no
    // CaSO4° ion pair: within 25 % (ion pairing alone is worth about that much).
    const text = readFileSync(`${dataDir}solubility/aqueous-solubility-mass-percent.csv`, 'utf8').replace(/^\uFEFF/, '');
    const rows = Papa.parse<string[]>(text, { skipEmptyLines: true }).data;
    const temps = (rows[0] as string[]).slice(2).map(Number);
    const row = rows.find((r) => r[1] === 'CaSO4') as string[];
    const w = Number(row[2 + temps.indexOf(25)]);
    const handbookGPer100g = (100 * w) / (100 - w);
    const r = findPrecipitates({ 'Ca^2+(ai)': 0.02, 'Cl-(ai)': 0.04, 'Na+(ai)': 0.04, 'SO4^2-(ai)': 0.02 }, 1000, 25, lib);
    expect(r.precipitates.map((p) => p.solidKey)).toEqual(['CaSO4·2H2O(cr)']);
    // CaSO4 left per 100 g water: mol Ca left × M(CaSO4) 136.14 g/mol / 10.
    const left = (r.remainingIonsMol['Ca^2+(ai)']! * 136.14 * 100) / r.waterG;
    expect(Math.abs(left / handbookGPer100g - 1)).toBeLessThan(0.25);
  });

  it('sodium carbonate decahydrate + calcium chloride hexahydrate precipitate calcium carbonate', () => {
    // 50 g Na2CO3·10H2O (286.14 g/mol) + 50 g CaCl2·6H2O (219.08 g/mol) in 100 g water: CO3²⁻ is
    // limiting (0.1747 mol < 0.2282 mol Ca²⁺) and Ksp ~1e-8 takes it out almost completely, so
    // 0.1747 mol × 100.09 g/mol = 17.49 g CaCO3 (stoichiometry; the check is independent of Ksp
    // beyond "very small"). ΔH of precipitation = −(ΔfH ions − ΔfH CaCO3) = +13.05 kJ/mol:
    // calcite dissolution is exothermic (CRC Ksp table: calcite solubility falls with temperature).
    const na = 50 / 286.14;
    const ca = 50 / 219.08;
    const { ionsMol } = ionsFromSolutes(lib, [
      { soluteKey: 'Na2CO3(cr)', mol: na },
      { soluteKey: 'CaCl2(cr)', mol: ca },
    ]);
    const r = findPrecipitates(ionsMol, 100 + (10 * na + 6 * ca) * 18.015, 25, lib);
    expect(r.precipitates).toHaveLength(1);
    expect(r.precipitates[0]!.solidKey).toBe('CaCO3(cr)');
    expect(r.precipitates[0]!.massG).toBeCloseTo(na * 100.09, 1);
    expect(r.heatReleasedJ).toBeLessThan(0);
    expect(r.statement).toMatch(/calcium carbonate.*precipitates/i);
    expect(r.warnings.map((w) => w.code)).toContain('precipitation.activity-extrapolated');
  });

  it('barium with sulfate gives barite; barium with carbonate gives witherite; dilute chloride and nitrate salts give nothing', () => {
    expect(findPrecipitates({ 'Ba^2+(ai)': 0.01, 'Cl-(ai)': 0.02, 'Na+(ai)': 0.02, 'SO4^2-(ai)': 0.01 }, 100, 25, lib).precipitates[0]?.solidKey).toBe('BaSO4(cr)');
    expect(findPrecipitates({ 'Ba^2+(ai)': 0.01, 'Cl-(ai)': 0.02, 'Na+(ai)': 0.02, 'CO3^2-(ai)': 0.01 }, 100, 25, lib).precipitates[0]?.solidKey).toBe('BaCO3(cr)');
    const none = findPrecipitates({ 'NH4+(ai)': 0.5, 'NO3-(ai)': 0.5, 'Na+(ai)': 0.2, 'Cl-(ai)': 0.2 }, 100, 25, lib);
    expect(none.precipitates).toEqual([]);
    expect(none.statement).toMatch(/^Nothing precipitates/);
  });
});
