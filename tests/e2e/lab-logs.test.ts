import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { defaultChemistryPort, packAreaM2 } from '@shared/thermal';
import { loggerCsv, syntheticSamples } from '@shared/lab-logs/__fixtures__/synthetic-log';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('lab logs in the browser', () => {
  it('a chemist uploads a logger CSV (clock times, °F), maps its columns, sees the overlay and the fit, and applies it', async () => {
    // A bench test made up from the model: 80 g ammonium nitrate in 120 g water in still air, with the
    // pack losing heat 20 % faster and dissolving at 60 % of the modelled rate, 0.1 K logger noise.
    const samples = syntheticSamples(
      defaultChemistryPort(),
      {
        components: [
          { key: 'water', massG: 120, process: { kind: 'inert', role: 'water' } },
          { key: 'an', massG: 80, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)', ionsPerFormulaUnit: 2 } },
        ],
        initialTempC: 24,
        ambientC: 24,
        contact: 'still-air',
        // The area the server estimates when no pack mass or area is given: a flat pouch of the 200 g fill.
        packAreaM2: packAreaM2({ massG: 200 }),
        packHeatCapacityJPerK: 24,
        horizonMin: 40,
      },
      { uaMultiplier: 1.2, enthalpyFactor: 0.97, rateMultiplier: 0.6, heatCapacityFactor: 1 },
      { everySec: 15, noiseK: 0.1, seed: 5 },
    );
    const dir = mkdtempSync(path.join(tmpdir(), 'pw-lab-'));
    const file = path.join(dir, 'bench-an-80g.csv');
    writeFileSync(file, loggerCsv(samples, { ambientC: 24, fahrenheit: true }));
    const tag = Date.now().toString(36);

    const { context, page } = await b.newPage();
    await b.signIn(page, 'chemist@demo.test');
    await page.getByRole('link', { name: 'Lab logs' }).first().click();
    await page.getByRole('heading', { name: 'Lab logs', level: 1 }).waitFor();
    await page.getByLabel('Logger file (.csv, .txt)').setInputFiles(file);
    await page.getByText(/Preview: 161 data rows, delimiter “,”, header on line 4/).waitFor();
    // Detected: the clock column for time, both probes in °F.
    await expect(page.getByLabel('Time is written as').inputValue()).resolves.toBe('clock');
    await expect(page.getByLabel('Temperatures are in').inputValue()).resolves.toBe('F');
    await b.screenshot(page, 'lab-logs-01-preview');

    // Map: only the pack probe, not the ambient one.
    await page.getByLabel('Ambient (°F)').uncheck();
    await page.getByLabel('Name of the log').fill(`Bench AN 80 g ${tag}`);
    await page.getByLabel('Ambient (°C)').fill('24');
    await page.getByLabel('Pack mass (g)').fill('');
    await page.getByLabel('Component 1', { exact: true }).selectOption({ label: 'Water (Deionised)' });
    await page.getByLabel('Component 1 mass (g)').fill('120');
    await page.getByLabel('Component 2', { exact: true }).selectOption({ label: 'Ammonium nitrate (Prilled, technical 34.5 % N)' });
    await page.getByLabel('Component 2 mass (g)').fill('80');
    await b.screenshot(page, 'lab-logs-02-mapping');
    await page.getByRole('button', { name: 'Store the lab log' }).click();

    await page.getByRole('heading', { name: `Bench AN 80 g ${tag}` }).waitFor();
    await page.getByText('Measured against predicted').waitFor();
    await page.getByText(/RMSE, model as is/).waitFor();
    await b.screenshot(page, 'lab-logs-03-overlay');

    await page.getByRole('button', { name: 'Fit the model' }).click();
    await page.getByText(/RMSE after the fit/).waitFor({ timeout: 30_000 });
    const table = page.getByRole('table', { name: 'Fitted values' });
    // The log was made with UA × 1.2, ΔH × 0.97: the fit finds them within a few per cent.
    await expect(table.getByRole('row').filter({ hasText: 'UA multiplier' }).textContent()).resolves.toMatch(/exchange\)1\.(1[6-9]|2[0-4])/);
    await expect(table.getByRole('row').filter({ hasText: 'Effective enthalpy factor' }).textContent()).resolves.toMatch(/factor0\.9[5-9]/);
    await expect(table.getByRole('row').filter({ hasText: 'Standard error' }).count()).resolves.toBe(1);
    await page.getByText(/Levenberg–Marquardt/).first().waitFor();
    await b.screenshot(page, 'lab-logs-04-fit');

    await page.getByLabel('Apply to').selectOption({ index: 0 });
    await page.getByRole('button', { name: 'Apply calibration' }).click();
    await page.getByText(/Applied: UA of still-air/).waitFor();
    await page.getByText(/Active from this log: contact still-air/).waitFor();
    await b.screenshot(page, 'lab-logs-05-applied');

    await page.goto('/lab-logs');
    await page.getByRole('link', { name: `Bench AN 80 g ${tag}` }).waitFor();
    await b.screenshot(page, 'lab-logs-06-list');
    await context.close();
  }, 120_000);
});
