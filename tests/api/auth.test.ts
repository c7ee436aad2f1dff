import { describe, expect, it } from 'vitest';
import request from 'supertest';
import jwt from 'jsonwebtoken';
import { demo, useHarness, uniqueEmail } from './support/harness';

const h = useHarness();

describe('sign-in', () => {
  it('a demo member signs in and receives a bearer token and an httpOnly SameSite session cookie', async () => {
    const res = await request(h.app).post('/api/auth/login').send({ email: demo.designer, password: 'packwright-demo' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: demo.designer, role: 'designer' });
    expect(typeof res.body.token).toBe('string');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/pw_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('a wrong password and an unknown address get the same answer', async () => {
    const wrong = await request(h.app).post('/api/auth/login').send({ email: demo.chemist, password: 'not-the-password' });
    const unknown = await request(h.app).post('/api/auth/login').send({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('login is rate-limited per address with a 429 and a message', async () => {
    const email = uniqueEmail('limited');
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      statuses.push((await request(h.app).post('/api/auth/login').send({ email, password: 'wrong-password' })).status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    const limited = await request(h.app).post('/api/auth/login').send({ email, password: 'wrong-password' });
    expect(limited.status).toBe(429);
    expect(limited.body.error.message).toMatch(/too many/i);
  });

  it('validation errors name the field and the rule', async () => {
    const res = await request(h.app).post('/api/auth/login').send({ email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    const fields = res.body.error.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('a body that is not JSON answers 400, one that is too large answers 413', async () => {
    const bad = await request(h.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    const big = await request(h.app).post('/api/auth/login').send({ email: demo.admin, password: 'x'.repeat(600 * 1024) });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('payload_too_large');
  });
});

describe('session', () => {
  it('/me answers by bearer token and by cookie, and 401 without either', async () => {
    const token = await h.token(demo.reviewer);
    const byBearer = await request(h.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
    expect(byBearer.status).toBe(200);
    expect(byBearer.body.user.role).toBe('reviewer');

    const agent = request.agent(h.app);
    await agent.post('/api/auth/login').send({ email: demo.reviewer, password: 'packwright-demo' });
    const byCookie = await agent.get('/api/auth/me');
    expect(byCookie.status).toBe(200);

    const none = await request(h.app).get('/api/auth/me');
    expect(none.status).toBe(401);
    expect(none.body.error.code).toBe('unauthenticated');
  });

  it('logout clears the cookie', async () => {
    // Logout ends every session of the member (token version): a member of its own, so the
    // demo members' sessions in other test files stay valid.
    const { UserRecord } = await import('../../backend/src/users/user.model');
    const { hashPassword } = await import('../../backend/src/auth/passwords');
    const chemist = (await UserRecord.findOne({ where: { email: demo.chemist } }))!;
    const email = uniqueEmail('logout');
    const member = await UserRecord.create({ workspaceId: chemist.workspaceId, email, name: 'Logout Tester', passwordHash: await hashPassword('packwright-demo'), role: 'chemist' });
    const agent = request.agent(h.app);
    await agent.post('/api/auth/login').send({ email, password: 'packwright-demo' });
    const origin = 'http://127.0.0.1';
    const out = await agent.post('/api/auth/logout').set('Origin', origin).set('Host', '127.0.0.1');
    expect(out.status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    await member.destroy();
  });

  it('a cookie-authenticated write from another origin is refused', async () => {
    const agent = request.agent(h.app);
    await agent.post('/api/auth/login').send({ email: demo.admin, password: 'packwright-demo' });
    const res = await agent.post('/api/auth/logout').set('Origin', 'https://evil.example');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_site_request');
  });

  it('tampered and expired tokens are refused', async () => {
    const token = await h.token(demo.designer);
    const [head, body, sig] = token.split('.');
    const payload = JSON.parse(Buffer.from(body!, 'base64url').toString());
    const forged = `${head}.${Buffer.from(JSON.stringify({ ...payload, sub: '1' })).toString('base64url')}.${sig}`;
    expect((await request(h.app).get('/api/auth/me').set('Authorization', `Bearer ${forged}`)).status).toBe(401);

    const expired = jwt.sign({ ...payload, iat: 1, exp: 2 }, process.env.JWT_SECRET!, { algorithm: 'HS256' });
    expect((await request(h.app).get('/api/auth/me').set('Authorization', `Bearer ${expired}`)).status).toBe(401);
  });

  it('security headers are set by helmet', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('unknown API routes answer 404 in JSON', async () => {
    const res = await request(h.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('route_not_found');
  });

  it('the OpenAPI document lists the foundation, optimiser and review routes', async () => {
    const res = await request(h.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    for (const path of ['/api/auth/login', '/api/auth/me', '/api/users', '/api/users/{id}', '/api/invitations', '/api/invitations/accept', '/api/health', '/api/mail-messages', '/api/auth/password-reset', '/api/briefs', '/api/briefs/{id}', '/api/briefs/{id}/runs', '/api/runs/{id}', '/api/runs/{id}/cancel', '/api/candidates/{id}', '/api/candidates/{id}/shortlist', '/api/candidates/compare']) {
      expect(Object.keys(res.body.paths)).toContain(path);
    }
  });
});
