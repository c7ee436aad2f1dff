import type { Objective, Verification } from '../schemas/briefs';

/** What ranking reads of a candidate. */
export interface RankItem {
  key: string;
  objectiveValue: number;
  unitCostValue: number;
  massG: number;
  /** Hold margin, min (simulated when verified, else the linear model's); null when unknown. */
  holdMarginMin: number | null;
  hazardScore: number;
  verificationStatus: Verification['status'];
  /** Actives with non-zero mass. */
  activeCount: number;
  /** Actives in the set as enumerated. */
  setSize: number;
  /** Ingredients with non-zero mass. */
  ingredientCount: number;
  /** Its ingredients are incompatible (incompatible-sets.ts); absent: compatible. */
  incompatible?: boolean;
}

/** Objective values closer than this (relative) are a tie, broken towards the simpler mixture. */
export const TIE_TOLERANCE = 1e-9;

const GROUP: Record<Verification['status'], number> = { passed: 0, 'not-verified': 1, missed: 2, failed: 3 };

function nearlyEqual(a: number, b: number, tol = TIE_TOLERANCE): boolean {
  if (!Number.isFinite(a) || !Number.isFinite(b)) return a === b;
  return Math.abs(a - b) <= tol * Math.max(1, Math.abs(a), Math.abs(b));
}

/**
 * Order candidates: first by verification (passed, then not yet verified, then missed — a
 * candidate that meets the linear model but misses in simulation ranks below every one that
 * passes —, then failed), then by the objective (least cost / least mass ascending, most hold
 * margin descending), ties (within {@link TIE_TOLERANCE}) to the lower hazard score, then the simpler mixture: fewer
 * actives in use, fewer actives in the set, fewer ingredients, then key. Within a verification
 * group, sets marked incompatible come after the compatible ones unless `allowIncompatible`.
 * Returns a new array.
 *
 * @example rankCandidates(items, 'least-cost').map((c) => c.key) // cheapest passing first
 */
export function rankCandidates<T extends RankItem>(items: readonly T[], objective: Objective, options: { allowIncompatible?: boolean } = {}): T[] {
  const dir = objective === 'most-hold-margin' ? -1 : 1;
  const apart = options.allowIncompatible !== true;
  return [...items].sort((a, b) => {
    // Within each verification group, incompatible sets after the compatible ones unless the brief allows them.
    if (apart && a.verificationStatus === b.verificationStatus && Boolean(a.incompatible) !== Boolean(b.incompatible)) return a.incompatible ? 1 : -1;
    return compareByObjective(a, b, dir, true);
  });
}

/** Order by the objective only (before verification), ties to the simpler mixture. */
export function orderByObjective<T extends RankItem>(items: readonly T[], objective: Objective): T[] {
  const dir = objective === 'most-hold-margin' ? -1 : 1;
  return [...items].sort((a, b) => compareByObjective(a, b, dir, false));
}

function compareByObjective(a: RankItem, b: RankItem, dir: number, byVerification: boolean): number {
  if (byVerification) {
    const g = GROUP[a.verificationStatus] - GROUP[b.verificationStatus];
    if (g !== 0) return g;
  }
  if (!nearlyEqual(a.objectiveValue, b.objectiveValue)) return dir * (a.objectiveValue - b.objectiveValue);
  // Ties go to the less hazardous mixture, then to the simpler one.
  if (!nearlyEqual(a.hazardScore, b.hazardScore)) return a.hazardScore - b.hazardScore;
  return a.activeCount - b.activeCount || a.setSize - b.setSize || a.ingredientCount - b.ingredientCount || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);
}

/**
 * Pareto front over (unit cost ↓, mass ↓, hold margin ↑, hazard score ↓): a candidate is on
 * the front when no other is at least as good in all four and strictly better in one
 * (comparisons within {@link TIE_TOLERANCE}; an unknown hold margin counts as −∞). Returns one
 * flag per item, in input order. O(n²).
 *
 * @example paretoFlags([{ cost 1, mass 100 }, { cost 2, mass 90 }, { cost 2, mass 100 }]) // → [true, true, false]
 */
export function paretoFlags(items: readonly RankItem[]): boolean[] {
  const v = items.map((c) => [c.unitCostValue, c.massG, -(c.holdMarginMin ?? -Infinity), c.hazardScore]);
  return v.map((a, i) => {
    for (let j = 0; j < v.length; j++) {
      if (j === i) continue;
      const b = v[j]!;
      let allAtLeast = true;
      let strictly = false;
      for (let k = 0; k < 4; k++) {
        const x = a[k]!;
        const y = b[k]!;
        if (nearlyEqual(x, y)) continue;
        if (y < x) strictly = true;
        else {
          allAtLeast = false;
          break;
        }
      }
      if (allAtLeast && strictly) return false;
    }
    return true;
  });
}
