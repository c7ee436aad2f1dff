// Broken multipart bodies on every upload route answer 400 with a message naming the problem
// and the form field, never 500 (the form reader's own errors are the client's to fix).
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, useHarness } from './support/harness';

const h = useHarness();
let token = '';
let ingredientId = 0;
beforeAll(async () => {
  token = await h.token(demo.chemist);
  const list = await request(h.app).get('/api/ingredients').query({ pageSize: 1 }).set('Authorization', `Bearer ${token}`);
  ingredientId = list.body.items[0].id;
});

const routes = () => ['/api/lab-logs/preview', '/api/lab-logs', '/api/ingredients/import', `/api/ingredients/${ingredientId}/attachments`];
const part = (headers: string, body: string) => `--XX\r\n${headers}\r\n\r\n${body}`;
const broken: { name: string; contentType: string; body: string; reason: RegExp }[] = [
  {
    name: 'a form cut short before its closing boundary',
    contentType: 'multipart/form-data; boundary=XX',
    body: part('Content-Disposition: form-data; name="file"; filename="log.csv"\r\nContent-Type: text/csv', 't,temp\n0,25\n'),
    reason: /ends before its closing boundary/,
  },
  {
    name: 'a malformed part header',
    contentType: 'multipart/form-data; boundary=XX',
    body: `${part('Content-Disposition form-data', 'abc')}\r\n--XX--\r\n`,
    reason: /malformed header/,
  },
  { name: 'no boundary in the Content-Type', contentType: 'multipart/form-data', body: 'abc', reason: /names no boundary/ },
  {
    name: 'multipart/mixed instead of form-data',
    contentType: 'multipart/mixed; boundary=XX',
    body: `${part('Content-Type: text/csv', 'abc')}\r\n--XX--\r\n`,
    reason: /must be multipart\/form-data/,
  },
];

describe('broken multipart bodies', () => {
  for (const form of broken) {
    it(`${form.name}: 400 malformed_multipart on each upload route`, async () => {
      for (const path of routes()) {
        const res = await request(h.app).post(path).set('Authorization', `Bearer ${token}`).set('Content-Type', form.contentType).send(form.body);
        expect(res.status, path).toBe(400);
        expect(res.body.error.code, path).toBe('malformed_multipart');
        expect(res.body.error.message, path).toMatch(form.reason);
        expect(res.body.error.fields, path).toEqual([{ field: 'file', message: expect.stringMatching(form.reason) }]);
      }
    });
  }
});
