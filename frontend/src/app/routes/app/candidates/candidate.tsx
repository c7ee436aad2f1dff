import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { LineChart, type ChartBand } from '@/components/charts/line-chart';
import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getCandidateQueryOptions, useCandidate } from '@/features/candidates/api/get-candidate';
import { getReviewHistoryQueryOptions } from '@/features/reviews/api/get-review-history';
import { HazardPanel } from '@/features/reviews/components/hazard-panel';
import { ReviewPanel } from '@/features/reviews/components/review-panel';
import { briefBand, useCandidateCurves } from '@/lib/candidate-curves';
import { VERIFICATION_WORDS, chemistryName } from '@/lib/candidate-figures';
import { formatMoney, formatNumber, formatQuantity } from '@/lib/format';
import { useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';
import { CandidateConfidence } from '@/components/charts/candidate-confidence';
import { idFrom } from '@/lib/route-params';


export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const id = idFrom(params.id);
    if (id) {
      void queryClient.prefetchQuery(getCandidateQueryOptions(id));
      void queryClient.prefetchQuery(getReviewHistoryQueryOptions(id));
    }
    return null;
  };

/** The brief's band clipped to the drawn temperatures (a band without a floor would stretch the axis). */
function curveBand(points: { tempC: number }[], band: { minC: number; maxC: number }, targetC: number): ChartBand[] {
  const temps = points.map((p) => p.tempC);
  return [{ from: Math.max(band.minC, Math.min(...temps, targetC) - 2), to: Math.min(band.maxC, Math.max(...temps, targetC) + 2), label: 'Target band', tone: 'moss' }];
}

export default function CandidateRoute() {
  const me = useSessionUser();
  const id = idFrom(useParams().id);
  const q = useCandidate(id);
  const [curve] = useCandidateCurves(q.data ? [{ candidate: q.data.candidate, brief: q.data.brief }] : []);

  if (!id || q.isError) return <QueryError title="This candidate could not be loaded" error={q.error ?? new Error('Not a candidate id.')} onRetry={() => void q.refetch()} retrying={q.isFetching} />;
  if (q.isPending) return <Loading label="Loading the candidate…" />;
  const { candidate: c, brief, currency } = q.data;
  const v = VERIFICATION_WORDS[c.verification.status];
  const band = briefBand(brief);
  return (
    <>
      <title>{`${chemistryName(c)} · candidate ${c.id} · Packwright`}</title>
      <p className="mb-2 text-small">
        <Link to={`/runs/${c.runId}`} className="font-semibold text-frost-700 hover:underline">
          ← Run {c.runId} · {brief.name}
        </Link>
      </p>
      <PageHeader title={chemistryName(c)} description={`Candidate ${c.id} for “${brief.name}” (${brief.packType} pack, target ${formatQuantity(brief.targetTempC, '°C')}, hold ${formatQuantity(brief.holdMin, 'min')}).`} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex flex-col gap-6">
          <Card>
            <CardHeader title="Composition and figures" action={<Badge tone={v.tone}>{v.label}</Badge>} />
            <CardBody className="flex flex-col gap-4">
              <table className="w-full text-small">
                <caption className="sr-only">Composition in grams</caption>
                <thead>
                  <tr className="text-left text-ink-600">
                    <th scope="col" className="py-1 pr-3 font-semibold">Ingredient</th>
                    <th scope="col" className="py-1 pr-3 font-semibold">Role</th>
                    <th scope="col" className="py-1 text-right font-semibold">Mass (g)</th>
                  </tr>
                </thead>
                <tbody>
                  {c.composition
                    .filter((e) => e.massG > 0)
                    .map((e) => (
                      <tr key={e.ingredientId} className="border-t border-ink-100">
                        <td className="py-1.5 pr-3">
                          <Link to={`/library/${e.ingredientId}`} className="text-frost-700 hover:underline">
                            {e.name}
                          </Link>
                        </td>
                        <td className="py-1.5 pr-3">{e.role}</td>
                        <td className="py-1.5 text-right tabular-nums">{formatNumber(e.massG, { maxFractionDigits: 1 })}</td>
                      </tr>
                    ))}
                </tbody>
              </table>
              <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-small sm:grid-cols-3">
                <div>
                  <dt className="text-ink-500">Pack mass</dt>
                  <dd className="font-semibold tabular-nums">{formatQuantity(c.massG, 'g', 0)}</dd>
                </div>
                <div>
                  <dt className="text-ink-500">Unit cost ({currency})</dt>
                  <dd className="font-semibold tabular-nums">{formatMoney(c.unitCost, currency)}</dd>
                </div>
                <div>
                  <dt className="text-ink-500">In band</dt>
                  <dd className="font-semibold tabular-nums">{formatQuantity(c.verification.minutesInBand, 'min')}</dd>
                </div>
                <div>
                  <dt className="text-ink-500">Coldest</dt>
                  <dd className="font-semibold tabular-nums">{formatQuantity(c.verification.minTempC, '°C')}</dd>
                </div>
                <div>
                  <dt className="text-ink-500">Warmest</dt>
                  <dd className="font-semibold tabular-nums">{formatQuantity(c.verification.maxTempC, '°C')}</dd>
                </div>
                <div>
                  <dt className="text-ink-500">Time to target</dt>
                  <dd className="font-semibold tabular-nums">{formatQuantity(c.verification.timeToTargetMin, 'min')}</dd>
                </div>
              </dl>
              {c.verification.reasons.length > 0 && (
                <ul className="list-disc pl-5 text-small text-ink-700">
                  {c.verification.reasons.map((r) => (
                    <li key={r}>{r}</li>
                  ))}
                </ul>
              )}
              {c.warnings.length > 0 && (
                <ul className="flex flex-col gap-1 text-caption text-ink-600">
                  {c.warnings.map((w) => (
                    <li key={w.code + w.message}>{w.message}</li>
                  ))}
                </ul>
              )}
            </CardBody>
          </Card>
          <Card>
            <CardHeader title="Temperature over the hold" description="The time model from activation, against the brief’s band (shaded)." />
            <CardBody>
              {curve?.isPending && curve.fetchStatus !== 'idle' && <Loading label="Running the thermal model…" />}
              {curve?.isError && <QueryError title="The curve could not be computed" error={curve.error} />}
              {curve?.data && (
                <LineChart
                  title={`Temperature of candidate ${c.id}`}
                  series={[{ id: String(c.id), label: chemistryName(c), points: curve.data.map((p) => ({ x: p.tMin, y: p.tempC })), tone: brief.packType === 'cold' ? 'frost' : 'ember' }]}
                  bands={curveBand(curve.data, band, brief.targetTempC)}
                  x={{ label: 'Time', unit: 'min', format: (x) => formatNumber(x, { maxFractionDigits: 1 }) }}
                  y={{ label: 'Temperature', unit: '°C', format: (y) => formatNumber(y, { maxFractionDigits: 1 }) }}
                  height={280}
                />
              )}
            </CardBody>
          </Card>
          <Card>
            <CardHeader title="How sure the prediction is" description="Monte Carlo over the uncertainties of enthalpy, heat capacity and heat exchange." />
            <CardBody>
              <CandidateConfidence candidateId={c.id} compact height={220} modelled={c.verification.status} />
            </CardBody>
          </Card>
          <HazardPanel candidateId={c.id} />
        </div>
        <div>
          <ReviewPanel candidate={c} role={me.role} />
        </div>
      </div>
    </>
  );
}
