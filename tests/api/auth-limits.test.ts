// Sign-in limits (failed attempts per address and per client), the trust-proxy setting and the
// session cookie's Secure flag. Each test builds its own app, so each has its own limiter.
import { describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { DEMO_PASSWORD, demo, uniqueEmail, useHarness } from './support/harness';

const h = useHarness();

async function appWith(options: { perAddress?: number; perClient?: number; windowMs?: number; trustProxy?: boolean | number | string } = {}): Promise<Express> {
  const { createApp } = await import('../../backend/src/app');
  return createApp({
    staticDir: null,
    trustProxy: options.trustProxy ?? false,
    loginLimits: { perAddress: options.perAddress ?? 3, perClient: options.perClient ?? 5, windowMs: options.windowMs ?? 15 * 60_000 },
  });
}

function login(app: Express, email: string, password: string, forwardedFor?: string) {
  const req = request(app).post('/api/auth/login');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password });
}

function expectLimited(res: request.Response, windowSeconds: number) {
  expect(res.status).toBe(429);
  expect(res.body.error.code).toBe('too_many_attempts');
  const retryAfter = Number(res.headers['retry-after']);
  expect(Number.isInteger(retryAfter)).toBe(true);
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(windowSeconds);
  // The same seconds in the header, the JSON field and the sentence the sign-in screen shows.
  expect(res.body.error.retryAfterSeconds).toBe(retryAfter);
  expect(res.body.error.message).toContain(`Try again in ${retryAfter} second`);
}

describe('sign-in limits', () => {
  it('successful sign-ins do not count: one office signs in again and again without being locked out', async () => {
    const app = await appWith({ perAddress: 3, perClient: 5 });
    for (let i = 0; i < 12; i++) {
      const email = [demo.designer, demo.chemist, demo.reviewer, demo.admin][i % 4]!;
      expect((await login(app, email, DEMO_PASSWORD)).status).toBe(200);
    }
  });

  it('failed sign-ins for one address are limited, with the seconds until retry in Retry-After and the message', async () => {
    const app = await appWith({ perAddress: 3, perClient: 50 });
    for (let i = 0; i < 3; i++) expect((await login(app, demo.chemist, 'wrong-password')).status).toBe(401);
    const limited = await login(app, demo.chemist, 'wrong-password');
    expectLimited(limited, 15 * 60);
    expect(limited.body.error.retryAfterSeconds).toBeGreaterThan(15 * 60 - 10);
    // Locked means locked: even the right password waits, so guessing cannot continue.
    expectLimited(await login(app, demo.chemist, DEMO_PASSWORD), 15 * 60);
    // Other addresses from the same client are not affected.
    expect((await login(app, demo.designer, DEMO_PASSWORD)).status).toBe(200);
  });

  it('the address limit holds across clients (trusted proxy, different forwarded addresses)', async () => {
    const app = await appWith({ perAddress: 3, perClient: 50, trustProxy: 'loopback' });
    const email = uniqueEmail('target');
    for (let i = 0; i < 3; i++) expect((await login(app, email, 'guess', `198.51.100.${i + 1}`)).status).toBe(401);
    expectLimited(await login(app, email, 'guess', '198.51.100.77'), 15 * 60);
  });

  it('a successful sign-in forgives the address its earlier failures', async () => {
    const app = await appWith({ perAddress: 3, perClient: 50 });
    for (let i = 0; i < 2; i++) expect((await login(app, demo.reviewer, 'typo')).status).toBe(401);
    expect((await login(app, demo.reviewer, DEMO_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(app, demo.reviewer, 'typo')).status).toBe(401);
    expect((await login(app, demo.reviewer, DEMO_PASSWORD)).status).toBe(200);
  });

  it('spraying many addresses from one client is limited, and the client’s own successful sign-in does not reset it', async () => {
    const app = await appWith({ perAddress: 3, perClient: 5 });
    for (let i = 0; i < 4; i++) expect((await login(app, uniqueEmail('spray'), 'Summer2026!')).status).toBe(401);
    expect((await login(app, demo.designer, DEMO_PASSWORD)).status).toBe(200);
    expect((await login(app, uniqueEmail('spray'), 'Summer2026!')).status).toBe(401);
    expectLimited(await login(app, uniqueEmail('spray'), 'Summer2026!'), 15 * 60);
    expectLimited(await login(app, demo.designer, DEMO_PASSWORD), 15 * 60);
  });

  it('without TRUST_PROXY, X-Forwarded-For does not let a client pose as many', async () => {
    const app = await appWith({ perAddress: 3, perClient: 5, trustProxy: false });
    for (let i = 0; i < 5; i++) expect((await login(app, uniqueEmail('spray'), 'guess', `203.0.113.${i + 1}`)).status).toBe(401);
    expectLimited(await login(app, uniqueEmail('spray'), 'guess', '203.0.113.99'), 15 * 60);
  });

  it('with TRUST_PROXY naming the proxy, each forwarded client has its own count', async () => {
    const app = await appWith({ perAddress: 3, perClient: 5, trustProxy: 'loopback' });
    for (let i = 0; i < 5; i++) expect((await login(app, uniqueEmail('spray'), 'guess', '203.0.113.10')).status).toBe(401);
    expectLimited(await login(app, uniqueEmail('spray'), 'guess', '203.0.113.10'), 15 * 60);
    expect((await login(app, demo.designer, DEMO_PASSWORD, '203.0.113.11')).status).toBe(200);
    expect((await login(app, uniqueEmail('spray'), 'guess', '203.0.113.11')).status).toBe(401);
  });

  it('parallel guesses cannot overtake the limit while passwords are being checked', async () => {
    const app = await appWith({ perAddress: 3, perClient: 50 });
    const email = uniqueEmail('parallel');
    const statuses = (await Promise.all(Array.from({ length: 8 }, () => login(app, email, 'guess')))).map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 401)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(5);
  });

  it('the limit lifts when the window has passed, and Retry-After counts down to it', async () => {
    const app = await appWith({ perAddress: 2, perClient: 50, windowMs: 2000 });
    const email = uniqueEmail('window');
    for (let i = 0; i < 2; i++) expect((await login(app, email, 'guess')).status).toBe(401);
    const limited = await login(app, email, 'guess');
    expectLimited(limited, 2);
    await new Promise((r) => setTimeout(r, 2100));
    expect((await login(app, email, 'guess')).status).toBe(401);
  });

  it('bad input is answered 400 and does not count as a failed sign-in', async () => {
    const app = await appWith({ perAddress: 1, perClient: 1 });
    for (let i = 0; i < 4; i++) expect((await request(app).post('/api/auth/login').send({ email: 'not-an-address', password: 'x' })).status).toBe(400);
    expect((await login(app, demo.designer, DEMO_PASSWORD)).status).toBe(200);
  });
});

describe('TRUST_PROXY and the session cookie', () => {
  it('parses the setting: off by default, true, hop counts, address lists; refuses anything else', async () => {
    const { parseTrustProxy, trustProxySchema } = await import('../../backend/src/config');
    expect(parseTrustProxy(trustProxySchema.parse(undefined))).toBe(false);
    expect(parseTrustProxy(trustProxySchema.parse('false'))).toBe(false);
    expect(parseTrustProxy(trustProxySchema.parse('true'))).toBe(true);
    expect(parseTrustProxy(trustProxySchema.parse('1'))).toBe(1);
    expect(parseTrustProxy(trustProxySchema.parse('loopback, 10.0.0.0/8'))).toBe('loopback,10.0.0.0/8');
    expect(trustProxySchema.safeParse('everyone').success).toBe(false);
  });

  it('over plain http the cookie is not Secure; a forwarded https claim is ignored without TRUST_PROXY', async () => {
    const app = await appWith({ trustProxy: false });
    const plain = await login(app, demo.designer, DEMO_PASSWORD);
    expect(String(plain.headers['set-cookie'])).not.toMatch(/;\s*Secure/i);
    const claimed = await request(app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: demo.designer, password: DEMO_PASSWORD });
    expect(String(claimed.headers['set-cookie'])).not.toMatch(/;\s*Secure/i);
  });

  it('behind a trusted https proxy the session cookie is Secure, on sign-in and on sign-out', async () => {
    const app = await appWith({ trustProxy: 'loopback' });
    const res = await request(app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: demo.designer, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(String(res.headers['set-cookie'])).toMatch(/pw_session=.*;\s*Secure/i);
    const out = await request(app)
      .post('/api/auth/logout')
      .set('X-Forwarded-Proto', 'https')
      .set('Authorization', `Bearer ${res.body.token}`);
    expect(out.status).toBe(204);
    expect(String(out.headers['set-cookie'])).toMatch(/pw_session=;.*Secure/i);
  });

  it('the shared test app keeps the default: forwarded headers from loopback are not believed', async () => {
    const res = await request(h.app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: demo.reviewer, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(String(res.headers['set-cookie'])).not.toMatch(/;\s*Secure/i);
  });
});
