import { describe, expect, it } from 'vitest';
import { packCharge } from '@shared/chemistry/pack-reaction';
import { reactionResponseSchema } from '@shared/schemas/thermo';
import { useBrowser } from './support/browser';

const b = useBrowser();

/** Same rendering as the screen's formatter: "1.2 kJ/g"-style numbers, read back as a number. */
function numberIn(text: string | null): number {
  const m = /−?-?[\d,]+(?:\.\d+)?/.exec((text ?? '').replace(/\u202f/g, ' '));
  return m ? Number(m[0].replace(/,/g, '').replace('−', '-')) : Number.NaN;
}

describe('the reaction tool answers a pack designer', () => {
  it('quicklime and water: heat per gram, pack temperature, boiling caution, gas from magnesium, ΔG behind a disclosure; no sideways scroll at 390 px', async () => {
    const { context, page } = await b.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await b.signIn(page, 'designer@demo.test');
    await page.goto('/reactions');
    await page.getByRole('heading', { name: 'Reaction in a pack' }).waitFor();
    const answers = page.getByRole('region', { name: 'What this charge does in a pack' });
    await answers.getByText('Heat given off by the charge').waitFor();

    // The screen's answers agree with the shared computation on the server's thermodynamics.
    const api = await page.request.post('/api/thermo/reaction', {
      headers: { Origin: b.baseUrl },
      data: { reactants: [{ formula: 'CaO', phase: 'cr', coef: 1 }, { formula: 'H2O', phase: 'l', coef: 1 }], products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: 1 }], tempC: 20 },
    });
    expect(api.status()).toBe(200);
    const thermo = reactionResponseSchema.parse(await api.json());
    const expected = packCharge({
      terms: thermo.terms.map((t) => ({ key: t.key, formula: t.formula, phase: t.phase, nu: t.nu, molarMass_g_per_mol: t.molarMass_g_per_mol, Cp_J_per_mol_K: t.Cp_J_per_mol_K })),
      dH_kJ: thermo.dH_kJ,
      chargeG: { 'CaO(cr)': 40, 'H2O(l)': 13 },
      waterRatio_g_per_g: 5,
      startTempC: 20,
    });
    const figure = (question: RegExp) => answers.locator('dl > div').filter({ has: page.locator('dt', { hasText: question }) }).locator('dd').first();
    expect(numberIn(await figure(/^Heat given off/).textContent())).toBeCloseTo(expected.heat_J / 1000, 1);
    expect(numberIn(await figure(/^Per gram of/).textContent())).toBeCloseTo((expected.heatPerLimiting_J_per_g as number) / 1000, 2);
    expect(numberIn(await figure(/^Pack temperature/).textContent())).toBeCloseTo(expected.packTempC, 0);
    // CaO + H2O → Ca(OH)2 runs by itself at room temperature (ΔrG° ≈ −57 kJ, CRC Handbook table 5-4, from memory).
    await answers.getByText(/^Yes — nothing needs to trigger it/).waitFor();
    await expect(figure(/^Gas at 1 atm/).textContent()).resolves.toBe('None');
    // ΔG is a detail, closed at first.
    await expect(answers.getByText('ΔG against temperature', { exact: true }).first().isVisible()).resolves.toBe(false);
    // About 60 °C: the usual burn caution, deferring to the SDS.
    await answers.getByText(/long contact burns skin/).waitFor();
    await b.screenshot(page, 'reactions-01-quicklime-1280');

    // No free water: the little water left boils off and the dry pack runs far above 100 °C; it says so.
    await page.getByLabel('Water as heat sink (g per g of reagents)').fill('0');
    await answers.getByText(/water would boil/).waitFor();
    await answers.getByText(/boils off/).waitFor();
    expect(numberIn(await figure(/^Pack temperature/).textContent())).toBeGreaterThan(100);

    // Magnesium and water: hydrogen, with its caution; the grams of water matched to the magnesium.
    await page.getByLabel('Reagent 1: formula').fill('Mg');
    await page.getByLabel('Reagent 1: grams in the pack').fill('5');
    await page.getByLabel('Reagent 2: moles in the reaction').fill('2');
    await page.getByLabel('Product 1: formula').fill('Mg(OH)2');
    await page.getByRole('button', { name: 'Add a product' }).click();
    await page.getByLabel('Product 2: formula').fill('H2');
    await page.getByLabel('Product 2: state').selectOption('g');
    await page.getByLabel('Water as heat sink (g per g of reagents)').fill('20');
    await answers.getByText(/Hydrogen is flammable/).waitFor();
    await page.getByRole('button', { name: 'Match the other reagents to the first' }).click();
    // 5 g Mg needs 2 × 18.015 / 24.305 × 5 = 7.41 g of water (IUPAC 2021 atomic weights).
    await expect(page.getByLabel('Reagent 2: grams in the pack').inputValue()).resolves.toBe('7.41');
    const gasL = numberIn(await figure(/^Gas at 1 atm/).textContent());
    // 5 g / 24.305 g/mol of H2 at ≥ 20 °C and 1 atm: ≥ 0.2057 mol × 24.06 L/mol (CODATA molar volume, scaled to 293.15 K).
    expect(gasL).toBeGreaterThan(4.9);
    expect(gasL).toBeLessThan(6.5);

    await page.getByText('The thermodynamics behind it').click();
    await page.getByText('ΔG against temperature').first().waitFor();
    await b.screenshot(page, 'reactions-02-magnesium-detail-1280');

    // A phone: nothing wider than the screen.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(300);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await b.screenshot(page, 'reactions-03-magnesium-390');

    // An ion written as in print is accepted.
    await page.getByLabel('Product 2: state').selectOption('');
    await page.getByLabel('Product 2: formula').fill('Ca2+');
    // Read as the calcium ion (not "Ca2" with charge +1): the reaction then fails only on balance.
    await page.getByText(/do not balance/).first().waitFor();
    await b.screenshot(page, 'reactions-04-unbalanced-390');
    await context.close();
  });

  it('a visitor who is not signed in opens the sign-in page without a console error (no session check answered 401)', async () => {
    const { context, page } = await b.newPage();
    const errors: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').waitFor();
    await page.waitForTimeout(500);
    expect(errors).toEqual([]);
    await context.close();
  });
});
