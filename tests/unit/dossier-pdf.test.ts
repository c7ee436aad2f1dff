import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Dossier } from '@shared/schemas/reviews';
import { axisTicks, renderDossierPdf, scriptRuns } from '../../backend/src/reviews/dossier-pdf';

const artifacts = process.env.TEST_ARTIFACTS_DIR ?? path.resolve('.test-artifacts');

/** A dossier with the fields the PDF prints; the values are invented. */
function sampleDossier(): Dossier {
  const curve = Array.from({ length: 26 }, (_, k) => ({ tMin: k, tempC: 4 + 14 * (1 - Math.exp(-k / 6)) - (k > 2 ? 0 : 0) }));
  return {
    generatedAt: '2026-12-02T05:00:00.000Z',
    workspace: { name: 'Demo workspace', currency: 'EUR' },
    candidate: {
      id: 14,
      setNames: ['Ammonium nitrate (prill)', 'Water (deionised)'],
      fillMassG: 140,
      massG: 152,
      unitCost: '0.42',
      verification: { status: 'verified', reasons: [], timeToTargetMin: 1.5, minutesInBand: 22, minTempC: 4.1, maxTempC: 17.9, endTempC: 17.9 },
    },
    status: { state: 'draft', revision: 1 },
    brief: { name: 'Sideline compress', packType: 'cold', targetTempC: 8, holdMin: 20, reachWithinMin: 3, ambientC: 25 },
    composition: [
      { ingredientId: '1', name: 'Ammonium nitrate', grade: 'prill', role: 'active', massG: 40, massFraction: 0.286, sources: ['ΔfH° and ΔsolH from NBS 1982 (Wagman et al.)'], hazardSource: 'SDS (invented)' },
      { ingredientId: '2', name: 'Water', grade: 'deionised', role: 'solvent', massG: 100, massFraction: 0.714, sources: ['cp from IAPWS-95'], hazardSource: null },
    ],
    curve,
    band: { minC: 0, maxC: 12 },
    hazards: { notes: [], classification: [{ hazardClass: 'ox-sol', category: '3', hStatements: ['H272'], rule: 'carried over' }, { hazardClass: 'eye-irrit', category: '2', hStatements: ['H319'], rule: 'Σ' }], label: { pictograms: ['GHS03', 'GHS07'], signalWord: 'Warning', hStatements: ['H272', 'H319'], pStatements: ['P210'] }, score: 3 },
    hazardNotes: [{ severity: 'caution', ruleId: 'skin.cold-contact', title: 'Cold contact', text: 'ΔT to the skin stays under 25 K; wrap the pack.', source: 'common practice' }],
    label: { pictograms: ['GHS03', 'GHS07'], signalWord: 'Warning', hStatements: ['H272', 'H319'], pStatements: ['P210'] },
    standingCaution: 'Computed guidance only: follow the SDS, local codes and licensed practice.',
    history: [],
    signOffs: [],
  } as unknown as Dossier;
}

describe('dossier PDF', () => {
  it('minute ticks are round steps (0, 5, … 25 for a 25-minute curve), not fractions of the span (common practice, no source)', () => {
    expect(axisTicks(0, 25, 8, true)).toEqual([0, 5, 10, 15, 20, 25]);
    expect(axisTicks(0, 90, 8, true)).toEqual([0, 15, 30, 45, 60, 75, 90]);
    expect(axisTicks(0, 240, 8, true)).toEqual([0, 30, 60, 90, 120, 150, 180, 210, 240]);
    expect(axisTicks(3.2, 18.7, 5)).toEqual([4, 6, 8, 10, 12, 14, 16, 18]);
  });

  it('sets Greek letters in the Greek subset: "ΔfH°" is two runs, Δ on its own', () => {
    expect(scriptRuns('ΔfH° from NBS')).toEqual([
      { text: 'Δ', greek: true },
      { text: 'fH° from NBS', greek: false },
    ]);
  });

  it('renders a dossier with the uncertainty band and embeds both Manrope subsets; the page is written as PNG when pdftoppm is installed', async () => {
    const d = sampleDossier();
    const band = d.curve.map((p) => ({ tMin: p.tMin, p5: p.tempC - 1.5, p50: p.tempC, p95: p.tempC + 1.8 }));
    const pdf = await renderDossierPdf(d, 'a4', { band, samples: 400, probabilityMeetsBrief: 0.82, calibrated: false });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const fonts = pdf.toString('latin1').match(/\/BaseFont \/[A-Z]{6}\+[^\s/]+/g) ?? [];
    expect(fonts.length).toBeGreaterThanOrEqual(3); // latin regular, latin bold, greek regular
    mkdirSync(artifacts, { recursive: true });
    const file = path.join(artifacts, 'dossier-sample.pdf');
    writeFileSync(file, pdf);
    if (existsSync('/usr/bin/pdftotext')) {
      const text = execFileSync('/usr/bin/pdftotext', [file, '-']).toString();
      expect(text).toContain('ΔfH°');
      expect(text).not.toContain('Delta');
      expect(text).toContain('Ox. Sol. 3');
    }
    if (existsSync('/usr/bin/pdftoppm')) execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '2', file, path.join(artifacts, 'dossier-sample')]);
  }, 60_000);
});
