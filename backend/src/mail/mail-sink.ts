import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import { Op, col, fn, where } from 'sequelize';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { config } from '../config';
import { InvitationRecord } from '../invitations/invitation.model';
import { UserRecord } from '../users/user.model';
import { MailMessageRecord } from './mail-message.model';
import { WORKSPACE_HEADER } from './mailer';

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/** The sink's SMTP credentials: generated when it starts, known only to the app that started it. */
export interface MailSinkAuth {
  user: string;
  pass: string;
}

export interface MailSink {
  port: number;
  auth: MailSinkAuth;
  close(): Promise<void>;
}

export interface MailSinkOptions {
  /** When the port is taken (another instance on this machine), listen on a free one instead. */
  fallbackWhenBusy?: boolean;
  /** The environment it would run in (config.env); the sink refuses production. */
  env?: string;
}

function sameSecret(given: string, expected: string): boolean {
  // Hashes have equal length, so the comparison takes the same time whatever was given.
  const a = createHash('sha256').update(given).digest();
  const b = createHash('sha256').update(expected).digest();
  return timingSafeEqual(a, b);
}

/**
 * Where a message is filed: the workspaces of each recipient — the workspace of the user with
 * that address, or, for an address with no account yet, of a pending invitation to it. A header never moves mail to a workspace the
 * recipient is not in: the app's workspace header only picks one of the recipient's own
 * workspaces when the address has several, and names the workspace of an address nobody has yet
 * (an invitation is mailed inside the transaction that creates it, so the sink cannot see it).
 * Only the app can send here (SMTP AUTH), so the header is the app's own. Without either, the
 * message is filed under no workspace (no admin sees it).
 */
export async function fileByRecipient(recipients: string[], hintedWorkspaceId: number | null): Promise<Map<number | null, string[]>> {
  const addresses = [...new Set(recipients.map((r) => r.trim().toLowerCase()).filter(Boolean))];
  const byAddress = new Map<string, Set<number>>(addresses.map((a) => [a, new Set<number>()]));
  if (addresses.length) {
    const lowerEmail = (model: string) => where(fn('lower', col(`${model}.email`)), { [Op.in]: addresses });
    const [users, invitations] = await Promise.all([
      UserRecord.findAll({ where: lowerEmail('UserRecord'), attributes: ['email', 'workspaceId'] }),
      InvitationRecord.findAll({ where: { [Op.and]: [lowerEmail('InvitationRecord'), { revokedAt: null }] }, attributes: ['email', 'workspaceId'] }),
    ]);
    // An address with an account is its user's (one person, one workspace: DEVELOPERS.md,
    // "Invitations"); a pending invitation to it from elsewhere never makes it a member there.
    for (const r of users) byAddress.get(r.email.toLowerCase())?.add(r.workspaceId);
    const hasAccount = new Set(users.map((r) => r.email.toLowerCase()));
    for (const r of invitations) if (!hasAccount.has(r.email.toLowerCase())) byAddress.get(r.email.toLowerCase())?.add(r.workspaceId);
  }
  const filed = new Map<number | null, string[]>();
  for (const [address, workspaces] of byAddress) {
    const targets: (number | null)[] =
      workspaces.size === 0 ? [hintedWorkspaceId] : hintedWorkspaceId !== null && workspaces.has(hintedWorkspaceId) ? [hintedWorkspaceId] : [...workspaces];
    for (const t of targets) filed.set(t, [...(filed.get(t) ?? []), address]);
  }
  return filed;
}

/**
 * The local mail sink (development and tests): a real SMTP server on 127.0.0.1 that stores every
 * message it receives in PostgreSQL, so invitation and reset links can be followed from the
 * admin's mail page. It takes mail only after SMTP AUTH with credentials generated here (answered
 * in `auth`, handed to the app's transport), files it by recipient, and never runs in production.
 * Port 0 takes a free port; so does a busy port with `fallbackWhenBusy` (the port in use is
 * answered and printed).
 */
export async function startMailSink(port: number, options: MailSinkOptions = {}): Promise<MailSink> {
  if ((options.env ?? config.env) === 'production') {
    throw new Error('The local mail sink does not run in production: set SMTP_HOST (and SMTP_PORT, SMTP_USER, SMTP_PASS) to a real mail server.');
  }
  const auth: MailSinkAuth = { user: `packwright-${randomBytes(4).toString('hex')}`, pass: randomBytes(24).toString('base64url') };
  try {
    return await listenMailSink(port, auth);
  } catch (error) {
    if (!options.fallbackWhenBusy || port === 0 || (error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    const sink = await listenMailSink(0, auth);
    console.log(`[mail] port ${port} is in use (another instance?); the mail sink listens on 127.0.0.1:${sink.port} instead`);
    return sink;
  }
}

function listenMailSink(port: number, auth: MailSinkAuth): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: false,
    authMethods: ['PLAIN', 'LOGIN'],
    // Loopback only, so no TLS; the credentials keep other local processes out.
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onAuth(attempt, _session, callback) {
      const ok = attempt.username === auth.user && sameSecret(attempt.password ?? '', auth.pass);
      if (!ok) return callback(new Error('Invalid username or password'));
      callback(null, { user: attempt.username });
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const hint = Number(parsed.headers.get(WORKSPACE_HEADER.toLowerCase()));
          const recipients = session.envelope.rcptTo.map((a) => a.address);
          const filed = await fileByRecipient(recipients, Number.isInteger(hint) && hint > 0 ? hint : null);
          await MailMessageRecord.bulkCreate(
            [...filed].map(([workspaceId, toAddresses]) => ({
              workspaceId,
              fromAddress: parsed.from?.text ?? '',
              toAddresses,
              subject: parsed.subject ?? '(no subject)',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : null,
            })),
          );
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject);
      // A client's broken connection must not bring the process down.
      server.on('error', (error: Error) => console.error('[mail] sink:', error.message));
      const address = server.server.address();
      const actualPort = typeof address === 'object' && address ? address.port : port;
      resolve({ port: actualPort, auth, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}
