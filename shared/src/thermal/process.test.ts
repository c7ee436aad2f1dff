import { describe, expect, it } from 'vitest';
import { DEFAULT_DISSOLUTION_RATE_PER_MIN, SAT_LATENT_HEAT_J_PER_G, SAT_MELTING_POINT_C } from './constants';
import { ingredientProcessSchema } from './process';

describe('ingredientProcessSchema', () => {
  it('fills documented defaults for a dissolution', () => {
    const p = ingredientProcessSchema.parse({ kind: 'dissolution', solidKey: 'NH4NO3(cr)' });
    expect(p).toMatchObject({ kind: 'dissolution', hydrateWaterPerFormula: 0, rateConstantPerMin: DEFAULT_DISSOLUTION_RATE_PER_MIN });
  });

  it('defaults crystallisation to sodium acetate trihydrate (58 °C, 264 J/g)', () => {
    const p = ingredientProcessSchema.parse({ kind: 'crystallisation' });
    expect(p).toMatchObject({ meltingPointC: SAT_MELTING_POINT_C, latentHeat_J_per_g: SAT_LATENT_HEAT_J_PER_G });
  });

  it('defaults air oxidation to 4Fe + 3O2 → 2Fe2O3', () => {
    const p = ingredientProcessSchema.parse({ kind: 'air-oxidation' });
    expect(p).toMatchObject({ metalKey: 'Fe(cr)', oxideKey: 'Fe2O3(cr)', metalPerO2: 4 / 3, oxidePerO2: 2 / 3 });
  });

  it('round-trips through JSON as the backend stores it', () => {
    const p = ingredientProcessSchema.parse({ kind: 'reaction', reactants: [{ key: 'CaO(cr)', coef: 1 }, { key: 'H2O(l)', coef: 1 }], products: [{ key: 'Ca(OH)2(cr)', coef: 1 }], ingredientKey: 'CaO(cr)' });
    expect(ingredientProcessSchema.parse(JSON.parse(JSON.stringify(p)))).toEqual(p);
  });

  it('rejects a species key without a phase, saying what a key looks like', () => {
    const r = ingredientProcessSchema.safeParse({ kind: 'dissolution', solidKey: 'NH4NO3' });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.message).toMatch(/species key/);
  });
});
