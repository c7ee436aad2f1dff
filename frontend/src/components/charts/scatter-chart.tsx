import { useId, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import { line, symbol as d3symbol, symbolCircle, type SymbolType } from 'd3';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { ChartAxes } from './chart-axes';
import { useWidth } from './line-chart';
import { DEFAULT_MARGIN, useChartScales, type ChartAxis, type ChartPoint, type ChartSeries } from './use-chart-scales';

export type ScatterGroup = { id: string; label: string; colour: string; symbol: SymbolType };

export type ScatterPoint = {
  id: string;
  x: number;
  y: number;
  group: string;
  /** Accessible name and tooltip heading. */
  label: string;
  /** Lines of the hover / focus readout. */
  details: string[];
  /** Drawn larger with a dark outline (e.g. on the Pareto front). */
  emphasised?: boolean;
  /** Drawn hollow (e.g. misses the brief). */
  hollow?: boolean;
  /** A short tag written beside the marker (e.g. the rank of a selected candidate). */
  tag?: string;
};

export type ScatterChartProps = {
  title: string;
  description?: string;
  points: readonly ScatterPoint[];
  groups: readonly ScatterGroup[];
  x: ChartAxis;
  y: ChartAxis;
  selectedIds: ReadonlySet<string>;
  /** Click, Enter or Space on a point. */
  onToggle?: (id: string) => void;
  /** The page of a point's record: a double-click or the O key opens it, and the table and readout link to it. */
  hrefOf?: (id: string) => string;
  /** A line through some points (e.g. the 2-D trade-off front for the chosen axes), drawn dashed. */
  frontier?: readonly ChartPoint[];
  frontierLabel?: string;
  /** Legend entries for the marker styles (emphasised, hollow, selected). */
  styleNotes?: { emphasised?: string; hollow?: string; selected?: string };
  height?: number;
  className?: string;
};

const AREA = { normal: 70, emphasised: 130 };

/**
 * Packwright's scatter plot, on the same scales and axes as the line chart: points grouped by
 * colour and marker shape, with a legend, a hover and focus readout, click or keyboard selection,
 * and a table alternative. The plot is one tab stop; inside it the arrow keys move from point to
 * point (in x order), Enter or Space selects, Escape leaves the readout.
 */
export function ScatterChart({
  title,
  description,
  points,
  groups,
  x: xAxis,
  y: yAxis,
  selectedIds,
  onToggle,
  hrefOf,
  frontier,
  frontierLabel,
  styleNotes,
  height = 360,
  className,
}: ScatterChartProps) {
  const id = useId();
  const navigate = useNavigate();
  const { ref, width } = useWidth<HTMLDivElement>(640);
  const margin = DEFAULT_MARGIN;
  const finite = useMemo(() => points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)), [points]);
  const series = useMemo<ChartSeries[]>(() => [{ id: 'points', label: title, points: finite.map((p) => ({ x: p.x, y: p.y })), pointsOnly: true }], [finite, title]);
  const scales = useChartScales({ width, height, series, x: xAxis, y: yAxis, margin });
  const { x, y, innerWidth, formatX, formatY } = scales;
  const [showTable, setShowTable] = useState(false);
  const [hover, setHover] = useState<string | null>(null);
  const [focusId, setFocusId] = useState<string | null>(null);
  const pointRefs = useRef(new Map<string, SVGGElement>());

  const order = useMemo(() => [...finite].sort((a, b) => a.x - b.x || a.y - b.y), [finite]);
  const byGroup = useMemo(() => new Map(groups.map((g) => [g.id, g])), [groups]);
  const shown = hover ?? focusId;
  const active = shown ? finite.find((p) => p.id === shown) : undefined;
  const tabStop = focusId ?? order[0]?.id;
  const focused = focusId ? finite.find((p) => p.id === focusId) : undefined;

  const frontierPath = useMemo(() => {
    if (!frontier || frontier.length < 2) return null;
    return line<ChartPoint>()
      .x((p) => x(p.x))
      .y((p) => y(p.y))([...frontier].sort((a, b) => a.x - b.x));
  }, [frontier, x, y]);

  const moveTo = (k: number) => {
    const p = order[Math.max(0, Math.min(order.length - 1, k))];
    if (!p) return;
    setFocusId(p.id);
    pointRefs.current.get(p.id)?.focus();
  };

  const onKeyDown = (event: KeyboardEvent<SVGGElement>, p: ScatterPoint) => {
    const k = order.findIndex((q) => q.id === p.id);
    if (event.key === 'ArrowRight' || event.key === 'ArrowDown') moveTo(k + 1);
    else if (event.key === 'ArrowLeft' || event.key === 'ArrowUp') moveTo(k - 1);
    else if (event.key === 'Home') moveTo(0);
    else if (event.key === 'End') moveTo(order.length - 1);
    else if (event.key === 'Enter' || event.key === ' ') onToggle?.(p.id);
    else if ((event.key === 'o' || event.key === 'O') && hrefOf) void navigate(hrefOf(p.id));
    else if (event.key === 'Escape') setFocusId(null);
    else return;
    event.preventDefault();
  };

  const symbolPath = (type: SymbolType, size: number) => d3symbol(type, size)() ?? '';
  const unitLabel = (axis: ChartAxis) => `${axis.label} (${axis.unit})`;

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
          {description} Tab into the plot, move with the arrow keys, select with Enter{hrefOf ? ', open with O or a double-click' : ''}.
        </p>
      )}

      <div ref={ref} className="relative w-full">
        <svg width={width} height={height} role="group" aria-labelledby={`${id}-title`} aria-describedby={description ? `${id}-desc` : undefined} className="block overflow-visible">
          <g transform={`translate(${margin.left},${margin.top})`}>
            <ChartAxes scales={scales} x={xAxis} y={yAxis} />
            {frontierPath && <path d={frontierPath} fill="none" stroke="var(--color-ink-500)" strokeWidth={1.5} strokeDasharray="5 4" aria-hidden="true" />}
            {/* Selected points last, so they draw on top. */}
            {[...finite]
              .sort((a, b) => Number(selectedIds.has(a.id)) - Number(selectedIds.has(b.id)) || Number(!!a.emphasised) - Number(!!b.emphasised))
              .map((p) => {
                const g = byGroup.get(p.group);
                const colour = g?.colour ?? 'var(--color-ink-700)';
                const selected = selectedIds.has(p.id);
                const size = p.emphasised ? AREA.emphasised : AREA.normal;
                const focused = shown === p.id;
                return (
                  <g
                    key={p.id}
                    ref={(el) => {
                      if (el) pointRefs.current.set(p.id, el);
                      else pointRefs.current.delete(p.id);
                    }}
                    transform={`translate(${x(p.x)},${y(p.y)})`}
                    tabIndex={p.id === tabStop ? 0 : -1}
                    role="checkbox"
                    aria-checked={selected}
                    aria-label={`${p.label}: ${xAxis.label} ${formatX(p.x)} ${xAxis.unit}, ${yAxis.label} ${formatY(p.y)} ${yAxis.unit}. ${p.details.join('. ')}`}
                    onClick={() => {
                      setFocusId(p.id);
                      onToggle?.(p.id);
                    }}
                    onDoubleClick={hrefOf ? () => void navigate(hrefOf(p.id)) : undefined}
                    onKeyDown={(e) => onKeyDown(e, p)}
                    onFocus={() => setFocusId(p.id)}
                    onPointerEnter={() => setHover(p.id)}
                    onPointerLeave={() => setHover(null)}
                    className="cursor-pointer outline-none"
                    data-point-id={p.id}
                  >
                    {/* A generous hit area. */}
                    <circle r={11} fill="transparent" />
                    {selected && <circle r={p.emphasised ? 12 : 10.5} fill="none" stroke="var(--color-ink-900)" strokeWidth={2.5} />}
                    {focused && <circle r={15} fill="none" stroke="var(--color-frost-400)" strokeWidth={3} />}
                    <path
                      d={symbolPath(g?.symbol ?? symbolCircle, size)}
                      fill={p.hollow ? 'white' : colour}
                      fillOpacity={p.hollow ? 1 : p.emphasised || selected ? 1 : 0.75}
                      stroke={p.hollow ? colour : p.emphasised ? 'var(--color-ink-900)' : 'white'}
                      strokeWidth={p.hollow ? 2.25 : p.emphasised ? 1.5 : 1}
                    />
                    {p.tag && (
                      <text x={14} y={-8} className="fill-ink-900 text-[12px] font-bold" paintOrder="stroke" stroke="white" strokeWidth={3}>
                        {p.tag}
                      </text>
                    )}
                  </g>
                );
              })}
          </g>
        </svg>

        {finite.length === 0 && <p className="absolute inset-0 flex items-center justify-center text-small text-ink-500">No points to draw.</p>}

        {active && (
          <div
            aria-hidden="true"
            className="pointer-events-none absolute z-10 max-w-72 rounded-control border border-ink-100 bg-surface/95 px-3 py-2 text-caption shadow-card"
            style={{
              left: Math.min(width - 290, Math.max(0, margin.left + x(active.x) + (x(active.x) > innerWidth / 2 ? -300 : 16))),
              top: Math.max(0, margin.top + y(active.y) - 20),
            }}
          >
            <p className="font-bold text-ink-900">{active.label}</p>
            <p className="tabular-nums text-ink-700">
              {xAxis.label}: {formatX(active.x)}&#8239;{xAxis.unit}
            </p>
            <p className="tabular-nums text-ink-700">
              {yAxis.label}: {formatY(active.y)}&#8239;{yAxis.unit}
            </p>
            {active.details.map((d) => (
              <p key={d} className="text-ink-600">
                {d}
              </p>
            ))}
            <p className="mt-1 font-semibold text-frost-700">
              {selectedIds.has(active.id) ? 'Selected — click to deselect' : 'Click to select'}
              {hrefOf ? '; double-click to open' : ''}
            </p>
          </div>
        )}
      </div>

      {hrefOf && focused && (
        <p className="text-small">
          <Link to={hrefOf(focused.id)} className="font-semibold text-frost-700 hover:underline">
            Open {focused.label}
          </Link>
        </p>
      )}

      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-caption text-ink-700" aria-label="Legend">
        {groups.map((g) => (
          <li key={g.id} className="flex items-center gap-1.5">
            <svg width={14} height={14} aria-hidden="true">
              <path transform="translate(7,7)" d={symbolPath(g.symbol, 60)} fill={g.colour} />
            </svg>
            {g.label}
          </li>
        ))}
        {styleNotes?.emphasised && (
          <li className="flex items-center gap-1.5">
            <svg width={16} height={16} aria-hidden="true">
              <circle cx={8} cy={8} r={6} fill="var(--color-ink-400)" stroke="var(--color-ink-900)" strokeWidth={1.5} />
            </svg>
            {styleNotes.emphasised}
          </li>
        )}
        {styleNotes?.hollow && (
          <li className="flex items-center gap-1.5">
            <svg width={16} height={16} aria-hidden="true">
              <circle cx={8} cy={8} r={5} fill="white" stroke="var(--color-ink-600)" strokeWidth={2} />
            </svg>
            {styleNotes.hollow}
          </li>
        )}
        {styleNotes?.selected && (
          <li className="flex items-center gap-1.5">
            <svg width={18} height={18} aria-hidden="true">
              <circle cx={9} cy={9} r={7.5} fill="none" stroke="var(--color-ink-900)" strokeWidth={2.5} />
            </svg>
            {styleNotes.selected}
          </li>
        )}
        {frontierLabel && frontierPath && (
          <li className="flex items-center gap-1.5">
            <svg width={22} height={8} aria-hidden="true">
              <line x1={0} x2={22} y1={4} y2={4} stroke="var(--color-ink-500)" strokeWidth={1.5} strokeDasharray="5 4" />
            </svg>
            {frontierLabel}
          </li>
        )}
      </ul>

      {showTable && (
        <div id={`${id}-table`} className="max-h-80 overflow-auto rounded-control border border-ink-100">
          <table className="w-full text-left text-small tabular-nums">
            <caption className="sr-only">{title}</caption>
            <thead className="sticky top-0 bg-ink-50 text-caption font-bold text-ink-600">
              <tr>
                <th scope="col" className="px-3 py-1.5">Point</th>
                <th scope="col" className="px-3 py-1.5">{unitLabel(xAxis)}</th>
                <th scope="col" className="px-3 py-1.5">{unitLabel(yAxis)}</th>
                <th scope="col" className="px-3 py-1.5">Group</th>
                <th scope="col" className="px-3 py-1.5">Notes</th>
                <th scope="col" className="px-3 py-1.5">Selected</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {order.map((p) => (
                <tr key={p.id}>
                  <th scope="row" className="px-3 py-1 font-semibold">
                    {hrefOf ? (
                      <Link to={hrefOf(p.id)} className="text-frost-700 hover:underline">
                        {p.label}
                      </Link>
                    ) : (
                      p.label
                    )}
                  </th>
                  <td className="px-3 py-1">{formatX(p.x)}</td>
                  <td className="px-3 py-1">{formatY(p.y)}</td>
                  <td className="px-3 py-1">{byGroup.get(p.group)?.label ?? p.group}</td>
                  <td className="px-3 py-1 text-ink-600">{p.details.join('; ')}</td>
                  <td className="px-3 py-1">
                    {onToggle ? (
                      <input type="checkbox" className="size-4" checked={selectedIds.has(p.id)} onChange={() => onToggle(p.id)} aria-label={`Select ${p.label}`} />
                    ) : selectedIds.has(p.id) ? (
                      'yes'
                    ) : (
                      ''
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {points.length > finite.length && (
            <p className="px-3 py-1.5 text-caption text-ink-500">{points.length - finite.length} points have no value on these axes and are not drawn.</p>
          )}
        </div>
      )}
    </figure>
  );
}

