import { useQueries } from '@tanstack/react-query';
import type { Brief, Candidate } from '@shared/schemas/briefs';
import { holdBand } from '@shared/evaluation/verify';
import { candidateCurveSchema } from '@shared/schemas/runs';
import { api } from './api-client';

/** A temperature curve, °C against minutes. */
export type Curve = { tMin: number; tempC: number }[];

/** A curve at evenly spaced times by linear interpolation, so several curves share the table's rows. */
export function resampleCurve(curve: Curve, stepMin: number, endMin: number): { x: number; y: number }[] {
  if (curve.length === 0) return [];
  const out: { x: number; y: number }[] = [];
  let k = 0;
  for (let t = 0; t <= endMin + 1e-9; t += stepMin) {
    while (k < curve.length - 2 && curve[k + 1]!.tMin < t) k++;
    const a = curve[k]!;
    const b = curve[Math.min(k + 1, curve.length - 1)]!;
    const f = b.tMin === a.tMin ? 0 : Math.min(1, Math.max(0, (t - a.tMin) / (b.tMin - a.tMin)));
    if (t > curve[curve.length - 1]!.tMin + 1e-9) break;
    out.push({ x: Number(t.toFixed(3)), y: a.tempC + f * (b.tempC - a.tempC) });
  }
  return out;
}

/** Drawing limits of a band, °C: an open end (no surface limit) is clipped to what a chart shows. */
const DRAW_MIN_C = -80;
const DRAW_MAX_C = 400;

/** The band a held pack must stay in (as the verification judges it), clipped to what can be drawn. */
export function briefBand(brief: Brief): { minC: number; maxC: number } {
  const band = holdBand(brief);
  return { minC: Math.max(DRAW_MIN_C, band.minC), maxC: Math.min(DRAW_MAX_C, band.maxC) };
}

/**
 * A candidate's curve from GET /api/candidates/:id/curve: the server replays it through the
 * evaluation core with its run's data snapshot, packaging and calibrations, as the run verified it.
 */
async function fetchCurve(id: number, signal?: AbortSignal): Promise<Curve> {
  const result = await api.get(`/api/candidates/${id}/curve`, { schema: candidateCurveSchema, signal });
  return result.curve;
}

type WithCurve = Pick<Candidate, 'composition'> & { id: number; curve?: Curve };

/**
 * The temperature curves of some candidates: the one a candidate carries, else the thermal model's
 * replayed by the server (cached per candidate). Answers one query per candidate.
 */
export function useCandidateCurves(items: readonly { candidate: WithCurve; brief: Brief | undefined }[]) {
  return useQueries({
    queries: items.map(({ candidate, brief }) => ({
      queryKey: ['candidates', 'detail', candidate.id, 'curve'] as const,
      queryFn: ({ signal }: { signal: AbortSignal }) =>
        candidate.curve && candidate.curve.length ? Promise.resolve(candidate.curve) : fetchCurve(candidate.id, signal),
      enabled: !!brief || !!candidate.curve?.length,
      staleTime: Number.POSITIVE_INFINITY,
    })),
  });
}
