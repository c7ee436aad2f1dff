import type { IngredientProcessInput } from './process';

/** Liquid water a process brings: water itself, a hydrate's crystal water, a reaction that frees water. */
function bringsWater(p: IngredientProcessInput): boolean {
  if (p.kind === 'inert') return p.role === 'water';
  if (p.kind === 'dissolution') return (p.hydrateWaterPerFormula ?? 0) > 0;
  if (p.kind === 'reaction') return p.products.some((t) => t.key === 'H2O(l)');
  return false;
}

/** Needs liquid water to do anything: a dissolving solid, a reaction that takes water. */
function needsWater(p: IngredientProcessInput): boolean {
  return p.kind === 'dissolution' || (p.kind === 'reaction' && p.reactants.some((t) => t.key === 'H2O(l)'));
}

/**
 * Mixtures that would evaluate without error yet mean nothing, as field errors (the bench and
 * POST /api/mixtures/evaluate answer them the same way):
 * - every component at 0 g → `components`;
 * - a dissolving salt (or a reaction that takes water) and no component that brings liquid
 *   water → the first such component's `ingredientId` or `formula`.
 * `fieldOf(k)` names the request field of component k (`ingredientId` or `formula`).
 *
 * @example mixtureInputProblems([{ formula: 'NH4NO3', massG: 40, process: an }], () => 'formula')
 * // → [{ field: 'components.0.formula', message: 'NH4NO3 needs liquid water to dissolve, …' }]
 */
export function mixtureInputProblems(
  components: readonly { key?: string; formula?: string; massG: number; process: IngredientProcessInput }[],
  fieldOf: (k: number) => 'ingredientId' | 'formula',
): { field: string; message: string }[] {
  if (components.length > 0 && components.every((c) => c.massG === 0)) {
    return [{ field: 'components', message: 'every component has massG 0: give at least one component a mass above 0 g' }];
  }
  if (components.some((c) => c.massG > 0 && bringsWater(c.process))) return [];
  const k = components.findIndex((c) => c.massG > 0 && needsWater(c.process));
  if (k < 0) return [];
  const c = components[k]!;
  return [
    {
      field: `components.${k}.${fieldOf(k)}`,
      message: `${c.key ?? c.formula ?? `component ${k + 1}`} needs liquid water to ${c.process.kind === 'dissolution' ? 'dissolve' : 'react'}, and no component brings any: add water (H2O) to the mixture`,
    },
  ];
}
