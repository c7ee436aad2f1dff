// Invitations: an address with an account in another workspace is not revealed to the inviting
// workspace (DEVELOPERS.md, "Invitations"); a member of one's own workspace answers 409; a
// second invitation to the same address is reported as resent and voids the earlier link.
import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, harbour, linkFrom, tokenFromLink, uniqueEmail, useHarness, waitForMail } from './support/harness';

const h = useHarness();
const bearer = (t: string) => ({ Authorization: `Bearer ${t}` });

/** The parts of an answer that do not depend on which address was invited. */
function shape(body: { invitation: Record<string, unknown>; resent: boolean }) {
  const { id: _id, email: _email, name: _name, createdAt: _c, expiresAt: _e, ...rest } = body.invitation;
  return { keys: Object.keys(body.invitation).sort(), ...rest, resent: body.resent };
}

describe('inviting an address that belongs to another workspace', () => {
  it('answers exactly as for a new address, and the invitation looks like any other', async () => {
    const admin = await h.token(harbour.admin);
    const fresh = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email: uniqueEmail('fresh'), name: 'Fresh Person', role: 'chemist' });
    const taken = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email: demo.chemist, name: 'Someone', role: 'chemist' });
    expect(fresh.status).toBe(201);
    expect(taken.status).toBe(201);
    expect(Object.keys(taken.body).sort()).toEqual(Object.keys(fresh.body).sort());
    expect(shape(taken.body)).toEqual(shape(fresh.body));
    expect(taken.body.invitation).toMatchObject({ email: demo.chemist, status: 'pending' });

    const list = await request(h.app).get('/api/invitations').set(bearer(admin));
    const listed = list.body.items.find((i: { id: number }) => i.id === taken.body.invitation.id);
    expect(listed).toMatchObject({ status: 'pending', email: demo.chemist });

    // The workspace's records do not tell either: its audit entry has the same detail as any invitation.
    const { AuditEventRecord } = await import('../../backend/src/audit/audit-event.model');
    const [a, b] = await Promise.all(
      [fresh, taken].map((r) => AuditEventRecord.findOne({ where: { action: 'invitation.create', entityId: String(r.body.invitation.id) } })),
    );
    expect(Object.keys(b!.detail).sort()).toEqual(Object.keys(a!.detail).sort());
  });

  it('only the address’s owner learns it cannot join: the message carries no link, and the inviting workspace’s mail view does not show it', async () => {
    const admin = await h.token(harbour.admin);
    const before = (await h.mailFor(demo.designer)).length;
    const res = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email: demo.designer, name: 'Dana', role: 'designer' });
    expect(res.status).toBe(201);
    const deadline = Date.now() + 5000;
    while ((await h.mailFor(demo.designer)).length === before && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    const mail = (await h.mailFor(demo.designer))[0]!;
    expect(mail.subject).toMatch(/invited/i);
    expect(mail.text).toMatch(/already has a Packwright account in another workspace/);
    expect(mail.text).not.toMatch(/accept-invitation\?token=/);

    const harbourMail = await request(h.app).get('/api/mail-messages').set(bearer(admin));
    expect(harbourMail.body.items.some((m: { to: string[] }) => m.to.includes(demo.designer))).toBe(false);
  });
});

describe('inviting a member of one’s own workspace', () => {
  it('answers 409 already_member naming the field', async () => {
    const res = await request(h.app).post('/api/invitations').set(bearer(await h.token(demo.admin))).send({ email: demo.reviewer, name: 'Again', role: 'reviewer' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('already_member');
    expect(res.body.error.message).toContain(demo.reviewer);
    expect(res.body.error.fields).toEqual([{ field: 'email', message: 'is already a member of this workspace' }]);
  });
});

describe('a second invitation to the same address', () => {
  it('is reported as resent; the earlier link stops working and the new one works', async () => {
    const admin = await h.token(demo.admin);
    const email = uniqueEmail('twice-invited');
    const first = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email, name: 'Twice', role: 'designer' });
    expect(first.status).toBe(201);
    expect(first.body.resent).toBe(false);
    const firstLink = tokenFromLink(linkFrom((await waitForMail(h, email)).text, '/accept-invitation'));

    const second = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email, name: 'Twice', role: 'chemist' });
    expect(second.status).toBe(201);
    expect(second.body.resent).toBe(true);
    const deadline = Date.now() + 5000;
    while ((await h.mailFor(email)).length < 2 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    const secondLink = tokenFromLink(linkFrom((await h.mailFor(email))[0]!.text, '/accept-invitation'));
    expect(secondLink).not.toBe(firstLink);

    const list = await request(h.app).get('/api/invitations').set(bearer(admin));
    const statuses = list.body.items.filter((i: { email: string }) => i.email === email).map((i: { id: number; status: string }) => [i.id, i.status]);
    expect(statuses).toEqual([
      [second.body.invitation.id, 'pending'],
      [first.body.invitation.id, 'revoked'],
    ]);
    expect((await request(h.app).get('/api/invitations/lookup').query({ token: firstLink })).status).toBe(400);
    const accepted = await request(h.app).post('/api/invitations/accept').send({ token: secondLink, name: 'Twice', password: 'twice-password-1' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user.role).toBe('chemist');
  });

  it('an expired earlier invitation is not counted as a resend', async () => {
    const admin = await h.token(demo.admin);
    const email = uniqueEmail('expired-then');
    const first = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email, name: 'Late', role: 'designer' });
    const { InvitationRecord } = await import('../../backend/src/invitations/invitation.model');
    await InvitationRecord.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: first.body.invitation.id } });
    const second = await request(h.app).post('/api/invitations').set(bearer(admin)).send({ email, name: 'Late', role: 'designer' });
    expect(second.status).toBe(201);
    expect(second.body.resent).toBe(false);
  });
});
