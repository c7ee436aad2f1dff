import { useQueries } from '@tanstack/react-query';
import type { Brief, Candidate } from '@shared/schemas/briefs';
import { holdBand, verificationHorizonMin } from '@shared/optimiser/verify';
import { thermalContactCase } from '@shared/optimiser/heat-exchange';
import type { EvaluateMixtureRequest } from '@shared/schemas/mixtures';
import { evaluateMixtureApiResponseSchema } from '@shared/schemas/thermo';
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

/** The evaluate endpoint's temperature limits, °C (shared/schemas/mixtures.ts). */
const EVAL_MIN_C = -80;
const EVAL_MAX_C = 400;

/** The band a held pack must stay in (as the optimiser verifies it), clipped to what can be drawn. */
export function briefBand(brief: Brief): { minC: number; maxC: number } {
  const band = holdBand(brief);
  return { minC: Math.max(EVAL_MIN_C, band.minC), maxC: Math.min(EVAL_MAX_C, band.maxC) };
}

/**
 * The POST /api/mixtures/evaluate request that replays a candidate against its brief, as the
 * optimiser's verification does: its composition (fill only), the brief's start, surroundings
 * (UA when given, else the contact case over the pack's area), the packaging's heat capacity,
 * and a horizon of reach + 1.5 × hold so a margin can show.
 */
export function curveRequest(brief: Brief, candidate: Pick<Candidate, 'composition'>): EvaluateMixtureRequest {
  const exchange =
    brief.uaWPerK !== null ? { uaWPerK: brief.uaWPerK, packAreaM2: brief.packAreaM2 } : { contact: { case: thermalContactCase(brief.contact), geometry: { areaM2: brief.packAreaM2 } } };
  return {
    components: candidate.composition.filter((c) => c.massG > 0 && c.role !== 'packaging').map((c) => ({ ingredientId: Number(c.ingredientId), massG: c.massG })),
    initialTempC: brief.initialTempC,
    ambientC: brief.ambientC,
    ...exchange,
    packHeatCapacityJPerK: brief.packaging.heatCapacityJPerK,
    holdMin: verificationHorizonMin(brief),
    targetTempC: brief.targetTempC,
    targetBand: briefBand(brief),
  } as EvaluateMixtureRequest;
}

async function evaluateCurve(brief: Brief, candidate: Pick<Candidate, 'composition'>, signal?: AbortSignal): Promise<Curve> {
  const result = await api.post('/api/mixtures/evaluate', { body: curveRequest(brief, candidate), schema: evaluateMixtureApiResponseSchema, signal });
  return result.curve;
}

type WithCurve = Pick<Candidate, 'composition'> & { id: number; curve?: Curve };

/**
 * The temperature curves of some candidates: the one a candidate carries, else the thermal model's
 * through POST /api/mixtures/evaluate (cached per candidate). Answers one query per candidate.
 */
export function useCandidateCurves(items: readonly { candidate: WithCurve; brief: Brief | undefined }[]) {
  return useQueries({
    queries: items.map(({ candidate, brief }) => ({
      queryKey: ['candidates', 'detail', candidate.id, 'curve'] as const,
      queryFn: ({ signal }: { signal: AbortSignal }) =>
        candidate.curve && candidate.curve.length ? Promise.resolve(candidate.curve) : evaluateCurve(brief!, candidate, signal),
      enabled: !!brief || !!candidate.curve?.length,
      staleTime: Number.POSITIVE_INFINITY,
    })),
  });
}
