import { useMemo } from 'react';
import { scaleLinear, type ScaleLinear } from 'd3';

/**
 * Scales for Packwright's charts: one place where data become pixels. Every chart (the mixture
 * bench's temperature curve, ΔG against temperature, the optimiser's trade-off plots) builds its
 * scales here, so domains, padding and ticks behave the same everywhere.
 */

export type ChartPoint = { x: number; y: number };

export type ChartTone = 'frost' | 'ember' | 'ink' | 'moss' | 'rust' | 'amber';

export type ChartSeries = {
  id: string;
  /** Shown in the legend, the hover readout and the table's column header. */
  label: string;
  points: readonly ChartPoint[];
  tone?: ChartTone;
  /** A CSS colour that wins over `tone`, e.g. from the categorical palette (palette.ts). */
  colour?: string;
  dashed?: boolean;
  /** Draw points only (a scatter), e.g. candidates on a trade-off plot. */
  pointsOnly?: boolean;
};

/** A shaded horizontal band, e.g. the target temperature band. */
export type ChartBand = { from: number; to: number; label: string; tone?: ChartTone };

/** A vertical (x) or horizontal (y) reference line with a label, e.g. a crossover temperature. */
export type ChartRule = { axis: 'x' | 'y'; value: number; label: string; tone?: ChartTone };

export type ChartAxis = {
  /** "Time", "Temperature": the axis title, shown with its unit. */
  label: string;
  /** "min", "°C", "kJ": every axis carries its unit. */
  unit: string;
  /** Fixed domain; otherwise the data, bands and rules decide. */
  domain?: readonly [number, number];
  /** Always include 0 in the domain (e.g. ΔG so the sign change is visible). */
  includeZero?: boolean;
  /** Formats a value without its unit (ticks, readout, table). Defaults to the scale's tick format. */
  format?: (value: number) => string;
};

export type ChartMargin = { top: number; right: number; bottom: number; left: number };

export const DEFAULT_MARGIN: ChartMargin = { top: 16, right: 20, bottom: 48, left: 64 };

export type ChartScales = {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  innerWidth: number;
  innerHeight: number;
  margin: ChartMargin;
  xTicks: number[];
  yTicks: number[];
  formatX: (value: number) => string;
  formatY: (value: number) => string;
};

function domainOf(values: number[], axis: ChartAxis): [number, number] {
  if (axis.domain) return [axis.domain[0], axis.domain[1]];
  const finite = values.filter(Number.isFinite);
  if (axis.includeZero) finite.push(0);
  if (finite.length === 0) return [0, 1];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (lo === hi) {
    const pad = Math.abs(lo) * 0.1 || 1;
    lo -= pad;
    hi += pad;
  }
  return [lo, hi];
}

/**
 * Linear x and y scales sized to the drawing area, with nice domains covering every series,
 * band and rule, plus tick values and formatters.
 *
 * @example const s = useChartScales({ width: 600, height: 320, series, x: { label: 'Time', unit: 'min' }, y: { label: 'Temperature', unit: '°C' } });
 *   s.x(10) // pixel of 10 min
 */
export function useChartScales({
  width,
  height,
  series,
  bands = [],
  rules = [],
  x: xAxis,
  y: yAxis,
  margin = DEFAULT_MARGIN,
}: {
  width: number;
  height: number;
  series: readonly ChartSeries[];
  bands?: readonly ChartBand[];
  rules?: readonly ChartRule[];
  x: ChartAxis;
  y: ChartAxis;
  margin?: ChartMargin;
}): ChartScales {
  return useMemo(() => {
    const innerWidth = Math.max(10, width - margin.left - margin.right);
    const innerHeight = Math.max(10, height - margin.top - margin.bottom);
    const xs = series.flatMap((s) => s.points.map((p) => p.x));
    const ys = series.flatMap((s) => s.points.map((p) => p.y));
    for (const b of bands) ys.push(b.from, b.to);
    for (const r of rules) (r.axis === 'x' ? xs : ys).push(r.value);

    const x = scaleLinear().domain(domainOf(xs, xAxis)).range([0, innerWidth]);
    const y = scaleLinear().domain(domainOf(ys, yAxis)).range([innerHeight, 0]);
    if (!xAxis.domain) x.nice();
    if (!yAxis.domain) y.nice();
    const xTickCount = Math.max(2, Math.floor(innerWidth / 80));
    const yTickCount = Math.max(2, Math.floor(innerHeight / 45));
    const xTickFormat = x.tickFormat(xTickCount);
    const yTickFormat = y.tickFormat(yTickCount);
    return {
      x,
      y,
      innerWidth,
      innerHeight,
      margin,
      xTicks: x.ticks(xTickCount),
      yTicks: y.ticks(yTickCount),
      formatX: xAxis.format ?? ((v: number) => xTickFormat(v)),
      formatY: yAxis.format ?? ((v: number) => yTickFormat(v)),
    };
  }, [width, height, series, bands, rules, xAxis, yAxis, margin]);
}
