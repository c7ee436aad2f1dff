import { HAZARD_STANDING_CAUTION, type CandidateHazards, type HazardNote, type IngredientHazardData } from '../schemas/hazards';
import type { IngredientProcessInput } from '../thermal/process';
import {
  disposalNotes,
  gasesEvolved,
  gasNotes,
  hazardScore,
  incompatibilityNotes,
  ingestionNotes,
  precursorNotes,
  skinColdNotes,
  skinHeatNotes,
  type GasEvolved,
  type SkinContact,
} from './hazard-notes';
import { classifyMixture, type MixtureClassification, type MixtureClassificationOptions } from './mixture-classification';

/** One ingredient of a candidate, as the hazard evaluation reads it. */
export interface HazardCompositionEntry {
  name: string;
  massG: number;
  hazardData: IngredientHazardData | null;
  process?: IngredientProcessInput | null;
  densityGPerMl?: number | null;
  acuteToxicityUnknown?: boolean;
}

export interface CandidateHazardsInput {
  composition: readonly HazardCompositionEntry[];
  predicted: {
    minTempC: number;
    maxTempC: number;
    /** How the pack meets the skin in use. */
    contact: SkinContact;
    /** Planned contact time with the skin, min (the brief's hold). */
    holdMin: number;
  };
  packType: 'cold' | 'warm';
  /** Gas space of the pack, mL; default {@link DEFAULT_HEADSPACE_FRACTION} of the fill volume. */
  headspaceMl?: number;
  /** The pack has a vent for its gas (e.g. a heater bag). Default false. */
  vented?: boolean;
  classificationOptions?: MixtureClassificationOptions;
}

/**
 * Headspace of a sealed pouch as a fraction of the fill volume when none is given: 10 %
 * (an assumption, not a published value; pouches are filled with little air).
 */
export const DEFAULT_HEADSPACE_FRACTION = 0.1;
/** Density used for an ingredient without one when estimating the fill volume, g/mL (assumption; water = 1). */
export const DEFAULT_DENSITY_G_PER_ML = 1.5;

/** The result: the shared contract plus what the views may show beside it. */
export interface CandidateHazardsResult extends CandidateHazards {
  standingCaution: string;
  gases: GasEvolved[];
  headspaceMl: number;
  mixture: MixtureClassification;
}

function isWater(e: HazardCompositionEntry): boolean {
  return e.process?.kind === 'inert' && e.process.role === 'water';
}

/**
 * Everything computed about a candidate's hazards (DEVELOPERS.md, "Hazard notes"):
 * 1. the mixture classification and label ({@link classifyMixture});
 * 2. notes: skin contact temperature (cold packs: the minimum; warm packs: the peak; a cold
 *    pack's peak above 40 °C and a warm pack's minimum below 0 °C are checked too), gases against the headspace,
 *    incompatible pairs, precursors, ingestion and child access, disposal, and the
 *    classification's own notes (carried-over classes, classes not computed);
 * 3. the score ({@link hazardScore}).
 * Headspace when not given: 10 % of Σ massG / density (water 1.0, others their density or 1.5 g/mL).
 * Notes are ordered blocker, warning, caution, info, then by rule id.
 *
 * @example candidateHazards({ composition: [an 50 g, water 50 g], predicted: { minTempC: 2, maxTempC: 25, contact: 'possible', holdMin: 15 }, packType: 'cold' })
 * // → notes: precursor.an-nitrogen (warning), skin.cold.numbness (caution), classification.carried.ox-sol, …
 */
export function candidateHazards(input: CandidateHazardsInput): CandidateHazardsResult {
  const comp = input.composition.filter((c) => c.massG > 0);
  if (!comp.length) throw new Error('expected a composition with at least one ingredient of mass > 0 g; found none');
  const mixture = classifyMixture(
    comp.map((c) => ({ name: c.name, massG: c.massG, hazardData: c.hazardData, ...(c.acuteToxicityUnknown ? { acuteToxicityUnknown: true } : {}) })),
    input.classificationOptions,
  );
  const { minTempC, maxTempC, contact, holdMin } = input.predicted;
  const notes: HazardNote[] = [];
  // The pack's own side first; the other side only where it could matter (a warm pack stored
  // below freezing, a cold pack that heats up above 40 °C).
  if (input.packType === 'cold' || minTempC < 0) notes.push(...skinColdNotes({ minTempC, contactMin: holdMin, skinContact: contact }));
  if (input.packType === 'warm' || maxTempC > 40) notes.push(...skinHeatNotes({ maxTempC, contactMin: holdMin, skinContact: contact }));

  const volumeMl = comp.reduce((a, c) => a + c.massG / (isWater(c) ? 1 : c.densityGPerMl ?? DEFAULT_DENSITY_G_PER_ML), 0);
  const headspaceMl = input.headspaceMl ?? DEFAULT_HEADSPACE_FRACTION * volumeMl;
  const gases = gasesEvolved(comp);
  notes.push(...gasNotes({ gases, headspaceL: headspaceMl / 1000, vented: input.vented ?? false }));

  const grouped = comp.map((c) => ({ name: c.name, massG: c.massG, hazardData: c.hazardData, isWater: isWater(c) }));
  notes.push(...incompatibilityNotes(grouped));
  notes.push(...precursorNotes(grouped));
  notes.push(...mixture.notes);
  notes.push(...ingestionNotes(mixture.classifications));
  notes.push(...disposalNotes(mixture.classifications, comp.map((c) => c.name)));

  const order = { blocker: 0, warning: 1, caution: 2, info: 3 } as const;
  notes.sort((a, b) => order[a.severity] - order[b.severity] || (a.ruleId < b.ruleId ? -1 : a.ruleId > b.ruleId ? 1 : 0));
  const classification = mixture.classifications.map((c) => ({ hazardClass: c.hazardClass, category: c.category, hStatements: c.hStatements, rule: c.rule }));
  return {
    notes,
    classification,
    label: mixture.label,
    score: hazardScore(notes, classification),
    standingCaution: HAZARD_STANDING_CAUTION,
    gases,
    headspaceMl,
    mixture,
  };
}
