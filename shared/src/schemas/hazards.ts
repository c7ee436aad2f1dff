import { z } from 'zod';
import { textSchema } from './common';

/**
 * Hazard data and computed hazard notes (DEVELOPERS.md, "Hazard notes"). The computations live in
 * shared/src/hazards; these are the shapes stored and sent over the API.
 */

export const HAZARD_SEVERITIES = ['info', 'caution', 'warning', 'blocker'] as const;
export const hazardSeveritySchema = z.enum(HAZARD_SEVERITIES);
export type HazardSeverity = z.infer<typeof hazardSeveritySchema>;

/** One computed note on a candidate or mixture: what, how serious, which rule, which source. */
export const hazardNoteSchema = z.object({
  severity: hazardSeveritySchema,
  /** Stable rule id, e.g. `skin.cold-contact`, `gas.hydrogen.flammable`, `precursor.an-nitrogen`. */
  ruleId: z.string(),
  title: z.string(),
  text: z.string(),
  source: z.string(),
});
export type HazardNote = z.infer<typeof hazardNoteSchema>;

export const GHS_PICTOGRAMS = ['GHS01', 'GHS02', 'GHS03', 'GHS04', 'GHS05', 'GHS06', 'GHS07', 'GHS08', 'GHS09'] as const;
export const ghsPictogramSchema = z.enum(GHS_PICTOGRAMS);

/** One GHS classification entry of an ingredient: class, category, H-statements. */
export const ghsClassificationSchema = z.object({
  /** Hazard class code, e.g. `ox-sol`, `acute-tox-oral`, `skin-corr`, `eye-dam`, `eye-irrit`, `water-react`, `flam-sol`. */
  hazardClass: textSchema().trim().min(1, 'is required').max(60),
  /** Category as printed, e.g. `1`, `1A`, `2`, `3`, `4`. */
  category: textSchema().trim().min(1, 'is required').max(8),
  hStatements: z.array(textSchema().regex(/^(EU)?H\d{3}[A-Za-z]*$/, 'must be an H-statement code such as H302')).max(20),
});
export type GhsClassification = z.infer<typeof ghsClassificationSchema>;

export const INCOMPATIBILITY_GROUPS = ['oxidiser', 'fuel', 'reducing-agent', 'water-reactive', 'acid', 'base'] as const;
export const incompatibilityGroupSchema = z.enum(INCOMPATIBILITY_GROUPS);

/** Hazard data a chemist keeps on each ingredient, each block with its source. */
export const ingredientHazardDataSchema = z.object({
  classifications: z.array(ghsClassificationSchema).max(30).default([]),
  pictograms: z.array(ghsPictogramSchema).max(9).default([]),
  signalWord: z.enum(['Danger', 'Warning']).nullable().default(null),
  /** Acute toxicity estimates, mg/kg body weight (oral, dermal) or mg/L (inhalation). */
  acuteToxicityEstimates: z
    .object({ oralMgPerKg: z.number().positive().nullable().default(null), dermalMgPerKg: z.number().positive().nullable().default(null) })
    .default({ oralMgPerKg: null, dermalMgPerKg: null }),
  /** pH of a 1 % (or saturated) aqueous solution, where known; feeds the GHS pH rule. */
  solutionPH: z.number().min(0).max(14).nullable().default(null),
  incompatibilityGroups: z.array(incompatibilityGroupSchema).max(6).default([]),
  /** Regulatory flags, e.g. `eu-2019-1148-an` (explosives precursor), `un-1942` (transport). */
  regulatoryFlags: z.array(z.object({ code: textSchema().min(1).max(60), text: textSchema().min(1).max(500) })).max(20).default([]),
  /** Where the data come from: a safety data sheet, a harmonised classification, or "from memory". */
  source: textSchema().trim().min(1, 'name the source of the hazard data').max(500),
});
export type IngredientHazardData = z.infer<typeof ingredientHazardDataSchema>;

/** GHS label elements of a mixture. */
export const labelElementsSchema = z.object({
  pictograms: z.array(ghsPictogramSchema),
  signalWord: z.enum(['Danger', 'Warning']).nullable(),
  hStatements: z.array(z.string()),
  pStatements: z.array(z.string()),
});
export type LabelElements = z.infer<typeof labelElementsSchema>;

/** Everything computed about a candidate's hazards. */
export const candidateHazardsSchema = z.object({
  notes: z.array(hazardNoteSchema),
  classification: z.array(ghsClassificationSchema.extend({ rule: z.string() })),
  label: labelElementsSchema,
  /** 0 (nothing to note) upward; feeds the ranking and the Pareto axis. */
  score: z.number().min(0),
});
export type CandidateHazards = z.infer<typeof candidateHazardsSchema>;

/** The standing caution every hazard view carries. */
export const HAZARD_STANDING_CAUTION =
  'These hazard notes are computed from the composition and the predicted temperatures to inform a design. They do not replace local codes, the current safety data sheet of each ingredient, or review by qualified people.';
