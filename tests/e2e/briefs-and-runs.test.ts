import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('briefs, runs and the trade-off view in the browser', () => {
  it('a designer writes a brief, runs the optimiser, weighs the candidates, compares two and shortlists one', async () => {
    const name = `sideline cold compress ${Date.now().toString(36)}`;
    const { context, page } = await b.newPage();
    await b.signIn(page, 'designer@demo.test');

    // The designer's home offers Briefs among its quick links.
    await page.getByRole('link', { name: /^Briefs/ }).first().waitFor();
    await page.goto('/briefs');
    await page.getByRole('heading', { name: 'Briefs', exact: true }).waitFor();
    await page.getByRole('link', { name: 'Sideline cold compress', exact: true }).waitFor();
    await b.screenshot(page, 'briefs-01-list');

    // A new brief: at most 5 °C within 3 min, held 15 min, at most 200 g and 0.60 a unit.
    await page.getByRole('link', { name: 'New brief' }).click();
    await page.getByRole('heading', { name: 'New brief' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Target, at most (≤ °C)').fill('5');
    await page.getByLabel('Reach the target within (min)').fill('3');
    await page.getByLabel('Hold in the band for (min)').fill('15');
    await page.getByLabel('Pack mass, at most (g)').fill('200');
    await page.getByLabel(/^Unit cost, at most \(/).fill('0.60');
    // A value the schema refuses is explained beside its field before anything is sent.
    await page.getByLabel('Hold in the band for (min)').fill('0');
    await page.getByRole('button', { name: 'Create the brief' }).click();
    await page.getByText('Hold in the band for (min) must be greater than 0.').waitFor();
    await b.screenshot(page, 'briefs-02-form-field-error');
    await page.getByLabel('Hold in the band for (min)').fill('15');
    await b.screenshot(page, 'briefs-03-form-filled');
    await page.getByRole('button', { name: 'Create the brief' }).click();

    await page.waitForURL(/\/briefs\/\d+$/);
    await page.getByRole('heading', { name, exact: true }).waitFor();
    await page.getByText(/≤ 5\s°C within 3\smin/).first().waitFor();
    await page.getByText('Not run yet').waitFor();
    await b.screenshot(page, 'briefs-04-brief-page');

    // Run it and follow the run: progress while it works, then the ranked candidates.
    await page.getByRole('button', { name: 'Run optimiser' }).click();
    await page.waitForURL(/\/runs\/\d+$/);
    await page.getByRole('progressbar', { name: 'Run steps done' }).or(page.getByRole('heading', { name: 'Candidates that meet the brief' })).first().waitFor();
    await b.screenshot(page, 'briefs-05-run-progress');
    await page.getByRole('heading', { name: 'Candidates that meet the brief' }).waitFor({ timeout: 90_000 });
    await expect.poll(() => page.getByRole('progressbar').count()).toBe(0);
    const rows = page.locator('tr[data-candidate-id]');
    expect(await rows.count()).toBeGreaterThanOrEqual(2);
    await b.screenshot(page, 'briefs-06-run-ranked');
    // Every listed candidate was simulated and carries its hazards; its name opens its page.
    await page.getByRole('columnheader', { name: /Hazards/ }).waitFor();
    const firstLink = rows.first().getByRole('link', { name: /^C-\d+/ });
    const href = await firstLink.getAttribute('href');
    expect(href).toMatch(/^\/candidates\/\d+$/);
    await firstLink.click();
    await page.waitForURL(/\/candidates\/\d+$/);
    await b.screenshot(page, 'briefs-06b-candidate-from-table');
    await page.goBack();
    await page.getByRole('heading', { name: 'Candidates that meet the brief' }).waitFor();

    // The Pareto plot draws one point per candidate.
    const plot = page.getByRole('group', { name: 'Hold margin against unit cost' });
    await plot.waitFor();
    expect(await plot.locator('[data-point-id]').count()).toBe(await rows.count());
    await plot.scrollIntoViewIfNeeded();
    await b.screenshot(page, 'briefs-07-trade-off');
    // A point on the plot opens its candidate too (O with the keyboard; a double-click with the mouse).
    // Points of equal figures can lie on top of each other, so the keyboard picks one unambiguously.
    await plot.locator('[data-point-id][tabindex="0"]').focus();
    await page.keyboard.press('o');
    await page.waitForURL(/\/candidates\/\d+$/);
    await page.goBack();
    await plot.waitFor();

    // One candidate chosen in the table, a second on the plot with the keyboard.
    await page.getByRole('checkbox', { name: /^Select C-\d+/ }).first().check();
    const tabStop = plot.locator('[data-point-id][tabindex="0"]');
    await tabStop.focus();
    if ((await tabStop.getAttribute('aria-checked')) === 'true') await page.keyboard.press('ArrowRight');
    await page.keyboard.press('Enter');
    await expect.poll(() => plot.locator('[aria-checked="true"]').count()).toBe(2);
    await expect.poll(() => page.getByRole('checkbox', { name: /^Select C-\d+/, checked: true }).count()).toBe(2);
    await page.getByText('Temperature of the selected candidates').waitFor();
    await b.screenshot(page, 'briefs-08-two-selected');

    // Compare them side by side, then shortlist one from there.
    await page.getByRole('link', { name: 'Compare 2' }).click();
    await page.waitForURL(/\/compare\?ids=\d+,\d+$/);
    await page.getByRole('heading', { name: 'Side by side' }).waitFor();
    await page.getByText('Temperature of the compared candidates').waitFor();
    await expect.poll(() => page.getByText('Running the thermal model for each candidate…').count(), { timeout: 30_000 }).toBe(0);
    await b.screenshot(page, 'briefs-09-compare');

    await page.getByRole('button', { name: 'Shortlist', exact: true }).first().click();
    await page.getByRole('button', { name: 'Take off the shortlist' }).waitFor();
    await page.getByText('Shortlisted', { exact: true }).first().waitFor();
    await b.screenshot(page, 'briefs-10-shortlisted');

    // The run's table shows the shortlisted candidate too.
    await page.getByRole('link', { name: /^← Run \d+/ }).click();
    await page.getByRole('heading', { name: 'Candidates that meet the brief' }).waitFor();
    await page.locator('tr[data-candidate-id]').getByText('Shortlisted', { exact: true }).first().waitFor();
    await context.close();
  });

  it('a chemist reads briefs and runs but is offered no way to change them', async () => {
    const { context, page } = await b.newPage();
    await b.signIn(page, 'chemist@demo.test');
    await page.goto('/briefs');
    await page.getByRole('link', { name: 'Sideline cold compress', exact: true }).click();
    await page.getByText('Read only').waitFor();
    expect(await page.getByRole('button', { name: 'Run optimiser' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Edit the brief' }).count()).toBe(0);
    await b.screenshot(page, 'briefs-11-chemist-reads');
    await context.close();
  });
});
