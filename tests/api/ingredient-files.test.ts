import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import { demo, harbour, useHarness } from './support/harness';

const h = useHarness();
const auth = async (email: string) => ({ Authorization: `Bearer ${await h.token(email)}` });
const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
// Everything this file creates has a name containing the run tag; removed afterwards.
afterAll(async () => {
  const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
  const { Op } = await import('sequelize');
  await IngredientRecord.destroy({ where: { name: { [Op.like]: `%${tag}%` } }, force: true });
});

async function namesInLibrary(email: string): Promise<string[]> {
  const res = await request(h.app).get('/api/ingredients').query({ q: tag, pageSize: 200 }).set(await auth(email));
  return res.body.items.map((i: { name: string }) => i.name);
}

const processCell = (solidKey: string) => `"${JSON.stringify({ kind: 'dissolution', solidKey }).replace(/"/g, '""')}"`;
const HEADER = 'name,grade,role,process,costPerKg,densityGPerMl,sources,notes';

describe('POST /api/ingredients/import', () => {
  it('imports a good file: every row created, audited, and visible in the library', async () => {
    const csv = [
      HEADER,
      `Potassium chloride ${tag},Import A,active,${processCell('KCl(cr)')},0.95,1.988,CRC Handbook | NBS 1982,imported`,
      `Water ${tag},Import A,solvent,,0.02,0.997,,`,
    ].join('\r\n');
    const res = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', Buffer.from(csv), { filename: 'library.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ dryRun: false, rows: 2, created: 2, updated: 0 });
    expect((await namesInLibrary(demo.designer)).sort()).toEqual([`Potassium chloride ${tag}`, `Water ${tag}`]);
    const list = await request(h.app).get('/api/ingredients').query({ q: `Potassium chloride ${tag}` }).set(await auth(demo.designer));
    const kcl = list.body.items[0];
    expect(kcl).toMatchObject({ costPerKg: '0.95', sources: ['CRC Handbook', 'NBS 1982'], speciesKey: 'KCl(cr)' });
    const history = await request(h.app).get(`/api/ingredients/${kcl.id}/history`).set(await auth(demo.designer));
    expect(history.body.items[0]).toMatchObject({ action: 'ingredient.create', actor: 'Chen Chemist', detail: { via: 'import', row: 2 } });
  });

  it('dryRun=true checks and counts but writes nothing', async () => {
    const csv = [HEADER, `Urea ${tag},Dry run,active,${processCell('CO(NH2)2(cr)')},0.7,1.32,,`].join('\n');
    const res = await request(h.app).post('/api/ingredients/import').query({ dryRun: 'true' }).set(await auth(demo.admin)).attach('file', Buffer.from(csv), 'dry.csv');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ dryRun: true, rows: 1, created: 1, updated: 0 });
    expect(await namesInLibrary(demo.designer)).not.toContain(`Urea ${tag}`);
  });

  it('one bad row imports nothing, and the answer names that row, its field and the rule', async () => {
    const csv = [
      HEADER,
      `Sodium chloride ${tag},All or nothing,active,${processCell('NaCl(cr)')},0.30,2.17,,`,
      `Calcium chloride ${tag},All or nothing,active,${processCell('CaCl2(cr)')},-0.85,2.15,,`,
      `Magnesium sulfate ${tag},All or nothing,active,${processCell('MgSO4(cr)')},0.90,2.66,,`,
    ].join('\n');
    const res = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', Buffer.from(csv), { filename: 'bad.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.fields).toEqual([{ field: 'rows.3.costPerKg', message: 'must be 0 or more' }]);
    expect(res.body.error.message).toMatch(/nothing was imported/);
    const names = await namesInLibrary(demo.designer);
    expect(names).not.toContain(`Sodium chloride ${tag}`);
    expect(names).not.toContain(`Magnesium sulfate ${tag}`);
  });

  it('reports every bad row: unknown role, invalid JSON process, unknown species, repeated name', async () => {
    const csv = [
      HEADER,
      `Thing ${tag},Bad,catalyst,,1,,,`,
      `Thing two ${tag},Bad,active,{not json},1,,,`,
      `Thing three ${tag},Bad,active,${processCell('Unobtainium(cr)')},1,,,`,
      `Thing four ${tag},Bad,additive,,1,,,`,
      `thing four ${tag},bad,additive,,1,,,`,
    ].join('\n');
    const res = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', Buffer.from(csv), 'bad.csv');
    expect(res.status).toBe(400);
    const fields = res.body.error.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['rows.2.role', 'rows.3.process', 'rows.4.process.solidKey', 'rows.6.name']));
    expect(fields.some((f: string) => f.startsWith('rows.5'))).toBe(false);
  });

  it('a file that is not CSV is refused with 415 (by type and name, or by binary content)', async () => {
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 0)]);
    const byType = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', png, { filename: 'logo.png', contentType: 'image/png' });
    expect(byType.status).toBe(415);
    const renamed = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', png, { filename: 'logo.csv', contentType: 'text/csv' });
    expect(renamed.status).toBe(415);
  });

  it('a file over 1 MB is refused with 413, a missing file with 400 naming the field', async () => {
    const big = Buffer.from(`${HEADER}\n${'x'.repeat(1024 * 1024)}`);
    const tooLarge = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', big, { filename: 'big.csv', contentType: 'text/csv' });
    expect(tooLarge.status).toBe(413);
    const missing = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).field('note', 'no file');
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields[0].field).toBe('file');
  });

  it('designers and reviewers may not import (403)', async () => {
    for (const who of [demo.designer, demo.reviewer]) {
      const res = await request(h.app).post('/api/ingredients/import').set(await auth(who)).attach('file', Buffer.from(`${HEADER}\n`), 'x.csv');
      expect(res.status).toBe(403);
    }
  });
});

describe('GET /api/ingredients/export.csv', () => {
  it('prefixes text cells starting with = + - @ with a quote, leaves numbers as numbers, and imports back unchanged', async () => {
    const created = await request(h.app)
      .post('/api/ingredients')
      .set(await auth(demo.chemist))
      .send({
        name: `=HYPERLINK("http://example.test","open") ${tag}`,
        grade: '-20 mesh',
        role: 'additive',
        costPerKg: '1.5',
        densityGPerMl: 0.45,
        sources: ['@SUM(A1:A2)'],
        notes: '+cmd|calc',
      });
    expect(created.status).toBe(201);

    const res = await request(h.app).get('/api/ingredients/export.csv').set(await auth(demo.reviewer));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?ingredients.csv"?$/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    const row = parsed.data.find((r) => r.name!.includes(tag) && r.name!.includes('HYPERLINK'))!;
    expect(row.name!.startsWith(`'=HYPERLINK`)).toBe(true);
    expect(row.grade).toBe("'-20 mesh");
    expect(row.sources).toBe("'@SUM(A1:A2)");
    expect(row.notes).toBe("'+cmd|calc");
    // Numbers are written bare (no quote prefix, no quoting), so a spreadsheet reads them as numbers.
    const line = res.text.split('\r\n').find((l) => l.includes(tag) && l.includes('HYPERLINK'))!;
    expect(line).toMatch(/,1\.5,EUR,0\.45,,/);
    // A role or a key never starts with a formula character, and other workspaces' rows are absent.
    expect(parsed.data.some((r) => r.name === 'HDPE insert shell')).toBe(false);

    // The whole export imports back as updates of the same ingredients (the quote prefix is undone).
    const back = await request(h.app).post('/api/ingredients/import').query({ dryRun: 'true' }).set(await auth(demo.chemist)).attach('file', Buffer.from(res.text), { filename: 'ingredients.csv', contentType: 'text/csv' });
    expect(back.status).toBe(200);
    expect(back.body.created).toBe(0);
    expect(back.body.updated).toBe(parsed.data.length);

    // Importing our row for real restores the exact text (the quote prefix is removed again).
    const [header] = res.text.split('\r\n');
    const mine = await request(h.app).post('/api/ingredients/import').set(await auth(demo.chemist)).attach('file', Buffer.from(`${header}\r\n${line}`), { filename: 'mine.csv', contentType: 'text/csv' });
    expect(mine.body).toMatchObject({ created: 0, updated: 1 });
    const after = await request(h.app).get(`/api/ingredients/${created.body.ingredient.id}`).set(await auth(demo.designer));
    expect(after.body.ingredient).toMatchObject({ name: created.body.ingredient.name, grade: '-20 mesh', sources: ['@SUM(A1:A2)'], notes: '+cmd|calc', costPerKg: '1.50', densityGPerMl: 0.45, version: 1 });
  });

  it('only text is escaped: a negative number stays a number', async () => {
    const { csvCell } = await import('../../backend/src/ingredients/ingredients-csv.service');
    expect(csvCell(-5)).toBe(-5);
    expect(csvCell('-5')).toBe("'-5");
    expect(csvCell('plain')).toBe('plain');
  });
});

describe('ingredient attachments', () => {
  const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1');

  async function ingredientId() {
    const res = await request(h.app)
      .post('/api/ingredients')
      .set(await auth(demo.chemist))
      .send({ name: `Attachment holder ${tag} ${Math.random().toString(36).slice(2, 6)}`, role: 'packaging', costPerKg: '3' });
    expect(res.status).toBe(201);
    return res.body.ingredient.id as number;
  }

  it('a PDF is stored, listed and downloaded as an attachment with nosniff by any member of the workspace', async () => {
    const id = await ingredientId();
    const up = await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(demo.chemist)).attach('file', pdf, { filename: '../SDS urea.pdf', contentType: 'application/pdf' });
    expect(up.status).toBe(201);
    expect(up.body.attachment).toMatchObject({ filename: 'SDS urea.pdf', contentType: 'application/pdf', sizeBytes: pdf.length, sha256: createHash('sha256').update(pdf).digest('hex') });

    const list = await request(h.app).get(`/api/ingredients/${id}/attachments`).set(await auth(demo.reviewer));
    expect(list.status).toBe(200);
    expect(list.body.items.map((a: { id: number }) => a.id)).toEqual([up.body.attachment.id]);

    const down = await request(h.app).get(`/api/attachments/${up.body.attachment.id}/download`).set(await auth(demo.designer)).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(down.status).toBe(200);
    expect(down.headers['content-type']).toBe('application/pdf');
    expect(down.headers['content-disposition']).toMatch(/^attachment; filename="?SDS urea.pdf"?/);
    expect(down.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(down.body as Buffer, pdf)).toBe(0);
  });

  it('a PNG renamed .pdf is refused (415): the type is judged by content', async () => {
    const id = await ingredientId();
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(100, 7)]);
    const res = await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(demo.chemist)).attach('file', png, { filename: 'sds.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(415);
    const list = await request(h.app).get(`/api/ingredients/${id}/attachments`).set(await auth(demo.chemist));
    expect(list.body.items).toEqual([]);
  });

  it('a file over 5 MB is refused (413)', async () => {
    const id = await ingredientId();
    const big = Buffer.concat([Buffer.from('%PDF-1.4\n'), Buffer.alloc(5 * 1024 * 1024, 0x20)]);
    const res = await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(demo.chemist)).attach('file', big, { filename: 'big.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(413);
  });

  it('designers may not upload (403); another workspace gets 404 for upload, list and download; no session 401', async () => {
    const id = await ingredientId();
    const up = await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(demo.admin)).attach('file', pdf, 'sds.pdf');
    expect(up.status).toBe(201);
    expect((await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(demo.designer)).attach('file', pdf, 'sds.pdf')).status).toBe(403);
    expect((await request(h.app).post(`/api/ingredients/${id}/attachments`).set(await auth(harbour.chemist)).attach('file', pdf, 'sds.pdf')).status).toBe(404);
    expect((await request(h.app).get(`/api/ingredients/${id}/attachments`).set(await auth(harbour.designer))).status).toBe(404);
    expect((await request(h.app).get(`/api/attachments/${up.body.attachment.id}/download`).set(await auth(harbour.admin))).status).toBe(404);
    expect((await request(h.app).get(`/api/attachments/${up.body.attachment.id}/download`)).status).toBe(401);
  });
});
