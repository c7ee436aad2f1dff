import { describe, expect, it } from 'vitest';
import { briefSchema, updateBriefRequestSchema } from '../schemas/briefs';

describe('briefSchema', () => {
  it('fills the defaults of a sideline cold compress from a name alone', () => {
    const b = briefSchema.parse({ name: 'Compress' });
    expect(b).toMatchObject({ packType: 'cold', ambientC: 25, initialTempC: 25, targetTempC: 5, bandK: 2, holdMin: 20, minSurfaceTempC: null, maxSurfaceTempC: null, objective: 'least-cost', maxActives: 2, maxUnitCost: null });
    expect(b.packaging).toEqual({ massG: 12, heatCapacityJPerK: 24, cost: '0.08' });
  });

  it('gives a warm pack its own target and a skin burn limit, and the initial temperature follows ambient', () => {
    const b = briefSchema.parse({ name: 'Warmer', packType: 'warm', ambientC: 10 });
    expect(b).toMatchObject({ targetTempC: 40, maxSurfaceTempC: 44, minSurfaceTempC: null, initialTempC: 10 });
  });

  it('rejects a cold target at or above ambient and a warm target at or below it, naming the field', () => {
    const cold = briefSchema.safeParse({ name: 'x', packType: 'cold', ambientC: 20, targetTempC: 22 });
    expect(cold.success).toBe(false);
    expect(cold.error!.issues.map((i) => i.path.join('.'))).toContain('targetTempC');
    const warm = briefSchema.safeParse({ name: 'x', packType: 'warm', ambientC: 20, targetTempC: 15, maxSurfaceTempC: null });
    expect(warm.success).toBe(false);
    expect(warm.error!.issues[0]!.message).toMatch(/above ambientC/);
  });

  it('rejects a surface limit on the wrong side of the target and packaging heavier than the mass limit', () => {
    const r = briefSchema.safeParse({ name: 'x', targetTempC: 5, minSurfaceTempC: 6, maxMassG: 50, packaging: { massG: 60 } });
    expect(r.success).toBe(false);
    const fields = r.error!.issues.map((i) => i.path.join('.'));
    expect(fields).toEqual(expect.arrayContaining(['minSurfaceTempC', 'packaging.massG']));
  });

  it('keeps money as a decimal string, accepting numbers, and normalises integer ingredient ids to strings', () => {
    const b = briefSchema.parse({ name: 'x', maxUnitCost: 1.5, allowedIngredientIds: [12, 'urea'] });
    expect(b.maxUnitCost).toBe('1.5');
    expect(b.allowedIngredientIds).toEqual(['12', 'urea']);
    expect(briefSchema.safeParse({ name: 'x', maxUnitCost: '-1' }).success).toBe(false);
  });

  it('limits actives per mixture to 1–3', () => {
    expect(briefSchema.safeParse({ name: 'x', maxActives: 4 }).success).toBe(false);
    expect(briefSchema.safeParse({ name: 'x', maxActives: 0 }).success).toBe(false);
  });

  it('an update carries only what changes, with the version, and applies no defaults', () => {
    const u = updateBriefRequestSchema.parse({ holdMin: 30, version: 2 });
    expect(u).toEqual({ holdMin: 30, version: 2 });
  });
});
