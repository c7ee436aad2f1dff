import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { CandidateRecord } from '@shared/schemas/runs';
import { LineChart, type ChartBand, type ChartRule, type ChartSeries } from '@/components/charts/line-chart';
import { CATEGORY_COLOURS } from '@/components/charts/palette';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import {
  VERIFICATION_WORDS,
  chemistryName,
  extremeTempC,
  holdMarginMin,
  shortIngredientName,
} from '@/lib/candidate-figures';
import { briefBand, resampleCurve, useCandidateCurves } from '@/lib/candidate-curves';
import { formatMoney, formatNumber, formatQuantity } from '@/lib/format';
import { useCandidateDetails } from '../api/get-candidate';
import { ShortlistButton } from './shortlist-button';

function Row({ candidates, label, render }: { candidates: CandidateRecord[]; label: string; render: (c: CandidateRecord) => ReactNode }) {
  return (
    <tr className="align-top">
      <th scope="row" className="w-44 px-5 py-2 text-left text-small font-semibold text-ink-600">
        {label}
      </th>
      {candidates.map((c) => (
        <td key={c.id} className="px-3 py-2 text-small text-ink-900">
          {render(c)}
        </td>
      ))}
    </tr>
  );
}

/** 2–4 candidates side by side, with their temperature curves overlaid on the brief's band. */
export function CompareView({ candidates, canWrite }: { candidates: CandidateRecord[]; canWrite: boolean }) {
  const details = useCandidateDetails(candidates.map((c) => c.id));
  const first = details[0]?.data;
  const currency = first?.currency ?? 'EUR';
  const brief = first?.brief;
  const packType = brief?.packType ?? 'cold';
  const sameBrief = new Set(candidates.map((c) => c.briefId)).size === 1;
  const curves = useCandidateCurves(candidates.map((c, k) => ({ candidate: c, brief: details[k]?.data?.brief })));
  const detailError = details.find((d) => d.isError);

  const horizon = brief ? brief.reachWithinMin + 1.5 * brief.holdMin : 60;
  const step = Math.max(0.25, Math.round((horizon / 90) * 4) / 4);
  const series: ChartSeries[] = candidates.flatMap((c, k) => {
    const data = curves[k]?.data;
    return data
      ? [{ id: String(c.id), label: `#${c.rank} ${chemistryName(c)}`, colour: CATEGORY_COLOURS[k], dashed: k % 2 === 1, points: resampleCurve(data, step, horizon) }]
      : [];
  });
  const temps = series.flatMap((s) => s.points.map((p) => p.y));
  const band = brief ? briefBand(brief) : null;
  const bands: ChartBand[] =
    brief && band && temps.length
      ? [{ from: Math.max(band.minC, Math.min(...temps, brief.targetTempC) - 2), to: Math.min(band.maxC, Math.max(...temps, brief.targetTempC) + 2), label: 'Target band', tone: 'moss' }]
      : [];
  const rules: ChartRule[] = brief
    ? [
        { axis: 'y', value: brief.targetTempC, label: `Target ${packType === 'cold' ? '≤' : '≥'} ${formatQuantity(brief.targetTempC, '°C')}`, tone: packType === 'cold' ? 'frost' : 'ember' },
        { axis: 'x', value: brief.reachWithinMin, label: `reach by ${formatQuantity(brief.reachWithinMin, 'min')}`, tone: 'ink' },
      ]
    : [];

  return (
    <div className="flex flex-col gap-gutter">
      {!sameBrief && <Alert tone="caution">These candidates answer different briefs; the band drawn is the first one’s.</Alert>}
      {detailError && <QueryError title="Some details could not be loaded" error={detailError.error} onRetry={() => void detailError.refetch()} />}
      <Card>
        <CardHeader title="Side by side" description="Composition, figures, verification and what binds each candidate." />
        <CardBody>
          <div className="-mx-5 overflow-x-auto">
            <table className="w-full min-w-[48rem] table-fixed">
              <caption className="sr-only">Candidates compared</caption>
              <thead className="border-b border-ink-100">
                <tr className="align-top">
                  <th scope="col" className="w-44 px-5 py-2 text-left text-caption font-bold text-ink-500 uppercase">
                    Candidate
                  </th>
                  {candidates.map((c, k) => (
                    <th key={c.id} scope="col" className="px-3 py-2 text-left">
                      <span className="flex items-start gap-2">
                        <span aria-hidden="true" className="mt-1.5 inline-block h-1 w-5 shrink-0 rounded-full" style={{ background: CATEGORY_COLOURS[k] }} />
                        <span className="font-bold text-ink-900">
                          #{c.rank} {chemistryName(c)}
                        </span>
                      </span>
                      <span className="mt-1 flex flex-wrap items-center gap-2">
                        {c.state === 'shortlisted' && <Badge tone="success">Shortlisted</Badge>}
                        {canWrite && <ShortlistButton candidates={[c]} />}
                      </span>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="divide-y divide-ink-100">
                <Row candidates={candidates}
                  label="Run"
                  render={(c) => (
                    <Link to={`/runs/${c.runId}`} className="font-semibold text-frost-700 hover:underline">
                      Run {c.runId}
                    </Link>
                  )}
                />
                <Row candidates={candidates}
                  label="Verification"
                  render={(c) => (
                    <div className="flex flex-col gap-1">
                      <Badge tone={VERIFICATION_WORDS[c.verification.status].tone} className="self-start">
                        {VERIFICATION_WORDS[c.verification.status].label}
                      </Badge>
                      {c.verification.reasons.length > 0 && (
                        <ul className="list-disc pl-4 text-caption text-ink-700">
                          {c.verification.reasons.map((r) => (
                            <li key={r}>{r}</li>
                          ))}
                        </ul>
                      )}
                    </div>
                  )}
                />
                <Row candidates={candidates} label={`Unit cost (${currency})`} render={(c) => <span className="tabular-nums">{formatMoney(c.unitCost, currency)}</span>} />
                <Row candidates={candidates} label="Pack mass (g)" render={(c) => <span className="tabular-nums">{formatQuantity(c.massG, 'g', 0)} <span className="text-ink-500">({formatQuantity(c.fillMassG, 'g', 0)} fill)</span></span>} />
                <Row candidates={candidates} label={packType === 'cold' ? 'Coldest (°C)' : 'Warmest (°C)'} render={(c) => <span className="tabular-nums">{formatQuantity(extremeTempC(c, packType), '°C')}</span>} />
                <Row candidates={candidates} label="In band (min)" render={(c) => <span className="tabular-nums">{formatQuantity(c.minutesInBand ?? c.verification.minutesInBand, 'min')}</span>} />
                <Row candidates={candidates} label="Hold margin (min)" render={(c) => <span className="tabular-nums">{formatQuantity(holdMarginMin(c), 'min')}</span>} />
                <Row candidates={candidates} label="Time to target (min)" render={(c) => <span className="tabular-nums">{formatQuantity(c.verification.timeToTargetMin, 'min')}</span>} />
                <Row candidates={candidates} label="Hazard score" render={(c) => <span className="tabular-nums">{formatNumber(c.hazardScore)}</span>} />
                <Row candidates={candidates} label="Pareto front" render={(c) => (c.pareto ? 'yes' : 'no')} />
                <Row candidates={candidates}
                  label="Composition (g)"
                  render={(c) => (
                    <ul className="flex flex-col tabular-nums">
                      {c.composition
                        .filter((e) => e.massG > 0)
                        .map((e) => (
                          <li key={e.ingredientId}>
                            {formatNumber(e.massG, { maxFractionDigits: 1 })}&#8239;g {shortIngredientName(e.name)}
                          </li>
                        ))}
                    </ul>
                  )}
                />
                <Row candidates={candidates}
                  label="Binding constraints"
                  render={(c) =>
                    c.bindingConstraints.length ? (
                      <ul className="flex flex-col gap-0.5 text-caption text-ink-700">
                        {c.bindingConstraints.map((b) => (
                          <li key={b.id}>{b.label}</li>
                        ))}
                      </ul>
                    ) : (
                      <span className="text-ink-500">none</span>
                    )
                  }
                />
              </tbody>
            </table>
          </div>
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Temperature over the hold" description="Each candidate through the time model from activation, against the brief’s band (shaded)." />
        <CardBody>
          {curves.some((q) => q.isPending && q.fetchStatus !== 'idle') || details.some((d) => d.isPending) ? (
            <Loading label="Running the thermal model for each candidate…" />
          ) : null}
          {curves.find((q) => q.isError) && <QueryError title="A curve could not be computed" error={curves.find((q) => q.isError)!.error} />}
          <LineChart
            title="Temperature of the compared candidates"
            description="Solid and dashed lines alternate so overlapping curves stay apart."
            series={series}
            bands={bands}
            rules={rules}
            x={{ label: 'Time', unit: 'min', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
            y={{ label: 'Temperature', unit: '°C', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
            tableCaption="Temperature (°C) against time (min) of the compared candidates"
          />
        </CardBody>
      </Card>
    </div>
  );
}
