import type { IngredientHazardData } from '../schemas/hazards';
import type { IngredientProcessInput } from '../thermal/process';
import type { ThermalComponent } from '../thermal/pack-model';

/** The roles an ingredient plays in a pack (schemas/briefs.ts). */
export type LineRole = 'active' | 'solvent' | 'additive' | 'packaging';

/**
 * One line of a pack as the evaluation core reads it: an ingredient (of a library, a run's
 * snapshot or the demo data) or a bare formula with its resolved process, and its mass.
 */
export interface EvaluationLine {
  /** The ingredient's id (string) — also the key its calibrations are filed under — or the formula. */
  id: string;
  /** Label in breakdowns and hazard notes. */
  name: string;
  massG: number;
  role?: LineRole | string;
  process: IngredientProcessInput | null;
  formula?: string;
  cpJPerGK?: number | null;
  densityGPerMl?: number | null;
  hazardData?: IngredientHazardData | null;
}

/** What the core needs of an ingredient record to make a line of it. */
export interface IngredientLike {
  id: string | number;
  name: string;
  role: LineRole | string;
  process: IngredientProcessInput | null;
  cpJPerGK?: number | null;
  densityGPerMl?: number | null;
  hazardData?: IngredientHazardData | null;
}

/**
 * The process a line runs: its own, else inert — water for the solvent, packaging for a
 * packaging line, an additive (with its cp when known) otherwise. The one place this fallback
 * lives (DEVELOPERS.md, "The evaluation core").
 *
 * @example processOfLine({ role: 'solvent', process: null }) // → { kind: 'inert', role: 'water' }
 */
export function processOfLine(line: Pick<EvaluationLine, 'role' | 'process' | 'cpJPerGK'>): IngredientProcessInput {
  if (line.process) return line.process;
  if (line.role === 'solvent') return { kind: 'inert', role: 'water' };
  return { kind: 'inert', role: line.role === 'packaging' ? 'packaging' : 'additive', ...(line.cpJPerGK ? { cp_J_per_gK: line.cpJPerGK } : {}) };
}

/** The thermal model's components of some lines (lines of 0 g left out). */
export function componentsOf(lines: readonly EvaluationLine[]): ThermalComponent[] {
  return lines
    .filter((l) => l.massG > 0)
    .map((l) => ({ key: l.id, ...(l.formula ? { formula: l.formula } : {}), massG: l.massG, process: processOfLine(l) }));
}

/** A line of an ingredient record at a mass. */
export function lineOf(ingredient: IngredientLike, massG: number, name = ingredient.name): EvaluationLine {
  return {
    id: String(ingredient.id),
    name,
    massG,
    role: ingredient.role,
    process: ingredient.process ?? null,
    cpJPerGK: ingredient.cpJPerGK ?? null,
    densityGPerMl: ingredient.densityGPerMl ?? null,
    hazardData: ingredient.hazardData ?? null,
  };
}

/**
 * The lines of a stored composition (`{ ingredientId, name, role, massG }`), each ingredient
 * looked up by id in `byId` (a run's snapshot first, the library for ingredients added since).
 * Returns the ids that could not be found in `missing` rather than guessing their process.
 */
export function linesOfComposition(
  composition: readonly { ingredientId: string; name: string; role?: string; massG: number }[],
  ...sources: ReadonlyMap<string, IngredientLike>[]
): { lines: EvaluationLine[]; missing: string[] } {
  const lines: EvaluationLine[] = [];
  const missing: string[] = [];
  for (const c of composition) {
    const ing = sources.map((m) => m.get(c.ingredientId)).find((x) => x !== undefined);
    if (!ing) {
      if (c.massG > 0) missing.push(c.ingredientId);
      continue;
    }
    lines.push({ ...lineOf(ing, c.massG, c.name), ...(c.role ? { role: c.role } : {}) });
  }
  return { lines, missing };
}
