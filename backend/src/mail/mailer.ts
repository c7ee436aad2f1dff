import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

export const WORKSPACE_HEADER = 'X-Packwright-Workspace';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  /** Tags the message so the local sink can show it to that workspace's admins only. */
  workspaceId?: number;
}

let transporter: Transporter | null = null;
let sinkPort: number | null = null;

/** Points the transport at the local mail sink once it is listening (development and tests). */
export function useMailSink(port: number): void {
  sinkPort = port;
  transporter = null;
}

function getTransporter(): Transporter {
  if (transporter) return transporter;
  if (config.mail.smtp) {
    const { host, port, user, pass } = config.mail.smtp;
    transporter = nodemailer.createTransport({ host, port, secure: port === 465, auth: user ? { user, pass } : undefined });
  } else if (sinkPort !== null) {
    transporter = nodemailer.createTransport({ host: '127.0.0.1', port: sinkPort, secure: false, ignoreTLS: true });
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
