import { hazardClassLabel } from '@shared/hazards/hazard-class-names';
import type { CandidateHazards, HazardNote, HazardSeverity } from '@shared/schemas/hazards';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/components/ui/cn';

const SEVERITY: Record<HazardSeverity, { label: string; tone: 'neutral' | 'caution' | 'warm' | 'danger'; border: string }> = {
  blocker: { label: 'Blocker', tone: 'danger', border: 'border-l-rust-600' },
  warning: { label: 'Warning', tone: 'warm', border: 'border-l-ember-500' },
  caution: { label: 'Caution', tone: 'caution', border: 'border-l-amber-600' },
  info: { label: 'Info', tone: 'neutral', border: 'border-l-ink-300' },
};

export function StandingCaution({ text }: { text: string }) {
  return (
    <p role="note" className="rounded-control border border-amber-100 bg-amber-50 px-3 py-2 text-small text-amber-700">
      <strong className="font-semibold">Standing caution. </strong>
      {text}
    </p>
  );
}

/** The mixture's classification in CLP notation ("Ox. Sol. 3", "Eye Irrit. 2"), each with its H-statements and the rule that gave it. */
export function ClassificationList({ classification }: { classification: CandidateHazards['classification'] }) {
  if (classification.length === 0) return <p className="text-small text-ink-600">Not classified by the arithmetic rules.</p>;
  return (
    <ul className="flex flex-col gap-1.5 text-small" aria-label="Classification">
      {classification.map((c) => (
        <li key={`${c.hazardClass}-${c.category}`}>
          <span className="font-semibold text-ink-900">{hazardClassLabel(c.hazardClass, c.category)}</span>
          {c.hStatements.length > 0 && <span className="tabular-nums text-ink-700"> · {c.hStatements.join(', ')}</span>}
          {c.rule && <span className="block text-caption text-ink-500">{c.rule}</span>}
        </li>
      ))}
    </ul>
  );
}

/** GHS label elements: pictogram codes, signal word, H- and P-statements. */
export function LabelElements({ label, hTexts }: { label: CandidateHazards['label']; hTexts?: Record<string, string> }) {
  return (
    <dl className="grid gap-x-6 gap-y-2 text-small sm:grid-cols-[10rem_1fr]">
      <dt className="font-semibold text-ink-700">Pictograms</dt>
      <dd>{label.pictograms.length ? label.pictograms.join(', ') : 'none'}</dd>
      <dt className="font-semibold text-ink-700">Signal word</dt>
      <dd>{label.signalWord ?? 'none'}</dd>
      <dt className="font-semibold text-ink-700">Hazard statements</dt>
      <dd>
        {label.hStatements.length ? (
          <ul className="flex flex-col gap-0.5">
            {label.hStatements.map((h) => (
              <li key={h}>
                <span className="font-semibold tabular-nums">{h}</span>
                {hTexts?.[h] ? ` — ${hTexts[h]}` : ''}
              </li>
            ))}
          </ul>
        ) : (
          'none'
        )}
      </dd>
      <dt className="font-semibold text-ink-700">Precautionary statements</dt>
      <dd>{label.pStatements.length ? label.pStatements.join(', ') : 'none'}</dd>
    </dl>
  );
}

/** Hazard notes, most serious first, each with its severity, rule and source. */
export function HazardNotesList({ notes }: { notes: readonly HazardNote[] }) {
  if (notes.length === 0) return <p className="text-small text-ink-600">No hazard notes for this composition.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label="Hazard notes">
      {notes.map((n) => {
        const s = SEVERITY[n.severity];
        return (
          <li key={`${n.ruleId}-${n.title}`} className={cn('rounded-control border border-ink-100 border-l-4 bg-surface px-3 py-2 break-inside-avoid', s.border)}>
            <div className="flex flex-wrap items-center gap-2">
              <Badge tone={s.tone}>{s.label}</Badge>
              <span className="font-semibold text-ink-900">{n.title}</span>
            </div>
            <p className="mt-1 text-small text-ink-800">{n.text}</p>
            <p className="mt-0.5 text-caption text-ink-500">
              Rule {n.ruleId} · Source: {n.source}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
