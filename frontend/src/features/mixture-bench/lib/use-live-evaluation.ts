import { useEffect, useMemo, useState } from 'react';
import type { ChemistryLibrary } from '@shared/chemistry';
import type { Ingredient } from '@shared/schemas/library';
import type { EvaluateMixtureRequest, EvaluateMixtureResponse } from '@shared/schemas/mixtures';
import { evaluateMixture } from '@shared/evaluation/evaluate-mixture';
import { chemistryModelFor } from '@shared/evaluation/chemistry-cache';
import { ThermalModelError } from '@shared/thermal';
import type { PrecipitationResult } from '@shared/chemistry';
import { mixturePrecipitation } from '@shared/thermal';
import { resolveMixture } from './resolve-mixture';

type Outcome =
  | { state: 'done'; result: EvaluateMixtureResponse; precipitation: PrecipitationResult; elapsedMs: number }
  | { state: 'failed'; message: string; fields: { field: string; message: string }[] };

export type LiveEvaluation =
  | { state: 'idle' }
  | { state: 'pending' }
  /** `updating`: the inputs changed and a fresh evaluation is due; the figures are the previous ones. */
  | (Outcome & { updating: boolean });

/**
 * Runs the shared `evaluateMixture` in the browser a moment after the request stops changing,
 * on the workspace's chemistry library: the same code the server runs for POST /api/mixtures/evaluate.
 */
export function useLiveEvaluation(
  lib: ChemistryLibrary | undefined,
  ingredients: ReadonlyMap<number, Ingredient>,
  request: EvaluateMixtureRequest | null,
  delayMs = 250,
): LiveEvaluation {
  // The chemistry model of the library from the one cache per library revision.
  const port = useMemo(() => (lib ? chemistryModelFor(lib) : null), [lib]);
  const [latest, setLatest] = useState<{ key: string; outcome: Outcome } | null>(null);
  const key = request ? JSON.stringify(request) : null;

  useEffect(() => {
    if (!port || !lib || !request || key === null) return;
    const timer = setTimeout(() => {
      const resolved = resolveMixture(lib, ingredients, request);
      if (!resolved.ok) {
        setLatest({ key, outcome: { state: 'failed', message: resolved.fields.map((f) => f.message).join(' '), fields: resolved.fields } });
        return;
      }
      const started = performance.now();
      try {
        const result = evaluateMixture(port, resolved.mixture);
        // Ions of two ingredients that meet in the water: the same check the server runs.
        const precipitation = mixturePrecipitation(lib, resolved.mixture.components, result);
        setLatest({ key, outcome: { state: 'done', result, precipitation, elapsedMs: performance.now() - started } });
      } catch (error) {
        const message = error instanceof Error ? error.message : 'The model could not evaluate this mixture.';
        const field = error instanceof ThermalModelError && error.field ? error.field : '';
        setLatest({ key, outcome: { state: 'failed', message, fields: field ? [{ field, message }] : [] } });
      }
    }, delayMs);
    return () => clearTimeout(timer);
    // `key` stands for the request's content.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, port, lib, ingredients, delayMs]);

  if (!request || !port) return { state: 'idle' };
  if (!latest) return { state: 'pending' };
  return { ...latest.outcome, updating: latest.key !== key };
}
