import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

/**
 * Names the workspace a message is about. The local sink files mail by recipient; this header
 * only picks among the recipient's own workspaces when the address has several.
 */
export const WORKSPACE_HEADER = 'X-Packwright-Workspace';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  /** The workspace the message is about (see WORKSPACE_HEADER). */
  workspaceId?: number;
}

let transporter: Transporter | null = null;
let sink: { port: number; auth: { user: string; pass: string } } | null = null;

/** Points the transport at the local mail sink once it is listening, with its generated credentials (development and tests). */
export function useMailSink(port: number, auth: { user: string; pass: string }): void {
  sink = { port, auth };
  transporter?.close();
  transporter = null;
}

function getTransporter(): Transporter {
  if (transporter) return transporter;
  if (config.mail.smtp) {
    const { host, port, user, pass } = config.mail.smtp;
    transporter = nodemailer.createTransport({ host, port, secure: port === 465, auth: user ? { user, pass } : undefined });
  } else if (sink !== null) {
    transporter = nodemailer.createTransport({ host: '127.0.0.1', port: sink.port, secure: false, ignoreTLS: true, auth: { ...sink.auth } });
  } else {
    throw new Error('No mail transport: set SMTP_HOST, or start the local mail sink (development and tests).');
  }
  return transporter;
}

/** Sends one message through nodemailer: real SMTP in production, the local sink otherwise. */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  await getTransporter().sendMail({
    from: config.mail.from,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    headers: mail.workspaceId ? { [WORKSPACE_HEADER]: String(mail.workspaceId) } : undefined,
  });
}

export function closeMailer(): void {
  transporter?.close();
  transporter = null;
}
