// The local mail sink: only the app that started it may send (SMTP AUTH with generated
// credentials), mail is filed by recipient (the workspace of the recipient's user or invitation,
// whatever a header says), a second instance on a busy port takes a free one, and it refuses to
// run in production.
import { createHash, randomBytes } from 'node:crypto';
import net from 'node:net';
import nodemailer from 'nodemailer';
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import { demo, harbour, uniqueEmail, useHarness, waitForMail } from './support/harness';

const h = useHarness();

async function workspaceId(slug: string): Promise<number> {
  const { Workspace } = await import('../../backend/src/workspaces/workspace.model');
  return (await Workspace.findOne({ where: { slug } }))!.id;
}

async function stored(subject: string) {
  const { MailMessageRecord } = await import('../../backend/src/mail/mail-message.model');
  return MailMessageRecord.findAll({ where: { subject }, order: [['id', 'ASC']] });
}

/** Sends through the app's own transport (which holds the sink's credentials). */
async function appSends(to: string | string[], subject: string, hintWorkspaceId?: number) {
  const { sendMail } = await import('../../backend/src/mail/mailer');
  await sendMail({ to, subject, text: `body of ${subject}`, workspaceId: hintWorkspaceId });
}

async function waitForStored(subject: string, count: number) {
  const deadline = Date.now() + 5000;
  for (;;) {
    const rows = await stored(subject);
    if (rows.length >= count || Date.now() > deadline) return rows;
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('who may send to the mail sink', () => {
  it('refuses mail from a local process without the credentials', async () => {
    const subject = `unauthenticated ${randomBytes(4).toString('hex')}`;
    const stranger = nodemailer.createTransport({ host: '127.0.0.1', port: h.mailSinkPort, secure: false, ignoreTLS: true });
    await expect(stranger.sendMail({ from: 'x@example.test', to: demo.admin, subject, text: 'hello' })).rejects.toThrow(/auth/i);
    stranger.close();
    expect(await stored(subject)).toHaveLength(0);
  });

  it('refuses mail with made-up credentials', async () => {
    const subject = `wrong password ${randomBytes(4).toString('hex')}`;
    const guesser = nodemailer.createTransport({ host: '127.0.0.1', port: h.mailSinkPort, secure: false, ignoreTLS: true, auth: { user: 'packwright', pass: 'guess' } });
    await expect(guesser.sendMail({ from: 'x@example.test', to: demo.admin, subject, text: 'hello' })).rejects.toThrow(/invalid|auth/i);
    guesser.close();
    expect(await stored(subject)).toHaveLength(0);
  });

  it('takes mail from the app, whose transport holds the generated credentials', async () => {
    const subject = `from the app ${randomBytes(4).toString('hex')}`;
    await appSends(demo.designer, subject);
    const rows = await waitForStored(subject, 1);
    expect(rows).toHaveLength(1);
    expect(rows[0]!.workspaceId).toBe(await workspaceId('demo'));
  });
});

describe('where the sink files mail', () => {
  it("an address with an account is filed under its user's workspace, even while another workspace has a pending invitation to it", async () => {
    const invite = await request(h.app).post('/api/invitations').set('Authorization', `Bearer ${await h.token(harbour.admin)}`).send({ email: demo.designer, name: 'Invited elsewhere', role: 'designer' });
    expect(invite.status).toBe(201);
    const subject = `account and invitation ${randomBytes(4).toString('hex')}`;
    await appSends(demo.designer, subject);
    const rows = await waitForStored(subject, 1);
    await new Promise((r) => setTimeout(r, 300)); // a second copy, were one filed, would be stored by now
    expect((await stored(subject)).map((r) => r.workspaceId)).toEqual([await workspaceId('demo')]);
    expect(rows).toHaveLength(1);
  });

  it("by the recipient's workspace, not by a header naming another one", async () => {
    const subject = `header says harbour ${randomBytes(4).toString('hex')}`;
    await appSends(demo.designer, subject, await workspaceId('harbour'));
    const rows = await waitForStored(subject, 1);
    expect(rows.map((r) => r.workspaceId)).toEqual([await workspaceId('demo')]);
    // And the harbour admin's mail page does not show it; the demo admin's does.
    const harbourInbox = await request(h.app).get('/api/mail-messages').set('Authorization', `Bearer ${await h.token(harbour.admin)}`);
    expect(harbourInbox.status).toBe(200);
    expect(harbourInbox.body.items.map((m: { subject: string }) => m.subject)).not.toContain(subject);
    const demoInbox = await request(h.app).get('/api/mail-messages').set('Authorization', `Bearer ${await h.token(demo.admin)}`);
    expect(demoInbox.body.items.map((m: { subject: string }) => m.subject)).toContain(subject);
  });

  it("by the workspace of a pending invitation to the address", async () => {
    const { InvitationRecord } = await import('../../backend/src/invitations/invitation.model');
    const { UserRecord } = await import('../../backend/src/users/user.model');
    const harbourId = await workspaceId('harbour');
    const inviter = await UserRecord.findOne({ where: { email: harbour.admin } });
    const invitee = uniqueEmail('invitee');
    await InvitationRecord.create({
      workspaceId: harbourId,
      email: invitee,
      name: 'Invited Person',
      role: 'designer',
      tokenHash: createHash('sha256').update(randomBytes(16)).digest('hex'),
      invitedById: inviter!.id,
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    const subject = `invitation ${randomBytes(4).toString('hex')}`;
    // Upper case in the address: addresses are compared without case.
    await appSends(invitee.toUpperCase(), subject);
    const rows = await waitForStored(subject, 1);
    expect(rows.map((r) => r.workspaceId)).toEqual([harbourId]);
    expect((await waitForMail(h, invitee)).subject).toBe(subject);
  });

  it('one copy per workspace for recipients of several, each with only its own recipients', async () => {
    const subject = `two workspaces ${randomBytes(4).toString('hex')}`;
    await appSends([demo.chemist, harbour.chemist], subject);
    const rows = await waitForStored(subject, 2);
    const byWorkspace = new Map(rows.map((r) => [r.workspaceId, r.toAddresses]));
    expect(byWorkspace.get(await workspaceId('demo'))).toEqual([demo.chemist]);
    expect(byWorkspace.get(await workspaceId('harbour'))).toEqual([harbour.chemist]);
    expect(rows).toHaveLength(2);
  });

  it('under no workspace when nobody has the address and the app names none', async () => {
    const subject = `nobody ${randomBytes(4).toString('hex')}`;
    await appSends(uniqueEmail('stranger'), subject);
    const rows = await waitForStored(subject, 1);
    expect(rows.map((r) => r.workspaceId)).toEqual([null]);
  });

  it("an invitation sent through the API reaches the inviting admin's mail page (it is mailed before its row is committed)", async () => {
    const email = uniqueEmail('api-invitee');
    const created = await request(h.app).post('/api/invitations').set('Authorization', `Bearer ${await h.token(harbour.admin)}`).send({ email, name: 'Api Invitee', role: 'chemist' });
    expect(created.status).toBe(201);
    const mail = await waitForMail(h, email);
    const inbox = await request(h.app).get('/api/mail-messages').set('Authorization', `Bearer ${await h.token(harbour.admin)}`);
    expect(inbox.body.items.map((m: { subject: string }) => m.subject)).toContain(mail.subject);
    const other = await request(h.app).get('/api/mail-messages').set('Authorization', `Bearer ${await h.token(demo.admin)}`);
    expect(other.body.items.some((m: { to: string[] }) => m.to.includes(email))).toBe(false);
  });
});

describe('starting the sink', () => {
  it('takes a free port when the one asked for is busy and may give way, and says which', async () => {
    const { startMailSink } = await import('../../backend/src/mail/mail-sink');
    const blocker = net.createServer();
    await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', () => resolve()));
    const busy = (blocker.address() as net.AddressInfo).port;
    try {
      await expect(startMailSink(busy)).rejects.toMatchObject({ code: 'EADDRINUSE' });
      const said = vi.spyOn(console, 'log');
      const sink = await startMailSink(busy, { fallbackWhenBusy: true });
      expect(sink.port).not.toBe(busy);
      expect(sink.port).toBeGreaterThan(0);
      expect(said).toHaveBeenCalledWith(`[mail] port ${busy} is in use (another instance?); the mail sink listens on 127.0.0.1:${sink.port} instead`);
      said.mockRestore();
      // It works: it greets on its port.
      const greeting = await new Promise<string>((resolve, reject) => {
        const socket = net.connect(sink.port, '127.0.0.1');
        socket.once('data', (d) => {
          resolve(String(d));
          socket.destroy();
        });
        socket.once('error', reject);
      });
      expect(greeting).toMatch(/^220 /);
      await sink.close();
    } finally {
      blocker.close();
    }
  });

  it('generates new credentials for every sink', async () => {
    const { startMailSink } = await import('../../backend/src/mail/mail-sink');
    const [a, b] = await Promise.all([startMailSink(0), startMailSink(0)]);
    expect(a.auth.pass).not.toBe(b.auth.pass);
    expect(a.auth.pass.length).toBeGreaterThanOrEqual(32);
    await Promise.all([a.close(), b.close()]);
  });

  it('refuses to run in production', async () => {
    const { startMailSink } = await import('../../backend/src/mail/mail-sink');
    await expect(startMailSink(0, { env: 'production' })).rejects.toThrow(/does not run in production: set SMTP_HOST/);
  });
});
