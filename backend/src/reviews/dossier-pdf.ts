import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { ticks } from 'd3-array';
import PDFDocument from 'pdfkit';
import type { CandidateConfidence } from '@shared/schemas/lab-logs';

/** What the PDF prints of a candidate's confidence (GET /api/candidates/:id/confidence). */
export type DossierConfidence = Pick<CandidateConfidence, 'band' | 'samples' | 'probabilityMeetsBrief' | 'calibrated'>;
import type { Dossier } from '@shared/schemas/reviews';
import { REVIEW_STATE_LABELS, type ReviewState } from '@shared/reviews/state-machine';
import { hazardClassLabel } from '@shared/hazards/hazard-class-names';
import { hStatementText } from '@shared/hazards/h-statements';
import { CHEMISTRY_CHECKLIST_LABELS, REGULATORY_CHECKLIST_LABELS } from '@shared/schemas/reviews';

const CHECKLIST_WORDS: Record<string, string> = { ...CHEMISTRY_CHECKLIST_LABELS, ...REGULATORY_CHECKLIST_LABELS };

export type Paper = 'a4' | 'letter';

const require = createRequire(import.meta.url);

/**
 * Manrope from @fontsource/manrope: the Latin subset and the Greek one (Δ, μ, ν…), as WOFF, which
 * pdfkit's font engine (fontkit) reads; Helvetica when missing.
 */
function fontFile(subset: 'latin' | 'greek', weight: 400 | 700): string | null {
  try {
    const dir = path.dirname(require.resolve('@fontsource/manrope/package.json'));
    const file = path.join(dir, 'files', `manrope-${subset}-${weight}-normal.woff`);
    return existsSync(file) ? file : null;
  } catch {
    return null;
  }
}

/** Characters neither subset has, spelt with ones they have. */
export function printable(text: string): string {
  return text
    .replace(/≤/g, '<=')
    .replace(/≥/g, '>=')
    .replace(/→/g, '->')
    .replace(/≈/g, '~')
    .replace(/[₀-₉]/g, (d) => String(d.charCodeAt(0) - 0x2080));
}

/** Greek and Coptic block: set in the Greek subset of the font. */
const GREEK = /[\u0370-\u03ff]+/g;

/** Splits a text into runs of Latin and Greek characters, so each is set in the subset that has its glyphs. */
export function scriptRuns(text: string): { text: string; greek: boolean }[] {
  const out: { text: string; greek: boolean }[] = [];
  let last = 0;
  for (const m of text.matchAll(GREEK)) {
    if (m.index > last) out.push({ text: text.slice(last, m.index), greek: false });
    out.push({ text: m[0], greek: true });
    last = m.index + m[0].length;
  }
  if (last < text.length || out.length === 0) out.push({ text: text.slice(last), greek: false });
  return out;
}

/**
 * Axis ticks at round steps (1, 2 or 5 × 10ⁿ, d3.ticks), inside [lo, hi]; minutes use 5, 10, 15,
 * 30, 60… so a 25-minute curve reads 0, 5, 10, 15, 20, 25.
 */
export function axisTicks(lo: number, hi: number, count: number, minutes = false): number[] {
  if (!(hi > lo)) return [lo];
  if (minutes) {
    const steps = [1, 2, 5, 10, 15, 20, 30, 60, 120, 180, 240, 360, 480, 720, 1440];
    const step = steps.find((st) => (hi - lo) / st <= count) ?? steps[steps.length - 1]!;
    const out: number[] = [];
    for (let t = Math.ceil(lo / step) * step; t <= hi + 1e-9; t += step) out.push(Number(t.toFixed(6)));
    return out;
  }
  return ticks(lo, hi, count);
}

const fmt = (x: number | null | undefined, digits = 1) => (x == null || !Number.isFinite(x) ? '—' : x.toFixed(digits));
const stateLabel = (s: string) => REVIEW_STATE_LABELS[s as ReviewState] ?? s;

/**
 * Renders the dossier as a PDF with pdfkit (its fonts bundled, nothing downloaded): A4 by default,
 * US Letter on request. Sections follow the dossier page: summary, composition, predicted
 * performance with the temperature curve, data sources, hazards, review history and sign-offs.
 */
export function renderDossierPdf(d: Dossier, paper: Paper = 'a4', confidence: DossierConfidence | null = null): Promise<Buffer> {
  const doc = new PDFDocument({
    size: paper === 'letter' ? 'LETTER' : 'A4',
    margins: { top: 56, bottom: 56, left: 56, right: 56 },
    info: { Title: `Dossier — candidate ${d.candidate.id}, revision ${d.status.revision}`, Author: d.workspace.name, Creator: 'Packwright' },
    bufferPages: true,
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const regular = fontFile('latin', 400);
  const bold = fontFile('latin', 700);
  const greekRegular = fontFile('greek', 400);
  const greekBold = fontFile('greek', 700);
  if (regular) doc.registerFont('body', regular);
  if (bold) doc.registerFont('bold', bold);
  if (greekRegular) doc.registerFont('body-greek', greekRegular);
  if (greekBold) doc.registerFont('bold-greek', greekBold);
  const body = regular ? 'body' : 'Helvetica';
  const strong = bold ? 'bold' : 'Helvetica-Bold';
  let current = body;
  const greekOf = (font: string) => (font === 'bold' && greekBold ? 'bold-greek' : font === 'body' && greekRegular ? 'body-greek' : null);
  const setFont = (font: string) => {
    current = font;
    return doc.font(font);
  };
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const left = doc.page.margins.left;

  /** Text in the current font, its Greek letters in the Greek subset (continued runs of one paragraph). */
  const write = (s: string, x: number | undefined, y: number | undefined, opts: PDFKit.Mixins.TextOptions = {}) => {
    const font = current;
    const greek = greekOf(font);
    const runs = greek ? scriptRuns(printable(s)) : [{ text: printable(s).replace(/Δ/g, 'Delta '), greek: false }];
    runs.forEach((r, k) => {
      doc.font(r.greek && greek ? greek : font);
      const last = k === runs.length - 1;
      const o = { ...opts, continued: last ? (opts.continued ?? false) : true };
      if (k === 0 && x !== undefined && y !== undefined) doc.text(r.text, x, y, o);
      else doc.text(r.text, o);
    });
    doc.font(font);
    return doc;
  };
  const text = (s: string, opts: PDFKit.Mixins.TextOptions = {}) => write(s, undefined, undefined, opts);
  const heading = (s: string) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 80) doc.addPage();
    doc.moveDown(0.8);
    setFont(strong).fontSize(13).fillColor('#1d3b36');
    text(s);
    doc.moveDown(0.3);
    setFont(body).fontSize(10).fillColor('#111111');
  };
  const row = (cells: string[], widths: number[], isHead = false) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 30) doc.addPage();
    const y = doc.y;
    let x = left;
    setFont(isHead ? strong : body).fontSize(9);
    let h = 0;
    cells.forEach((c, k) => {
      const w = widths[k]! * width;
      h = Math.max(h, doc.heightOfString(printable(c), { width: w - 6 }));
      x += w;
    });
    x = left;
    cells.forEach((c, k) => {
      const w = widths[k]! * width;
      write(c, x, y, { width: w - 6 });
      x += w;
    });
    doc.x = left;
    doc.y = y + h + 4;
    doc.moveTo(left, doc.y - 2).lineTo(left + width, doc.y - 2).lineWidth(0.3).strokeColor('#bbbbbb').stroke();
  };

  const c = d.candidate;
  const brief = d.brief as { name?: string; packType?: string; targetTempC?: number; holdMin?: number; reachWithinMin?: number; ambientC?: number };

  setFont(strong).fontSize(18).fillColor('#1d3b36');
  text(`Candidate dossier — ${c.setNames.map((n) => n.replace(/\s*\([^)]*\)\s*$/, '')).join(' + ')}`);
  setFont(body).fontSize(10).fillColor('#333333');
  text(`${d.workspace.name} · candidate ${c.id}, revision ${d.status.revision} · state: ${stateLabel(d.status.state)}`);
  text(`Brief: ${brief.name ?? ''} (${brief.packType ?? ''} pack; target ${fmt(brief.targetTempC)} °C within ${fmt(brief.reachWithinMin, 0)} min, held ${fmt(brief.holdMin, 0)} min; ambient ${fmt(brief.ambientC)} °C)`);
  text(`Generated ${d.generatedAt.replace('T', ' ').slice(0, 16)} UTC`);

  heading('Composition');
  const cw = [0.44, 0.14, 0.14, 0.14, 0.14];
  row(['Ingredient', 'Role', 'Mass (g)', 'Fill share (%)', ''], cw, true);
  for (const line of d.composition) row([`${line.name}${line.grade ? ` (${line.grade})` : ''}`, line.role, fmt(line.massG, 1), fmt(line.massFraction * 100, 1), ''], cw);
  text(`Fill ${fmt(c.fillMassG, 1)} g; with packaging ${fmt(c.massG, 1)} g. Unit cost ${c.unitCost} ${d.workspace.currency}.`);

  heading('Predicted performance');
  const v = c.verification;
  text(`Time model: ${v.status}${v.reasons.length ? ` — ${v.reasons.join('; ')}` : ''}.`);
  const bandWords = d.band.minC < -100 ? `at or below ${fmt(d.band.maxC)} °C` : d.band.maxC > 300 ? `at or above ${fmt(d.band.minC)} °C` : `${fmt(d.band.minC)}–${fmt(d.band.maxC)} °C`;
  text(`Reaches the target after ${fmt(v.timeToTargetMin)} min; ${fmt(v.minutesInBand)} min in the band (${bandWords}); coldest ${fmt(v.minTempC)} °C, warmest ${fmt(v.maxTempC)} °C, end ${fmt(v.endTempC)} °C.`);
  drawCurve(doc, d, confidence, left, width, body);
  if (confidence?.probabilityMeetsBrief != null) {
    text(`Chance of meeting the brief under the model's uncertainties: ${fmt(confidence.probabilityMeetsBrief * 100, 0)} % (${confidence.samples} Monte Carlo samples${confidence.calibrated ? ', calibrated on lab logs' : ''}).`);
  }

  heading('Data sources');
  for (const line of d.composition) {
    setFont(strong).fontSize(9);
    text(line.name);
    setFont(body).fontSize(9);
    for (const s of line.sources) text(`• ${s}`, { indent: 8 });
    if (line.hazardSource) text(`• Hazard data: ${line.hazardSource}`, { indent: 8 });
  }

  heading('Hazard notes and label elements');
  setFont(body).fontSize(9).fillColor('#5a3b00');
  text(d.standingCaution);
  doc.fillColor('#111111');
  if (d.label) {
    text(`Pictograms: ${d.label.pictograms.join(', ') || 'none'} · Signal word: ${d.label.signalWord ?? 'none'}`);
    for (const h of d.label.hStatements) text(`${h}: ${hStatementText(h)}`, { indent: 8 });
    if (d.label.pStatements.length) text(`Precautionary statements: ${d.label.pStatements.join(', ')}`);
  } else {
    text('Label elements: not computed for this candidate.');
  }
  if (d.hazards?.classification.length) {
    text(`Classification (CLP): ${d.hazards.classification.map((k) => `${hazardClassLabel(k.hazardClass, k.category)}${k.hStatements.length ? ` (${k.hStatements.join(', ')})` : ''}`).join('; ')}`);
  }
  if (d.hazardNotes.length === 0) text('No hazard notes.');
  for (const n of d.hazardNotes) {
    doc.moveDown(0.2);
    setFont(strong).fontSize(9);
    text(`[${n.severity.toUpperCase()}] ${n.title}`);
    setFont(body);
    text(`${n.text} (rule ${n.ruleId}; source: ${n.source})`, { indent: 8 });
  }

  heading('Review history');
  const hw = [0.2, 0.22, 0.26, 0.32];
  row(['When (UTC)', 'Who', 'From → to', 'Comment'], hw, true);
  for (const e of d.history) {
    const what = e.kind === 'review' && e.review ? `${e.review.stage} review, ${e.review.verdict}` : e.kind;
    row([e.at.replace('T', ' ').slice(0, 16), `${e.actor} (${e.actorRole})`, `rev. ${e.revision} ${what}: ${stateLabel(e.from)} → ${stateLabel(e.to)}`, e.comment || '—'], hw);
  }

  heading('Sign-offs');
  if (d.signOffs.length === 0) text('Not signed off yet.');
  for (const s of d.signOffs) {
    const items = Object.entries(s.checklist)
      .map(([k, val]) => {
        if (k === 'labLog' && val && typeof val === 'object') return 'attached' in val ? 'lab log attached' : `lab log waived (${(val as { waivedReason: string }).waivedReason})`;
        return `${CHECKLIST_WORDS[k] ?? k}: ${val === true ? 'yes' : 'no'}`;
      })
      .join('; ');
    text(`${s.stage === 'chemistry' ? 'Chemistry' : 'Regulatory'} — approved by ${s.reviewer.name} on ${s.createdAt.slice(0, 10)} (revision of candidate ${s.candidateId}). Checklist: ${items}.${s.comment ? ` Comment: ${s.comment}` : ''}`);
  }

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font(body).fontSize(8).fillColor('#666666');
    doc.text(printable(`Packwright dossier · candidate ${c.id} rev. ${d.status.revision} · page ${i + 1} of ${range.count}`), left, doc.page.height - 36, { width, align: 'center' });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}

/**
 * The temperature curve with the brief's band, the model's 5–95 % uncertainty band (Monte Carlo,
 * as on the dossier page) when it is known, and round axis ticks (axisTicks).
 */
function drawCurve(doc: PDFKit.PDFDocument, d: Dossier, confidence: DossierConfidence | null, left: number, width: number, font: string): void {
  if (d.curve.length < 2) return;
  const h = 160;
  if (doc.y + h + 44 > doc.page.height - doc.page.margins.bottom) doc.addPage();
  const top = doc.y + 8;
  const plotLeft = left + 40;
  const plotW = width - 46;
  const band = confidence?.band.length ? confidence.band : [];
  const ts = [...d.curve.map((p) => p.tMin), ...band.map((p) => p.tMin)];
  const temps = [...d.curve.map((p) => p.tempC), ...band.flatMap((p) => [p.p5, p.p95])];
  // The brief's band joins the range only where it is finite and near the curve, so an open-ended band does not stretch the axis.
  const near = (v: number) => v > Math.min(...temps) - 15 && v < Math.max(...temps) + 15;
  const lo0 = Math.min(...temps, ...(near(d.band.minC) ? [d.band.minC] : []));
  const hi0 = Math.max(...temps, ...(near(d.band.maxC) ? [d.band.maxC] : []));
  const yTicks = axisTicks(lo0 - 1, hi0 + 1, 5);
  const yMin = Math.min(lo0 - 1, yTicks[0]!);
  const yMax = Math.max(hi0 + 1, yTicks[yTicks.length - 1]!);
  const tMax = Math.max(...ts);
  const x = (t: number) => plotLeft + (t / tMax) * plotW;
  const y = (v: number) => top + h - ((v - yMin) / (yMax - yMin)) * h;
  const clampY = (v: number) => y(Math.max(yMin, Math.min(yMax, v)));
  // The brief's band.
  const b0 = clampY(d.band.maxC);
  const b1 = clampY(d.band.minC);
  doc.rect(plotLeft, b0, plotW, Math.max(0, b1 - b0)).fillColor('#dcefe9').fill();
  // The uncertainty band, p5 forward then p95 back.
  if (band.length > 1) {
    doc.moveTo(x(band[0]!.tMin), clampY(band[0]!.p5));
    for (const p of band.slice(1)) doc.lineTo(x(p.tMin), clampY(p.p5));
    for (const p of [...band].reverse()) doc.lineTo(x(p.tMin), clampY(p.p95));
    doc.closePath().fillOpacity(0.35).fillColor('#9fc9dd').fill().fillOpacity(1);
  }
  doc.rect(plotLeft, top, plotW, h).lineWidth(0.5).strokeColor('#888888').stroke();
  doc.font(font).fontSize(7).fillColor('#444444');
  for (const v of yTicks) {
    if (v < yMin || v > yMax) continue;
    doc.moveTo(plotLeft, y(v)).lineTo(plotLeft + plotW, y(v)).lineWidth(0.2).strokeColor('#dddddd').stroke();
    doc.text(`${Number(v.toFixed(1))} °C`, left, y(v) - 3, { width: 37, align: 'right' });
  }
  for (const t of axisTicks(0, tMax, 8, true)) doc.text(`${t}`, x(t) - 15, top + h + 3, { width: 30, align: 'center' });
  doc.text('min', plotLeft + plotW - 30, top + h + 12, { width: 30, align: 'right' });
  doc.moveTo(x(d.curve[0]!.tMin), y(d.curve[0]!.tempC));
  for (const p of d.curve.slice(1)) doc.lineTo(x(p.tMin), y(p.tempC));
  doc.lineWidth(1.4).strokeColor('#1f6f8b').stroke();
  doc.x = left;
  doc.y = top + h + 24;
  doc.fillColor('#111111').fontSize(8);
  doc.text(
    band.length > 1
      ? `Pack temperature (time model) against minutes. Green: where the brief asks the pack to hold. Blue: 5–95 % of ${confidence!.samples} Monte Carlo samples of the model's uncertainties.`
      : 'Pack temperature (time model) against minutes; the shaded band is where the brief asks the pack to hold. No uncertainty band was computed for this candidate.',
    left,
    doc.y,
    { width },
  );
  doc.fontSize(10);
}
