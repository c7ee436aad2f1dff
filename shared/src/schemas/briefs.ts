import { z } from 'zod';
import { textSchema, MAX_ID } from './common';
import { candidateHazardsSchema } from './hazards';

/**
 * A brief: what a pack must do (DEVELOPERS.md, "Briefs and the optimiser") and the optimiser's answer to it.
 *
 * Units are in every field name. Temperatures in °C, temperature differences in K, times in
 * minutes, masses in grams, gas volumes in litres at 25 °C and 1 atm, money in the workspace
 * currency as a decimal string (a JSON number is accepted and converted; money is never stored
 * as a float). Ingredient ids are strings: the back end's integer ids arrive as numbers or
 * strings and are normalised to strings ("12").
 *
 * Semantics of the thermal target (also used by the optimiser's verification):
 * - cold pack: the pack must get down to `targetTempC` or colder within `reachWithinMin`, then
 *   stay in its band, at most `targetTempC + bandK` (and not below `minSurfaceTempC`), for
 *   `holdMin` minutes;
 * - warm pack: up to `targetTempC` or warmer within `reachWithinMin`, then at least
 *   `targetTempC − bandK` (and not above `maxSurfaceTempC`) for `holdMin` minutes.
 * The band is the tolerance a pack may drift past its target while it is held.
 */

export const PACK_TYPES = ['cold', 'warm'] as const;
export const packTypeSchema = z.enum(PACK_TYPES, { error: `must be one of ${PACK_TYPES.join(', ')}` });
export type PackType = z.infer<typeof packTypeSchema>;

/**
 * How the pack exchanges heat with its surroundings when no `uaWPerK` is given: the thermal
 * model's contact cases (thermal/contact.ts) over the pack's area `packAreaM2`:
 * `skin-through-fabric` (the thermal model's `skin-fabric`) exchanges with the skin (33 °C)
 * through a fabric layer on one face and with the ambient air on the other.
 */
export const CONTACT_CASES = ['still-air', 'skin-through-fabric', 'insulated'] as const;
export const contactCaseSchema = z.enum(CONTACT_CASES, { error: `must be one of ${CONTACT_CASES.join(', ')}` });
export type ContactCase = z.infer<typeof contactCaseSchema>;

export const OBJECTIVES = ['least-cost', 'least-mass', 'most-hold-margin'] as const;
export const objectiveSchema = z.enum(OBJECTIVES, { error: `must be one of ${OBJECTIVES.join(', ')}` });
export type Objective = z.infer<typeof objectiveSchema>;

/** Money in the workspace currency: a decimal string such as "0.45"; a JSON number is accepted. */
export const moneySchema = z.preprocess(
  (v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : v),
  textSchema({ error: 'must be a decimal amount such as 0.45' })
    .trim()
    .refine((s) => !s.startsWith('-'), { message: 'must be 0 or more', abort: true })
    .regex(/^\d{1,8}(\.\d{1,6})?$/, 'must be a decimal amount such as 0.45 (at most 8 digits before and 6 after the point)'),
);

/** An ingredient id: a positive integer or a non-empty string, normalised to a string. */
export const ingredientIdSchema = z.preprocess(
  (v) => (typeof v === 'number' && Number.isInteger(v) && v > 0 ? String(v) : v),
  textSchema({ error: 'must be an ingredient id' }).trim().min(1, 'must be an ingredient id').max(120, 'must be at most 120 characters'),
);

/** GHS hazard class code, e.g. `ox-sol-3`, `acute-tox-4-oral`, `eye-irrit-2`. Hazard data arrive with the hazards module. */
const hazardClassSchema = textSchema().trim().min(1, 'must not be empty').max(60, 'must be at most 60 characters');

/**
 * A cap on one ingredient's mass fraction of the fill (the mixture without packaging), e.g.
 * to keep a mixture below a classification cut-off or a precursor threshold. The hazards
 * module adds its own; a designer may add more.
 */
export const concentrationCapSchema = z.object({
  ingredientId: ingredientIdSchema,
  /** Highest mass fraction of the fill, 0–1. */
  maxMassFraction: z.number({ error: 'must be a number between 0 and 1' }).min(0, 'must be 0 or more').max(1, 'must be at most 1'),
  /** Why the cap exists (rule id or citation). */
  reason: textSchema().trim().max(300, 'must be at most 300 characters').default('designer cap'),
});
export type ConcentrationCap = z.infer<typeof concentrationCapSchema>;

/** Pouch, inner bag and anything else the pack carries that is not an ingredient. */
export const packagingSchema = z.object({
  massG: z.number({ error: 'must be a number of grams' }).min(0, 'must be 0 or more').max(5000, 'must be at most 5000 g').default(12),
  /**
   * Heat capacity of the packaging, J/K. Default 24 J/K: 12 g of polyethylene film at about
   * 2.0 J/(g·K) (typical handbook value for PE, from memory).
   */
  heatCapacityJPerK: z.number({ error: 'must be a number in J/K' }).min(0, 'must be 0 or more').max(1e6, 'must be at most 1e6 J/K').default(24),
  /** Cost of the packaging per unit, workspace currency (invented default). */
  cost: moneySchema.default('0.08'),
});
export type Packaging = z.infer<typeof packagingSchema>;

/** What a pack heats or cools. */
export const LOAD_KINDS = ['food-drink', 'limb-through-fabric', 'cold-chain-box'] as const;
export type LoadKind = (typeof LOAD_KINDS)[number];

/**
 * The thing the pack serves (a meal or drink, a limb through fabric, a cold-chain box's
 * contents) as a lumped heat capacity with its own start temperature, coupled to the pack by a
 * conductance given directly (`uaToPackWPerK`) or from a contact area (`contactAreaM2` × the
 * kind's contact conductance, evaluation/load.ts), and to the surroundings by `uaToEnvWPerK`.
 * With a load the brief's target and hold apply to the load's temperature; the surface limits
 * stay on the pack.
 */
export const loadSchema = z
  .object({
    kind: z.enum(LOAD_KINDS, { error: `must be one of ${LOAD_KINDS.join(', ')}` }),
    massG: z.number({ error: 'must be a number of grams' }).positive('must be greater than 0').max(100000, 'must be at most 100 kg'),
    cpJPerGK: z.number({ error: 'must be a number in J/(g·K)' }).positive('must be greater than 0').max(10, 'must be at most 10 J/(g·K)'),
    /** Start temperature of the load, °C; default the brief's ambient. */
    initialTempC: z.number({ error: 'must be a number of °C' }).min(-60, 'must be at least −60 °C').max(200, 'must be at most 200 °C').nullable().default(null),
    uaToPackWPerK: z.number({ error: 'must be a number in W/K' }).min(0, 'must be 0 or more').max(1000, 'must be at most 1000 W/K').nullable().default(null),
    contactAreaM2: z.number({ error: 'must be a number of m²' }).positive('must be greater than 0').max(10, 'must be at most 10 m²').nullable().default(null),
    uaToEnvWPerK: z.number({ error: 'must be a number in W/K' }).min(0, 'must be 0 or more').max(1000, 'must be at most 1000 W/K').default(0),
  })
  .refine((l) => (l.uaToPackWPerK === null) !== (l.contactAreaM2 === null), {
    message: 'give either uaToPackWPerK or contactAreaM2 (exactly one)',
    path: ['uaToPackWPerK'],
  });
export type Load = z.infer<typeof loadSchema>;
export type LoadInput = z.input<typeof loadSchema>;

/** Defaults of a brief, by pack type: a sideline cold compress and a warm compress. */
export const BRIEF_DEFAULTS = {
  cold: {
    /** A cold compress should get to 5 °C or colder (common first-aid practice: 0–10 °C at the skin). */
    targetTempC: 5,
    /**
     * No floor by default: the optimiser's floor row is adiabatic (conservative), and with a
     * floor a few kelvin under the target no fill can also pay for the heat leaking in over a
     * hold. A designer who needs a floor (a medicine insert that must not freeze) sets one;
     * cold-injury cautions for skin contact come with the hazard notes.
     */
    minSurfaceTempC: null,
    maxSurfaceTempC: null,
  },
  warm: {
    /** A warm compress should get to 40 °C or warmer. */
    targetTempC: 40,
    minSurfaceTempC: null,
    /**
     * Not above 44 °C against the skin: prolonged contact above about 44 °C can burn
     * (Moritz & Henriques, Am. J. Pathol. 23 (1947) 695, from memory; local codes decide).
     */
    maxSurfaceTempC: 44,
  },
  ambientC: 25,
  /** Tolerance past the target while the pack is held, K. */
  bandK: 2,
  /** An instant pack is expected to work within a few minutes (common practice). */
  reachWithinMin: 5,
  /** 20 min: the usual single application of a cold compress (common first-aid practice). */
  holdMin: 20,
  contact: 'still-air' as ContactCase,
  /** Two faces of a 15 cm × 10 cm pouch. */
  packAreaM2: 0.03,
  maxMassG: 400,
  maxGasL: 0,
  objective: 'least-cost' as Objective,
  maxActives: 2,
} as const;

const temp = (what: string) =>
  z.number({ error: `${what} must be a number of °C` }).min(-60, `${what} must be at least −60 °C`).max(200, `${what} must be at most 200 °C`);

/** Fields of a brief with their defaults, before pack-type defaults and cross-field rules. */
const briefFields = {
  name: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  packType: packTypeSchema.default('cold'),
  /** Temperature of the air around the pack, °C. */
  ambientC: temp('ambientC').default(BRIEF_DEFAULTS.ambientC),
  /** Temperature of the pack when activated; defaults to ambientC. */
  initialTempC: temp('initialTempC').optional(),
  /** Cold: at most this temperature; warm: at least. Default by pack type (5 °C cold, 40 °C warm). */
  targetTempC: temp('targetTempC').optional(),
  bandK: z.number({ error: 'bandK must be a number of kelvin' }).min(0, 'must be 0 or more').max(50, 'must be at most 50 K').default(BRIEF_DEFAULTS.bandK),
  reachWithinMin: z.number({ error: 'must be a number of minutes' }).positive('must be greater than 0').max(1440, 'must be at most 1440 min').default(BRIEF_DEFAULTS.reachWithinMin),
  holdMin: z.number({ error: 'must be a number of minutes' }).positive('must be greater than 0').max(7 * 1440, 'must be at most one week (10080 min)').default(BRIEF_DEFAULTS.holdMin),
  contact: contactCaseSchema.default(BRIEF_DEFAULTS.contact),
  /** Outer area of the pack, m², for UA from the contact case and for O2 uptake through the film. */
  packAreaM2: z.number({ error: 'must be a number of m²' }).positive('must be greater than 0').max(10, 'must be at most 10 m²').default(BRIEF_DEFAULTS.packAreaM2),
  /** Overall heat-exchange conductance, W/K; when given it wins over the contact case. 0: adiabatic. */
  uaWPerK: z.number({ error: 'must be a number in W/K' }).min(0, 'must be 0 or more').max(1000, 'must be at most 1000 W/K').nullable().default(null),
  /** Most mass of the whole pack (fill and packaging), g. */
  maxMassG: z.number({ error: 'must be a number of grams' }).positive('must be greater than 0').max(100000, 'must be at most 100 kg').default(BRIEF_DEFAULTS.maxMassG),
  /** Most cost per unit (fill and packaging), workspace currency; null: no limit. */
  maxUnitCost: moneySchema.nullable().default(null),
  /** Coldest surface temperature allowed, °C; null: none (the default). */
  minSurfaceTempC: temp('minSurfaceTempC').nullable().optional(),
  /** Warmest surface temperature allowed, °C; null: none. Default 44 °C for warm packs. */
  maxSurfaceTempC: temp('maxSurfaceTempC').nullable().optional(),
  /** Most gas the pack may evolve, L at 25 °C and 1 atm. Default 0: a sealed pack evolves none. */
  maxGasL: z.number({ error: 'must be a number of litres' }).min(0, 'must be 0 or more').max(1000, 'must be at most 1000 L').default(BRIEF_DEFAULTS.maxGasL),
  /** Ingredients the optimiser may use; empty: the whole library. */
  allowedIngredientIds: z.array(ingredientIdSchema).max(500, 'at most 500 ids').default([]),
  excludedIngredientIds: z.array(ingredientIdSchema).max(500, 'at most 500 ids').default([]),
  /** Ingredients carrying any of these GHS hazard classes are left out (data arrive with the hazards module). */
  excludedHazardClasses: z.array(hazardClassSchema).max(100, 'at most 100 hazard classes').default([]),
  concentrationCaps: z.array(concentrationCapSchema).max(100, 'at most 100 caps').default([]),
  objective: objectiveSchema.default(BRIEF_DEFAULTS.objective),
  /** Most active ingredients per mixture, 1–3. */
  maxActives: z.number({ error: 'must be 1, 2 or 3' }).int('must be 1, 2 or 3').min(1, 'must be 1, 2 or 3').max(3, 'must be 1, 2 or 3').default(BRIEF_DEFAULTS.maxActives),
  packaging: packagingSchema.default({ massG: 12, heatCapacityJPerK: 24, cost: '0.08' }),
  /**
   * Rank sets whose ingredients are incompatible (ions that precipitate, a gas from their meeting,
   * reactive pairs) among the others; false (the default): after every compatible one.
   */
  allowIncompatible: z.boolean({ error: 'must be true or false' }).default(false),
  /** What the pack heats or cools; null (the default): the pack itself is judged. */
  load: loadSchema.nullable().default(null),
  notes: textSchema({ error: 'must be text' }).max(4000, 'must be at most 4000 characters').default(''),
};

const briefObjectSchema = z.object(briefFields);
type BriefObject = z.output<typeof briefObjectSchema>;

/** A brief with every default applied. */
export interface Brief extends Omit<BriefObject, 'initialTempC' | 'targetTempC' | 'minSurfaceTempC' | 'maxSurfaceTempC'> {
  initialTempC: number;
  targetTempC: number;
  minSurfaceTempC: number | null;
  maxSurfaceTempC: number | null;
}

/** Fill in the defaults that depend on other fields (initial = ambient; target and surface limits by pack type). */
function applyDependentDefaults(b: BriefObject): Brief {
  const d = BRIEF_DEFAULTS[b.packType];
  return {
    ...b,
    initialTempC: b.initialTempC ?? b.ambientC,
    targetTempC: b.targetTempC ?? d.targetTempC,
    minSurfaceTempC: b.minSurfaceTempC === undefined ? d.minSurfaceTempC : b.minSurfaceTempC,
    maxSurfaceTempC: b.maxSurfaceTempC === undefined ? d.maxSurfaceTempC : b.maxSurfaceTempC,
  };
}

/**
 * Cross-field rules of a complete brief, as field/message pairs: a cold pack's target lies
 * below both its ambient and its initial temperature, a warm pack's above; the surface limits
 * leave room for the target (cold: minSurfaceTempC < targetTempC; warm: maxSurfaceTempC >
 * targetTempC); the packaging alone stays within the mass and cost limits; no ingredient is
 * both allowed and excluded.
 *
 * @example briefRuleErrors({ ...brief, packType: 'cold', ambientC: 25, targetTempC: 30 })
 * // → [{ field: 'targetTempC', message: 'a cold pack's target must be below ambientC (25 °C); found 30 °C' }, …]
 */
export function briefRuleErrors(b: Brief): { field: string; message: string }[] {
  const errors: { field: string; message: string }[] = [];
  if (b.packType === 'cold') {
    if (!(b.targetTempC < b.ambientC)) errors.push({ field: 'targetTempC', message: `a cold pack's target must be below ambientC (${b.ambientC} °C); found ${b.targetTempC} °C` });
    if (!(b.targetTempC < b.initialTempC)) errors.push({ field: 'targetTempC', message: `a cold pack's target must be below initialTempC (${b.initialTempC} °C); found ${b.targetTempC} °C` });
    if (b.minSurfaceTempC !== null && !(b.minSurfaceTempC < b.targetTempC)) {
      errors.push({ field: 'minSurfaceTempC', message: `must be below the target (${b.targetTempC} °C) for a cold pack; found ${b.minSurfaceTempC} °C` });
    }
  } else {
    if (!(b.targetTempC > b.ambientC)) errors.push({ field: 'targetTempC', message: `a warm pack's target must be above ambientC (${b.ambientC} °C); found ${b.targetTempC} °C` });
    if (!(b.targetTempC > b.initialTempC)) errors.push({ field: 'targetTempC', message: `a warm pack's target must be above initialTempC (${b.initialTempC} °C); found ${b.targetTempC} °C` });
    if (b.maxSurfaceTempC !== null && !(b.maxSurfaceTempC > b.targetTempC)) {
      errors.push({ field: 'maxSurfaceTempC', message: `must be above the target (${b.targetTempC} °C) for a warm pack; found ${b.maxSurfaceTempC} °C` });
    }
  }
  if (b.minSurfaceTempC !== null && b.maxSurfaceTempC !== null && !(b.minSurfaceTempC < b.maxSurfaceTempC)) {
    errors.push({ field: 'maxSurfaceTempC', message: `must be above minSurfaceTempC (${b.minSurfaceTempC} °C); found ${b.maxSurfaceTempC} °C` });
  }
  if (!(b.packaging.massG < b.maxMassG)) {
    errors.push({ field: 'packaging.massG', message: `the packaging alone must weigh less than maxMassG (${b.maxMassG} g); found ${b.packaging.massG} g` });
  }
  if (b.maxUnitCost !== null && !(Number(b.packaging.cost) < Number(b.maxUnitCost))) {
    errors.push({ field: 'packaging.cost', message: `the packaging alone must cost less than maxUnitCost (${b.maxUnitCost}); found ${b.packaging.cost}` });
  }
  const excluded = new Set(b.excludedIngredientIds);
  const both = b.allowedIngredientIds.filter((id) => excluded.has(id));
  if (both.length) errors.push({ field: 'excludedIngredientIds', message: `ingredients cannot be both allowed and excluded; found ${both.join(', ')} in both lists` });
  return errors;
}

/**
 * A brief as created by a designer: everything but the name has a default (a sideline cold
 * compress: ambient and initial 25 °C, ≤ 5 °C within 5 min, band 2 K, held 20 min, on skin through
 * fabric, 0.03 m², ≤ 400 g, no cost limit, no surface floor, no gas, least cost, up to
 * 2 actives, 12 g / 24 J/K / 0.08 packaging). The output is a complete {@link Brief}.
 *
 * @example briefSchema.parse({ name: 'Sideline compress' }).targetTempC // → 5
 * @example briefSchema.parse({ name: 'Glove warmer', packType: 'warm' }).maxSurfaceTempC // → 44
 */
export const briefSchema = briefObjectSchema.transform(applyDependentDefaults).superRefine((b, ctx) => {
  for (const e of briefRuleErrors(b)) ctx.addIssue({ code: 'custom', message: e.message, path: e.field.split('.') });
});
export type BriefInput = z.input<typeof briefSchema>;

/** Create payload of a brief (same as {@link briefSchema}). */
export const createBriefRequestSchema = briefSchema;
export type CreateBriefRequest = z.output<typeof createBriefRequestSchema>;

/**
 * A partial change of a brief: any field, no defaults applied. The service merges it onto the
 * stored brief and validates the merged whole with {@link briefSchema} (cross-field rules need
 * the whole brief). `version` is the one the client loaded (stale → 409).
 */
export const updateBriefRequestSchema = z
  .object(
    Object.fromEntries(
      Object.entries(briefFields).map(([k, v]) => [k, (v instanceof z.ZodDefault ? (v.unwrap() as z.ZodType) : (v as z.ZodType)).optional()]),
    ) as {
      [K in keyof typeof briefFields]: z.ZodOptional<z.ZodType<z.output<(typeof briefFields)[K]>, z.input<(typeof briefFields)[K]>>>;
    },
  )
  .extend({ version: z.number({ error: 'is required' }).int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`) });
export type UpdateBriefRequest = z.output<typeof updateBriefRequestSchema>;

// ---------------------------------------------------------------------------------------------
// The optimiser's answer

/** The kinds of constraint of the optimiser's linear model (see optimiser/linear-model.ts). */
export const CONSTRAINT_KINDS = [
  'heat-budget',
  'solubility',
  'water-for-reaction',
  'total-mass',
  'unit-cost',
  'gas',
  'surface-temperature',
  'oxygen-supply',
  'concentration-cap',
  'additive-ratio',
  'partner-stoichiometry',
] as const;
export const constraintKindSchema = z.enum(CONSTRAINT_KINDS);
export type ConstraintKind = z.infer<typeof constraintKindSchema>;

export const compositionEntrySchema = z.object({
  ingredientId: z.string(),
  name: z.string(),
  role: z.enum(['active', 'solvent', 'additive', 'packaging']),
  massG: z.number(),
});
export type CompositionEntry = z.infer<typeof compositionEntrySchema>;

/** A binding constraint and what relaxing it by one unit of its own would buy. */
export const sensitivitySchema = z.object({
  constraintId: z.string(),
  kind: constraintKindSchema,
  label: z.string(),
  /** Unit of the constraint's right-hand side, e.g. `g`, `kJ`, `L`, `currency`. */
  unit: z.string(),
  /** Change of the objective when the constraint is relaxed by one unit (re-solved), in the objective's unit; null when the relaxed LP fails. */
  objectiveChangePerUnit: z.number().nullable(),
  /** Marginal rate (shadow price) in objective units per unit of the constraint, from a small step. */
  marginalRate: z.number().nullable(),
  objectiveUnit: z.string(),
});
export type Sensitivity = z.infer<typeof sensitivitySchema>;

export const VERIFICATION_STATUSES = ['passed', 'missed', 'not-verified', 'failed'] as const;
export const verificationSchema = z.object({
  /** passed: the time model meets the brief; missed: it does not (reasons say why); not-verified: outside the verified top; failed: the time model raised an error. */
  status: z.enum(VERIFICATION_STATUSES),
  reasons: z.array(z.string()),
  timeToTargetMin: z.number().nullable(),
  minutesInBand: z.number().nullable(),
  minTempC: z.number().nullable(),
  maxTempC: z.number().nullable(),
  endTempC: z.number().nullable(),
  /** Simulated minutes in band minus holdMin (negative: short). */
  holdMarginMin: z.number().nullable(),
});
export type Verification = z.infer<typeof verificationSchema>;

/** Why a candidate's ingredients do not belong together (optimiser/incompatible-sets.ts), in words. */
export const candidateIncompatibilitySchema = z.object({
  kind: z.enum(['precipitation', 'gas', 'reactive']),
  /** The ingredients involved, by name. */
  between: z.array(z.string()),
  /** The solid precipitated, the gas evolved, or the hazard rule id. */
  subject: z.string(),
  message: z.string(),
});
export type CandidateIncompatibility = z.infer<typeof candidateIncompatibilitySchema>;

export const candidateSchema = z.object({
  /** Ids of the active ingredients of the set, sorted. */
  setIds: z.array(z.string()),
  setNames: z.array(z.string()),
  /** Grams per ingredient (fill only; packaging separate). */
  composition: z.array(compositionEntrySchema),
  fillMassG: z.number(),
  /** Fill and packaging, g. */
  massG: z.number(),
  /** Fill and packaging, workspace currency, as a decimal string with 4 decimals. */
  unitCost: z.string(),
  /** The same as a number, for plots and ranking. */
  unitCostValue: z.number(),
  /** Heat beyond the budget in the linear model at the target, J (≥ 0 for a feasible candidate). */
  heatSurplusJ: z.number(),
  /** Linear-model hold margin: heat surplus / (UA·|T_env − T_target|), min; null when UA·ΔT = 0. */
  predictedHoldMarginMin: z.number().nullable(),
  /** Adiabatic extreme temperature of the linear model (all heat into the pack, none lost), °C. */
  predictedExtremeTempC: z.number(),
  /** Predicted by the time model (null until verified). */
  predictedMinTempC: z.number().nullable(),
  predictedMaxTempC: z.number().nullable(),
  minutesInBand: z.number().nullable(),
  objectiveValue: z.number(),
  bindingConstraints: z.array(z.object({ id: z.string(), kind: constraintKindSchema, label: z.string() })),
  verification: verificationSchema,
  pareto: z.boolean(),
  rank: z.number().int(),
  /** The hazards module's score (hazards/hazard-notes.ts hazardScore); 0 when no ingredient carries hazard data. */
  hazardScore: z.number(),
  /** Hazard notes, mixture classification and label of the candidate; absent when no ingredient carries hazard data. */
  hazards: candidateHazardsSchema.optional(),
  sensitivity: z.array(sensitivitySchema),
  enthalpyIteration: z.object({ iterations: z.number().int(), settled: z.boolean(), lastRelativeChange: z.number() }),
  /**
   * Closing the loop: rounds in which the set's heat budget was raised by its simulated
   * shortfall and the set solved again, the heat added (J, 0 when the first optimum was kept)
   * and the simulated hold margin of the composition listed (min; negative: short).
   */
  correction: z.object({ rounds: z.number().int().min(0), heatBudgetCorrectionJ: z.number(), finalHoldMarginMin: z.number().nullable() }).optional(),
  /** What goes wrong when its ingredients meet; empty: compatible. Absent on runs made before the check. */
  incompatibilities: z.array(candidateIncompatibilitySchema).optional(),
  warnings: z.array(z.object({ code: z.string(), message: z.string() })),
});
export type Candidate = z.infer<typeof candidateSchema>;

export const blockingConstraintSchema = z.object({
  constraintId: z.string(),
  kind: constraintKindSchema,
  label: z.string(),
  /**
   * How far the constraint must be relaxed for the set to become feasible, in `unit` (> 0);
   * null when no finite relaxation would do (e.g. a power the film can never supply): the
   * reason says so in words.
   */
  shortfall: z.number().nullable(),
  unit: z.string(),
  /** `alone`: relaxing this constraint alone by the shortfall makes the set feasible; `jointly`: together with the others listed. */
  relaxation: z.enum(['alone', 'jointly']),
});
export type BlockingConstraint = z.infer<typeof blockingConstraintSchema>;

export const infeasibleSetSchema = z.object({
  setIds: z.array(z.string()),
  setNames: z.array(z.string()),
  blocking: z.array(blockingConstraintSchema),
  /** One sentence for people. */
  reason: z.string(),
});
export type InfeasibleSet = z.infer<typeof infeasibleSetSchema>;

export const optimisationResultSchema = z.object({
  status: z.enum(['completed', 'cancelled']),
  objective: objectiveSchema,
  objectiveUnit: z.string(),
  candidates: z.array(candidateSchema),
  infeasible: z.array(infeasibleSetSchema),
  /** Library ingredients left out before enumeration, with the reason. */
  excludedIngredients: z.array(z.object({ ingredientId: z.string(), name: z.string(), reason: z.string() })),
  stats: z.object({
    setsEnumerated: z.number().int(),
    setsSolved: z.number().int(),
    lpsSolved: z.number().int(),
    feasibleSets: z.number().int(),
    verified: z.number().int(),
    unsettledSets: z.number().int(),
    /** Missed sets whose heat budget was corrected by their simulated shortfall and solved again. */
    correctedSets: z.number().int().optional(),
    /** Steps the run's progress counted: sets solved + candidates simulated + target-sweep points. */
    steps: z.number().int().optional(),
  }),
  warnings: z.array(z.object({ code: z.string(), message: z.string() })),
});
export type OptimisationResult = z.infer<typeof optimisationResultSchema>;
