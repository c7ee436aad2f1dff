import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '../chemistry/library';
import type { IngredientProcessInput } from '../thermal/process';
import { DEMO_HAZARD_DATA } from './demo-hazard-data';
import { incompatibilities } from './incompatibilities';

const lib = defaultChemistryLibrary();
const water = { name: 'Water', massG: 100, process: { kind: 'inert', role: 'water' } as const };
const soda = { name: 'Soda', massG: 50, process: { kind: 'dissolution', solidKey: 'Na2CO3·10H2O(cr)', soluteKey: 'Na2CO3(cr)', hydrateWaterPerFormula: 10, ionsPerFormulaUnit: 3 } as const };
const cacl2 = { name: 'CaCl2 hexahydrate', massG: 50, process: { kind: 'dissolution', solidKey: 'CaCl2·6H2O(cr)', soluteKey: 'CaCl2(cr)', hydrateWaterPerFormula: 6, ionsPerFormulaUnit: 3 } as const };
const nacl = { name: 'Salt', massG: 20, process: { kind: 'dissolution', solidKey: 'NaCl(cr)' } as const };

describe('incompatibilities', () => {
  it('names the two ingredients whose ions precipitate', () => {
    const r = incompatibilities([soda, cacl2, water], lib);
    const p = r.filter((x) => x.kind === 'precipitation');
    expect(p).toHaveLength(1);
    expect(p[0]!.subject).toBe('CaCO3(cr)');
    expect(p[0]!.between.sort()).toEqual(['CaCl2 hexahydrate', 'Soda']);
  });

  it('finds nothing for salts that stay dissolved, or for dry anhydrous salts; hydrate water counts as water', () => {
    expect(incompatibilities([soda, nacl, water], lib)).toEqual([]);
    const drySoda = { name: 'Soda ash', massG: 20, process: { kind: 'dissolution', solidKey: 'Na2CO3(cr)' } as const };
    const dryCaCl2 = { name: 'CaCl2', massG: 20, process: { kind: 'dissolution', solidKey: 'CaCl2(cr)' } as const };
    expect(incompatibilities([drySoda, dryCaCl2], lib)).toEqual([]);
    // The two hydrates ground together wet themselves with their crystal water and react.
    expect(incompatibilities([soda, cacl2], lib).some((x) => x.kind === 'precipitation')).toBe(true);
  });

  it('reports gas from a reaction and reactive hazard groups', () => {
    const mgProcess: IngredientProcessInput = { kind: 'reaction', reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' };
    const mg = { name: 'Mg', massG: 2.43, process: mgProcess };
    const r = incompatibilities([mg, water], lib);
    expect(r.find((x) => x.kind === 'gas')?.subject).toBe('H2(g)');
    const an = { name: 'Ammonium nitrate', massG: 10, hazardData: DEMO_HAZARD_DATA['Ammonium nitrate']!, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } as const };
    const fe = { name: 'Iron powder', massG: 10, hazardData: DEMO_HAZARD_DATA['Iron powder']!, process: { kind: 'air-oxidation' } as const };
    expect(incompatibilities([an, fe], lib).some((x) => x.kind === 'reactive' && x.subject === 'incompat.oxidiser-fuel')).toBe(true);
  });
});
