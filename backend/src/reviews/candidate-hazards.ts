import type { Brief } from '@shared/schemas/briefs';
import type { CandidateHazards, IngredientHazardData } from '@shared/schemas/hazards';

export interface HazardInputLine {
  name: string;
  role: string;
  massG: number;
  hazardData: IngredientHazardData | null;
}

/**
 * The computed hazards of a candidate (shared/src/hazards). Null until the mixture
 * classification is available for this composition.
 */
export function hazardsForCandidate(_lines: HazardInputLine[], _brief: Brief, _temps: { minTempC: number | null; maxTempC: number | null }): CandidateHazards | null {
  return null;
}
