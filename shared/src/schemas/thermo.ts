import { z } from 'zod';
import { textSchema } from './common';
import { phaseSchema } from './library';
import { evaluateMixtureResponseSchema } from './mixtures';
import { ghsClassificationSchema, hazardNoteSchema, labelElementsSchema } from './hazards';

// Thermochemistry API: reaction thermodynamics and the chemistry library for instant previews.

export const reactionTermSchema = z.object({
  formula: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(100, 'must be at most 100 characters'),
  phase: phaseSchema.optional(),
  coef: z.number({ error: 'must be a number' }).positive('must be greater than 0').max(1000, 'must be at most 1000'),
});

export const reactionRequestSchema = z.object({
  reactants: z.array(reactionTermSchema, { error: 'must be a list of {formula, phase, coef}' }).min(1, 'needs at least one reactant').max(20, 'at most 20 terms'),
  products: z.array(reactionTermSchema, { error: 'must be a list of {formula, phase, coef}' }).min(1, 'needs at least one product').max(20, 'at most 20 terms'),
  tempC: z.number({ error: 'must be a number in °C' }).min(-200, 'must be at least −200 °C').max(3000, 'must be at most 3000 °C').default(25),
});
export type ReactionRequest = z.infer<typeof reactionRequestSchema>;

const warningSchema = z.object({ code: z.string(), message: z.string() });

export const reactionResponseSchema = z.object({
  /** ΔrH at tempC, kJ per mole of reaction as written. */
  dH_kJ: z.number(),
  /** ΔrS at tempC, J/K (null when entropies are missing). */
  dS_J_per_K: z.number().nullable(),
  /** ΔrG at tempC, kJ. */
  dG_kJ: z.number().nullable(),
  /** Temperature where ΔrG changes sign (ΔrH°/ΔrS°), °C, or null. */
  crossoverC: z.number().nullable(),
  favourability: z.enum(['always', 'never', 'above', 'below']),
  favourabilityText: z.string(),
  dH298_kJ: z.number(),
  dS298_J_per_K: z.number().nullable(),
  dG298_kJ: z.number().nullable(),
  dCp_J_per_K: z.number().nullable(),
  crossoverKirchhoffC: z.number().nullable(),
  tempC: z.number(),
  warnings: z.array(warningSchema),
  /** The species used, with signed stoichiometric numbers (products +) and their sources. */
  terms: z.array(
    z.object({
      key: z.string(),
      name: z.string(),
      formula: z.string(),
      phase: phaseSchema,
      nu: z.number(),
      molarMass_g_per_mol: z.number(),
      Cp_J_per_mol_K: z.number().nullable(),
      source: z.string(),
    }),
  ),
});
export type ReactionResponse = z.infer<typeof reactionResponseSchema>;

/** The ChemistryLibrary (shared/src/chemistry/types.ts) of the signed-in member's workspace. */
export const chemistryLibraryResponseSchema = z.object({
  species: z.array(z.record(z.string(), z.unknown())),
  dilution: z.array(z.record(z.string(), z.unknown())),
  solubility: z.array(z.record(z.string(), z.unknown())),
  solutionHeatCapacity: z.array(z.record(z.string(), z.unknown())),
  freezingPoint: z.array(z.record(z.string(), z.unknown())).optional(),
  eutectics: z.array(z.record(z.string(), z.unknown())).optional(),
});

// ---------------------------------------------------------------------------------------------
// POST /api/mixtures/evaluate: the shared evaluation plus what only the library knows.

/** The mixture's material cost from the ingredients' cost per kg, as a decimal string. */
export const mixtureCostSchema = z.object({
  amount: z.string(),
  currency: z.string(),
  /** False when some component (a bare formula) has no cost in the library. */
  complete: z.boolean(),
});

export const evaluatedComponentSchema = z.object({
  ingredientId: z.number().nullable(),
  formula: z.string().nullable(),
  name: z.string(),
  massG: z.number(),
  processKind: z.string(),
  /** For a bare formula: the processes the bench may choose, the expected one first (empty for water and ingredients). */
  processOptions: z.array(z.object({ kind: z.string(), label: z.string() })).default([]),
});

export const evaluateMixtureApiResponseSchema = evaluateMixtureResponseSchema.extend({
  /** null when the components' costs are in different currencies (see warnings). */
  cost: mixtureCostSchema.nullable(),
  components: z.array(evaluatedComponentSchema),
  /** Hazard notes of the mixture (shared/src/hazards, as for a candidate), most serious first. */
  hazards: z.array(hazardNoteSchema),
  /** GHS label elements of the mixture and its classification. */
  label: labelElementsSchema,
  classification: z.array(ghsClassificationSchema.extend({ rule: z.string() })),
  /** Where each bare formula's classification comes from, or that the project's data hold none. */
  classificationStatements: z.array(z.string()),
  standingCaution: z.string(),
  /** What precipitates when the dissolved ions meet (chemistry/precipitation.ts). */
  precipitation: z.object({
    precipitates: z.array(z.object({ solidKey: z.string(), name: z.string(), mol: z.number(), massG: z.number(), log10Ksp: z.number(), heatReleasedJ: z.number().nullable() })),
    heatReleasedJ: z.number(),
    statement: z.string(),
    source: z.string(),
  }),
});
export type EvaluateMixtureApiResponse = z.infer<typeof evaluateMixtureApiResponseSchema>;
