import { hazardTags, isHazardCapToken } from '../hazards/optimiser-hazards';
import type { Brief } from '../schemas/briefs';
import { pruneDominated } from './dominance';
import type { IngredientSet, OptimiserIngredient } from './types';

/** An ingredient the enumeration left out, and why. */
export interface ExcludedIngredient {
  ingredientId: string;
  name: string;
  reason: string;
}

export interface SetEnumeration {
  sets: IngredientSet[];
  /** Actives that passed the brief's filters, sorted by id. */
  actives: OptimiserIngredient[];
  water: OptimiserIngredient | null;
  excluded: ExcludedIngredient[];
}

/** True for an ingredient whose process is water (the solvent). */
export function isWaterIngredient(i: OptimiserIngredient): boolean {
  return i.process?.kind === 'inert' && i.process.role === 'water' ? true : i.role === 'solvent' && !i.process;
}

/** Whether a process needs liquid water in the pack: dissolution, and reactions that take water. */
function needsWater(i: OptimiserIngredient): boolean {
  const p = i.process;
  if (!p) return false;
  if (p.kind === 'dissolution') return true;
  if (p.kind === 'reaction') return p.reactants.some((t) => t.key === 'H2O(l)');
  return false;
}

/**
 * The candidate sets of a brief: every combination of 1 to `maxActives` actives from the
 * allowed library (all actives when `allowedIngredientIds` is empty), minus excluded ids,
 * ingredients carrying an excluded hazard class, and actives `isUseful` rejects (e.g. a salt
 * that absorbs heat for a warm brief). Each set brings the additives its actives need
 * (`needs`) and water when any member dissolves, reacts with water, or needs it. Number of sets:
 * Σ_{k=1..N} C(A, k) for A usable actives; e.g. 20 actives, up to 3 → 20 + 190 + 1140 = 1350.
 *
 * @example enumerateSets(brief, library, () => null).sets.map((s) => s.key) // → ['an', 'an+urea', 'urea', …]
 */
export function enumerateSets(
  brief: Pick<Brief, 'allowedIngredientIds' | 'excludedIngredientIds' | 'excludedHazardClasses' | 'maxActives'>,
  library: readonly OptimiserIngredient[],
  /** Returns null when the active can help this brief, else the reason it cannot. */
  isUseful: (i: OptimiserIngredient) => string | null,
  /** Leave out actives a cheaper one with the same chemistry dominates (dominance.ts; default true). */
  options: { pruneDominated?: boolean } = {},
): SetEnumeration {
  const byId = new Map(library.map((i) => [i.id, i]));
  const allowed = new Set(brief.allowedIngredientIds);
  const excludedIds = new Set(brief.excludedIngredientIds);
  // Cap tokens (`precursor-an`, `cap:eye-dam-1`, …) cap concentrations instead of excluding (hazards/optimiser-hazards.ts).
  const hazards = new Set(brief.excludedHazardClasses.filter((h) => !isHazardCapToken(h)));
  const excluded: ExcludedIngredient[] = [];
  const waterCandidates = library.filter(isWaterIngredient).filter((w) => !excludedIds.has(w.id));
  const water = waterCandidates[0] ?? null;
  const blockedReason = (i: OptimiserIngredient): string | null => {
    if (excludedIds.has(i.id)) return 'excluded by the brief';
    const hit = hazardTags(i).filter((h) => hazards.has(h));
    if (hit.length) return `carries excluded hazard class ${hit.join(', ')}`;
    return null;
  };
  const usable: OptimiserIngredient[] = [];
  for (const i of [...library].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))) {
    if (i.role !== 'active') continue;
    if (allowed.size > 0 && !allowed.has(i.id)) continue;
    const blocked = blockedReason(i);
    if (blocked) {
      excluded.push({ ingredientId: i.id, name: i.name, reason: blocked });
      continue;
    }
    const missing = (i.needs ?? []).filter((n) => {
      const d = byId.get(n.ingredientId);
      return !d || blockedReason(d) !== null;
    });
    if (missing.length) {
      excluded.push({ ingredientId: i.id, name: i.name, reason: `needs ${missing.map((n) => n.ingredientId).join(', ')}, which the library lacks or the brief excludes` });
      continue;
    }
    if (needsWater(i) && !water) {
      excluded.push({ ingredientId: i.id, name: i.name, reason: 'needs water, and the library has no water ingredient the brief allows' });
      continue;
    }
    const useless = isUseful(i);
    if (useless) {
      excluded.push({ ingredientId: i.id, name: i.name, reason: useless });
      continue;
    }
    usable.push(i);
  }
  let actives = usable;
  if (options.pruneDominated !== false) {
    const pruned = pruneDominated(usable);
    actives = pruned.kept;
    for (const d of pruned.dominated) {
      excluded.push({
        ingredientId: d.ingredient.id,
        name: d.ingredient.name,
        reason: `same chemistry as ${d.by.name} at a higher cost per kg: every set with it is tried as the same set with ${d.by.name}`,
      });
    }
  }
  const sets: IngredientSet[] = [];
  const k = Math.min(brief.maxActives, actives.length);
  const pick = (start: number, chosen: OptimiserIngredient[]) => {
    if (chosen.length > 0) sets.push(makeSet(chosen, byId, water));
    if (chosen.length === k) return;
    for (let j = start; j < actives.length; j++) pick(j + 1, [...chosen, actives[j]!]);
  };
  pick(0, []);
  // Smaller sets first, then by key: the order ties are broken in.
  sets.sort((a, b) => a.activeIds.length - b.activeIds.length || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  return { sets, actives, water, excluded };
}

function makeSet(actives: OptimiserIngredient[], byId: Map<string, OptimiserIngredient>, water: OptimiserIngredient | null): IngredientSet {
  const additiveIds = new Set<string>();
  let wantsWater = actives.some(needsWater);
  for (const a of actives) {
    for (const n of a.needs ?? []) {
      const d = byId.get(n.ingredientId);
      if (!d) continue;
      if (isWaterIngredient(d)) wantsWater = true;
      else if (!actives.some((x) => x.id === d.id)) additiveIds.add(d.id);
    }
  }
  const additives = [...additiveIds].sort().map((id) => byId.get(id)!);
  const members = [...actives, ...additives, ...(wantsWater && water ? [water] : [])];
  const activeIds = actives.map((a) => a.id);
  return { activeIds, members, key: activeIds.join('+') };
}
