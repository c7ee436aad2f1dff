// Sessions that really end and tokens that must be whole: logout revokes the bearer token as
// well as the cookie (token version), a signed token needs a numeric user id and an expiry,
// and a password longer than bcrypt reads (72 bytes) is refused wherever one is set or given.
import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, uniqueEmail, useHarness } from './support/harness';

const h = useHarness();
const secret = () => process.env.JWT_SECRET!;
let demoWorkspaceId = 0;
const created: number[] = [];

beforeAll(async () => {
  const { UserRecord } = await import('../../backend/src/users/user.model');
  demoWorkspaceId = (await UserRecord.findOne({ where: { email: demo.designer } }))!.workspaceId;
});
afterAll(async () => {
  const { UserRecord } = await import('../../backend/src/users/user.model');
  await UserRecord.destroy({ where: { id: created } });
});

/** A member of the demo workspace of its own, so ending its sessions touches no other test. */
async function throwawayMember(password: string) {
  const { UserRecord } = await import('../../backend/src/users/user.model');
  const { hashPassword } = await import('../../backend/src/auth/passwords');
  const email = uniqueEmail('session');
  const user = await UserRecord.create({ workspaceId: demoWorkspaceId, email, name: 'Session Tester', passwordHash: await hashPassword(password), role: 'designer' });
  created.push(user.id);
  return { id: user.id, email, password };
}

const me = (token: string) => request(h.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
const signIn = (email: string, password: string) => request(h.app).post('/api/auth/login').send({ email, password });

describe('logout', () => {
  it('ends the session: the bearer token that logged out, and older tokens of the member, answer 401; signing in again works', async () => {
    const member = await throwawayMember('session-password-1');
    const first = (await signIn(member.email, member.password)).body.token as string;
    const second = (await signIn(member.email, member.password)).body.token as string;
    expect((await me(first)).status).toBe(200);
    expect((await me(second)).status).toBe(200);

    const out = await request(h.app).post('/api/auth/logout').set('Authorization', `Bearer ${first}`);
    expect(out.status).toBe(204);
    for (const token of [first, second]) {
      const after = await me(token);
      expect(after.status).toBe(401);
      expect(after.body.error.code).toBe('unauthenticated');
    }
    // Logging out again with the ended token is just "no session".
    expect((await request(h.app).post('/api/auth/logout').set('Authorization', `Bearer ${first}`)).status).toBe(401);

    const again = await signIn(member.email, member.password);
    expect(again.status).toBe(200);
    expect((await me(again.body.token)).status).toBe(200);
  });

  it('a cookie session that logged out cannot be replayed from a copied cookie either', async () => {
    const member = await throwawayMember('session-password-2');
    const agent = request.agent(h.app);
    const login = await agent.post('/api/auth/login').send({ email: member.email, password: member.password });
    const cookie = String(login.headers['set-cookie']).split(';')[0]!;
    const out = await agent.post('/api/auth/logout').set('Origin', 'http://127.0.0.1').set('Host', '127.0.0.1');
    expect(out.status).toBe(204);
    expect((await request(h.app).get('/api/auth/me').set('Cookie', cookie)).status).toBe(401);
  });
});

describe('token claims', () => {
  async function claims() {
    const { UserRecord } = await import('../../backend/src/users/user.model');
    const user = (await UserRecord.findOne({ where: { email: demo.designer } }))!;
    return { ws: user.workspaceId, tv: user.tokenVersion, sub: String(user.id) };
  }
  const sign = (payload: object, options: jwt.SignOptions = { expiresIn: 600 }) => jwt.sign(payload, secret(), { algorithm: 'HS256', issuer: 'packwright', ...options });

  it('a correctly signed token is accepted (the control for the cases below)', async () => {
    expect((await me(sign(await claims()))).status).toBe(200);
  });

  it('a correctly signed token whose user id is not a number answers 401, not 500', async () => {
    const base = await claims();
    for (const sub of ['abc', '1e3', '-1', '0', '1.5', '99999999999', ' 1', `${base.sub}abc`, '']) {
      const res = await me(sign({ ...base, sub }));
      expect(res.status, `sub ${JSON.stringify(sub)}`).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
    for (const patch of [{ ws: 'x' }, { tv: '0' }, { ws: 1e20 }]) {
      expect((await me(sign({ ...base, ...patch }))).status, JSON.stringify(patch)).toBe(401);
    }
  });

  it('a correctly signed token without an expiry claim is refused', async () => {
    const noExpiry = sign(await claims(), {});
    expect((jwt.decode(noExpiry) as { exp?: number }).exp).toBeUndefined();
    expect((await me(noExpiry)).status).toBe(401);
  });
});

describe('passwords longer than bcrypt reads (72 bytes)', () => {
  const at72 = 'p'.repeat(72);

  it('a password of exactly 72 bytes signs in; the same with another ending is refused with a 400 naming the rule, not signed in', async () => {
    const member = await throwawayMember(at72);
    expect((await signIn(member.email, at72)).status).toBe(200);
    const longer = await signIn(member.email, `${at72}-and-a-different-ending`);
    expect(longer.status).toBe(400);
    expect(longer.body.error.fields).toEqual([{ field: 'password', message: expect.stringMatching(/at most 72 bytes/) }]);
    expect(longer.body.token).toBeUndefined();
  });

  it('bytes, not characters, are counted: 36 × "é" (72 bytes) is a password, 37 (74 bytes) is refused', async () => {
    const member = await throwawayMember('é'.repeat(36));
    expect((await signIn(member.email, 'é'.repeat(36))).status).toBe(200);
    const tooLong = await signIn(member.email, 'é'.repeat(37));
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fields).toEqual([{ field: 'password', message: expect.stringMatching(/at most 72 bytes/) }]);
    // As a new password: 36 passes validation (the unknown link token is what is refused), 37 does not.
    const fake = 'x'.repeat(40);
    const ok = await request(h.app).post('/api/auth/password-reset/confirm').send({ token: fake, password: 'é'.repeat(36) });
    expect(ok.body.error.fields ?? []).not.toContainEqual(expect.objectContaining({ field: 'password' }));
    const refused = await request(h.app).post('/api/auth/password-reset/confirm').send({ token: fake, password: 'é'.repeat(37) });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual([{ field: 'password', message: expect.stringMatching(/at most 72 bytes/) }]);
  });

  it('every route that sets a password refuses one over 72 bytes with the field named', async () => {
    const long = `${'q'.repeat(70)}ünf`;
    const reset = await request(h.app).post('/api/auth/password-reset/confirm').send({ token: 'x'.repeat(40), password: long });
    const accept = await request(h.app).post('/api/invitations/accept').send({ token: 'x'.repeat(40), name: 'New Member', password: long });
    for (const res of [reset, accept]) {
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toContainEqual({ field: 'password', message: expect.stringMatching(/at most 72 bytes/) });
    }
  });

  it('the password service itself refuses to hash what bcrypt would cut, and never matches it', async () => {
    const { hashPassword, verifyPassword } = await import('../../backend/src/auth/passwords');
    await expect(hashPassword(`${at72}x`)).rejects.toMatchObject({ status: 400 });
    const hash = await hashPassword(at72);
    expect(await verifyPassword(at72, hash)).toBe(true);
    expect(await verifyPassword(`${at72}x`, hash)).toBe(false);
  });
});
