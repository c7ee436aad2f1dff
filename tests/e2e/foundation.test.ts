import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('foundation in the browser', () => {
  it('an admin invites someone, follows the link from the mail page, and the new member signs in to their home', async () => {
    const email = `e2e-${Date.now().toString(36)}@example.test`;
    const { context, page } = await b.newPage();
    await b.signIn(page, 'admin@demo.test');
    await b.screenshot(page, 'foundation-01-admin-home');

    await page.goto('/admin/users');
    await page.getByRole('heading', { name: /people|users|members/i }).first().waitFor();
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Name', { exact: true }).fill('Eve Example');
    await page.getByLabel('Role', { exact: true }).selectOption('chemist');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(email).first().waitFor();
    await b.screenshot(page, 'foundation-02-users-invited');

    await page.goto('/admin/mail');
    await page.getByRole('button', { name: /invited/i }).first().click();
    await page.getByRole('button', { name: 'Plain text' }).click();
    await b.screenshot(page, 'foundation-03-mail-sink');
    const link = page.getByRole('link', { name: /accept-invitation/ }).first();
    const href = await link.getAttribute('href');
    expect(href).toContain('/accept-invitation?token=');

    // The invitee opens the link in their own browser.
    const invitee = await b.newPage();
    await invitee.page.goto(href!);
    await invitee.page.getByLabel('Your name').fill('Eve Example');
    await invitee.page.getByLabel('Choose a password').fill('eve-password-123');
    await invitee.page.getByLabel('Repeat the password').fill('eve-password-123');
    await b.screenshot(invitee.page, 'foundation-04-accept-invitation');
    await invitee.page.getByRole('button', { name: 'Join the workspace' }).click();
    await invitee.page.waitForURL((url) => url.pathname === '/');
    await invitee.page.getByText('Eve Example').first().waitFor();
    await b.screenshot(invitee.page, 'foundation-05-new-member-home');

    // And signs in again later with the password they chose.
    await invitee.context.clearCookies();
    await b.signIn(invitee.page, email, 'eve-password-123');
    expect(new URL(invitee.page.url()).pathname).toBe('/');
    await invitee.context.close();
    await context.close();
  });

  it('the address a newcomer types — the root — serves the app, and deep links load too', async () => {
    const { context, page } = await b.newPage();
    const root = await page.goto('/');
    expect(root?.status()).toBe(200);
    await page.getByLabel('E-mail').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await b.signIn(page, 'designer@demo.test');
    const home = await page.goto('/');
    expect(home?.status()).toBe(200);
    await page.getByRole('main').waitFor();
    const deep = await page.goto('/briefs');
    expect(deep?.status()).toBe(200);
    await context.close();
  });

  it('each demo role signs in and sees its own home', async () => {
    for (const role of ['designer', 'chemist', 'reviewer'] as const) {
      const { context, page } = await b.newPage();
      await b.signIn(page, `${role}@demo.test`);
      await page.getByRole('main').waitFor();
      await b.screenshot(page, `foundation-home-${role}`);
      // Administration is not offered to other roles, and the page says so if opened directly.
      await page.goto('/admin/users');
      await page.getByText(/not (available )?for your role|administrator/i).first().waitFor();
      await context.close();
    }
  });
});
