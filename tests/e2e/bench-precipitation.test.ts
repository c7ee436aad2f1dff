import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('mixture bench: precipitation, hazards and formula processes in the browser', () => {
  it('a designer mixes sodium carbonate decahydrate and calcium chloride hexahydrate and is told calcium carbonate precipitates, with the hazard notes from the server', async () => {
    const { context, page } = await b.newPage();
    await b.signIn(page, 'designer@demo.test');
    await page.goto('/bench');
    await page.getByRole('heading', { name: 'Mixture bench' }).waitFor();
    await page.getByLabel('Component 1: from').selectOption('formula');
    await page.getByLabel('Component 1: formula').fill('Na2CO3·10H2O');
    await page.getByLabel('Component 1: mass (g)').fill('50');
    await page.getByLabel('Component 2: from').selectOption('formula');
    await page.getByLabel('Component 2: formula').fill('CaCl2·6H2O');
    await page.getByLabel('Component 2: mass (g)').fill('50');
    await page.getByRole('button', { name: 'Add a component' }).click();
    await page.getByLabel('Component 3: from').selectOption('formula');
    await page.getByLabel('Component 3: formula').fill('H2O');
    await page.getByLabel('Component 3: mass (g)').fill('100');

    // Computed in the browser: the precipitation warning (Ksp from ΔfG°, chemistry/precipitation.ts).
    await page.getByText('A solid precipitates').first().waitFor();
    await expect(page.getByText(/calcium carbonate \(calcite\) \(CaCO3\) precipitates/i).first().textContent()).resolves.toBeTruthy();

    await page.getByRole('button', { name: 'Check on the server' }).click();
    await page.getByRole('region', { name: 'Hazards and checks from the server' }).waitFor();
    await page.getByText('Label elements').waitFor();
    await page.getByText(/Na2CO3·10H2O: classified as Sodium carbonate decahydrate/).waitFor();
    await b.screenshot(page, 'bench-04-precipitation-hazards');

    // A formula that a chemist could mean two ways offers the choice.
    await page.getByLabel('Component 1: formula').fill('NaCH3COO·3H2O');
    await page.getByLabel('Component 1: process').selectOption({ label: 'a supercooled melt that crystallises on a trigger (58 °C plateau)' });
    await page.getByText('End temperature', { exact: true }).waitFor();
    await b.screenshot(page, 'bench-05-formula-process');
    await context.close();
  });
});
