import { describe, expect, it } from 'vitest';
import type { APIRequestContext, Page } from 'playwright-core';
import { useBrowser } from './support/browser';

const b = useBrowser();

async function tokenFor(request: APIRequestContext, email: string): Promise<string> {
  const res = await request.post('/api/auth/login', { data: { email, password: 'packwright-demo' } });
  expect(res.status()).toBe(200);
  return (await res.json()).token as string;
}

/** The newest link to a candidate in the mails the sink stored for an address. */
async function mailedLink(email: string, candidateId: number, timeoutMs = 10_000): Promise<string> {
  const { MailMessageRecord } = await import('../../backend/src/mail/mail-message.model');
  const { Op } = await import('sequelize');
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const rows = await MailMessageRecord.findAll({ where: { toAddresses: { [Op.contains]: [email] } }, order: [['id', 'DESC']], limit: 20 });
    for (const r of rows) {
      const m = r.text.match(new RegExp(`https?://\\S+/candidates/${candidateId}(?=\\s|$)`));
      if (m) return m[0];
    }
    if (Date.now() > deadline) throw new Error(`no mail to ${email} about candidate ${candidateId}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function signedIn(email: string): Promise<Page> {
  const { page } = await b.newPage();
  await b.signIn(page, email);
  return page;
}

describe('review and sign-off in the browser', () => {
  it('designer submits, chemist approves with the checklist, reviewer requests changes, designer revises, both approve; the dossier prints', async () => {
    // A candidate to review: the designer's brief, run by the optimiser, its best candidate shortlisted.
    const setup = await b.browser.newContext({ baseURL: b.baseUrl });
    const designerToken = await tokenFor(setup.request, 'designer@demo.test');
    const auth = { Authorization: `Bearer ${designerToken}` };
    const brief = await (await setup.request.post('/api/briefs', { headers: auth, data: { name: `Review path cold compress ${Date.now().toString(36)}`, packType: 'cold', targetTempC: 5, reachWithinMin: 3, holdMin: 15, maxMassG: 200, maxUnitCost: '0.60' } })).json();
    const { runId } = await (await setup.request.post(`/api/briefs/${brief.brief.id}/runs`, { headers: auth })).json();
    let run;
    const deadline = Date.now() + 90_000;
    do {
      await new Promise((r) => setTimeout(r, 300));
      run = await (await setup.request.get(`/api/runs/${runId}`, { headers: auth })).json();
      if (Date.now() > deadline) throw new Error(`run ${runId} still ${run.status}`);
    } while (['queued', 'running'].includes(run.status));
    expect(run.status).toBe('succeeded');
    const candidateId = run.candidates[0].id as number;
    expect((await setup.request.post(`/api/candidates/${candidateId}/shortlist`, { headers: auth, data: { shortlisted: true } })).status()).toBe(200);
    await setup.close();

    // Designer: the candidate page with its hazard notes and the standing caution; submit.
    const designer = await signedIn('designer@demo.test');
    await designer.goto(`/candidates/${candidateId}`);
    await designer.getByRole('heading', { name: 'Review and sign-off' }).waitFor();
    const hazards = designer.locator('section', { has: designer.getByRole('heading', { name: 'Hazard notes', exact: true }) });
    await hazards.getByText('Standing caution.').waitFor();
    await hazards.getByRole('list', { name: 'Hazard notes' }).or(hazards.getByText('No hazard notes for this composition.')).first().waitFor();
    await hazards.scrollIntoViewIfNeeded();
    await hazards.screenshot({ path: '.test-artifacts/review-01-hazard-notes.png' });
    await b.screenshot(designer, 'review-02-candidate-shortlisted');
    await designer.getByLabel('Note for the reviewers (optional)').fill('Ready for review.');
    await designer.getByRole('button', { name: 'Submit for review' }).click();
    await designer.getByText('In chemistry review').first().waitFor();
    await designer.getByText('Waiting for a chemist.').waitFor();

    // Chemist: follows the link in the e-mail; an approval without the checklist is refused beside each item.
    const chemLink = await mailedLink('chemist@demo.test', candidateId);
    const chemist = await signedIn('chemist@demo.test');
    await chemist.goto(chemLink);
    await chemist.getByRole('form', { name: 'Chemistry review' }).waitFor();
    await chemist.getByRole('button', { name: 'Approve' }).click();
    await chemist.getByText('Data sources checked must be checked to approve.').waitFor();
    await chemist.getByText('Lab log must be attached, or waived with a reason, to approve.').waitFor();
    await b.screenshot(chemist, 'review-03-chemistry-checklist-errors');
    await chemist.getByLabel('Data sources checked').check();
    await chemist.getByLabel('The model is valid in this regime').check();
    await chemist.getByLabel('Waived, with a reason').check();
    await chemist.getByLabel('Reason for waiving the lab log').fill('Same solute family as the logged sideline pack.');
    await b.screenshot(chemist, 'review-04-chemistry-checklist-filled');
    await chemist.getByRole('button', { name: 'Approve' }).click();
    await chemist.getByText('In regulatory review').first().waitFor();

    // Reviewer: the Reviews page lists it; changes requested need a comment.
    const reviewer = await signedIn('reviewer@demo.test');
    await reviewer.getByRole('link', { name: 'Reviews', exact: true }).first().click();
    await reviewer.getByRole('heading', { name: 'Waiting for you' }).waitFor();
    const waiting = reviewer.locator('section', { has: reviewer.getByRole('heading', { name: 'Waiting for you' }) });
    await waiting.locator(`a[href="/candidates/${candidateId}"]`).click();
    await reviewer.getByRole('form', { name: 'Regulatory review' }).waitFor();
    await reviewer.getByRole('button', { name: 'Request changes' }).click();
    await reviewer.getByText(/Comment is required when the decision is not an approval/).waitFor();
    await reviewer.getByLabel('Comment (required unless you approve)').fill('Trim the first ingredient by a tenth and send it again.');
    await reviewer.getByRole('button', { name: 'Request changes' }).click();
    await reviewer.getByText('Changes requested').first().waitFor();

    // Designer: follows the e-mail, revises the grams; the new version starts shortlisted and is submitted.
    const designerLink = await mailedLink('designer@demo.test', candidateId);
    await designer.goto(designerLink);
    const revise = designer.getByRole('form', { name: 'Revise the composition' });
    await revise.waitFor();
    const firstMass = revise.locator('input[id^="mass-"]').first();
    const before = Number(await firstMass.inputValue());
    await firstMass.fill(String(Math.round(before * 0.9 * 10) / 10));
    await designer.getByRole('button', { name: 'Make a revised version' }).click();
    await designer.waitForURL((url) => url.pathname !== `/candidates/${candidateId}` && /\/candidates\/\d+$/.test(url.pathname));
    const v2 = Number(new URL(designer.url()).pathname.split('/').pop());
    await designer.getByText(`This version revises`).waitFor();
    await designer.getByRole('button', { name: 'Submit for review' }).click();
    await designer.getByText('Waiting for a chemist.').waitFor();

    await chemist.goto(await mailedLink('chemist@demo.test', v2));
    await chemist.getByLabel('Data sources checked').check();
    await chemist.getByLabel('The model is valid in this regime').check();
    await chemist.getByLabel('A lab log is attached').check();
    await chemist.getByRole('button', { name: 'Approve' }).click();
    await chemist.getByText('In regulatory review').first().waitFor();

    await reviewer.goto(await mailedLink('reviewer@demo.test', v2));
    for (const item of ['Classification checked', 'Label elements checked', 'Cautions checked', 'Regulatory flags checked']) await reviewer.getByLabel(item).check();
    await reviewer.getByRole('button', { name: 'Approve' }).click();
    await reviewer.getByText('Signed off by chemistry and regulatory review.').waitFor();
    await b.screenshot(reviewer, 'review-05-approved-history');

    // The dossier: every section, the paper choice, print rules, the PDF.
    await reviewer.getByRole('link', { name: 'Open the dossier' }).click();
    const dossier = reviewer.getByRole('article', { name: 'Dossier' });
    await dossier.waitFor();
    for (const section of ['Composition', 'Predicted performance', 'Data sources', 'Hazard notes', 'Label elements', 'Review history', 'Sign-offs']) {
      await dossier.getByRole('heading', { name: section, exact: true }).waitFor();
    }
    await dossier.getByText('Standing caution.').waitFor();
    expect(await dossier.getByText(/Regulatory review: requested changes/).count()).toBe(1);
    expect(await dossier.getByText(/Chemistry review: approved/).count()).toBe(2);
    await b.screenshot(reviewer, 'review-06-dossier');
    const pageRule = () => reviewer.evaluate(() => [...document.querySelectorAll('style')].map((s) => s.textContent ?? '').find((t) => t.includes('@page')) ?? '');
    expect(await pageRule()).toContain('size: A4 portrait');
    await reviewer.getByLabel('Paper').selectOption('letter');
    expect(await pageRule()).toContain('size: letter portrait');
    const pdfHref = await reviewer.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
    expect(pdfHref).toBe(`/api/candidates/${v2}/dossier.pdf?paper=letter`);
    const pdf = await reviewer.request.get(pdfHref!);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    // ANSI Letter: 8.5 × 11 in = 612 × 792 pt.
    expect((await pdf.body()).toString('latin1')).toMatch(/\/MediaBox \[0 0 612 792\]/);
    await reviewer.getByLabel('Paper').selectOption('a4');
    await reviewer.emulateMedia({ media: 'print' });
    expect(await reviewer.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    expect(await reviewer.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    await b.screenshot(reviewer, 'review-07-dossier-print');
  }, 240_000);
});
