import { describe, expect, it } from 'vitest';
import { useBrowser } from './support/browser';

const b = useBrowser();

describe('incompatible sets and ranking by hazard in the browser', () => {
  it('the brief form offers to allow incompatible mixtures; the ranked table marks them in words and sorts by hazard', async () => {
    const { context, page } = await b.newPage();
    await b.signIn(page, 'designer@demo.test');

    // The brief form: a labelled checkbox with its hint, unticked by default.
    await page.goto('/briefs/new');
    await page.getByRole('heading', { name: 'New brief' }).waitFor();
    const allow = page.getByLabel('Rank incompatible mixtures among the others');
    expect(await allow.isChecked()).toBe(false);
    await allow.scrollIntoViewIfNeeded();
    await page.getByText(/Unticked, it ranks after every compatible one/).waitFor();
    await b.screenshot(page, 'incompatible-01-brief-form-checkbox');

    // A brief over soda crystals, calcium chloride hexahydrate, urea and ammonium chloride: soda and
    // calcium chloride precipitate calcium carbonate when they meet.
    const setup = await b.browser.newContext({ baseURL: b.baseUrl });
    const login = await setup.request.post('/api/auth/login', { data: { email: 'designer@demo.test', password: 'packwright-demo' } });
    expect(login.status()).toBe(200);
    const auth = { Authorization: `Bearer ${(await login.json()).token as string}` };
    const listed = await setup.request.get('/api/ingredients', { headers: auth, params: { pageSize: 200 } });
    expect(listed.status(), await listed.text()).toBe(200);
    const lib = (await listed.json()).items as { id: number; name: string }[];
    const id = (name: string) => {
      const hit = lib.find((i) => i.name === name);
      if (!hit) throw new Error(`no ingredient named ${name}; found ${lib.map((i) => i.name).join(', ')}`);
      return String(hit.id);
    };
    const allowed = ['Sodium carbonate decahydrate', 'Calcium chloride hexahydrate', 'Urea', 'Ammonium chloride'].map(id);
    const created = await setup.request.post('/api/briefs', {
      headers: auth,
      data: { name: `Incompatible check ${Date.now().toString(36)}`, packType: 'cold', targetTempC: 15, reachWithinMin: 10, holdMin: 5, maxActives: 2, allowedIngredientIds: allowed },
    });
    expect(created.status()).toBe(201);
    const brief = (await created.json()).brief as { id: number };
    const { runId } = await (await setup.request.post(`/api/briefs/${brief.id}/runs`, { headers: auth })).json();

    await page.goto(`/runs/${runId}`);
    await page.getByRole('heading', { name: 'Candidates that meet the brief' }).waitFor({ timeout: 90_000 });
    await expect.poll(() => page.getByRole('progressbar').count()).toBe(0);
    const rows = page.locator('tr[data-candidate-id]');
    const marked = rows.filter({ hasText: 'Incompatible' });
    expect(await marked.count()).toBeGreaterThan(0);
    await marked.first().getByText(/calcium carbonate|CaCO3/i).first().waitFor();
    await marked.first().scrollIntoViewIfNeeded();
    await b.screenshot(page, 'incompatible-02-ranked-table-marker');

    // Rank by hazard: the Hazards header sorts the table by hazard score, one way then the other.
    const header = page.getByRole('columnheader', { name: /Hazards/ });
    const scores = () => rows.evaluateAll((trs) => trs.map((tr) => Number(/score ([\d.]+)/.exec(tr.textContent ?? '')?.[1] ?? 'NaN')));
    for (const _click of [1, 2]) {
      await header.getByRole('button').click();
      await expect.poll(() => header.getAttribute('aria-sort')).toMatch(/ascending|descending/);
      const dir = (await header.getAttribute('aria-sort')) === 'ascending' ? 1 : -1;
      const s = await scores();
      expect(s.length).toBeGreaterThan(1);
      for (let i = 1; i < s.length; i++) expect(dir * (s[i]! - s[i - 1]!)).toBeGreaterThanOrEqual(0);
    }
    await header.scrollIntoViewIfNeeded();
    await b.screenshot(page, 'incompatible-03-sorted-by-hazard');
    await setup.close();
    await context.close();
  }, 150_000);
});
