import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });

// Rows this file adds to the demo workspace, removed before and after so reruns start clean.
const ADDED_KEY = 'C16H34(l)';
const CORRECTED_KEY = 'LiCl(cr)';
async function cleanUp() {
  const { SpeciesRow } = await import('../../backend/src/species/species.model');
  const { Op } = await import('sequelize');
  await SpeciesRow.destroy({ where: { key: [ADDED_KEY, CORRECTED_KEY], workspaceId: { [Op.ne]: null } } });
}
beforeAll(cleanUp);
afterAll(cleanUp);

async function findOne(email: string, q: string, phase: string) {
  const res = await request(h.app).get('/api/species').query({ q, phase, pageSize: 200 }).set(await auth(email));
  expect(res.status).toBe(200);
  return res.body.items as { id: number; key: string; scope: string; version: number; dfH_kJ_per_mol: number | null; correctsId: number | null; source: string }[];
}

describe('GET /api/species', () => {
  it('searches by formula and filters by phase', async () => {
    const rows = await findOne(demo.designer, 'KCl', 'cr');
    expect(rows.map((r) => r.key)).toContain('KCl(cr)');
    expect(rows.every((r) => r.key.endsWith('(cr)'))).toBe(true);
  });

  it('searches by name, case-insensitively', async () => {
    const res = await request(h.app).get('/api/species').query({ q: 'AMMONIUM' }).set(await auth(demo.reviewer));
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items.every((s: { name: string; formula: string }) => /ammonium/i.test(s.name) || /NH4/.test(s.formula))).toBe(true);
  });

  it('pages: pageSize rows per page, total counts all', async () => {
    const first = await request(h.app).get('/api/species').query({ pageSize: 5, page: 1 }).set(await auth(demo.designer));
    const second = await request(h.app).get('/api/species').query({ pageSize: 5, page: 2 }).set(await auth(demo.designer));
    expect(first.body.items).toHaveLength(5);
    expect(first.body.total).toBeGreaterThan(100);
    const ids = new Set(first.body.items.map((s: { id: number }) => s.id));
    expect(second.body.items.some((s: { id: number }) => ids.has(s.id))).toBe(false);
  });

  it('an unknown phase answers 400 naming the query field', async () => {
    const res = await request(h.app).get('/api/species').query({ phase: 'plasma' }).set(await auth(demo.designer));
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].field).toBe('query.phase');
  });

  it('needs a session', async () => {
    expect((await request(h.app).get('/api/species')).status).toBe(401);
  });
});

describe('POST /api/species', () => {
  // NIST Chemistry WebBook, hexadecane: M = 226.44 g/mol, ΔfH°(liquid) ≈ −456 kJ/mol (from memory).
  const hexadecane = { formula: 'C16H34', phase: 'l', name: 'hexadecane', dfH_kJ_per_mol: -456.1, source: 'NIST Chemistry WebBook, SRD 69: hexadecane, liquid' };

  it('designers and reviewers may not add species (403)', async () => {
    for (const who of [demo.designer, demo.reviewer]) {
      const res = await request(h.app).post('/api/species').set(await auth(who)).send(hexadecane);
      expect(res.status).toBe(403);
    }
  });

  it('a citation is required (400 naming source)', async () => {
    const { source: _s, ...uncited } = hexadecane;
    const res = await request(h.app).post('/api/species').set(await auth(demo.chemist)).send(uncited);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('source');
  });

  it('a formula the parser cannot read answers 400 naming formula', async () => {
    const res = await request(h.app).post('/api/species').set(await auth(demo.chemist)).send({ ...hexadecane, formula: 'C16H34)' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { field: string }) => f.field)).toContain('formula');
  });

  it('a chemist adds a species to the workspace only, molar mass computed, audited; a repeat is 409', async () => {
    const res = await request(h.app).post('/api/species').set(await auth(demo.chemist)).send(hexadecane);
    expect(res.status).toBe(201);
    expect(res.body.species.key).toBe(ADDED_KEY);
    expect(res.body.species.scope).toBe('workspace');
    expect(Math.abs(res.body.species.molarMass_g_per_mol - 226.44)).toBeLessThan(0.02);
    expect((await findOne(demo.designer, 'C16H34', 'l')).map((r) => r.key)).toEqual([ADDED_KEY]);
    expect(await findOne(harbour.chemist, 'C16H34', 'l')).toEqual([]);

    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const event = await AuditEventRecord.findOne({ where: { entityType: 'species', entityId: String(res.body.species.id), action: 'species.create' } });
    expect(event?.detail).toMatchObject({ source: hexadecane.source });

    const again = await request(h.app).post('/api/species').set(await auth(demo.admin)).send(hexadecane);
    expect(again.status).toBe(409);
  });

  it('a species already in the reference data cannot be added again (409, correct it instead)', async () => {
    const res = await request(h.app).post('/api/species').set(await auth(demo.chemist)).send({ formula: 'NaCl', phase: 'cr', name: 'salt', dfH_kJ_per_mol: -411, source: 'a textbook' });
    expect(res.status).toBe(409);
  });
});

describe('PATCH /api/species/:id', () => {
  it('correcting a reference row creates a workspace correction that this workspace alone computes with; audited with before and after', async () => {
    const [reference] = await findOne(demo.chemist, 'LiCl', 'cr');
    expect(reference!.scope).toBe('reference');
    const corrected = -408.27;
    const res = await request(h.app)
      .patch(`/api/species/${reference!.id}`)
      .set(await auth(demo.chemist))
      .send({ dfH_kJ_per_mol: corrected, source: 'Correction from the laboratory notebook LN-12, p. 4', version: reference!.version });
    expect(res.status).toBe(200);
    expect(res.body.species).toMatchObject({ key: CORRECTED_KEY, scope: 'workspace', correctsId: reference!.id, dfH_kJ_per_mol: corrected });
    expect(res.body.species.id).not.toBe(reference!.id);

    const ours = await findOne(demo.designer, 'LiCl', 'cr');
    expect(ours.map((r) => r.scope)).toEqual(['workspace']);
    const theirs = await findOne(harbour.designer, 'LiCl', 'cr');
    expect(theirs).toHaveLength(1);
    expect(theirs[0]).toMatchObject({ scope: 'reference', dfH_kJ_per_mol: reference!.dfH_kJ_per_mol });

    const lib = await request(h.app).get('/api/thermo/library').set(await auth(demo.designer));
    expect(lib.body.species.find((s: { key: string }) => s.key === CORRECTED_KEY).dfH_kJ_per_mol).toBe(corrected);
    const otherLib = await request(h.app).get('/api/thermo/library').set(await auth(harbour.designer));
    expect(otherLib.body.species.find((s: { key: string }) => s.key === CORRECTED_KEY).dfH_kJ_per_mol).toBe(reference!.dfH_kJ_per_mol);

    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const event = await AuditEventRecord.findOne({ where: { entityType: 'species', entityId: String(res.body.species.id), action: 'species.correct' } });
    expect(event?.detail).toMatchObject({ before: { dfH_kJ_per_mol: reference!.dfH_kJ_per_mol }, after: { dfH_kJ_per_mol: corrected } });

    // A second correction of the same reference row is refused; the workspace edits its own row.
    const twice = await request(h.app).patch(`/api/species/${reference!.id}`).set(await auth(demo.chemist)).send({ dfH_kJ_per_mol: -408, source: 'again', version: 0 });
    expect(twice.status).toBe(409);

    const edit = await request(h.app).patch(`/api/species/${res.body.species.id}`).set(await auth(demo.admin)).send({ Cp_J_per_mol_K: 48.0, source: 'LN-12, p. 5', version: 0 });
    expect(edit.status).toBe(200);
    expect(edit.body.species.version).toBe(1);
    const stale = await request(h.app).patch(`/api/species/${res.body.species.id}`).set(await auth(demo.chemist)).send({ Cp_J_per_mol_K: 47.0, source: 'LN-12, p. 6', version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
  });

  it("another workspace's row answers 404; designers may not correct (403); a citation is required (400)", async () => {
    const [reference] = await findOne(demo.chemist, 'KNO3', 'cr');
    const noCitation = await request(h.app).patch(`/api/species/${reference!.id}`).set(await auth(demo.chemist)).send({ dfH_kJ_per_mol: -494, version: 0 });
    expect(noCitation.status).toBe(400);
    expect(noCitation.body.error.fields.map((f: { field: string }) => f.field)).toContain('source');
    const designer = await request(h.app).patch(`/api/species/${reference!.id}`).set(await auth(demo.designer)).send({ dfH_kJ_per_mol: -494, source: 'x y z', version: 0 });
    expect(designer.status).toBe(403);

    // The demo workspace's own row (added above) is invisible to the harbour workspace.
    const [ours] = await findOne(demo.chemist, 'C16H34', 'l');
    expect(ours?.scope).toBe('workspace');
    const res = await request(h.app).patch(`/api/species/${ours!.id}`).set(await auth(harbour.chemist)).send({ name: 'mine now', source: 'a b c', version: ours!.version });
    expect(res.status).toBe(404);
  });
});
