// Browser-test set-up: the real server (API + built front end) on a free loopback port, and
// Debian's Chromium driven by playwright-core. Screenshots go to .test-artifacts/ (git-ignored).
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export interface BrowserHarness {
  baseUrl: string;
  browser: Browser;
  /** A fresh, signed-out browser context and page. */
  newPage(): Promise<{ context: BrowserContext; page: Page }>;
  /** Signs in through the sign-in page and waits for the home page. */
  signIn(page: Page, email: string, password?: string): Promise<void>;
  screenshot(page: Page, name: string): Promise<string>;
}

const artifactsDir = process.env.TEST_ARTIFACTS_DIR ?? path.resolve('.test-artifacts');

export function useBrowser(): BrowserHarness {
  const state: { baseUrl?: string; browser?: Browser; stop?: () => Promise<void> } = {};
  beforeAll(async () => {
    mkdirSync(artifactsDir, { recursive: true });
    const { startServer } = await import('../../../backend/src/server');
    const running = await startServer({ port: 0, migrate: true, seed: true });
    state.baseUrl = running.url;
    state.stop = running.stop;
    state.browser = await chromium.launch({
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      // playwright-core gives every launch a fresh, empty profile of its own.
    });
  });
  afterAll(async () => {
    await state.browser?.close();
    await state.stop?.();
  });
  return {
    get baseUrl() {
      return state.baseUrl!;
    },
    get browser() {
      return state.browser!;
    },
    async newPage() {
      const context = await state.browser!.newContext({ baseURL: state.baseUrl, viewport: { width: 1360, height: 900 } });
      const page = await context.newPage();
      return { context, page };
    },
    async signIn(page, email, password = 'packwright-demo') {
      await page.goto('/sign-in');
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(password);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    },
    async screenshot(page, name) {
      const file = path.join(artifactsDir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
  };
}
