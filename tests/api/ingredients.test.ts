import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });
const unique = (prefix: string) => `${prefix} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

// Everything this file creates carries this grade and is removed afterwards.
const TEST_GRADE = 'API test grade';
afterAll(async () => {
  const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
  await IngredientRecord.destroy({ where: { grade: TEST_GRADE }, force: true });
});

const urea = (name: string) => ({
  name,
  grade: TEST_GRADE,
  role: 'active',
  process: { kind: 'dissolution', solidKey: 'CO(NH2)2(cr)', ionsPerFormulaUnit: 1 },
  costPerKg: '0.85',
  densityGPerMl: 1.32,
  sources: ['NBS 1982'],
  notes: 'made by the API test',
});

async function create(email: string, body: Record<string, unknown>) {
  return request(h.app).post('/api/ingredients').set(await auth(email)).send(body);
}

describe('GET /api/ingredients', () => {
  it('every role reads the seeded library of at least 25 ingredients', async () => {
    for (const who of [demo.designer, demo.reviewer, demo.chemist, demo.admin]) {
      const res = await request(h.app).get('/api/ingredients').query({ pageSize: 200 }).set(await auth(who));
      expect(res.status).toBe(200);
      expect(res.body.total).toBeGreaterThanOrEqual(25);
    }
  });

  it('filters by role, searches by name, sorts by cost, pages', async () => {
    const packaging = await request(h.app).get('/api/ingredients').query({ role: 'packaging', pageSize: 200 }).set(await auth(demo.designer));
    expect(packaging.body.items.length).toBeGreaterThan(0);
    expect(packaging.body.items.every((i: { role: string }) => i.role === 'packaging')).toBe(true);

    const chloride = await request(h.app).get('/api/ingredients').query({ q: 'chloride', pageSize: 200 }).set(await auth(demo.designer));
    expect(chloride.body.items.length).toBeGreaterThan(2);
    expect(chloride.body.items.every((i: { name: string; grade: string; notes: string; speciesKey: string | null }) => /chloride|Cl/i.test(`${i.name} ${i.grade} ${i.notes} ${i.speciesKey}`))).toBe(true);

    const byCost = await request(h.app).get('/api/ingredients').query({ sort: '-costPerKg', pageSize: 200 }).set(await auth(demo.designer));
    const costs = byCost.body.items.map((i: { costPerKg: string }) => Number(i.costPerKg));
    expect(costs).toEqual([...costs].sort((a, b) => b - a));
    expect(byCost.body.items.every((i: { costPerKg: string }) => typeof i.costPerKg === 'string' && /^\d+\.\d{2,4}$/.test(i.costPerKg))).toBe(true);

    const page2 = await request(h.app).get('/api/ingredients').query({ pageSize: 10, page: 2 }).set(await auth(demo.designer));
    expect(page2.body.items).toHaveLength(10);
    expect(page2.body.page).toBe(2);
  });

  it('an unknown sort answers 400 naming query.sort', async () => {
    const res = await request(h.app).get('/api/ingredients').query({ sort: 'density' }).set(await auth(demo.designer));
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].field).toBe('query.sort');
  });

  it('workspaces see only their own library', async () => {
    const ours = await request(h.app).get('/api/ingredients').query({ pageSize: 200 }).set(await auth(demo.designer));
    const theirs = await request(h.app).get('/api/ingredients').query({ pageSize: 200 }).set(await auth(harbour.designer));
    const ourIds = new Set(ours.body.items.map((i: { id: number }) => i.id));
    expect(theirs.body.items.length).toBeGreaterThan(0);
    expect(theirs.body.items.some((i: { id: number }) => ourIds.has(i.id))).toBe(false);
    expect(theirs.body.items.every((i: { currency: string }) => i.currency === 'GBP')).toBe(true);
  });
});

describe('ingredient writes', () => {
  it('designers and reviewers read but may not create, change or delete (403)', async () => {
    const { body } = await create(demo.chemist, urea(unique('Urea roles')));
    const id = body.ingredient.id;
    for (const who of [demo.designer, demo.reviewer]) {
      expect((await create(who, urea(unique('Urea forbidden')))).status).toBe(403);
      expect((await request(h.app).patch(`/api/ingredients/${id}`).set(await auth(who)).send({ notes: 'x', version: 0 })).status).toBe(403);
      expect((await request(h.app).delete(`/api/ingredients/${id}`).set(await auth(who))).status).toBe(403);
      expect((await request(h.app).get(`/api/ingredients/${id}`).set(await auth(who))).status).toBe(200);
    }
  });

  it('chemists and admins create (201) with the workspace currency by default', async () => {
    for (const who of [demo.chemist, demo.admin]) {
      const res = await create(who, urea(unique('Urea by')));
      expect(res.status).toBe(201);
      expect(res.body.ingredient).toMatchObject({ currency: 'EUR', costPerKg: '0.85', version: 0, speciesKey: 'CO(NH2)2(cr)' });
      expect(res.body.ingredient.process.kind).toBe('dissolution');
    }
  });

  it("another workspace's ingredient answers 404 to read, change, delete and history", async () => {
    const { body } = await create(demo.chemist, urea(unique('Urea private')));
    const id = body.ingredient.id;
    expect((await request(h.app).get(`/api/ingredients/${id}`).set(await auth(harbour.chemist))).status).toBe(404);
    expect((await request(h.app).patch(`/api/ingredients/${id}`).set(await auth(harbour.chemist)).send({ notes: 'x', version: 0 })).status).toBe(404);
    expect((await request(h.app).delete(`/api/ingredients/${id}`).set(await auth(harbour.admin))).status).toBe(404);
    expect((await request(h.app).get(`/api/ingredients/${id}/history`).set(await auth(harbour.chemist))).status).toBe(404);
  });

  it('invalid input answers 400 naming each field and rule', async () => {
    const negative = await create(demo.chemist, { ...urea(unique('Urea bad')), costPerKg: -1 });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields).toContainEqual({ field: 'costPerKg', message: 'must be 0 or more' });

    const floaty = await create(demo.chemist, { ...urea(unique('Urea bad')), costPerKg: '1.23456' });
    expect(floaty.body.error.fields.map((f: { field: string }) => f.field)).toContain('costPerKg');

    const { process: _p, ...noProcess } = urea(unique('Urea bad'));
    const active = await create(demo.chemist, noProcess);
    expect(active.status).toBe(400);
    expect(active.body.error.fields.map((f: { field: string }) => f.field)).toContain('process');

    const unknownSolid = await create(demo.chemist, { ...urea(unique('Urea bad')), process: { kind: 'dissolution', solidKey: 'Unobtainium(cr)' } });
    expect(unknownSolid.status).toBe(400);
    expect(unknownSolid.body.error.fields.map((f: { field: string }) => f.field)).toContain('process.solidKey');

    const role = await create(demo.chemist, { ...urea(unique('Urea bad')), role: 'catalyst' });
    expect(role.body.error.fields.map((f: { field: string }) => f.field)).toContain('role');
  });

  it('the same name and grade twice answers 409', async () => {
    const body = urea(unique('Urea twice'));
    expect((await create(demo.chemist, body)).status).toBe(201);
    const again = await create(demo.admin, { ...body, name: body.name.toUpperCase() });
    expect(again.status).toBe(409);
  });

  it('a change carries the version it loaded: success bumps it, a stale version answers 409 and changes nothing', async () => {
    const { body } = await create(demo.chemist, urea(unique('Urea lock')));
    const id = body.ingredient.id;
    const first = await request(h.app).patch(`/api/ingredients/${id}`).set(await auth(demo.chemist)).send({ costPerKg: '0.9', version: 0 });
    expect(first.status).toBe(200);
    expect(first.body.ingredient).toMatchObject({ version: 1, costPerKg: '0.90' });
    const stale = await request(h.app).patch(`/api/ingredients/${id}`).set(await auth(demo.admin)).send({ costPerKg: '5', version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    const now = await request(h.app).get(`/api/ingredients/${id}`).set(await auth(demo.designer));
    expect(now.body.ingredient).toMatchObject({ version: 1, costPerKg: '0.90' });
    const staleDelete = await request(h.app).delete(`/api/ingredients/${id}`).query({ version: 0 }).set(await auth(demo.chemist));
    expect(staleDelete.status).toBe(409);
  });

  it('a change that breaks the cross-field rules answers 400 (an active ingredient needs a heat-producing process)', async () => {
    const { body } = await create(demo.chemist, urea(unique('Urea rules')));
    const res = await request(h.app).patch(`/api/ingredients/${body.ingredient.id}`).set(await auth(demo.chemist)).send({ process: { kind: 'inert', role: 'additive' }, version: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('process.kind');
  });

  it('every change is audited: history lists who, when, before and after, and survives deletion', async () => {
    const { body } = await create(demo.chemist, urea(unique('Urea history')));
    const id = body.ingredient.id;
    await request(h.app).patch(`/api/ingredients/${id}`).set(await auth(demo.admin)).send({ notes: 'second thoughts', version: 0 });
    const del = await request(h.app).delete(`/api/ingredients/${id}`).query({ version: 1 }).set(await auth(demo.chemist));
    expect(del.status).toBe(204);
    expect((await request(h.app).get(`/api/ingredients/${id}`).set(await auth(demo.designer))).status).toBe(404);

    const res = await request(h.app).get(`/api/ingredients/${id}/history`).set(await auth(demo.reviewer));
    expect(res.status).toBe(200);
    const events = res.body.items as { action: string; actor: string; at: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null }[];
    expect(events.map((e) => e.action)).toEqual(['ingredient.create', 'ingredient.update', 'ingredient.delete']);
    expect(events.map((e) => e.actor)).toEqual(['Chen Chemist', 'Ada Admin', 'Chen Chemist']);
    expect(events[0]!.before).toBeNull();
    expect(events[1]!.before).toMatchObject({ notes: 'made by the API test', version: 0 });
    expect(events[1]!.after).toMatchObject({ notes: 'second thoughts', version: 1 });
    expect(events[2]!.after).toBeNull();
    expect(events.every((e) => !Number.isNaN(Date.parse(e.at)))).toBe(true);
  });
});
