import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

const HEADER = 'name,grade,role,speciesKey,process,costPerKg,currency,densityGPerMl,cpJPerGK,sources,notes';

/** One CSV line; the process JSON is quoted with its quotes doubled, as CSV requires. */
function line(cells: { name: string; cost: string; process?: string }): string {
  const process = cells.process ? `"${cells.process.replace(/"/g, '""')}"` : '';
  return [cells.name, 'E2E grade', 'active', 'KCl(cr)', process, cells.cost, 'EUR', '1.98', '', 'CRC Handbook (from memory)', ''].join(',');
}

describe('ingredient library and mixture bench in the browser', () => {
  it('a chemist checks a CSV with one bad row, reads the row-by-row report, fixes the row and imports all or nothing', async () => {
    const tag = Date.now().toString(36);
    const good = `E2E potassium chloride ${tag}`;
    const fixedName = `E2E second salt ${tag}`;
    const dissolving = '{"kind":"dissolution","solidKey":"KCl(cr)","ionsPerFormulaUnit":2}';
    const badCsv = [HEADER, line({ name: good, cost: '0.95', process: dissolving }), line({ name: fixedName, cost: 'cheap', process: dissolving })].join('\r\n');
    const fixedCsv = [HEADER, line({ name: good, cost: '0.95', process: dissolving }), line({ name: fixedName, cost: '1.10', process: dissolving })].join('\r\n');

    const { context, page } = await b.newPage();
    await b.signIn(page, 'chemist@demo.test');
    await page.goto('/library');
    await page.getByRole('heading', { name: 'Ingredient library' }).waitFor();
    await page.getByRole('table').waitFor();
    await b.screenshot(page, 'library-01-table');

    await page.getByRole('link', { name: 'Import CSV' }).click();
    await page.getByLabel('Ingredient CSV file').setInputFiles({ name: 'ingredients.csv', mimeType: 'text/csv', buffer: Buffer.from(badCsv) });
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByText(/Nothing was imported/).waitFor();
    // The report names the spreadsheet row (header = row 1, so the second ingredient is row 3), the field and the rule.
    const report = page.getByRole('table', { name: /Problems found/ });
    const badRow = report.getByRole('row').filter({ hasText: 'costPerKg' });
    await expect(badRow.getByRole('rowheader').textContent()).resolves.toBe('3');
    await expect(badRow.textContent()).resolves.toMatch(/decimal number/);
    // Nothing is importable until the file passes.
    expect(await page.getByRole('button', { name: 'Import', exact: true }).isDisabled()).toBe(true);
    await b.screenshot(page, 'library-02-import-report');

    await page.getByLabel('Ingredient CSV file').setInputFiles({ name: 'ingredients-fixed.csv', mimeType: 'text/csv', buffer: Buffer.from(fixedCsv) });
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByText(/ingredients-fixed\.csv: every row is valid/).waitFor();
    await b.screenshot(page, 'library-03-import-checked');
    await expect(page.getByText(/2 rows checked: 2 new ingredients/).count()).resolves.toBe(1);
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByText(/2 ingredients added/).waitFor();
    await b.screenshot(page, 'library-04-imported');

    await page.goto(`/library?q=${encodeURIComponent(tag)}`);
    await page.getByRole('link', { name: fixedName }).waitFor();
    await expect(page.getByRole('link', { name: good }).count()).resolves.toBe(1);
    await page.getByRole('link', { name: fixedName }).click();
    await page.getByRole('heading', { name: fixedName }).waitFor();
    await expect(page.getByLabel('Cost per kg').inputValue()).resolves.toBe('1.10');
    await page.getByText(/^Added · version 0/).first().waitFor();
    await b.screenshot(page, 'library-05-ingredient-page');
    await context.close();
  });

  it('a designer enters 40 g ammonium nitrate and 100 g water on the mixture bench and sees the curve, the same as the server computes', async () => {
    const { context, page } = await b.newPage();
    await b.signIn(page, 'designer@demo.test');
    await page.goto('/bench');
    await page.getByRole('heading', { name: 'Mixture bench' }).waitFor();
    await page.getByText('Add components to see the curve').waitFor();
    await b.screenshot(page, 'bench-01-empty');

    const ingredient = page.getByLabel('Component 1: ingredient');
    const nitrate = await ingredient.locator('option', { hasText: /^Ammonium nitrate/ }).first().getAttribute('value');
    expect(nitrate).toBeTruthy();
    await ingredient.selectOption(nitrate!);
    await page.getByLabel('Component 1: mass (g)').fill('40');
    await page.getByLabel('Component 2: from').selectOption('formula');
    await page.getByLabel('Component 2: formula').fill('H2O');
    await page.getByLabel('Component 2: mass (g)').fill('100');
    await page.getByLabel('Target band from (°C)').fill('0');
    await page.getByLabel('Target band to (°C)').fill('12');

    // The curve is drawn in the browser from the shared evaluation, without a round trip.
    const chart = page.getByRole('group', { name: 'Pack temperature over the hold' });
    await chart.waitFor();
    await expect(chart.locator('path[stroke]').count()).resolves.toBeGreaterThan(0);
    await page.getByText('End temperature', { exact: true }).waitFor();
    await page.getByText(/fully dissolved|limited by/).first().waitFor();

    // Keyboard readout, and the table alternative.
    await chart.focus();
    await page.keyboard.press('End');
    await chart.getByText(/Time: /).waitFor();
    await b.screenshot(page, 'bench-02-curve');
    await page.getByRole('button', { name: 'Show as a table' }).click();
    const rows = page.getByRole('table', { name: /Pack temperature/ }).getByRole('row');
    expect(await rows.count()).toBeGreaterThan(5);

    // The server runs the same shared code on the same data: the two end temperatures agree.
    await page.getByRole('button', { name: 'Check on the server' }).click();
    const note = page.getByText(/^End .* \(browser: /);
    await note.waitFor();
    const match = /End (-?[\d.,]+)\s*°C \(browser: (-?[\d.,]+)\s*°C\)/.exec((await note.textContent()) ?? '');
    expect(match).not.toBeNull();
    expect(match![1]).toBe(match![2]);
    await b.screenshot(page, 'bench-03-server-check');
    await context.close();
  });
});
