import type { OptimiserIngredient } from './types';

/** An active left out of the enumeration because a cheaper one does everything it does. */
export interface DominatedActive {
  ingredient: OptimiserIngredient;
  by: OptimiserIngredient;
}

/**
 * Everything about an ingredient that the linear model, the time model and the hazard rules
 * read, except its cost, id and descriptive text (name, grade, sources, notes): two actives
 * with the same signature give every LP row the same coefficients but the cost row's.
 */
export function physicsSignature(i: OptimiserIngredient): string {
  return stableJson({
    role: i.role,
    process: i.process ?? null,
    cp: i.cpJPerGK ?? null,
    density: i.densityGPerMl ?? null,
    hazardClasses: [...(i.hazardClasses ?? [])].sort(),
    hazardData: i.hazardData ?? null,
    needs: [...(i.needs ?? [])].sort((a, b) => (a.ingredientId < b.ingredientId ? -1 : 1)).map((n) => ({ id: n.ingredientId, min: n.minGPerG, max: n.maxGPerG ?? null })),
  });
}

/**
 * Dominance pruning of the actives (DEVELOPERS.md, "Optimiser: search at library scale"). Of
 * actives with the same {@link physicsSignature}, only the cheapest (ties: the smallest id) is
 * enumerated. This loses no optimum, for any objective: in a set S containing a dearer grade d
 * of the kept grade k, replacing d by k (or, when k is in S already, moving d's grams onto k)
 * leaves every row but the cost row unchanged and lowers or keeps the cost, so the set with k
 * is feasible whenever S is and its optimum is at least as good. A library of many grades of
 * the same chemicals therefore enumerates as the library of its distinct chemistries.
 */
export function pruneDominated(actives: readonly OptimiserIngredient[]): { kept: OptimiserIngredient[]; dominated: DominatedActive[] } {
  const best = new Map<string, OptimiserIngredient>();
  const signatures = actives.map(physicsSignature);
  actives.forEach((a, i) => {
    const sig = signatures[i]!;
    const current = best.get(sig);
    if (!current || cheaper(a, current)) best.set(sig, a);
  });
  const kept: OptimiserIngredient[] = [];
  const dominated: DominatedActive[] = [];
  actives.forEach((a, i) => {
    const winner = best.get(signatures[i]!)!;
    if (winner === a) kept.push(a);
    else dominated.push({ ingredient: a, by: winner });
  });
  return { kept, dominated };
}

function cheaper(a: OptimiserIngredient, b: OptimiserIngredient): boolean {
  const ca = Number(a.costPerKg);
  const cb = Number(b.costPerKg);
  if (ca !== cb) return ca < cb;
  return a.id < b.id;
}

function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}
