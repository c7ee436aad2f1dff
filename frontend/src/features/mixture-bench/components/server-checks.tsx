import type { EvaluateMixtureApiResponse } from '@shared/schemas/thermo';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';

const SEVERITY_TONE = { blocker: 'danger', warning: 'caution', caution: 'caution', info: 'neutral' } as const;

/**
 * What only the server adds to a mixture's evaluation: the hazard notes and GHS label elements
 * (shared/src/hazards, as for a candidate), where each bare formula's classification comes from,
 * what precipitates, and the server's warnings.
 */
export function ServerChecks({ result }: { result: EvaluateMixtureApiResponse }) {
  const { label } = result;
  return (
    <section aria-label="Hazards and checks from the server" className="flex flex-col gap-3">
      {result.precipitation.precipitates.length > 0 && (
        <Alert tone="caution" title="A solid precipitates">
          {result.precipitation.statement}
        </Alert>
      )}
      <div className="rounded-control border border-ink-100 px-4 py-3">
        <h3 className="text-small font-bold text-ink-900">Label elements</h3>
        <p className="text-small">
          {label.signalWord ? <strong>{label.signalWord}</strong> : 'No signal word'}
          {label.pictograms.length ? ` · pictograms ${label.pictograms.join(', ')}` : ' · no pictogram'}
          {label.hStatements.length ? ` · ${label.hStatements.join(', ')}` : ''}
        </p>
        {result.classificationStatements.length > 0 && (
          <ul className="mt-2 list-disc pl-4 text-caption text-ink-600">
            {result.classificationStatements.map((s) => (
              <li key={s}>{s}</li>
            ))}
          </ul>
        )}
      </div>
      {result.hazards.length > 0 && (
        <table className="w-full text-left text-small">
          <caption className="mb-1 text-left text-small font-bold text-ink-900">Hazard notes</caption>
          <tbody className="divide-y divide-ink-100">
            {result.hazards.map((n) => (
              <tr key={n.ruleId}>
                <td className="py-1.5 pr-3 align-top">
                  <Badge tone={SEVERITY_TONE[n.severity]}>{n.severity}</Badge>
                </td>
                <td className="py-1.5">
                  <span className="font-semibold">{n.title}.</span> {n.text}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {result.warnings.length > 0 && (
        <Alert tone="caution" title="Server warnings">
          <ul className="list-disc pl-4">
            {result.warnings.map((w, k) => (
              <li key={`${w.code}-${k}`}>{w.message}</li>
            ))}
          </ul>
        </Alert>
      )}
      <p className="text-caption text-ink-500">{result.standingCaution}</p>
    </section>
  );
}
