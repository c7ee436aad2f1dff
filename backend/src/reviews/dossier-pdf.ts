import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import type { Dossier } from '@shared/schemas/reviews';
import { REVIEW_STATE_LABELS, type ReviewState } from '@shared/reviews/state-machine';
import { hStatementText } from '@shared/hazards/h-statements';
import { CHEMISTRY_CHECKLIST_LABELS, REGULATORY_CHECKLIST_LABELS } from '@shared/schemas/reviews';

const CHECKLIST_WORDS: Record<string, string> = { ...CHEMISTRY_CHECKLIST_LABELS, ...REGULATORY_CHECKLIST_LABELS };

export type Paper = 'a4' | 'letter';

const require = createRequire(import.meta.url);

/** Manrope from @fontsource/manrope (WOFF, which pdfkit's font engine reads); Helvetica when missing. */
function fontFile(weight: 400 | 700): string | null {
  try {
    const dir = path.dirname(require.resolve('@fontsource/manrope/package.json'));
    const file = path.join(dir, 'files', `manrope-latin-${weight}-normal.woff`);
    return existsSync(file) ? file : null;
  } catch {
    return null;
  }
}

/** Characters the Latin subset of the font lacks, spelt with ones it has. */
function printable(text: string): string {
  return text
    .replace(/≤/g, '<=')
    .replace(/≥/g, '>=')
    .replace(/→/g, '->')
    .replace(/≈/g, '~')
    .replace(/Δ/g, 'Delta ')
    .replace(/[₀-₉]/g, (d) => String(d.charCodeAt(0) - 0x2080));
}

const fmt = (x: number | null | undefined, digits = 1) => (x == null || !Number.isFinite(x) ? '—' : x.toFixed(digits));
const stateLabel = (s: string) => REVIEW_STATE_LABELS[s as ReviewState] ?? s;

/**
 * Renders the dossier as a PDF with pdfkit (its fonts bundled, nothing downloaded): A4 by default,
 * US Letter on request. Sections follow the dossier page: summary, composition, predicted
 * performance with the temperature curve, data sources, hazards, review history and sign-offs.
 */
export function renderDossierPdf(d: Dossier, paper: Paper = 'a4'): Promise<Buffer> {
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

  const regular = fontFile(400);
  const bold = fontFile(700);
  if (regular) doc.registerFont('body', regular);
  if (bold) doc.registerFont('bold', bold);
  const body = regular ? 'body' : 'Helvetica';
  const strong = bold ? 'bold' : 'Helvetica-Bold';
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const left = doc.page.margins.left;

  const text = (s: string, opts: PDFKit.Mixins.TextOptions = {}) => doc.text(printable(s), opts);
  const heading = (s: string) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 80) doc.addPage();
    doc.moveDown(0.8).font(strong).fontSize(13).fillColor('#1d3b36');
    text(s);
    doc.moveDown(0.3).font(body).fontSize(10).fillColor('#111111');
  };
  const row = (cells: string[], widths: number[], isHead = false) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 30) doc.addPage();
    const y = doc.y;
    let x = left;
    doc.font(isHead ? strong : body).fontSize(9);
    let h = 0;
    cells.forEach((c, k) => {
      const w = widths[k]! * width;
      h = Math.max(h, doc.heightOfString(printable(c), { width: w - 6 }));
      x += w;
    });
    x = left;
    cells.forEach((c, k) => {
      const w = widths[k]! * width;
      doc.text(printable(c), x, y, { width: w - 6 });
      x += w;
    });
    doc.x = left;
    doc.y = y + h + 4;
    doc.moveTo(left, doc.y - 2).lineTo(left + width, doc.y - 2).lineWidth(0.3).strokeColor('#bbbbbb').stroke();
  };

  const c = d.candidate;
  const brief = d.brief as { name?: string; packType?: string; targetTempC?: number; holdMin?: number; reachWithinMin?: number; ambientC?: number };

  doc.font(strong).fontSize(18).fillColor('#1d3b36');
  text(`Candidate dossier — ${c.setNames.map((n) => n.replace(/\s*\([^)]*\)\s*$/, '')).join(' + ')}`);
  doc.font(body).fontSize(10).fillColor('#333333');
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
  drawCurve(doc, d, left, width, body);

  heading('Data sources');
  for (const line of d.composition) {
    doc.font(strong).fontSize(9);
    text(line.name);
    doc.font(body).fontSize(9);
    for (const s of line.sources) text(`• ${s}`, { indent: 8 });
    if (line.hazardSource) text(`• Hazard data: ${line.hazardSource}`, { indent: 8 });
  }

  heading('Hazard notes and label elements');
  doc.font(body).fontSize(9).fillColor('#5a3b00');
  text(d.standingCaution);
  doc.fillColor('#111111');
  if (d.label) {
    text(`Pictograms: ${d.label.pictograms.join(', ') || 'none'} · Signal word: ${d.label.signalWord ?? 'none'}`);
    for (const h of d.label.hStatements) text(`${h}: ${hStatementText(h)}`, { indent: 8 });
    if (d.label.pStatements.length) text(`Precautionary statements: ${d.label.pStatements.join(', ')}`);
  } else {
    text('Label elements: not computed for this candidate.');
  }
  if (d.hazardNotes.length === 0) text('No hazard notes.');
  for (const n of d.hazardNotes) {
    doc.moveDown(0.2).font(strong).fontSize(9);
    text(`[${n.severity.toUpperCase()}] ${n.title}`);
    doc.font(body);
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

function drawCurve(doc: PDFKit.PDFDocument, d: Dossier, left: number, width: number, font: string): void {
  if (d.curve.length < 2) return;
  const h = 150;
  if (doc.y + h + 30 > doc.page.height - doc.page.margins.bottom) doc.addPage();
  const top = doc.y + 8;
  const plotLeft = left + 34;
  const plotW = width - 40;
  const ts = d.curve.map((p) => p.tMin);
  const temps = d.curve.map((p) => p.tempC);
  const bandTop = Math.min(d.band.maxC, 200);
  const bandBottom = Math.max(d.band.minC, -60);
  const yMin = Math.floor(Math.min(...temps, bandBottom > -60 ? bandBottom : Infinity) - 2);
  const yMax = Math.ceil(Math.max(...temps, bandTop < 200 ? bandTop : -Infinity) + 2);
  const tMax = Math.max(...ts);
  const x = (t: number) => plotLeft + (t / tMax) * plotW;
  const y = (v: number) => top + h - ((v - yMin) / (yMax - yMin)) * h;
  // The band.
  const b0 = y(Math.min(bandTop, yMax));
  const b1 = y(Math.max(bandBottom, yMin));
  doc.rect(plotLeft, b0, plotW, Math.max(0, b1 - b0)).fillColor('#dcefe9').fill();
  doc.rect(plotLeft, top, plotW, h).lineWidth(0.5).strokeColor('#888888').stroke();
  doc.font(font).fontSize(7).fillColor('#444444');
  for (let k = 0; k <= 4; k++) {
    const v = yMin + ((yMax - yMin) * k) / 4;
    doc.text(`${v.toFixed(0)} °C`, left, y(v) - 3, { width: 32, align: 'right' });
    const t = (tMax * k) / 4;
    doc.text(`${t.toFixed(0)} min`, x(t) - 15, top + h + 3, { width: 30, align: 'center' });
  }
  doc.moveTo(x(d.curve[0]!.tMin), y(d.curve[0]!.tempC));
  for (const p of d.curve.slice(1)) doc.lineTo(x(p.tMin), y(p.tempC));
  doc.lineWidth(1.4).strokeColor('#1f6f8b').stroke();
  doc.x = left;
  doc.y = top + h + 16;
  doc.fillColor('#111111').fontSize(8);
  doc.text('Pack temperature (time model) against minutes; the shaded band is where the brief asks the pack to hold.', left, doc.y, { width });
  doc.fontSize(10);
}
