import { candidateHazards, type CandidateHazardsResult } from '../hazards/evaluate-candidate-hazards';
import type { SkinContact } from '../hazards/hazard-notes';
import type { Brief } from '../schemas/briefs';
import type { EvaluationLine } from './components';
import { processOfLine } from './components';

/**
 * How a brief's contact case meets the skin for the hazard notes: a pack worn against the skin
 * through fabric → `through-fabric`; a pack in still air is one a person holds or lays on skin
 * (a compress) → `possible`; an insulated insert (a medicine carrier) → `none`.
 */
export const SKIN_CONTACT_BY_CASE: Readonly<Record<Brief['contact'], SkinContact>> = {
  'skin-through-fabric': 'through-fabric',
  'still-air': 'possible',
  insulated: 'none',
};

/** What is known of a pack's temperatures, best first. */
export interface KnownTemperatures {
  /** From the time model (a verification or an evaluation). */
  verified?: { minTempC: number | null; maxTempC: number | null } | null;
  /** From the candidate's figures (the time model's when verified). */
  predictedMinTempC?: number | null;
  predictedMaxTempC?: number | null;
  /** The linear model's adiabatic extreme (cold: the coldest, warm: the warmest). */
  predictedExtremeTempC?: number | null;
}

/**
 * The temperatures the hazard notes judge, °C — the one fallback order: the time model's
 * coldest/warmest; else the candidate's predicted figures; else, on the pack's own side, the
 * linear model's adiabatic extreme or the brief's target, and on the other side the start.
 *
 * @example hazardTemperatures(coldBrief, { predictedExtremeTempC: 1.5 }) // → { minTempC: 1.5, maxTempC: brief.initialTempC }
 */
export function hazardTemperatures(brief: Pick<Brief, 'packType' | 'targetTempC' | 'initialTempC'>, t: KnownTemperatures): { minTempC: number; maxTempC: number } {
  const cold = brief.packType === 'cold';
  const own = t.predictedExtremeTempC ?? brief.targetTempC;
  return {
    minTempC: t.verified?.minTempC ?? t.predictedMinTempC ?? (cold ? own : brief.initialTempC),
    maxTempC: t.verified?.maxTempC ?? t.predictedMaxTempC ?? (cold ? brief.initialTempC : own),
  };
}

/**
 * The hazard inputs of a pack under a brief and the hazards computed from them
 * (hazards/evaluate-candidate-hazards.ts): the fill (lines of 0 g and packaging left out, each
 * with its hazard data, process and density), the temperatures of {@link hazardTemperatures},
 * the brief's skin contact ({@link SKIN_CONTACT_BY_CASE}) and hold as the contact time, and a
 * pack allowed to evolve gas (`maxGasL > 0`) taken to be vented.
 * Returns null when no line of the fill carries hazard data, unless `evenWithoutHazardData`
 * (the notes on temperature and gas still apply; a view says which ingredients lack data).
 */
export function hazardsUnderBrief(
  lines: readonly EvaluationLine[],
  brief: Pick<Brief, 'packType' | 'targetTempC' | 'initialTempC' | 'contact' | 'holdMin' | 'maxGasL'>,
  temps: KnownTemperatures,
  options: { evenWithoutHazardData?: boolean } = {},
): CandidateHazardsResult | null {
  const fill = lines.filter((l) => l.massG > 0 && l.role !== 'packaging');
  if (!fill.some((l) => l.hazardData) && !(options.evenWithoutHazardData && fill.length)) return null;
  const t = hazardTemperatures(brief, temps);
  return candidateHazards({
    composition: fill.map((l) => ({ name: l.name, massG: l.massG, hazardData: l.hazardData ?? null, process: processOfLine(l), densityGPerMl: l.densityGPerMl ?? null })),
    predicted: { minTempC: t.minTempC, maxTempC: t.maxTempC, contact: SKIN_CONTACT_BY_CASE[brief.contact], holdMin: brief.holdMin },
    packType: brief.packType,
    vented: brief.maxGasL > 0,
  });
}
