import type { ModelCalibrations } from '@shared/lab-logs/calibrations';
import type { Brief, OptimisationResult } from '@shared/schemas/briefs';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import type { OptimiserIngredient } from '@shared/optimiser/types';

export interface OptimiseThreadInput {
  brief: Brief;
  ingredients: OptimiserIngredient[];
  chemistry: ChemistryLibrary;
  /** Applied lab calibrations from the run's data snapshot. */
  calibrations?: ModelCalibrations | null;
}

export type OptimiseThreadMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'result'; result: OptimisationResult & { sweep?: unknown }; elapsedMs: number }
  | { type: 'error'; message: string };
