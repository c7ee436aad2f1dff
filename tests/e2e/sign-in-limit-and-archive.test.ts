// The screens changed by the sign-in limit, the resent invitation and brief archiving.
import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('sign-in limit, resent invitation and archiving in the browser', () => {
  it('after too many failed sign-ins the sign-in screen counts down the seconds and holds the button', async () => {
    const { context, page } = await b.newPage();
    const email = `e2e-locked-${Date.now().toString(36)}@example.test`;
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('not-the-password');
    const button = page.getByRole('button', { name: /sign in/i });
    // LOGIN_RATE_LIMIT (10) failures for the address, then the 429.
    for (let i = 0; i < 11; i++) {
      // The button is held while the request runs; each answer replaces the alert.
      await Promise.all([page.waitForResponse((r) => r.url().endsWith('/api/auth/login')), button.click()]);
    }
    const alert = page.getByRole('alert').filter({ hasText: 'Try again in' });
    await alert.waitFor();
    const first = (await alert.textContent()) ?? '';
    expect(first).toMatch(/Too many failed sign-in attempts .* Try again in \d+ seconds \(about 15 minutes\)\./);
    expect(await button.isDisabled()).toBe(true);
    await b.screenshot(page, 'hardening-01-sign-in-limited');
    const seconds = Number(first.match(/Try again in (\d+) seconds/)![1]);
    await page.waitForTimeout(2200);
    const later = Number(((await alert.textContent()) ?? '').match(/Try again in (\d+) seconds/)![1]);
    expect(later).toBeLessThan(seconds);
    await context.close();
  });

  it('inviting the same address twice says the invitation was sent again', async () => {
    const { context, page } = await b.newPage();
    const email = `e2e-twice-${Date.now().toString(36)}@example.test`;
    await b.signIn(page, 'admin@demo.test');
    await page.goto('/admin/users');
    for (let i = 0; i < 2; i++) {
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Name', { exact: true }).fill('Twice Invited');
      await page.getByRole('button', { name: 'Send invitation' }).click();
      await page.getByRole('status').filter({ hasText: i === 0 ? 'Invitation sent to' : 'Invitation sent again to' }).waitFor();
    }
    await page.getByText(/The earlier link no longer works/).waitFor();
    await b.screenshot(page, 'hardening-02-invitation-resent');
    await context.close();
  });

  it('the brief page offers Archive, says what it does, and shows an archived brief as read-only', async () => {
    const { context, page } = await b.newPage();
    await b.signIn(page, 'designer@demo.test');
    const name = `Archive me (e2e ${Date.now().toString(36)})`;
    const created = await page.request.post('/api/briefs', { data: { name, packType: 'cold' }, headers: { Origin: b.baseUrl } });
    expect(created.status()).toBe(201);
    const id = (await created.json()).brief.id as number;

    await page.goto(`/briefs/${id}`);
    await page.getByRole('button', { name: 'Archive this brief' }).click();
    await page.getByText(/It leaves the list of briefs and becomes read-only/).waitFor();
    await b.screenshot(page, 'hardening-03-brief-archive-confirm');
    await page.getByRole('button', { name: 'Yes, archive it' }).click();
    await page.getByRole('status').filter({ hasText: /^Archived/ }).waitFor();
    expect(await page.getByRole('button', { name: 'Run optimiser' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Edit the brief' }).count()).toBe(0);
    await b.screenshot(page, 'hardening-04-brief-archived');

    await page.goto('/briefs');
    await page.getByRole('heading', { name: 'Active briefs' }).waitFor();
    expect(await page.getByText(name).count()).toBe(0);
    await page.getByRole('link', { name: 'Show the archived briefs' }).click();
    await page.getByText(name).first().waitFor();
    await b.screenshot(page, 'hardening-05-archived-list');

    await page.goto(`/briefs/${id}`);
    await page.getByRole('button', { name: 'Unarchive' }).click();
    await page.getByRole('button', { name: 'Run optimiser' }).waitFor();
    await context.close();
  });
});
