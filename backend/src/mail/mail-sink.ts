import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import { MailMessageRecord } from './mail-message.model';
import { WORKSPACE_HEADER } from './mailer';

const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

export interface MailSink {
  port: number;
  close(): Promise<void>;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);
}

/**
 * The local mail sink: a real SMTP server on 127.0.0.1 that stores every message it receives
 * in PostgreSQL, so invitation and reset links can be followed from the admin's mail page.
 */
export function startMailSink(port: number): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const workspaceHeader = parsed.headers.get(WORKSPACE_HEADER.toLowerCase());
          const workspaceId = workspaceHeader ? Number(workspaceHeader) : null;
          await MailMessageRecord.create({
            workspaceId: Number.isFinite(workspaceId) ? workspaceId : null,
            fromAddress: parsed.from?.text ?? '',
            toAddresses: addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const address = server.server.address();
      const actualPort = typeof address === 'object' && address ? address.port : port;
      resolve({ port: actualPort, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}
