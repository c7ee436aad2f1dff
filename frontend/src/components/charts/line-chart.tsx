import { useEffect, useId, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { area, bisector, line } from 'd3';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import {
  DEFAULT_MARGIN,
  useChartScales,
  type ChartAxis,
  type ChartBand,
  type ChartMargin,
  type ChartPoint,
  type ChartRule,
  type ChartSeries,
  type ChartTone,
} from './use-chart-scales';

export type { ChartAxis, ChartBand, ChartPoint, ChartRule, ChartSeries, ChartTone } from './use-chart-scales';

/** A shaded range between two curves (e.g. a 5–95 % confidence band); pair it with series that set the domain. */
export type ChartArea = { id: string; label: string; points: readonly { x: number; lo: number; hi: number }[]; tone?: ChartTone; opacity?: number };

const TONE_COLOURS: Record<ChartTone, string> = {
  frost: 'var(--color-frost-500)',
  ember: 'var(--color-ember-500)',
  ink: 'var(--color-ink-700)',
  moss: 'var(--color-moss-600)',
  rust: 'var(--color-rust-500)',
  amber: 'var(--color-amber-600)',
};
const SERIES_TONES: ChartTone[] = ['frost', 'ember', 'ink', 'moss', 'amber', 'rust'];

/** A series' stroke: its own colour (e.g. a categorical palette entry) or its tone's. */
function colourOf(series: ChartSeries, index: number): string {
  return series.colour ?? TONE_COLOURS[toneOf(series, index)];
}

function toneOf(series: ChartSeries, index: number): ChartTone {
  return series.tone ?? SERIES_TONES[index % SERIES_TONES.length]!;
}

const byX = bisector<ChartPoint, number>((p) => p.x).center;

/** The point of a series nearest to x (points sorted by x), or null for an empty series. */
function nearest(points: readonly ChartPoint[], x: number): ChartPoint | null {
  if (points.length === 0) return null;
  return points[byX(points, x)] ?? null;
}

/** Width of the element, following resizes. */
export function useWidth<T extends HTMLElement>(fallback: number) {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const update = () => setWidth(Math.max(240, Math.floor(el.getBoundingClientRect().width)));
    update();
    const observer = new ResizeObserver(update);
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

export type LineChartProps = {
  /** The chart's accessible name and visible caption. */
  title: string;
  /** One sentence read with the chart (what it shows, how to explore it). */
  description?: string;
  series: readonly ChartSeries[];
  x: ChartAxis;
  y: ChartAxis;
  bands?: readonly ChartBand[];
  rules?: readonly ChartRule[];
  /** Shaded ranges drawn under the series. */
  areas?: readonly ChartArea[];
  height?: number;
  margin?: ChartMargin;
  /** Caption of the table alternative; defaults to the title. */
  tableCaption?: string;
  /** The table alternative shows at most this many rows (evenly sampled), default 60. */
  maxTableRows?: number;
  className?: string;
};

/**
 * Packwright's one line chart: D3 scales and axes (through {@link useChartScales}), any number of
 * series, shaded bands, labelled reference lines, a hover and keyboard readout, and a data-table
 * alternative. Focus the chart and use ←/→ (Home/End) to step through the points.
 */
export function LineChart({
  title,
  description,
  series,
  x: xAxis,
  y: yAxis,
  bands = [],
  rules = [],
  areas = [],
  height = 320,
  margin = DEFAULT_MARGIN,
  tableCaption,
  maxTableRows = 60,
  className,
}: LineChartProps) {
  const id = useId();
  const { ref, width } = useWidth<HTMLDivElement>(640);
  const scales = useChartScales({ width, height, series, bands, rules, x: xAxis, y: yAxis, margin });
  const { x, y, innerWidth, innerHeight, xTicks, yTicks, formatX, formatY } = scales;
  const [showTable, setShowTable] = useState(false);

  // Every x at which some series has a point: the stops of the readout.
  const stops = useMemo(() => {
    const set = new Set<number>();
    for (const s of series) for (const p of s.points) if (Number.isFinite(p.x)) set.add(p.x);
    return [...set].sort((a, b) => a - b);
  }, [series]);
  const [active, setActive] = useState<number | null>(null);
  const activeX = active !== null ? stops[Math.min(active, stops.length - 1)] : undefined;

  const path = useMemo(
    () =>
      line<ChartPoint>()
        .defined((p) => Number.isFinite(p.x) && Number.isFinite(p.y))
        .x((p) => x(p.x))
        .y((p) => y(p.y)),
    [x, y],
  );

  const areaPath = useMemo(
    () =>
      area<{ x: number; lo: number; hi: number }>()
        .defined((p) => Number.isFinite(p.x) && Number.isFinite(p.lo) && Number.isFinite(p.hi))
        .x((p) => x(p.x))
        .y0((p) => y(p.lo))
        .y1((p) => y(p.hi)),
    [x, y],
  );

  const readout =
    activeX === undefined
      ? null
      : {
          x: activeX,
          values: series.map((s, i) => ({ series: s, colour: colourOf(s, i), point: nearest(s.points, activeX) })),
        };

  const onPointerMove = (event: PointerEvent<SVGRectElement>) => {
    if (stops.length === 0) return;
    const box = event.currentTarget.getBoundingClientRect();
    const value = x.invert(event.clientX - box.left);
    const index = bisector<number, number>((v) => v).center(stops, value);
    setActive(index);
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (stops.length === 0) return;
    const last = stops.length - 1;
    const step = Math.max(1, Math.round(stops.length / 20));
    const current = active ?? -1;
    let next: number | null = null;
    if (event.key === 'ArrowRight') next = Math.min(last, current + 1);
    else if (event.key === 'ArrowLeft') next = Math.max(0, current < 0 ? last : current - 1);
    else if (event.key === 'PageUp') next = Math.min(last, current + step);
    else if (event.key === 'PageDown') next = Math.max(0, current - step);
    else if (event.key === 'Home') next = 0;
    else if (event.key === 'End') next = last;
    else if (event.key === 'Escape') next = null;
    else return;
    event.preventDefault();
    setActive(next);
  };

  const unitLabel = (axis: ChartAxis) => `${axis.label} (${axis.unit})`;
  const withUnit = (value: string, unit: string) => `${value}\u202f${unit}`;

  const tableRows = useMemo(() => {
    if (stops.length <= maxTableRows) return stops;
    const every = (stops.length - 1) / (maxTableRows - 1);
    return Array.from({ length: maxTableRows }, (_, k) => stops[Math.round(k * every)]!);
  }, [stops, maxTableRows]);

  const empty = series.every((s) => s.points.length === 0);

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
      {description && (
        <p id={`${id}-desc`} className="text-caption text-ink-500">
          {description} Focus the chart and use the arrow keys to read values.
        </p>
      )}

      <div
        ref={ref}
        role="group"
        tabIndex={0}
        aria-labelledby={`${id}-title`}
        aria-describedby={description ? `${id}-desc` : undefined}
        onKeyDown={onKeyDown}
        onBlur={() => setActive(null)}
        className="relative w-full rounded-control"
      >
        <svg width={width} height={height} role="img" aria-labelledby={`${id}-title`} className="block overflow-visible">
          <g transform={`translate(${margin.left},${margin.top})`}>
            {/* Bands first, so lines draw over them. */}
            {bands.map((b) => {
              const top = y(Math.max(b.from, b.to));
              const bottom = y(Math.min(b.from, b.to));
              const tone = b.tone ?? 'moss';
              return (
                <g key={`band-${b.label}`}>
                  <rect x={0} width={innerWidth} y={top} height={Math.max(0, bottom - top)} fill={TONE_COLOURS[tone]} opacity={0.12} />
                  <text x={innerWidth - 6} y={top + 14} textAnchor="end" className="fill-ink-600 text-[11px] font-semibold">
                    {b.label}
                  </text>
                </g>
              );
            })}

            {/* Grid and y axis. */}
            {yTicks.map((t) => (
              <g key={`y-${t}`} transform={`translate(0,${y(t)})`}>
                <line x2={innerWidth} stroke="var(--color-ink-100)" />
                <text x={-8} dy="0.32em" textAnchor="end" className="fill-ink-500 text-[11px] tabular-nums">
                  {formatY(t)}
                </text>
              </g>
            ))}
            <line y2={innerHeight} stroke="var(--color-ink-300)" />
            <text
              transform={`translate(${-margin.left + 14},${innerHeight / 2}) rotate(-90)`}
              textAnchor="middle"
              className="fill-ink-700 text-[12px] font-semibold"
            >
              {unitLabel(yAxis)}
            </text>

            {/* x axis. */}
            <g transform={`translate(0,${innerHeight})`}>
              <line x2={innerWidth} stroke="var(--color-ink-300)" />
              {xTicks.map((t) => (
                <g key={`x-${t}`} transform={`translate(${x(t)},0)`}>
                  <line y2={5} stroke="var(--color-ink-300)" />
                  <text y={18} textAnchor="middle" className="fill-ink-500 text-[11px] tabular-nums">
                    {formatX(t)}
                  </text>
                </g>
              ))}
              <text x={innerWidth / 2} y={40} textAnchor="middle" className="fill-ink-700 text-[12px] font-semibold">
                {unitLabel(xAxis)}
              </text>
            </g>

            {/* Reference lines. */}
            {rules.map((r) => {
              const colour = TONE_COLOURS[r.tone ?? 'ink'];
              return r.axis === 'x' ? (
                <g key={`rule-x-${r.label}`} transform={`translate(${x(r.value)},0)`}>
                  <line y2={innerHeight} stroke={colour} strokeDasharray="4 3" />
                  <text x={4} y={12} className="text-[11px] font-semibold" fill={colour}>
                    {r.label}
                  </text>
                </g>
              ) : (
                <g key={`rule-y-${r.label}`} transform={`translate(0,${y(r.value)})`}>
                  <line x2={innerWidth} stroke={colour} strokeDasharray="4 3" />
                  <text x={4} y={-4} className="text-[11px] font-semibold" fill={colour}>
                    {r.label}
                  </text>
                </g>
              );
            })}

            {/* Series, over any shaded areas. */}
            <g clipPath={`url(#${CSS.escape(id)}-clip)`}>
              {areas.map((a) => (
                <path key={a.id} d={areaPath(a.points as { x: number; lo: number; hi: number }[]) ?? undefined} fill={TONE_COLOURS[a.tone ?? 'frost']} opacity={a.opacity ?? 0.2} aria-label={a.label} />
              ))}
              {series.map((s, i) => {
                const colour = colourOf(s, i);
                return s.pointsOnly ? (
                  <g key={s.id}>
                    {s.points.map((p, k) => (
                      <circle key={k} cx={x(p.x)} cy={y(p.y)} r={3.5} fill={colour} />
                    ))}
                  </g>
                ) : (
                  <path
                    key={s.id}
                    d={path(s.points as ChartPoint[]) ?? undefined}
                    fill="none"
                    stroke={colour}
                    strokeWidth={2.25}
                    strokeDasharray={s.dashed ? '6 4' : undefined}
                    strokeLinejoin="round"
                  />
                );
              })}
            </g>
            <clipPath id={`${id}-clip`}>
              <rect x={-4} y={-4} width={innerWidth + 8} height={innerHeight + 8} />
            </clipPath>

            {/* Hover guide. */}
            {readout && (
              <g aria-hidden="true">
                <line x1={x(readout.x)} x2={x(readout.x)} y2={innerHeight} stroke="var(--color-ink-400)" />
                {readout.values.map(
                  (v) =>
                    v.point &&
                    Number.isFinite(v.point.y) && (
                      <circle
                        key={v.series.id}
                        cx={x(v.point.x)}
                        cy={y(v.point.y)}
                        r={4.5}
                        fill="white"
                        stroke={v.colour}
                        strokeWidth={2.5}
                      />
                    ),
                )}
              </g>
            )}
            <rect
              width={innerWidth}
              height={innerHeight}
              fill="transparent"
              onPointerMove={onPointerMove}
              onPointerLeave={() => setActive(null)}
            />
          </g>
        </svg>

        {empty && (
          <p className="absolute inset-0 flex items-center justify-center text-small text-ink-500">No points to draw yet.</p>
        )}

        {readout && (
          <div
            aria-hidden="true"
            className="pointer-events-none absolute top-2 rounded-control border border-ink-100 bg-surface/95 px-3 py-2 text-caption shadow-card"
            style={
              x(readout.x) + margin.left > width / 2
                ? { left: margin.left + 8 }
                : { right: margin.right + 8 }
            }
          >
            <p className="font-bold text-ink-900">
              {xAxis.label}: {withUnit(formatX(readout.x), xAxis.unit)}
            </p>
            {readout.values.map((v) => (
              <p key={v.series.id} className="flex items-center gap-2 tabular-nums text-ink-700">
                <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ background: v.colour }} />
                {v.series.label}: {v.point ? withUnit(formatY(v.point.y), yAxis.unit) : '—'}
              </p>
            ))}
          </div>
        )}
      </div>

      {/* What the readout shows, for screen readers. */}
      <p aria-live="polite" className="sr-only">
        {readout
          ? `${xAxis.label} ${withUnit(formatX(readout.x), xAxis.unit)}: ` +
            readout.values.map((v) => `${v.series.label} ${v.point ? withUnit(formatY(v.point.y), yAxis.unit) : 'no value'}`).join(', ')
          : ''}
      </p>

      {series.length > 1 && (
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-caption text-ink-600" aria-label="Legend">
          {series.map((s, i) => (
            <li key={s.id} className="flex items-center gap-1.5">
              <span
                aria-hidden="true"
                className="inline-block h-0.5 w-5"
                style={{ background: colourOf(s, i), opacity: s.dashed ? 0.6 : 1 }}
              />
              {s.label}
            </li>
          ))}
        </ul>
      )}

      {showTable && (
        <div id={`${id}-table`} className="max-h-80 overflow-auto rounded-control border border-ink-100">
          <table className="w-full text-left text-small tabular-nums">
            <caption className="sr-only">{tableCaption ?? title}</caption>
            <thead className="sticky top-0 bg-ink-50 text-caption font-bold text-ink-600">
              <tr>
                <th scope="col" className="px-3 py-1.5">
                  {unitLabel(xAxis)}
                </th>
                {series.map((s) => (
                  <th key={s.id} scope="col" className="px-3 py-1.5">
                    {s.label} ({yAxis.unit})
                  </th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {tableRows.map((xv) => (
                <tr key={xv}>
                  <th scope="row" className="px-3 py-1 font-semibold">
                    {formatX(xv)}
                  </th>
                  {series.map((s) => {
                    const p = s.points.find((q) => q.x === xv);
                    return (
                      <td key={s.id} className="px-3 py-1">
                        {p && Number.isFinite(p.y) ? formatY(p.y) : '—'}
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
          {stops.length > tableRows.length && (
            <p className="px-3 py-1.5 text-caption text-ink-500">
              Every {Math.round(stops.length / tableRows.length)}th of {stops.length} points shown.
            </p>
          )}
        </div>
      )}
    </figure>
  );
}
