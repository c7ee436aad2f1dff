import { useId, useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { ChartAxes } from './chart-axes';
import { useWidth } from './line-chart';
import { useChartScales, type ChartAxis, type ChartMargin, type ChartSeries } from './use-chart-scales';

export type Bar = {
  id: string;
  /** Shown above the bar (and in the table). */
  label: string;
  value: number | null;
  /** The value with its unit, written at the bar's end; defaults to the axis format. */
  valueText?: string;
  colour?: string;
};

const ROW = 46;
const MARGIN: ChartMargin = { top: 8, right: 24, bottom: 48, left: 16 };

/**
 * Packwright's horizontal bar chart, on the same scales and axes as the line chart: one labelled
 * bar per row, diverging from zero, with the value written at its end and a table alternative.
 * A bar without a value says so instead of drawing.
 */
export function BarChart({
  title,
  description,
  bars,
  x: xAxis,
  className,
  emptyText = 'Nothing to show.',
}: {
  title: string;
  description?: string;
  bars: readonly Bar[];
  x: ChartAxis;
  className?: string;
  emptyText?: string;
}) {
  const id = useId();
  const { ref, width } = useWidth<HTMLDivElement>(640);
  const height = MARGIN.top + MARGIN.bottom + Math.max(1, bars.length) * ROW;
  const n = bars.length;
  const series = useMemo<ChartSeries[]>(
    () => [{ id: 'bars', label: title, points: bars.filter((b) => b.value !== null && Number.isFinite(b.value)).map((b, k) => ({ x: b.value!, y: k })) }],
    [bars, title],
  );
  const yAxis = useMemo<ChartAxis>(() => ({ label: '', unit: '', domain: [0, Math.max(1, n)] }), [n]);
  const xWithZero = useMemo<ChartAxis>(() => ({ ...xAxis, includeZero: true }), [xAxis]);
  const scales = useChartScales({ width, height, series, x: xWithZero, y: yAxis, margin: MARGIN });
  const { x, innerWidth, formatX } = scales;
  const [showTable, setShowTable] = useState(false);
  const zero = x(0);

  return (
    <figure className={cn('flex flex-col gap-2', className)}>
      <figcaption className="flex flex-wrap items-center justify-between gap-2">
        <span id={`${id}-title`} className="text-small font-bold text-ink-900">
          {title}
        </span>
        <Button variant="ghost" size="sm" aria-expanded={showTable} aria-controls={`${id}-table`} onClick={() => setShowTable((v) => !v)}>
          {showTable ? 'Hide the table' : 'Show as a table'}
        </Button>
      </figcaption>
      {description && <p className="text-caption text-ink-500">{description}</p>}
      <div ref={ref} className="w-full">
        {n === 0 ? (
          <p className="rounded-control border border-dashed border-ink-200 px-4 py-6 text-center text-small text-ink-500">{emptyText}</p>
        ) : (
          <svg width={width} height={height} role="img" aria-labelledby={`${id}-title`} className="block overflow-visible">
            <g transform={`translate(${MARGIN.left},${MARGIN.top})`}>
              <ChartAxes scales={scales} x={xWithZero} y={yAxis} hideY />
              {bars.map((b, k) => {
                const top = k * ROW;
                const has = b.value !== null && Number.isFinite(b.value);
                const end = has ? x(b.value!) : zero;
                const left = Math.min(zero, end);
                const w = Math.max(has ? 1.5 : 0, Math.abs(end - zero));
                const text = has ? (b.valueText ?? formatX(b.value!)) : 'no value (relaxed problem did not solve)';
                const textRight = end >= zero;
                return (
                  <g key={b.id}>
                    <text x={0} y={top + 13} className="fill-ink-800 text-[12px] font-semibold">
                      <title>{b.label}</title>
                      {b.label.length > innerWidth / 6.5 ? `${b.label.slice(0, Math.floor(innerWidth / 6.5) - 1)}…` : b.label}
                    </text>
                    <rect x={left} y={top + 19} width={w} height={16} rx={2} fill={b.colour ?? 'var(--color-frost-500)'} />
                    <text
                      x={textRight ? left + w + 6 : left - 6}
                      y={top + 31}
                      textAnchor={textRight ? 'start' : 'end'}
                      className="fill-ink-700 text-[11px] tabular-nums"
                    >
                      {text}
                    </text>
                  </g>
                );
              })}
              <line x1={zero} x2={zero} y1={0} y2={n * ROW} stroke="var(--color-ink-500)" />
            </g>
          </svg>
        )}
      </div>
      {showTable && (
        <div id={`${id}-table`} className="overflow-auto rounded-control border border-ink-100">
          <table className="w-full text-left text-small tabular-nums">
            <caption className="sr-only">{title}</caption>
            <thead className="bg-ink-50 text-caption font-bold text-ink-600">
              <tr>
                <th scope="col" className="px-3 py-1.5">Row</th>
                <th scope="col" className="px-3 py-1.5">
                  {xAxis.label} ({xAxis.unit})
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {bars.map((b) => (
                <tr key={b.id}>
                  <th scope="row" className="px-3 py-1 font-semibold">
                    {b.label}
                  </th>
                  <td className="px-3 py-1">{b.value !== null && Number.isFinite(b.value) ? (b.valueText ?? formatX(b.value)) : '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </figure>
  );
}
