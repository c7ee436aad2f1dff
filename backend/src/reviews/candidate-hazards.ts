import type { Brief } from '@shared/schemas/briefs';
import type { IngredientHazardData } from '@shared/schemas/hazards';
import type { IngredientProcessInput } from '@shared/thermal/process';
import { candidateHazards, type CandidateHazardsResult } from '@shared/hazards';
import { SKIN_CONTACT_BY_CASE } from '@shared/optimiser/candidate-hazards';

export interface HazardInputLine {
  name: string;
  role: string;
  massG: number;
  hazardData: IngredientHazardData | null;
  process?: IngredientProcessInput | null;
  densityGPerMl?: number | null;
}

/**
 * The computed hazards of a candidate (shared/src/hazards: GHS mixture classification, label
 * elements, notes): its fill (packaging left out), the time model's coldest and warmest
 * temperatures (the brief's start when the candidate was not simulated), the brief's hold as the
 * contact time.
 */
export function hazardsForCandidate(lines: HazardInputLine[], brief: Brief, temps: { minTempC: number | null; maxTempC: number | null }): CandidateHazardsResult {
  return candidateHazards({
    composition: lines
      .filter((l) => l.massG > 0 && l.role !== 'packaging')
      .map((l) => ({ name: l.name, massG: l.massG, hazardData: l.hazardData, process: l.process ?? null, densityGPerMl: l.densityGPerMl ?? null })),
    predicted: {
      minTempC: temps.minTempC ?? brief.initialTempC,
      maxTempC: temps.maxTempC ?? brief.initialTempC,
      // The same skin exposure and venting the optimiser used when it ranked the candidate.
      contact: SKIN_CONTACT_BY_CASE[brief.contact],
      holdMin: brief.holdMin,
    },
    packType: brief.packType,
    vented: brief.maxGasL > 0,
  });
}
