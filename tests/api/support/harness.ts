// Shared set-up for API tests: the real Express app against the real PostgreSQL that
// scripts/test.ts started, migrated and seeded. Each test file gets its own app, mail sink and mail worker.
import { afterAll, beforeAll } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';

export const DEMO_PASSWORD = 'packwright-demo';
export const demo = {
  admin: 'admin@demo.test',
  designer: 'designer@demo.test',
  chemist: 'chemist@demo.test',
  reviewer: 'reviewer@demo.test',
} as const;
export const harbour = {
  admin: 'admin@harbour.test',
  designer: 'designer@harbour.test',
  chemist: 'chemist@harbour.test',
} as const;

export interface Harness {
  app: Express;
  mailSinkPort: number;
  /** The credentials the sink takes mail with (only the app holds them). */
  mailSinkAuth: { user: string; pass: string };
  /** Signs in through the API and returns the bearer token. */
  token(email: string, password?: string): Promise<string>;
  /** Messages the sink stored for an address, newest first. */
  mailFor(email: string): Promise<{ subject: string; text: string; html: string | null }[]>;
}

/**
 * Call once at the top of a test file. Tokens are cached per file, so a role matrix does not
 * hit the login rate limit.
 */
export function useHarness(): Harness {
  const state: Partial<Harness> & { tokens: Map<string, string>; closeSink?: () => Promise<void> } = { tokens: new Map() };
  beforeAll(async () => {
    const { createApp } = await import('../../../backend/src/app');
    const { startMailSink } = await import('../../../backend/src/mail/mail-sink');
    const { useMailSink } = await import('../../../backend/src/mail/mailer');
    const sink = await startMailSink(0);
    useMailSink(sink.port, sink.auth);
    state.closeSink = sink.close;
    state.mailSinkPort = sink.port;
    state.mailSinkAuth = sink.auth;
    state.app = createApp({ staticDir: null });
    // Background mail (password-reset links) goes out through the pg-boss mail queue.
    const { startMailWorker } = await import('../../../backend/src/mail/mail-queue');
    await startMailWorker();
  });
  afterAll(async () => {
    const { stopRunQueue } = await import('../../../backend/src/runs/run-queue');
    await stopRunQueue();
    await state.closeSink?.();
    const { sequelize } = await import('../../../backend/src/db/sequelize');
    await sequelize.close();
  });
  return {
    get app() {
      return state.app!;
    },
    get mailSinkAuth() {
      return state.mailSinkAuth!;
    },
    get mailSinkPort() {
      return state.mailSinkPort!;
    },
    async token(email: string, password = DEMO_PASSWORD) {
      const key = `${email}|${password}`;
      const cached = state.tokens.get(key);
      if (cached) return cached;
      const res = await request(state.app!).post('/api/auth/login').send({ email, password });
      if (res.status !== 200) throw new Error(`login as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      state.tokens.set(key, res.body.token);
      return res.body.token as string;
    },
    async mailFor(email: string) {
      const { MailMessageRecord } = await import('../../../backend/src/mail/mail-message.model');
      const { Op } = await import('sequelize');
      const rows = await MailMessageRecord.findAll({ where: { toAddresses: { [Op.contains]: [email] } }, order: [['id', 'DESC']] });
      return rows.map((r) => ({ subject: r.subject, text: r.text, html: r.html }));
    },
  };
}

/** A unique address for records a test creates, so parallel files never collide. */
export function uniqueEmail(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@example.test`;
}

/** Polls until the sink has stored a message for the address (SMTP delivery is asynchronous). */
export async function waitForMail(h: Harness, email: string, timeoutMs = 5000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const messages = await h.mailFor(email);
    if (messages.length > 0) return messages[0]!;
    if (Date.now() > deadline) throw new Error(`no mail for ${email} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function linkFrom(text: string, path: string): string {
  const match = text.match(new RegExp(`https?://[^\\s"<>]+${path}\\?token=[A-Za-z0-9_%-]+`));
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return match[0];
}

export function tokenFromLink(link: string): string {
  return decodeURIComponent(new URL(link).searchParams.get('token') ?? '');
}

/**
 * Creates a brief as `token`'s user, runs the optimiser on it and waits until the run leaves
 * queued/running; answers the brief, the run id and the run as GET /api/runs/:id gives it (the caller asserts on it).
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- API bodies, as the callers' supertest reads give them
export async function runBriefToEnd(h: Harness, token: string, briefBody: object, timeoutMs = 80_000): Promise<{ brief: any; runId: number; run: any }> {
  const auth = { Authorization: `Bearer ${token}` };
  const { default: request } = await import('supertest');
  const brief = (await request(h.app).post('/api/briefs').set(auth).send(briefBody)).body.brief;
  const runId = (await request(h.app).post(`/api/briefs/${brief.id}/runs`).set(auth)).body.runId as number;
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const run = (await request(h.app).get(`/api/runs/${runId}`).set(auth)).body;
    if (!['queued', 'running'].includes(run.status)) return { brief, runId, run };
    if (Date.now() > deadline) throw new Error('run did not finish');
    await new Promise((r) => setTimeout(r, 150));
  }
}
