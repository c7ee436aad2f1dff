import { Badge } from '@/components/ui/badge';
import { LineChart } from './line-chart';

export type ConfidenceBandPoint = { tMin: number; p5: number; p50: number; p95: number };

export type ConfidenceBandProps = {
  /** 5th, 50th and 95th percentiles of the temperature, °C, over time (GET /api/candidates/:id/confidence → confidence.band). */
  band: readonly ConfidenceBandPoint[];
  /** The nominal prediction (confidence.nominal). */
  nominal?: readonly { tMin: number; tempC: number }[];
  /** The brief's hold band (confidence.targetBand), shaded. */
  targetBand?: { minC: number; maxC: number } | null;
  /** The nominal (as modelled) verdict, said beside the probability so the two never read as a contradiction. */
  modelled?: 'passed' | 'missed' | 'failed' | 'not-verified';
  /** Share of samples meeting the brief, 0–1 (confidence.probabilityMeetsBrief). */
  probabilityMeetsBrief?: number | null;
  /** Monte Carlo samples behind the band (confidence.samples). */
  samples?: number;
  title?: string;
  height?: number;
  /** Compact: no caption line (e.g. in a table row or a dossier column). */
  compact?: boolean;
};

const clampBand = (b: { minC: number; maxC: number }) => ({ from: Math.max(b.minC, -40), to: Math.min(b.maxC, 120) });

/**
 * How sure a prediction is: the 5–95 % band of the temperature from Monte Carlo over the data's
 * uncertainties (enthalpy, heat capacity, UA), the median and the nominal curve, the brief's band
 * and the probability of meeting the brief.
 */
export function ConfidenceBand({ band, nominal, targetBand, probabilityMeetsBrief, samples, modelled, title = 'Predicted temperature with its 5–95 % band', height = 260, compact }: ConfidenceBandProps) {
  const p = probabilityMeetsBrief;
  const tone = p === null || p === undefined ? 'neutral' : p >= 0.9 ? 'success' : p >= 0.6 ? 'caution' : 'danger';
  return (
    <div className="flex flex-col gap-2">
      {p !== null && p !== undefined && (
        <p className="flex flex-wrap items-center gap-2 text-small text-ink-700">
          <Badge tone={tone}>
            {modelled ? `${modelled === 'passed' ? 'Meets' : 'Misses'} the brief as modelled; ` : ''}
            {Math.round(p * 100)} % of samples meet it under the model&apos;s uncertainty
          </Badge>
          {!compact && samples ? <span className="text-caption text-ink-500">from {samples} Monte Carlo samples of the time model</span> : null}
        </p>
      )}
      <LineChart
        title={title}
        {...(compact ? {} : { description: 'The shaded range holds 90 % of the sampled curves; the line is the median, the dashed line the nominal prediction.' })}
        height={height}
        x={{ label: 'Time', unit: 'min' }}
        y={{ label: 'Temperature', unit: '°C' }}
        areas={[{ id: 'band', label: '5–95 % band', tone: 'frost', points: band.map((b) => ({ x: b.tMin, lo: b.p5, hi: b.p95 })) }]}
        bands={targetBand ? [{ ...clampBand(targetBand), label: 'Brief’s band', tone: 'moss' }] : []}
        series={[
          { id: 'p95', label: '95th percentile', tone: 'frost', dashed: true, points: band.map((b) => ({ x: b.tMin, y: b.p95 })) },
          { id: 'p50', label: 'Median', tone: 'frost', points: band.map((b) => ({ x: b.tMin, y: b.p50 })) },
          { id: 'p5', label: '5th percentile', tone: 'frost', dashed: true, points: band.map((b) => ({ x: b.tMin, y: b.p5 })) },
          ...(nominal ? [{ id: 'nominal', label: 'Nominal prediction', tone: 'ink' as const, dashed: true, points: nominal.map((n) => ({ x: n.tMin, y: n.tempC })) }] : []),
        ]}
      />
    </div>
  );
}
