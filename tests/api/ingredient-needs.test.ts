import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });
const unique = (prefix: string) => `${prefix} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

// Everything this file creates carries this grade and is removed afterwards.
const TEST_GRADE = 'API needs test grade';
afterAll(async () => {
  const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
  await IngredientRecord.destroy({ where: { grade: TEST_GRADE }, force: true });
});

interface Row {
  id: number;
  name: string;
  grade: string;
  needs: { ingredientId: number; minGPerG: number; maxGPerG?: number; source?: string }[];
}

async function library(email: string): Promise<Row[]> {
  const res = await request(h.app).get('/api/ingredients').query({ pageSize: 200 }).set(await auth(email));
  return res.body.items as Row[];
}

const ironLike = (needs: unknown) => ({
  name: unique('Iron powder test'),
  grade: TEST_GRADE,
  role: 'active',
  process: { kind: 'air-oxidation' },
  costPerKg: '2.00',
  needs,
});

describe('ingredient needs', () => {
  it('the seeded iron powder needs salt, carbon, vermiculite and water of the same library, within the demo ratios', async () => {
    const rows = await library(demo.designer);
    const iron = rows.find((r) => r.name === 'Iron powder')!;
    const nameOf = new Map(rows.map((r) => [r.id, r.name]));
    expect(iron.needs.map((n) => nameOf.get(n.ingredientId)).sort()).toEqual(['Activated carbon', 'Sodium chloride', 'Vermiculite', 'Water']);
    for (const n of iron.needs) {
      expect(n.minGPerG).toBeGreaterThanOrEqual(0);
      expect(n.maxGPerG!).toBeGreaterThanOrEqual(n.minGPerG);
    }
  });

  it('a chemist creates and changes needs naming ingredients of the library; the answer carries them', async () => {
    const rows = await library(demo.chemist);
    const water = rows.find((r) => r.name === 'Water')!;
    const carbon = rows.find((r) => r.name === 'Activated carbon')!;
    const created = await request(h.app).post('/api/ingredients').set(await auth(demo.chemist)).send(ironLike([{ ingredientId: water.id, minGPerG: 0.3, maxGPerG: 0.5, source: 'test' }]));
    expect(created.status).toBe(201);
    expect(created.body.ingredient.needs).toEqual([{ ingredientId: water.id, minGPerG: 0.3, maxGPerG: 0.5, source: 'test' }]);
    const changed = await request(h.app).patch(`/api/ingredients/${created.body.ingredient.id}`).set(await auth(demo.chemist)).send({ needs: [{ ingredientId: carbon.id, minGPerG: 0.2 }], version: created.body.ingredient.version });
    expect(changed.status).toBe(200);
    expect(changed.body.ingredient.needs).toEqual([{ ingredientId: carbon.id, minGPerG: 0.2 }]);
    // A change that does not mention needs keeps them.
    const notes = await request(h.app).patch(`/api/ingredients/${created.body.ingredient.id}`).set(await auth(demo.chemist)).send({ notes: 'kept', version: changed.body.ingredient.version });
    expect(notes.body.ingredient.needs).toEqual([{ ingredientId: carbon.id, minGPerG: 0.2 }]);
  });

  it('a negative ratio, a max below the min or the same ingredient twice answers 400 naming the field', async () => {
    const water = (await library(demo.chemist)).find((r) => r.name === 'Water')!;
    const cases: [unknown, string][] = [
      [[{ ingredientId: water.id, minGPerG: -0.1 }], 'needs.0.minGPerG'],
      [[{ ingredientId: water.id, minGPerG: 0.5, maxGPerG: 0.2 }], 'needs.0.maxGPerG'],
      [[{ ingredientId: water.id, minGPerG: 0.1 }, { ingredientId: water.id, minGPerG: 0.2 }], 'needs.1.ingredientId'],
    ];
    for (const [needs, field] of cases) {
      const res = await request(h.app).post('/api/ingredients').set(await auth(demo.chemist)).send(ironLike(needs));
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain(field);
    }
  });

  it("an id of another workspace's ingredient, an unknown id or the ingredient itself answers 400 naming needs.N.ingredientId", async () => {
    const theirs = (await library(harbour.chemist)).find((r) => r.name === 'Water')!;
    const other = await request(h.app).post('/api/ingredients').set(await auth(demo.chemist)).send(ironLike([{ ingredientId: theirs.id, minGPerG: 0.3 }]));
    expect(other.status).toBe(400);
    expect(other.body.error.fields).toEqual([expect.objectContaining({ field: 'needs.0.ingredientId' })]);
    const unknown = await request(h.app).post('/api/ingredients').set(await auth(demo.chemist)).send(ironLike([{ ingredientId: 2_000_000_000, minGPerG: 0.3 }]));
    expect(unknown.status).toBe(400);

    const created = await request(h.app).post('/api/ingredients').set(await auth(demo.chemist)).send(ironLike([]));
    const self = await request(h.app).patch(`/api/ingredients/${created.body.ingredient.id}`).set(await auth(demo.chemist)).send({ needs: [{ ingredientId: created.body.ingredient.id, minGPerG: 0.1 }], version: created.body.ingredient.version });
    expect(self.status).toBe(400);
    expect(self.body.error.fields).toEqual([expect.objectContaining({ field: 'needs.0.ingredientId', message: expect.stringMatching(/itself/) })]);
  });
});

describe('what a run hands the optimiser', () => {
  it("the iron powder's needs name the optimiser ids (the record ids as strings) of records in the same snapshot", async () => {
    const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
    const { toOptimiserIngredient } = await import('../../backend/src/runs/runs.service');
    const iron = (await library(demo.designer)).find((r) => r.name === 'Iron powder')!;
    const records = await IngredientRecord.findAll({ where: { workspaceId: (await IngredientRecord.findByPk(iron.id))!.workspaceId } });
    const mapped = records.map(toOptimiserIngredient);
    const ids = new Set(mapped.map((i) => i.id));
    const fe = mapped.find((i) => i.id === String(iron.id))!;
    expect(fe.needs).toHaveLength(4);
    for (const n of fe.needs!) {
      expect(typeof n.ingredientId).toBe('string');
      expect(ids.has(n.ingredientId)).toBe(true);
    }
  });
});
