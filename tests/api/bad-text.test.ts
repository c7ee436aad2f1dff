// Text PostgreSQL cannot hold — NUL (U+0000) and lone UTF-16 surrogates — is refused with a 400
// naming the field and the rule, never stored altered and never a 500. The database's own
// "data exception" errors (SQLSTATE class 22) answer 400 as well.
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, useHarness } from './support/harness';

const h = useHarness();
const tag = `bt${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
const NUL = 'a\u0000b';
const LONE_HIGH = 'cold \uD83D pack';
const LONE_LOW = '\uDE00';
let token = '';
let designerToken = '';
const bearer = () => ({ Authorization: `Bearer ${token}` });
const designer = () => ({ Authorization: `Bearer ${designerToken}` });

beforeAll(async () => {
  token = await h.token(demo.chemist);
  designerToken = await h.token(demo.designer);
});
afterAll(async () => {
  const { IngredientRecord } = await import('../../backend/src/ingredients/ingredient.model');
  const { Op } = await import('sequelize');
  await IngredientRecord.destroy({ where: { name: { [Op.like]: `%${tag}%` } }, force: true });
});

const ingredient = (extra: Record<string, unknown>) => ({ name: `Urea ${tag}`, role: 'additive', costPerKg: '0.70', ...extra });

function expectRefused(res: request.Response, field: string, rule: RegExp) {
  expect(res.status, JSON.stringify(res.body)).toBe(400);
  expect(res.body.error.code).toBe('validation_failed');
  expect(res.body.error.fields).toContainEqual({ field, message: expect.stringMatching(rule) });
  expect(res.body.error.message).toContain(field);
}

describe('NUL characters and lone surrogates in request text', () => {
  it('an ingredient name, notes, grade or source carrying one is refused naming the field, and nothing is saved', async () => {
    expectRefused(await request(h.app).post('/api/ingredients').set(bearer()).send(ingredient({ name: `Urea ${NUL} ${tag}` })), 'name', /NUL/);
    expectRefused(await request(h.app).post('/api/ingredients').set(bearer()).send(ingredient({ notes: LONE_HIGH })), 'notes', /lone UTF-16 surrogate/);
    expectRefused(await request(h.app).post('/api/ingredients').set(bearer()).send(ingredient({ grade: LONE_LOW })), 'grade', /lone UTF-16 surrogate/);
    expectRefused(await request(h.app).post('/api/ingredients').set(bearer()).send(ingredient({ sources: ['CRC Handbook', NUL] })), 'sources.1', /NUL/);
    const list = await request(h.app).get('/api/ingredients').query({ q: tag }).set(bearer());
    expect(list.body.items).toEqual([]);
  });

  it('a well-formed surrogate pair (an emoji) is ordinary text and is kept as sent', async () => {
    const res = await request(h.app).post('/api/ingredients').set(bearer()).send(ingredient({ notes: 'cold \uD83D\uDE00 pack' }));
    expect(res.status).toBe(201);
    expect(res.body.ingredient.notes).toBe('cold \uD83D\uDE00 pack');
  });

  it('brief names and notes, a species citation and a search query are refused the same way', async () => {
    expectRefused(await request(h.app).post('/api/briefs').set(designer()).send({ name: `Compress ${NUL}` }), 'name', /NUL/);
    expectRefused(await request(h.app).post('/api/briefs').set(designer()).send({ name: `Compress ${tag}`, notes: LONE_HIGH }), 'notes', /surrogate/);
    expectRefused(
      await request(h.app).post('/api/species').set(bearer()).send({ formula: 'KCl', phase: 'cr', name: 'Potassium chloride', source: `CRC ${NUL}` }),
      'source',
      /NUL/,
    );
    expectRefused(await request(h.app).get('/api/ingredients').query({ q: NUL }).set(bearer()), 'query.q', /NUL/);
    expectRefused(await request(h.app).get('/api/species').query({ q: 'K\u0000' }).set(bearer()), 'query.q', /NUL/);
  });

  it('a key or free-form value no schema names is refused too, with its path', async () => {
    const res = await request(h.app).post('/api/briefs').set(designer()).send({ name: `Compress ${tag}`, ['x\u0000']: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([{ field: '(body)', message: expect.stringMatching(/key that must not contain NUL/) }]);
  });

  it('an uploaded file whose name carries NUL is refused (400 naming the file field), not stored renamed', async () => {
    const list = await request(h.app).get('/api/ingredients').query({ pageSize: 1 }).set(bearer());
    const id = list.body.items[0].id;
    const form = (filename: string, type: string, content: string) =>
      `--XX\r\nContent-Disposition: form-data; name="file"; filename*=UTF-8''${filename}\r\nContent-Type: ${type}\r\n\r\n${content}\r\n--XX--\r\n`;
    for (const [path, type, content] of [
      [`/api/ingredients/${id}/attachments`, 'application/pdf', '%PDF-1.4\n%%EOF\n'],
      ['/api/lab-logs/preview', 'text/csv', 't,temp\n0,25\n'],
      ['/api/ingredients/import', 'text/csv', 'name,role,costPerKg\n'],
    ] as const) {
      const res = await request(h.app).post(path).set(bearer()).set('Content-Type', 'multipart/form-data; boundary=XX').send(form('sheet%00.pdf', type, content));
      expectRefused(res, 'file', /file name must not contain NUL/);
    }
    const attachments = await request(h.app).get(`/api/ingredients/${id}/attachments`).set(bearer());
    expect(attachments.body.items.map((a: { filename: string }) => a.filename)).not.toContain('sheet.pdf');
  });
});

describe('database data exceptions', () => {
  it('a value PostgreSQL refuses (22021, 22P05, 22P02, 22003, 22007) answers 400 invalid_value, not 500', async () => {
    const { sequelize } = await import('../../backend/src/db/sequelize');
    const { errorHandler } = await import('../../backend/src/http/error-handler');
    const app = express();
    const queries: Record<string, [string, unknown[]]> = {
      '22021': ["SELECT convert_from('\\x610062'::bytea, 'UTF8') AS v", []],
      '22P05': ['SELECT $1::jsonb AS v', ['{"name": "a\\u0000b"}']],
      '22P02': ['SELECT $1::integer AS v', ['twelve']],
      '22003': ['SELECT $1::integer AS v', ['99999999999']],
      '22007': ['SELECT $1::date AS v', ['the day after tomorrow']],
    };
    app.get('/probe/:code', async (req, _res, next) => {
      try {
        const [sql, bind] = queries[req.params.code]!;
        await sequelize.query(sql, bind.length ? { bind } : {});
        next(new Error('the query should have failed'));
      } catch (error) {
        next(error);
      }
    });
    app.use(errorHandler);
    for (const code of Object.keys(queries)) {
      const res = await request(app).get(`/probe/${code}`);
      expect(res.status, code).toBe(400);
      expect(res.body.error.code, code).toBe('invalid_value');
      expect(res.body.error.message, code).toMatch(/cannot be stored/);
    }
  });
});
