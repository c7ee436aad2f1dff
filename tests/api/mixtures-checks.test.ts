import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });
const adiabatic = { initialTempC: 25, ambientC: 25, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 30 };
const evaluate = async (body: object) => request(h.app).post('/api/mixtures/evaluate').set(await auth(demo.designer)).send(body);
const fieldsOf = (res: { body: { error: { fields: { field: string; message: string }[] } } }) => res.body.error.fields;

describe('POST /api/mixtures/evaluate: precipitation, hazards, formula processes, inputs that used to pass silently', () => {
  it('sodium carbonate decahydrate + calcium chloride hexahydrate: calcium carbonate precipitates, with a warning and a statement', async () => {
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'Na2CO3·10H2O', massG: 50 }, { formula: 'CaCl2·6H2O', massG: 50 }], ...adiabatic });
    expect(res.status).toBe(200);
    const p = res.body.precipitation.precipitates;
    expect(p.map((x: { solidKey: string }) => x.solidKey)).toEqual(['CaCO3(cr)']);
    // Stoichiometry: CO3²⁻ limits, 50/286.14 mol × 100.09 g/mol = 17.5 g CaCO3 (CIAAW 2021 molar masses) when it all dissolved.
    expect(p[0].massG).toBeGreaterThan(10);
    expect(p[0].massG).toBeLessThan(17.6);
    expect(res.body.precipitation.statement).toMatch(/calcium carbonate/i);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('precipitation');
  });

  it('salts that stay dissolved precipitate nothing', async () => {
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'NH4NO3', massG: 20 }, { formula: 'NaCl', massG: 5 }], ...adiabatic });
    expect(res.status).toBe(200);
    expect(res.body.precipitation.precipitates).toEqual([]);
    expect(res.body.precipitation.statement).toMatch(/^Nothing precipitates/);
  });

  it('a salt with no water answers 400 naming the salt\'s field', async () => {
    const res = await evaluate({ components: [{ formula: 'NH4NO3', massG: 40 }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(fieldsOf(res)[0]!.field).toBe('components.0.formula');
    expect(fieldsOf(res)[0]!.message).toMatch(/needs liquid water/);
  });

  it('every mass zero answers 400 naming components', async () => {
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 0 }, { formula: 'NH4NO3', massG: 0 }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(fieldsOf(res)).toEqual([{ field: 'components', message: expect.stringMatching(/every component has massG 0/) }]);
  });

  it('sodium sulfate at 10 °C, below its solubility data (20–100 °C), carries a warning a person reads', async () => {
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'Na2SO4', massG: 10 }], initialTempC: 10, ambientC: 10, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 30 });
    expect(res.status).toBe(200);
    const w = res.body.warnings.find((x: { code: string; message: string }) => x.code.startsWith('thermal.solubility-') && x.message.includes('Na2SO4'));
    expect(w?.message).toMatch(/start at 20 °C/);
  });

  it('CaO with water hydrates (CaO + H2O → Ca(OH)2) and heats as the published reaction enthalpy says', async () => {
    // ΔrH = −65.2 kJ/mol (CRC Handbook ΔfH° of CaO, H2O(l), Ca(OH)2; from memory). 5.608 g = 0.1 mol
    // CaO in 200 g water: ΔT ≈ 6520 J / (200 g × 4.18 + 5.6 g × 0.75 J/(g·K)) ≈ 7.8 K (cp of water,
    // common textbook value; cp of CaO/Ca(OH)2 ≈ 0.75–1.2 J/(g·K), from memory): within 5 %.
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 200 }, { formula: 'CaO', massG: 5.608 }], ...adiabatic });
    expect(res.status).toBe(200);
    const c = res.body.components.find((x: { formula: string }) => x.formula === 'CaO');
    expect(c.processKind).toBe('reaction');
    expect(c.processOptions[0].kind).toBe('reaction');
    expect(Math.abs(res.body.adiabaticEndTempC - 25 - 7.8) / 7.8).toBeLessThan(0.05);
  });

  it('iron oxidises in air; sodium acetate trihydrate may be chosen as a supercooled melt; an impossible choice is a 400', async () => {
    const still = { contact: { case: 'still-air', geometry: { areaM2: 0.016 } } };
    const fe = await evaluate({ components: [{ formula: 'H2O', massG: 10 }, { formula: 'Fe', massG: 20 }], initialTempC: 20, ambientC: 20, packHeatCapacityJPerK: 0, holdMin: 30, ...still });
    expect(fe.status, JSON.stringify(fe.body)).toBe(200);
    expect(fe.body.components.find((x: { formula: string }) => x.formula === 'Fe').processKind).toBe('air-oxidation');
    const sat = await evaluate({ components: [{ formula: 'NaCH3COO·3H2O', massG: 100, process: 'crystallisation' }], ...adiabatic, initialTempC: 20, ambientC: 20 });
    expect(sat.status).toBe(200);
    const c = sat.body.components[0];
    expect(c.processKind).toBe('crystallisation');
    expect(c.processOptions.map((o: { kind: string }) => o.kind)).toEqual(['dissolution', 'crystallisation']);
    // Crystallisation releases its latent heat and the melt warms towards its 58 °C plateau (Lane 1983, from memory).
    expect(sat.body.maxTempC).toBeGreaterThan(40);
    const bad = await evaluate({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'NaCl', massG: 10, process: 'reaction' }], ...adiabatic });
    expect(bad.status).toBe(400);
    expect(fieldsOf(bad)[0]!.field).toBe('components.1.formula');
  });

  it('a process given for a library ingredient answers 400 naming components.0.process', async () => {
    const res = await evaluate({ components: [{ ingredientId: 1, massG: 10, process: 'dissolution' }], ...adiabatic });
    expect(res.status).toBe(400);
    expect(fieldsOf(res).map((f) => f.field)).toContain('components.0.process');
  });

  it('returns hazard notes and label elements of any mixture; a bare formula takes the project\'s classification or says it has none', async () => {
    const res = await evaluate({ components: [{ formula: 'H2O', massG: 100 }, { formula: 'NH4NO3', massG: 60 }, { formula: 'Na2S2O3', massG: 5 }], ...adiabatic });
    expect(res.status).toBe(200);
    // Ammonium nitrate: Ox. Sol. 3 H272 and Eye Irrit. 2 H319 (CLP / supplier SDS, from memory): the
    // mixture at 36 % AN carries H319 (≥ 10 % cut-off, GHS Rev. 9 Table 3.3.3) and the flame-over-circle.
    expect(res.body.label.hStatements).toContain('H319');
    expect(res.body.hazards.some((n: { ruleId: string }) => n.ruleId === 'precursor.an-nitrogen')).toBe(true);
    expect(res.body.standingCaution).toMatch(/safety data sheet/);
    const statements: string[] = res.body.classificationStatements;
    expect(statements.find((s) => s.startsWith('NH4NO3'))).toMatch(/Ammonium nitrate/);
    expect(statements.find((s) => s.startsWith('Na2S2O3'))).toMatch(/no classification/);
  });
});
