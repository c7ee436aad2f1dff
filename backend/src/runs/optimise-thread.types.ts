import type { ModelCalibrations } from '@shared/calibration/calibrations';
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

/** What the process posts to its long-lived optimisation thread: one run, tagged with its id. */
export interface OptimiseThreadRequest {
  type: 'run';
  runId: number;
  input: OptimiseThreadInput;
}

export type OptimiseThreadMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'result'; result: OptimisationResult & { sweep?: unknown }; elapsedMs: number }
  | { type: 'error'; message: string };

/** What the thread posts back: a message about the run it names. */
export type OptimiseThreadReply = OptimiseThreadMessage & { runId: number };
