import { useMemo, useState } from 'react';
import type { CandidateRecord, RunDetail } from '@shared/schemas/runs';
import { BarChart } from '@/components/charts/bar-chart';
import { LineChart, type ChartBand, type ChartRule, type ChartSeries } from '@/components/charts/line-chart';
import { CATEGORY_COLOURS, categoryStyle } from '@/components/charts/palette';
import { ScatterChart, type ScatterGroup, type ScatterPoint } from '@/components/charts/scatter-chart';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { VERIFICATION_WORDS, candidateRef, chemistryName, holdMarginMin, leadActive, objectiveUnitText } from '@/lib/candidate-figures';
import { briefBand, resampleCurve, useCandidateCurves, type Curve } from '@/lib/candidate-curves';
import { formatMoney, formatNumber, formatQuantity } from '@/lib/format';
import { parseSweep } from '../lib/sweep';
import { CandidateConfidence } from '@/components/charts/candidate-confidence';

type MetricId = 'cost' | 'mass' | 'margin' | 'hazard';
type Metric = { id: MetricId; label: string; unit: (currency: string) => string; value: (c: CandidateRecord) => number | null; better: 'low' | 'high' };

/** The four figures the Pareto front is taken over (DEVELOPERS.md, "Briefs and the optimiser"). */
const METRICS: readonly Metric[] = [
  { id: 'cost', label: 'Unit cost', unit: (currency) => currency, value: (c) => c.unitCostValue, better: 'low' },
  { id: 'mass', label: 'Pack mass', unit: () => 'g', value: (c) => c.massG, better: 'low' },
  { id: 'margin', label: 'Hold margin', unit: () => 'min', value: (c) => holdMarginMin(c), better: 'high' },
  { id: 'hazard', label: 'Hazard score', unit: () => 'score', value: (c) => c.hazardScore, better: 'low' },
];
const metricOf = (id: MetricId) => METRICS.find((m) => m.id === id)!;

/** Points no other point beats on both chosen axes (the 2-D trade-off front for these axes). */
function front2d(points: { x: number; y: number }[], xBetter: 'low' | 'high', yBetter: 'low' | 'high') {
  const sx = xBetter === 'low' ? 1 : -1;
  const sy = yBetter === 'low' ? 1 : -1;
  return points.filter(
    (p) => !points.some((q) => sx * q.x <= sx * p.x && sy * q.y <= sy * p.y && (sx * q.x < sx * p.x || sy * q.y < sy * p.y)),
  );
}

/**
 * The trade-off view of a run: the candidates on a Pareto scatter with axes to choose, the
 * temperature curves of the selected ones against the brief's band, what relaxing each binding
 * constraint would buy, and the target sweep. Selection is shared with the candidates table.
 */
export function TradeOffView({
  run,
  candidates,
  selectedIds,
  focus,
  onToggle,
}: {
  run: RunDetail;
  candidates: CandidateRecord[];
  selectedIds: readonly number[];
  /** The candidates the curves and sensitivity show: the selection, else the top one. */
  focus: CandidateRecord[];
  onToggle: (id: number) => void;
}) {
  const [xId, setXId] = useState<MetricId>('cost');
  const [yId, setYId] = useState<MetricId>('margin');
  const currency = run.currency;
  const xm = metricOf(xId);
  const ym = metricOf(yId);

  const groups = useMemo<ScatterGroup[]>(() => {
    const names: string[] = [];
    for (const c of candidates) {
      const g = leadActive(c);
      if (!names.includes(g)) names.push(g);
    }
    return names.map((name, k) => ({ id: name, label: name, colour: categoryStyle(k).colour, symbol: categoryStyle(k).symbol }));
  }, [candidates]);

  const selectedSet = useMemo(() => new Set(selectedIds.map(String)), [selectedIds]);
  const points = useMemo<ScatterPoint[]>(
    () =>
      candidates.map((c) => {
        const v = VERIFICATION_WORDS[c.verification.status];
        const margin = holdMarginMin(c);
        return {
          id: String(c.id),
          x: xm.value(c) ?? Number.NaN,
          y: ym.value(c) ?? Number.NaN,
          group: leadActive(c),
          label: `${candidateRef(c)} ${chemistryName(c)}`,
          details: [
            v.label + (c.pareto ? ' · Pareto front' : ''),
            `${formatMoney(c.unitCost, currency)} · ${formatQuantity(c.massG, 'g', 0)} · margin ${formatQuantity(margin, 'min')}`,
          ],
          emphasised: c.pareto,
          hollow: c.verification.status === 'missed' || c.verification.status === 'failed',
          tag: selectedSet.has(String(c.id)) ? candidateRef(c) : undefined,
        };
      }),
    [candidates, xm, ym, currency, selectedSet],
  );
  const frontier = useMemo(
    () => (xId === yId ? [] : front2d(points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)), xm.better, ym.better)),
    [points, xId, yId, xm.better, ym.better],
  );

  const axisSelect = (label: string, value: MetricId, onChange: (id: MetricId) => void) => (
    <SelectField label={label} controlSize="sm" value={value} onChange={(e) => onChange(e.target.value as MetricId)} containerClassName="w-44">
      {METRICS.map((m) => (
        <option key={m.id} value={m.id}>
          {m.label} ({m.unit(currency)})
        </option>
      ))}
    </SelectField>
  );

  const allHazardZero = candidates.every((c) => c.hazardScore === 0);
  // Ticks keep the scale's own precision (close values stay distinguishable).
  const xAxis = useMemo(() => ({ label: xm.label, unit: xm.unit(currency) }), [xm, currency]);
  const yAxis = useMemo(() => ({ label: ym.label, unit: ym.unit(currency) }), [ym, currency]);
  const marginShown = xId === 'margin' || yId === 'margin';

  return (
    <Card>
      <CardHeader
        title="Trade-off view"
        description="Weigh the candidates against each other. Click a point (or a row above) to select it; the curves and bars follow."
      />
      <CardBody className="flex flex-col gap-8">
        <div className="grid grid-cols-1 gap-8 xl:grid-cols-2">
          <div className="flex flex-col gap-3">
            <div className="flex flex-wrap gap-3">
              {axisSelect('Across (x axis)', xId, setXId)}
              {axisSelect('Up (y axis)', yId, setYId)}
            </div>
            <ScatterChart
              title={`${ym.label} against ${xm.label.toLowerCase()}`}
              description={`Each point is a candidate, coloured and shaped by its main active. ${xm.better === 'low' ? 'Left' : 'Right'} and ${ym.better === 'low' ? 'lower' : 'higher'} is better.${
                (xId === 'hazard' || yId === 'hazard') && allHazardZero ? ' No ingredient of these candidates carries hazard data, so every hazard score is 0.' : ''
              }${
                marginShown
                  ? ' Hold margin is the simulated time in the band beyond the hold; the simulation runs for reach + 1.5 × hold, so margins top out near half the hold.'
                  : ''
              }`}
              points={points}
              groups={groups}
              x={xAxis}
              y={yAxis}
              selectedIds={selectedSet}
              onToggle={(id) => onToggle(Number(id))}
              hrefOf={(id) => `/candidates/${id}`}
              frontier={frontier}
              frontierLabel="best trade-off on these two axes"
              styleNotes={{ emphasised: 'Pareto front (all four figures)', hollow: 'misses the brief', selected: 'selected' }}
            />
          </div>
          <CandidateCurves run={run} focus={focus} />
        </div>
        <div className="grid grid-cols-1 gap-8 xl:grid-cols-2">
          <Sensitivity run={run} focus={focus} />
          <TargetSweep run={run} />
        </div>
      </CardBody>
    </Card>
  );
}

function CandidateCurves({ run, focus }: { run: RunDetail; focus: CandidateRecord[] }) {
  const brief = run.brief;
  const curves = useCandidateCurves(focus.map((c) => ({ candidate: c as CandidateRecord & { curve?: Curve }, brief })));
  const band = briefBand(brief);
  const horizon = brief.reachWithinMin + 1.5 * brief.holdMin;
  const step = Math.max(0.25, Math.round((horizon / 90) * 4) / 4);

  const series: ChartSeries[] = focus.flatMap((c, k) => {
    const data = curves[k]?.data;
    return data ? [{ id: String(c.id), label: `${candidateRef(c)} ${chemistryName(c)}`, colour: CATEGORY_COLOURS[k % CATEGORY_COLOURS.length], dashed: k % 2 === 1, points: resampleCurve(data, step, horizon) }] : [];
  });
  const temps = series.flatMap((s) => s.points.map((p) => p.y));
  const lo = Math.min(brief.targetTempC, ...temps);
  const hi = Math.max(brief.targetTempC, ...temps);
  // An open side of the band ("no limit") is drawn to just past the curves.
  const bands: ChartBand[] = [
    { from: Math.max(band.minC, lo - 2), to: Math.min(band.maxC, hi + 2), label: `Target band, held ${formatQuantity(brief.holdMin, 'min')}`, tone: 'moss' },
  ];
  const rules: ChartRule[] = [
    { axis: 'y', value: brief.targetTempC, label: `Target ${brief.packType === 'cold' ? '≤' : '≥'} ${formatQuantity(brief.targetTempC, '°C')}`, tone: brief.packType === 'cold' ? 'frost' : 'ember' },
    { axis: 'x', value: brief.reachWithinMin, label: `reach by ${formatQuantity(brief.reachWithinMin, 'min')}`, tone: 'ink' },
  ];
  const pending = curves.some((q) => q.isPending && q.fetchStatus !== 'idle');
  const failed = curves.find((q) => q.isError);

  return (
    <div className="flex flex-col gap-3">
      {focus.length === 0 ? (
        <EmptyState title="No candidate to draw">Select a candidate to see its temperature over the hold.</EmptyState>
      ) : (
        <>
          {failed && <QueryError title="A curve could not be computed" error={failed.error} onRetry={() => void failed.refetch()} />}
          {pending && <Loading label="Running the thermal model for the selected candidates…" className="py-2" />}
          <LineChart
            title={focus.length > 1 ? 'Temperature of the selected candidates' : `Temperature of ${candidateRef(focus[0]!)} ${chemistryName(focus[0]!)}`}
            description={`The time model from activation, against the brief's band (shaded). ${focus.length > 1 ? '' : 'Select more candidates to overlay them.'}`}
            series={series}
            bands={bands}
            rules={rules}
            x={{ label: 'Time', unit: 'min', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
            y={{ label: 'Temperature', unit: '°C', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
            tableCaption="Temperature (°C) against time (min) of the selected candidates"
          />
          <CandidateConfidence candidateId={focus[0]!.id} modelled={focus[0]!.verification.status} title={`How sure: ${candidateRef(focus[0]!)} ${chemistryName(focus[0]!)}, 5–95 % band`} height={220} />
        </>
      )}
    </div>
  );
}

function Sensitivity({ run, focus }: { run: RunDetail; focus: CandidateRecord[] }) {
  const [chosen, setChosen] = useState<number | null>(null);
  const candidate = focus.find((c) => c.id === chosen) ?? focus[0];
  if (!candidate) return <EmptyState title="No candidate selected" />;
  const objUnit = objectiveUnitText(run.objectiveUnit ?? candidate.sensitivity[0]?.objectiveUnit, run.currency);
  const unit = (u: string) => (u === 'currency' ? run.currency : u);
  const bars = candidate.sensitivity.map((s) => ({
    id: s.constraintId,
    label: s.label,
    value: s.objectiveChangePerUnit,
    valueText:
      s.objectiveChangePerUnit === null
        ? undefined
        : `${formatNumber(s.objectiveChangePerUnit, { maxFractionDigits: Math.abs(s.objectiveChangePerUnit) < 0.01 ? 5 : 3 })} ${objectiveUnitText(s.objectiveUnit, run.currency)} per ${unit(s.unit)}`,
    colour: s.objectiveChangePerUnit !== null && s.objectiveChangePerUnit < 0 ? 'var(--color-ember-500)' : 'var(--color-frost-500)',
  }));
  return (
    <div className="flex flex-col gap-3">
      {focus.length > 1 && (
        <SelectField label="Sensitivity of" controlSize="sm" value={candidate.id} onChange={(e) => setChosen(Number(e.target.value))} containerClassName="max-w-sm">
          {focus.map((c) => (
            <option key={c.id} value={c.id}>
              {candidateRef(c)} {chemistryName(c)}
            </option>
          ))}
        </SelectField>
      )}
      <BarChart
        title={`What relaxing each binding constraint buys · ${candidateRef(candidate)}`}
        description={`Change of the objective (${objUnit}) when a binding constraint is relaxed by one of its own units, re-solved. Units differ per row; compare within a row.`}
        bars={bars}
        x={{ label: 'Objective change per unit relaxed', unit: `${objUnit} per unit` }}
        emptyText="No binding constraint: nothing limits this candidate at the margin."
      />
    </div>
  );
}

function TargetSweep({ run }: { run: RunDetail }) {
  const sweep = parseSweep(run.sweep);
  const objUnit = objectiveUnitText(sweep?.objectiveUnit ?? run.objectiveUnit, run.currency);
  if (!sweep)
    return (
      <div className="flex flex-col gap-2">
        <p className="text-small font-bold text-ink-900">Target sweep</p>
        <EmptyState title="No target sweep for this run">
          A sweep shows the best objective against the target temperature or the hold time, so you can see what a degree or a
          minute costs. This run did not compute one.
        </EmptyState>
      </div>
    );
  const byTemp = sweep.parameter === 'targetTempC';
  const current = byTemp ? run.brief.targetTempC : run.brief.holdMin;
  const series: ChartSeries[] = [
    {
      id: 'sweep',
      label: 'Best objective',
      tone: 'ink',
      points: sweep.points.filter((p) => p.bestObjective !== null).map((p) => ({ x: p.value, y: p.bestObjective! })),
    },
  ];
  const infeasible = sweep.points.filter((p) => p.bestObjective === null).length;
  return (
    <LineChart
      title={`Target sweep: best objective against ${byTemp ? 'target temperature' : 'hold time'}`}
      description={`The best objective ${objUnit ? `(${objUnit}) ` : ''}among sets that meet the brief in simulation at each ${byTemp ? 'target' : 'hold time'}, other limits as in the brief; at this brief's own value it is rank 1.${
        infeasible ? ` ${infeasible} of ${sweep.points.length} values had no set that meets the brief and are left out.` : ''
      }`}
      series={series}
      rules={[{ axis: 'x', value: current, label: `this brief: ${formatQuantity(current, byTemp ? '°C' : 'min')}`, tone: 'ember' }]}
      x={{ label: byTemp ? 'Target temperature' : 'Hold time', unit: byTemp ? '°C' : 'min', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
      y={{ label: 'Best objective', unit: objUnit || '—', format: (v) => formatNumber(v, { maxFractionDigits: 3 }) }}
      height={280}
    />
  );
}
