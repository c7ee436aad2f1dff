import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, linkFrom, tokenFromLink, uniqueEmail, useHarness, waitForMail } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });

describe('roles × routes', () => {
  const adminOnly: [string, string, object?][] = [
    ['get', '/api/users'],
    ['patch', '/api/users/1', { role: 'designer', version: 0 }],
    ['get', '/api/invitations'],
    ['post', '/api/invitations', { email: 'x@example.test', name: 'X', role: 'designer' }],
    ['delete', '/api/invitations/1'],
    ['get', '/api/mail-messages'],
  ];
  for (const role of ['designer', 'chemist', 'reviewer'] as const) {
    for (const [method, path, body] of adminOnly) {
      it(`${role} gets 403 from ${method.toUpperCase()} ${path}`, async () => {
        const token = await h.token(demo[role]);
        const res = await (request(h.app) as unknown as Record<string, (p: string) => request.Test>)[method]!(path).set(bearer(token)).send(body ?? {});
        expect(res.status).toBe(403);
      });
    }
  }
  for (const [method, path] of adminOnly) {
    it(`no session gets 401 from ${method.toUpperCase()} ${path}`, async () => {
      const res = await (request(h.app) as unknown as Record<string, (p: string) => request.Test>)[method]!(path).send({});
      expect(res.status).toBe(401);
    });
  }
  it('every role reads its own home and /me', async () => {
    for (const role of ['designer', 'chemist', 'reviewer', 'admin'] as const) {
      const token = await h.token(demo[role]);
      const home = await request(h.app).get('/api/home').set(bearer(token));
      expect(home.status).toBe(200);
      expect(home.body.role).toBe(role);
    }
  });
  it("the designer's token gets 403 from GET /api/users and the admin's 200", async () => {
    expect((await request(h.app).get('/api/users').set(bearer(await h.token(demo.designer)))).status).toBe(403);
    const ok = await request(h.app).get('/api/users').set(bearer(await h.token(demo.admin)));
    expect(ok.status).toBe(200);
    expect(ok.body.items.map((u: { email: string }) => u.email)).toContain(demo.designer);
  });
});

describe('workspace isolation', () => {
  it("an admin sees only their own workspace's members", async () => {
    const res = await request(h.app).get('/api/users').set(bearer(await h.token(harbour.admin)));
    const emails = res.body.items.map((u: { email: string }) => u.email);
    expect(emails).toContain(harbour.designer);
    expect(emails).not.toContain(demo.designer);
  });
  it("changing another workspace's member answers 404", async () => {
    const demoUsers = await request(h.app).get('/api/users').set(bearer(await h.token(demo.admin)));
    const target = demoUsers.body.items.find((u: { email: string }) => u.email === demo.reviewer);
    const res = await request(h.app).patch(`/api/users/${target.id}`).set(bearer(await h.token(harbour.admin))).send({ role: 'admin', version: target.version });
    expect(res.status).toBe(404);
  });
  it("revoking another workspace's invitation answers 404", async () => {
    const created = await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email: uniqueEmail('iso'), name: 'Iso Person', role: 'chemist' });
    expect(created.status).toBe(201);
    const res = await request(h.app).delete(`/api/invitations/${created.body.invitation.id}`).set(bearer(await h.token(harbour.admin)));
    expect(res.status).toBe(404);
  });
  it("the mail page shows only the workspace's own messages", async () => {
    const email = uniqueEmail('ws-mail');
    await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'Mail Person', role: 'designer' });
    await waitForMail(h, email);
    const demoMail = await request(h.app).get('/api/mail-messages').set(bearer(await h.token(demo.admin)));
    const harbourMail = await request(h.app).get('/api/mail-messages').set(bearer(await h.token(harbour.admin)));
    expect(demoMail.body.items.some((m: { to: string[] }) => m.to.includes(email))).toBe(true);
    expect(harbourMail.body.items.some((m: { to: string[] }) => m.to.includes(email))).toBe(false);
  });
});

describe('invitations', () => {
  it('round trip: invite → real SMTP into the sink → accept with a password → sign in', async () => {
    const email = uniqueEmail('invitee');
    const adminToken = await h.token(demo.admin);
    const invite = await request(h.app).post('/api/invitations').set(bearer(adminToken)).send({ email, name: 'Ivy Invitee', role: 'chemist' });
    expect(invite.status).toBe(201);
    expect(invite.body.invitation.status).toBe('pending');

    const mail = await waitForMail(h, email);
    expect(mail.subject).toMatch(/invited/i);
    const link = linkFrom(mail.text, '/accept-invitation');
    expect(mail.html).toContain('/accept-invitation?token=');
    const token = tokenFromLink(link);

    const lookup = await request(h.app).get('/api/invitations/lookup').query({ token });
    expect(lookup.status).toBe(200);
    expect(lookup.body).toMatchObject({ email, role: 'chemist' });

    const short = await request(h.app).post('/api/invitations/accept').send({ token, name: 'Ivy', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields[0].field).toBe('password');

    const accepted = await request(h.app).post('/api/invitations/accept').send({ token, name: 'Ivy Invitee', password: 'a-long-password-1' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email, role: 'chemist' });

    const again = await request(h.app).post('/api/invitations/accept').send({ token, name: 'Ivy Invitee', password: 'a-long-password-1' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');

    const login = await request(h.app).post('/api/auth/login').send({ email, password: 'a-long-password-1' });
    expect(login.status).toBe(200);
  });

  it('an invitation to an existing member is refused naming the field', async () => {
    const res = await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email: demo.chemist, name: 'Dup', role: 'chemist' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields[0].field).toBe('email');
  });

  it('an expired invitation is refused', async () => {
    const email = uniqueEmail('expired');
    await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'Late', role: 'designer' });
    const token = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));
    const { InvitationRecord } = await import('../../backend/src/invitations/invitation.model');
    await InvitationRecord.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const res = await request(h.app).post('/api/invitations/accept').send({ token, name: 'Late', password: 'a-long-password-1' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('the stored token is a hash, not the link token', async () => {
    const email = uniqueEmail('hashed');
    await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'Hash', role: 'designer' });
    const token = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));
    const { InvitationRecord } = await import('../../backend/src/invitations/invitation.model');
    const row = await InvitationRecord.findOne({ where: { email } });
    expect(row!.tokenHash).not.toContain(token);
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    const hours = (row!.expiresAt.getTime() - row!.createdAt.getTime()) / 3600_000;
    expect(hours).toBeCloseTo(72, 1);
  });
});

describe('administration', () => {
  async function newMember(role: 'designer' | 'chemist' = 'designer') {
    const email = uniqueEmail('member');
    await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'New Member', role });
    const token = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));
    const accepted = await request(h.app).post('/api/invitations/accept').send({ token, name: 'New Member', password: 'member-password-1' });
    return { email, id: accepted.body.user.id as number, token: accepted.body.token as string };
  }

  it('changing a role uses optimistic locking: a stale version answers 409', async () => {
    const member = await newMember();
    const adminToken = await h.token(demo.admin);
    const ok = await request(h.app).patch(`/api/users/${member.id}`).set(bearer(adminToken)).send({ role: 'reviewer', version: 0 });
    expect(ok.status).toBe(200);
    expect(ok.body.user).toMatchObject({ role: 'reviewer', version: 1 });
    const stale = await request(h.app).patch(`/api/users/${member.id}`).set(bearer(adminToken)).send({ role: 'chemist', version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
  });

  it('a disabled member can no longer sign in and their existing token stops working', async () => {
    const member = await newMember();
    expect((await request(h.app).get('/api/auth/me').set(bearer(member.token))).status).toBe(200);
    const res = await request(h.app).patch(`/api/users/${member.id}`).set(bearer(await h.token(demo.admin))).send({ disabled: true, version: 0 });
    expect(res.status).toBe(200);
    expect((await request(h.app).get('/api/auth/me').set(bearer(member.token))).status).toBe(401);
    const login = await request(h.app).post('/api/auth/login').send({ email: member.email, password: 'member-password-1' });
    expect(login.status).toBe(401);
  });

  it('an admin cannot disable themselves', async () => {
    const me = await request(h.app).get('/api/auth/me').set(bearer(await h.token(demo.admin)));
    const res = await request(h.app).patch(`/api/users/${me.body.user.id}`).set(bearer(await h.token(demo.admin))).send({ disabled: true, version: 0 });
    expect(res.status).toBe(400);
  });

  it('a change with nothing to change names the field', async () => {
    const res = await request(h.app).patch('/api/users/2').set(bearer(await h.token(demo.admin))).send({ version: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].field).toBe('role');
  });
});

describe('password reset', () => {
  it('answers the same whether the address exists or not', async () => {
    const known = await request(h.app).post('/api/auth/password-reset').send({ email: demo.reviewer });
    const unknown = await request(h.app).post('/api/auth/password-reset').send({ email: uniqueEmail('ghost') });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
  });

  it('round trip: request → mail → confirm → new password works, old session ends, token is spent', async () => {
    const email = uniqueEmail('resetter');
    await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email, name: 'Reset Person', role: 'designer' });
    const inviteToken = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));
    const accepted = await request(h.app).post('/api/invitations/accept').send({ token: inviteToken, name: 'Reset Person', password: 'first-password-1' });
    const oldSession = accepted.body.token as string;

    await request(h.app).post('/api/auth/password-reset').send({ email });
    let resetMail: { subject: string; text: string } | undefined;
    for (let i = 0; i < 50 && !resetMail; i++) {
      resetMail = (await h.mailFor(email)).find((m) => /reset/i.test(m.subject));
      if (!resetMail) await new Promise((r) => setTimeout(r, 100));
    }
    const token = tokenFromLink(linkFrom(resetMail!.text, '/reset-password'));
    const confirm = await request(h.app).post('/api/auth/password-reset/confirm').send({ token, password: 'second-password-2' });
    expect(confirm.status).toBe(200);
    expect((await request(h.app).post('/api/auth/login').send({ email, password: 'second-password-2' })).status).toBe(200);
    expect((await request(h.app).post('/api/auth/login').send({ email, password: 'first-password-1' })).status).toBe(401);
    expect((await request(h.app).get('/api/auth/me').set(bearer(oldSession))).status).toBe(401);
    const reuse = await request(h.app).post('/api/auth/password-reset/confirm').send({ token, password: 'third-password-3' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');
  });
});
