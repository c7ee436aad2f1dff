import type { ChartAxis, ChartScales } from './use-chart-scales';

/**
 * The axes and grid of a chart drawn from {@link ChartScales}: horizontal grid lines with y tick
 * labels, the x axis with its ticks, and both titles with their units. Render inside the
 * chart's `<g transform="translate(margin)">`.
 */
export function ChartAxes({ scales, x: xAxis, y: yAxis, hideY = false }: { scales: ChartScales; x: ChartAxis; y: ChartAxis; hideY?: boolean }) {
  const { x, y, innerWidth, innerHeight, xTicks, yTicks, formatX, formatY, margin } = scales;
  return (
    <g aria-hidden="true">
      {!hideY &&
        yTicks.map((t) => (
          <g key={`y-${t}`} transform={`translate(0,${y(t)})`}>
            <line x2={innerWidth} stroke="var(--color-ink-100)" />
            <text x={-8} dy="0.32em" textAnchor="end" className="fill-ink-500 text-[11px] tabular-nums">
              {formatY(t)}
            </text>
          </g>
        ))}
      {!hideY && (
        <>
          <line y2={innerHeight} stroke="var(--color-ink-300)" />
          <text
            transform={`translate(${-margin.left + 14},${innerHeight / 2}) rotate(-90)`}
            textAnchor="middle"
            className="fill-ink-700 text-[12px] font-semibold"
          >
            {`${yAxis.label} (${yAxis.unit})`}
          </text>
        </>
      )}
      <g transform={`translate(0,${innerHeight})`}>
        <line x2={innerWidth} stroke="var(--color-ink-300)" />
        {xTicks.map((t) => (
          <g key={`x-${t}`} transform={`translate(${x(t)},0)`}>
            <line y2={5} stroke="var(--color-ink-300)" />
            {hideY && <line y1={-innerHeight} y2={0} stroke="var(--color-ink-100)" />}
            <text y={18} textAnchor="middle" className="fill-ink-500 text-[11px] tabular-nums">
              {formatX(t)}
            </text>
          </g>
        ))}
        <text x={innerWidth / 2} y={40} textAnchor="middle" className="fill-ink-700 text-[12px] font-semibold">
          {`${xAxis.label} (${xAxis.unit})`}
        </text>
      </g>
    </g>
  );
}
