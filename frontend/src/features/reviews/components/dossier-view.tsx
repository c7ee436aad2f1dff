import type { ReactNode } from 'react';
import type { Dossier } from '@shared/schemas/reviews';
import { CHEMISTRY_CHECKLIST_LABELS, REGULATORY_CHECKLIST_LABELS } from '@shared/schemas/reviews';
import { LineChart, type ChartBand } from '@/components/charts/line-chart';
import { chemistryName } from '@/lib/candidate-figures';
import { formatDateTime, formatMoney, formatNumber, formatQuantity } from '@/lib/format';
import { useHStatements } from '../api/get-h-statements';
import { HazardNotesList, LabelElements, StandingCaution } from './hazard-notes';
import { ReviewStateBadge } from './review-state-badge';
import { ReviewTimeline } from './review-panel';
import { CandidateConfidence } from '@/components/charts/candidate-confidence';

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="dossier-section border-t border-ink-200 pt-4">
      <h2 className="mb-3 text-lead font-bold text-ink-900">{title}</h2>
      {children}
    </section>
  );
}

function checklistWords(checklist: Record<string, unknown>): string {
  const labels: Record<string, string> = { ...CHEMISTRY_CHECKLIST_LABELS, ...REGULATORY_CHECKLIST_LABELS };
  return Object.entries(checklist)
    .map(([k, v]) => {
      if (k === 'labLog' && v && typeof v === 'object') return 'attached' in v ? 'Lab log attached' : `Lab log waived: ${(v as { waivedReason: string }).waivedReason}`;
      return `${labels[k] ?? k}: ${v === true ? 'yes' : 'no'}`;
    })
    .join(' · ');
}

/** The printable dossier of a candidate in or past review. */
export function DossierView({ dossier: d }: { dossier: Dossier }) {
  const h = useHStatements();
  const c = d.candidate;
  const brief = d.brief as { name?: string; packType?: 'cold' | 'warm'; targetTempC?: number; holdMin?: number; reachWithinMin?: number; ambientC?: number };
  const temps = d.curve.map((p) => p.tempC);
  const bands: ChartBand[] = temps.length
    ? [{ from: Math.max(d.band.minC, Math.min(...temps) - 2), to: Math.min(d.band.maxC, Math.max(...temps) + 2), label: 'Target band', tone: 'moss' }]
    : [];
  return (
    <article className="dossier flex flex-col gap-6 rounded-card border border-ink-100 bg-surface p-6 print:border-0 print:p-0" aria-label="Dossier">
      <header className="flex flex-col gap-1">
        <p className="text-caption font-semibold tracking-wide text-ink-500 uppercase">{d.workspace.name} · candidate dossier</p>
        <h1 className="text-title font-bold text-ink-900">{chemistryName(c)}</h1>
        <p className="flex flex-wrap items-center gap-2 text-small text-ink-700">
          Candidate {c.id}, revision {d.status.revision} · <ReviewStateBadge state={d.status.state} />
        </p>
        <p className="text-small text-ink-700">
          Brief “{brief.name}”: {brief.packType} pack, target {formatQuantity(brief.targetTempC, '°C')} within {formatQuantity(brief.reachWithinMin, 'min')}, held {formatQuantity(brief.holdMin, 'min')}, ambient {formatQuantity(brief.ambientC, '°C')}.
        </p>
        <p className="text-caption text-ink-500">Generated {formatDateTime(d.generatedAt)}</p>
      </header>

      <Section title="Composition">
        <table className="w-full text-small">
          <thead>
            <tr className="text-left text-ink-600">
              <th scope="col" className="py-1 pr-3 font-semibold">Ingredient</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Grade</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Role</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">Mass (g)</th>
              <th scope="col" className="py-1 text-right font-semibold">Share of fill (%)</th>
            </tr>
          </thead>
          <tbody>
            {d.composition.map((l) => (
              <tr key={l.ingredientId} className="border-t border-ink-100">
                <td className="py-1.5 pr-3 font-semibold">{l.name}</td>
                <td className="py-1.5 pr-3">{l.grade}</td>
                <td className="py-1.5 pr-3">{l.role}</td>
                <td className="py-1.5 pr-3 text-right tabular-nums">{formatNumber(l.massG, { maxFractionDigits: 1 })}</td>
                <td className="py-1.5 text-right tabular-nums">{formatNumber(l.massFraction * 100, { maxFractionDigits: 1 })}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-small text-ink-700">
          Fill {formatQuantity(c.fillMassG, 'g')}; with packaging {formatQuantity(c.massG, 'g')}. Unit cost {formatMoney(c.unitCost, d.workspace.currency)}.
        </p>
      </Section>

      <Section title="Predicted performance">
        <p className="text-small text-ink-800">
          Time model: <strong>{c.verification.status}</strong>
          {c.verification.reasons.length ? ` — ${c.verification.reasons.join('; ')}` : ''}. Reaches the target after {formatQuantity(c.verification.timeToTargetMin, 'min')}; {formatQuantity(c.verification.minutesInBand, 'min')} in the band; coldest {formatQuantity(c.verification.minTempC, '°C')}, warmest {formatQuantity(c.verification.maxTempC, '°C')}.
        </p>
        {d.curve.length > 1 && (
          <div className="mt-3 break-inside-avoid">
            <LineChart
              title="Pack temperature over time"
              series={[{ id: 'curve', label: 'Pack temperature', points: d.curve.map((p) => ({ x: p.tMin, y: p.tempC })), tone: brief.packType === 'warm' ? 'ember' : 'frost' }]}
              bands={bands}
              x={{ label: 'Time', unit: 'min', format: (x) => formatNumber(x, { maxFractionDigits: 1 }) }}
              y={{ label: 'Temperature', unit: '°C', format: (y) => formatNumber(y, { maxFractionDigits: 1 }) }}
              height={240}
              maxTableRows={12}
            />
          </div>
        )}
        <div className="mt-3 break-inside-avoid">
          <CandidateConfidence candidateId={c.id} title="How sure the prediction is: 5–95 % band" height={220} modelled={c.verification.status} />
        </div>
      </Section>

      <Section title="Data sources">
        <ul className="flex flex-col gap-2 text-small">
          {d.composition.map((l) => (
            <li key={l.ingredientId} className="break-inside-avoid">
              <span className="font-semibold">{l.name}</span>
              <ul className="list-disc pl-5 text-ink-700">
                {l.sources.map((s) => (
                  <li key={s}>{s}</li>
                ))}
                {l.hazardSource && <li>Hazard data: {l.hazardSource}</li>}
              </ul>
            </li>
          ))}
        </ul>
      </Section>

      <Section title="Hazard notes">
        <div className="flex flex-col gap-3">
          <StandingCaution text={d.standingCaution} />
          <HazardNotesList notes={d.hazardNotes} />
        </div>
      </Section>

      <Section title="Label elements">
        {d.label ? <LabelElements label={d.label} hTexts={h.data?.texts} /> : <p className="text-small">Not computed.</p>}
        {h.data && <p className="mt-2 text-caption text-ink-500">H-statement texts: {h.data.source}.</p>}
      </Section>

      <Section title="Review history">
        <ReviewTimeline events={d.history} currentId={c.id} />
      </Section>

      <Section title="Sign-offs">
        {d.signOffs.length === 0 ? (
          <p className="text-small">Not signed off yet.</p>
        ) : (
          <ul className="flex flex-col gap-2 text-small">
            {d.signOffs.map((s) => (
              <li key={s.id} className="break-inside-avoid">
                <strong>{s.stage === 'chemistry' ? 'Chemistry' : 'Regulatory'}</strong> approved by {s.reviewer.name} ({s.reviewer.role}), {formatDateTime(s.createdAt)}
                {s.candidateId !== c.id ? ` — on revision of candidate ${s.candidateId}` : ''}.
                <br />
                <span className="text-ink-600">{checklistWords(s.checklist)}</span>
                {s.comment && <span className="text-ink-800"> · “{s.comment}”</span>}
              </li>
            ))}
          </ul>
        )}
      </Section>
    </article>
  );
}
