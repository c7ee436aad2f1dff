import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });

async function ingredientNamed(email: string, name: string, grade?: string) {
  const res = await request(h.app).get('/api/ingredients').query({ q: name, pageSize: 200 }).set(await auth(email));
  expect(res.status).toBe(200);
  const found = res.body.items.find((i: { name: string; grade: string }) => i.name === name && (grade === undefined || i.grade === grade));
  if (!found) throw new Error(`no ingredient ${name} in the library of ${email}`);
  return found as { id: number; costPerKg: string; currency: string };
}

describe('GET /api/thermo/library', () => {
  it('answers the workspace chemistry library with every table, privately cacheable, 304 on revalidation', async () => {
    const res = await request(h.app).get('/api/thermo/library').set(await auth(demo.designer));
    expect(res.status).toBe(200);
    expect(res.body.species.length).toBeGreaterThan(100);
    for (const part of ['dilution', 'solubility', 'solutionHeatCapacity', 'freezingPoint', 'eutectics']) expect(res.body[part].length).toBeGreaterThan(0);
    const an = res.body.species.find((s: { key: string }) => s.key === 'NH4NO3(cr)');
    // CRC Handbook, "Standard Thermodynamic Properties of Chemical Substances": ΔfH°(NH4NO3, cr) = −365.6 kJ/mol (from memory).
    expect(an.dfH_kJ_per_mol).toBeCloseTo(-365.6, 0);
    expect(res.headers['cache-control']).toMatch(/private/);
    expect(res.headers.etag).toBeTruthy();
    const again = await request(h.app).get('/api/thermo/library').set(await auth(demo.designer)).set('If-None-Match', res.headers.etag as string);
    expect(again.status).toBe(304);
  });

  it('needs a session', async () => {
    expect((await request(h.app).get('/api/thermo/library')).status).toBe(401);
  });
});

describe('POST /api/thermo/reaction', () => {
  it('quicklime hydration CaO + H2O → Ca(OH)2 is exothermic by about 65 kJ/mol and favourable below its crossover', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.reviewer))
      .send({ reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 1 }], products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }], tempC: 25 });
    expect(res.status).toBe(200);
    // CRC Handbook (CODATA key values, from memory): ΔfH° CaO(cr) −634.9, H2O(l) −285.83, Ca(OH)2(cr) −985.2 kJ/mol → ΔrH° = −64.5 kJ/mol.
    expect(res.body.dH_kJ).toBeGreaterThan(-66.5);
    expect(res.body.dH_kJ).toBeLessThan(-63.5);
    expect(res.body.favourability).toBe('below');
    expect(res.body.dG_kJ).toBeLessThan(0);
    expect(res.body.terms).toHaveLength(3);
    expect(res.body.terms.every((t: { source: string }) => t.source.length > 0)).toBe(true);
  });

  it('limestone calcination CaCO3 → CaO + CO2 is favourable only above about 835 °C', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.designer))
      .send({ reactants: [{ formula: 'CaCO3', phase: 'cr', coef: 1 }], products: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'CO2', phase: 'g', coef: 1 }] });
    expect(res.status).toBe(200);
    // Atkins, Physical Chemistry (worked example, from memory): ΔrH° ≈ +178 kJ/mol, ΔrS° ≈ +161 J/K, ΔrG°(298 K) ≈ +130 kJ/mol,
    // decomposition above ≈ 1110 K (≈ 837 °C).
    expect(res.body.dH_kJ).toBeCloseTo(178, -1);
    expect(res.body.dS_J_per_K).toBeCloseTo(161, -1);
    expect(res.body.dG_kJ).toBeCloseTo(130, -1);
    expect(res.body.favourability).toBe('above');
    expect(Math.abs(res.body.crossoverC - 837)).toBeLessThan(20);
  });

  it('dissolving NH4NO3 to infinite dilution absorbs 25.69 kJ/mol', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.chemist))
      .send({ reactants: [{ formula: 'NH4NO3', phase: 'cr', coef: 1 }], products: [{ formula: 'NH4+', phase: 'ai', coef: 1 }, { formula: 'NO3-', phase: 'ai', coef: 1 }] });
    expect(res.status).toBe(200);
    // CRC Handbook, "Enthalpy of Solution of Electrolytes" (Parker, NSRDS-NBS 2, 1965): NH4NO3 25.69 kJ/mol (from memory).
    expect(Math.abs(res.body.dH_kJ - 25.69)).toBeLessThan(0.1);
  });

  it('an unbalanced reaction answers 400 naming the products and the element that does not balance', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.designer))
      .send({ reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 2 }], products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }] });
    expect(res.status).toBe(400);
    const field = res.body.error.fields.find((f: { field: string }) => f.field === 'products');
    expect(field.message).toMatch(/H: 4 on the left, 2 on the right/);
  });

  it('an unknown formula answers 400 naming its field, e.g. reactants.1.formula', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.designer))
      .send({ reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'Qx2', coef: 1 }], products: [{ formula: 'CaQx2', phase: 'cr', coef: 1 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual(expect.arrayContaining(['reactants.1.formula', 'products.0.formula']));
  });

  it('a formula the parser reads but the species data lack answers 400 at that field', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.designer))
      .send({ reactants: [{ formula: 'C60', phase: 'cr', coef: 1 }, { formula: 'O2', phase: 'g', coef: 60 }], products: [{ formula: 'CO2', phase: 'g', coef: 60 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['reactants.0.formula']);
  });

  it('a negative coefficient answers 400 naming reactants.0.coef', async () => {
    const res = await request(h.app)
      .post('/api/thermo/reaction')
      .set(await auth(demo.designer))
      .send({ reactants: [{ formula: 'CaO', phase: 'cr', coef: -1 }], products: [{ formula: 'CaO', phase: 'cr', coef: 1 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('reactants.0.coef');
  });
});

describe('POST /api/mixtures/evaluate', () => {
  // Hand check of an adiabatic case, with values from outside the product's tables:
  // 10 g NH4NO3 in 1000 g water at 25 °C. n = (1000/18.015)/(10/80.043) ≈ 444 mol H2O per mol,
  // close to infinite dilution, so the heat absorbed is ≈ n_salt × ΔsolH∞ with ΔsolH∞ = 25.69 kJ/mol
  // (CRC Handbook, "Enthalpy of Solution of Electrolytes", Parker 1965; from memory). The heat capacity
  // is that of the water, 4.1813 J/(g·K) (IAPWS-95), plus the salt's ≈ 1.7 J/(g·K) (from memory).
  // ΔT = −(10/80.043 × 25690) / (1000 × 4.1813 + 10 × 1.7) ≈ −0.765 K. Finite dilution (≈ 1 %) and
  // the solution's heat capacity (≈ 1 %) stay inside the 0.04 K allowed.
  const molarMassAN = 14.007 * 2 + 1.008 * 4 + 15.999 * 3; // CIAAW 2021 abridged atomic weights
  const expectedDropK = ((10 / molarMassAN) * 25690) / (1000 * 4.1813 + 10 * 1.7);

  const adiabatic = { initialTempC: 25, ambientC: 25, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 30 };

  it('adiabatic case (uaWPerK 0, packHeatCapacityJPerK 0) by formula matches the hand check', async () => {
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ formula: 'H2O', massG: 1000 }, { formula: 'NH4NO3', massG: 10 }], ...adiabatic });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.adiabaticEndTempC - (25 - expectedDropK))).toBeLessThan(0.04);
    expect(Math.abs(res.body.endTempC - (25 - expectedDropK))).toBeLessThan(0.04);
    expect(res.body.dissolvedFraction).toBeGreaterThan(0.99);
    expect(res.body.massG).toBe(1010);
    expect(res.body.curve.length).toBeGreaterThan(2);
    expect(Array.isArray(res.body.warnings)).toBe(true);
    expect(Array.isArray(res.body.hazards)).toBe(true);
  });

  it('by ingredient id it gives the same temperatures and a decimal cost from the library', async () => {
    const water = await ingredientNamed(demo.designer, 'Water', 'Deionised');
    const an = await ingredientNamed(demo.designer, 'Ammonium nitrate');
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ ingredientId: water.id, massG: 1000 }, { ingredientId: an.id, massG: 10 }], ...adiabatic });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.endTempC - (25 - expectedDropK))).toBeLessThan(0.04);
    // cost = Σ costPerKg × kg, in integer ten-thousandths so no float creeps in.
    const tenThousandths = (s: string) => Math.round(Number(s) * 10_000);
    const expected = tenThousandths(water.costPerKg) * 1 + (tenThousandths(an.costPerKg) * 10) / 1000;
    expect(Math.round(Number(res.body.cost.amount) * 10_000)).toBe(Math.round(expected));
    expect(res.body.cost.currency).toBe('EUR');
    expect(res.body.cost.complete).toBe(true);
  });

  it('a pack that loses heat to warm surroundings ends warmer than the adiabatic pack', async () => {
    const body = { components: [{ formula: 'H2O', massG: 100 }, { formula: 'NH4NO3', massG: 40 }], initialTempC: 25, ambientC: 25, packHeatCapacityJPerK: 0, holdMin: 60 };
    const closed = await request(h.app).post('/api/mixtures/evaluate').set(await auth(demo.designer)).send({ ...body, uaWPerK: 0 });
    const open = await request(h.app).post('/api/mixtures/evaluate').set(await auth(demo.designer)).send({ ...body, uaWPerK: 0.5 });
    expect(closed.status).toBe(200);
    expect(open.status).toBe(200);
    expect(open.body.endTempC).toBeGreaterThan(closed.body.endTempC);
    expect(closed.body.minTempC).toBeLessThan(25);
  });

  it('a negative mass answers 400 naming components.1.massG', async () => {
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'NH4NO3', massG: -5 }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('components.1.massG');
  });

  it('an unknown formula answers 400 naming components.1.formula', async () => {
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'Zq3', massG: 5 }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['components.1.formula']);
  });

  it("another workspace's ingredient is not found: 400 naming components.0.ingredientId", async () => {
    const theirs = await ingredientNamed(harbour.chemist, 'Water');
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ ingredientId: theirs.id, massG: 100 }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toEqual(['components.0.ingredientId']);
  });

  it('inputs outside the tabulated data come back as warnings, not errors', async () => {
    // The Laliberté heat-capacity fit for NH4NO3 covers 25 °C only (its validity range in the data).
    const res = await request(h.app)
      .post('/api/mixtures/evaluate')
      .set(await auth(demo.designer))
      .send({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'NH4NO3', massG: 60 }], initialTempC: 45, ambientC: 45, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 20 });
    expect(res.status).toBe(200);
    expect(res.body.warnings.length).toBeGreaterThan(0);
  });
});

describe('OpenAPI document', () => {
  it('documents every route of the library and thermochemistry API', async () => {
    const res = await request(h.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    const paths = res.body.paths as Record<string, Record<string, unknown>>;
    const expected: [string, string][] = [
      ['/api/species', 'get'], ['/api/species', 'post'], ['/api/species/{id}', 'patch'],
      ['/api/thermo/library', 'get'], ['/api/thermo/reaction', 'post'], ['/api/mixtures/evaluate', 'post'],
      ['/api/ingredients', 'get'], ['/api/ingredients', 'post'], ['/api/ingredients/{id}', 'get'], ['/api/ingredients/{id}', 'patch'],
      ['/api/ingredients/{id}', 'delete'], ['/api/ingredients/{id}/history', 'get'], ['/api/ingredients/import', 'post'],
      ['/api/ingredients/export.csv', 'get'], ['/api/ingredients/{id}/attachments', 'post'], ['/api/ingredients/{id}/attachments', 'get'],
      ['/api/attachments/{id}/download', 'get'],
    ];
    for (const [path, method] of expected) expect(paths[path]?.[method], `${method.toUpperCase()} ${path}`).toBeDefined();
  });
});
