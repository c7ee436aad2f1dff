import type { ChemistryLibrary } from '@shared/chemistry';
import { resolveMixtureRequest } from '@shared/evaluation/resolve-mixture';
import type { Ingredient } from '@shared/schemas/library';
import type { EvaluateMixtureRequest, ResolvedMixture } from '@shared/schemas/mixtures';

export type ResolveResult =
  | { ok: true; mixture: ResolvedMixture }
  | { ok: false; fields: { field: string; message: string }[] };

/** Turns a bench request (ingredient ids or formulas) into what the shared `evaluateMixture` takes: the server's own resolution (evaluation/resolve-mixture.ts). */
export function resolveMixture(lib: ChemistryLibrary, ingredients: ReadonlyMap<number, Ingredient>, request: EvaluateMixtureRequest): ResolveResult {
  const r = resolveMixtureRequest(lib, ingredients, request);
  return r.ok ? { ok: true, mixture: r.mixture } : { ok: false, fields: r.fields };
}
