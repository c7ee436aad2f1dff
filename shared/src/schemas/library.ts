import { z } from 'zod';
import { FormulaError, parseFormula } from '../chemistry/formula';
import { ingredientProcessSchema } from '../thermal/process';
import { paged, pagedQuerySchema, searchTextSchema, textSchema, MAX_ID, type FieldError } from './common';

// Species data and the ingredient library (DEVELOPERS.md, "Ingredient processes", "The API").

export const PHASES = ['cr', 'l', 'g', 'aq', 'ai', 'ao'] as const;
export const phaseSchema = z.enum(PHASES, { error: `must be one of ${PHASES.join(', ')}` });

/** A species key `formula(phase)`, e.g. `NH4NO3(cr)`. */
export const speciesKeySchema = textSchema({ error: 'must be a species key such as NH4NO3(cr)' })
  .trim()
  .max(120, 'must be at most 120 characters')
  .regex(/^.+\((cr|l|g|aq|ai|ao)\)$/, 'must be a species key such as NH4NO3(cr) (formula, then phase in brackets)');

/** A formula the shared parser reads (hydrate dots, brackets, charges). */
export const formulaSchema = textSchema({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(100, 'must be at most 100 characters')
  .superRefine((value, ctx) => {
    try {
      parseFormula(value);
    } catch (error) {
      ctx.addIssue({ code: 'custom', message: error instanceof FormulaError ? error.message : 'is not a formula' });
    }
  });

/** Every change to species data names where the values come from. */
export const citationSchema = textSchema({ error: 'is required: cite the source of these values' })
  .trim()
  .min(3, 'is required: cite the source of these values (at least 3 characters)')
  .max(500, 'must be at most 500 characters');

const kJPerMol = (what: string) => z.number({ error: `${what} must be a number in kJ/mol` }).min(-100_000).max(100_000);
const jPerMolK = (what: string) => z.number({ error: `${what} must be a number in J/(mol·K)` }).min(-10_000).max(10_000);

export const speciesSchema = z.object({
  id: z.number(),
  key: z.string(),
  formula: z.string(),
  phase: phaseSchema,
  name: z.string(),
  dfH_kJ_per_mol: z.number().nullable(),
  dfG_kJ_per_mol: z.number().nullable(),
  S_J_per_mol_K: z.number().nullable(),
  Cp_J_per_mol_K: z.number().nullable(),
  molarMass_g_per_mol: z.number(),
  source: z.string(),
  /** `reference`: published data every workspace shares; `workspace`: added or corrected here. */
  scope: z.enum(['reference', 'workspace']),
  /** For a workspace correction: the id of the reference row it replaces in this workspace. */
  correctsId: z.number().nullable(),
  version: z.number(),
  updatedAt: z.string(),
});
export type Species = z.infer<typeof speciesSchema>;

export const speciesListQuerySchema = pagedQuerySchema(['formula', 'name', 'phase', 'updatedAt'], 'formula').extend({
  q: searchTextSchema.optional(),
  phase: phaseSchema.optional(),
  scope: z.enum(['reference', 'workspace']).optional(),
});
export type SpeciesListQuery = z.infer<typeof speciesListQuerySchema>;
export const speciesListResponseSchema = paged(speciesSchema);

export const createSpeciesRequestSchema = z.object({
  formula: formulaSchema,
  phase: phaseSchema,
  name: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(200, 'must be at most 200 characters'),
  dfH_kJ_per_mol: kJPerMol('dfH_kJ_per_mol').nullable().optional(),
  dfG_kJ_per_mol: kJPerMol('dfG_kJ_per_mol').nullable().optional(),
  S_J_per_mol_K: jPerMolK('S_J_per_mol_K').nullable().optional(),
  Cp_J_per_mol_K: jPerMolK('Cp_J_per_mol_K').nullable().optional(),
  /** Computed from the formula (CIAAW 2021) when left out. */
  molarMass_g_per_mol: z.number({ error: 'must be a number in g/mol' }).positive('must be greater than 0').max(100_000).optional(),
  source: citationSchema,
});
export type CreateSpeciesRequest = z.infer<typeof createSpeciesRequestSchema>;

/**
 * Correct a species' values. The key (formula and phase) stays; `source` cites the correction.
 * On a reference row this creates the workspace's correction; on a workspace row it edits it.
 */
export const updateSpeciesRequestSchema = z.object({
  name: textSchema().trim().min(1, 'is required').max(200, 'must be at most 200 characters').optional(),
  dfH_kJ_per_mol: kJPerMol('dfH_kJ_per_mol').nullable().optional(),
  dfG_kJ_per_mol: kJPerMol('dfG_kJ_per_mol').nullable().optional(),
  S_J_per_mol_K: jPerMolK('S_J_per_mol_K').nullable().optional(),
  Cp_J_per_mol_K: jPerMolK('Cp_J_per_mol_K').nullable().optional(),
  molarMass_g_per_mol: z.number({ error: 'must be a number in g/mol' }).positive('must be greater than 0').max(100_000).optional(),
  source: citationSchema,
  version: z.number({ error: 'is required' }).int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`),
});
export type UpdateSpeciesRequest = z.infer<typeof updateSpeciesRequestSchema>;

// ---------------------------------------------------------------------------------------------
// Ingredients

export const INGREDIENT_ROLES = ['active', 'solvent', 'additive', 'packaging'] as const;
export const ingredientRoleSchema = z.enum(INGREDIENT_ROLES, { error: `must be one of ${INGREDIENT_ROLES.join(', ')}` });
export type IngredientRole = z.infer<typeof ingredientRoleSchema>;

/**
 * Cost per kg as a decimal string (money is never a float): a JSON number or a string such as
 * "12.50" is accepted, at most 8 digits before and 4 after the point; the answer is a string.
 */
export const costPerKgSchema = z.preprocess(
  (v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : v),
  textSchema({ error: 'must be a decimal number such as 12.50' })
    .trim()
    .refine((s) => !s.startsWith('-'), { message: 'must be 0 or more', abort: true })
    .regex(/^\d{1,8}(\.\d{1,4})?$/, 'must be a decimal number such as 12.50 (at most 8 digits before and 4 after the point)'),
);

export const currencySchema = textSchema({ error: 'must be a three-letter currency code such as EUR' })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, 'must be a three-letter currency code such as EUR');

const gPerG = (what: string) => z.number({ error: `${what} must be a number in g per g` }).min(0, `${what} must be 0 or more`).max(1000, `${what} must be at most 1000 g per g`);

/**
 * One ingredient another needs beside it, in grams per gram of the one that needs it (iron
 * powder needs salt, carbon, a water-holding filler and water). `ingredientId` is an ingredient
 * of the same workspace (the service checks); the ratios are ≥ 0 and max ≥ min when given.
 */
export const ingredientNeedSchema = z
  .object({
    ingredientId: z.number({ error: 'must be the id of an ingredient of this library' }).int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`),
    minGPerG: gPerG('minGPerG'),
    /** Absent: no upper ratio. */
    maxGPerG: gPerG('maxGPerG').optional(),
    /** Why (citation or common practice). */
    source: textSchema({ error: 'must be text' }).trim().max(500, 'must be at most 500 characters').optional(),
  })
  .refine((n) => n.maxGPerG === undefined || n.maxGPerG >= n.minGPerG, { message: 'must be at least minGPerG', path: ['maxGPerG'] });
export type IngredientNeed = z.infer<typeof ingredientNeedSchema>;

/** The needs of one ingredient: at most 20, each other ingredient named once. */
export const ingredientNeedsSchema = z
  .array(ingredientNeedSchema)
  .max(20, 'at most 20 needs')
  .superRefine((needs, ctx) => {
    const seen = new Set<number>();
    needs.forEach((n, k) => {
      if (seen.has(n.ingredientId)) ctx.addIssue({ code: 'custom', message: 'names the same ingredient twice', path: [k, 'ingredientId'] });
      seen.add(n.ingredientId);
    });
  });

const ingredientFields = {
  name: textSchema({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  grade: textSchema({ error: 'must be text' }).trim().max(120, 'must be at most 120 characters'),
  role: ingredientRoleSchema,
  /** The species the ingredient is, when it is one (e.g. `NH4NO3(cr)`). */
  speciesKey: speciesKeySchema.nullable(),
  /** The heat-producing process it carries (shared thermal process schema). */
  process: ingredientProcessSchema.nullable(),
  costPerKg: costPerKgSchema,
  /** Defaults to the workspace's currency. */
  currency: currencySchema,
  densityGPerMl: z.number({ error: 'must be a number in g/mL' }).positive('must be greater than 0').max(25, 'must be at most 25 g/mL').nullable(),
  /** Specific heat capacity of an inert ingredient, J/(g·K). */
  cpJPerGK: z.number({ error: 'must be a number in J/(g·K)' }).positive('must be greater than 0').max(10, 'must be at most 10 J/(g·K)').nullable(),
  /** Citations (data sheets, handbooks) behind the figures. */
  sources: z.array(textSchema().trim().min(1, 'must not be empty').max(500, 'must be at most 500 characters')).max(20, 'at most 20 sources'),
  notes: textSchema({ error: 'must be text' }).max(4000, 'must be at most 4000 characters'),
  /** Other ingredients of this library it needs beside it, g per g of it. */
  needs: ingredientNeedsSchema,
};

type IngredientRuleInput = {
  role?: IngredientRole | undefined;
  process?: z.output<typeof ingredientProcessSchema> | null | undefined;
};

/**
 * Cross-field rules of an ingredient: an active ingredient carries a heat-producing process
 * (not `inert`); a solvent, additive or packaging item carries none or an inert one, and a
 * solvent's inert role is `water`.
 */
export function ingredientRuleErrors(x: IngredientRuleInput): FieldError[] {
  const errors: FieldError[] = [];
  const kind = x.process?.kind;
  if (x.role === 'active') {
    if (!x.process) errors.push({ field: 'process', message: 'is required for an active ingredient (dissolution, reaction, crystallisation or air-oxidation)' });
    else if (kind === 'inert') errors.push({ field: 'process.kind', message: 'an active ingredient needs a heat-producing process, not inert' });
  } else if (x.role && x.process) {
    if (kind !== 'inert') errors.push({ field: 'process.kind', message: `a ${x.role} ingredient carries no heat-producing process: use inert or leave process empty` });
    else if (x.role === 'solvent' && x.process.kind === 'inert' && x.process.role !== 'water') {
      errors.push({ field: 'process.role', message: 'a solvent is water: use role water' });
    }
  }
  return errors;
}

function addRuleIssues(value: IngredientRuleInput, ctx: z.RefinementCtx) {
  for (const e of ingredientRuleErrors(value)) ctx.addIssue({ code: 'custom', message: e.message, path: e.field.split('.') });
}

export const createIngredientRequestSchema = z
  .object({
    ...ingredientFields,
    grade: ingredientFields.grade.optional(),
    speciesKey: ingredientFields.speciesKey.optional(),
    process: ingredientFields.process.optional(),
    currency: ingredientFields.currency.optional(),
    densityGPerMl: ingredientFields.densityGPerMl.optional(),
    cpJPerGK: ingredientFields.cpJPerGK.optional(),
    sources: ingredientFields.sources.optional(),
    notes: ingredientFields.notes.optional(),
    needs: ingredientFields.needs.optional(),
  })
  .superRefine(addRuleIssues);
export type CreateIngredientRequest = z.infer<typeof createIngredientRequestSchema>;

/** A partial change; `version` is the one the client loaded (stale → 409). */
export const updateIngredientRequestSchema = z
  .object({
    name: ingredientFields.name.optional(),
    grade: ingredientFields.grade.optional(),
    role: ingredientFields.role.optional(),
    speciesKey: ingredientFields.speciesKey.optional(),
    process: ingredientFields.process.optional(),
    costPerKg: ingredientFields.costPerKg.optional(),
    currency: ingredientFields.currency.optional(),
    densityGPerMl: ingredientFields.densityGPerMl.optional(),
    cpJPerGK: ingredientFields.cpJPerGK.optional(),
    sources: ingredientFields.sources.optional(),
    notes: ingredientFields.notes.optional(),
    needs: ingredientFields.needs.optional(),
    version: z.number({ error: 'is required' }).int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`),
  });
export type UpdateIngredientRequest = z.infer<typeof updateIngredientRequestSchema>;

export const ingredientSchema = z.object({
  id: z.number(),
  name: z.string(),
  grade: z.string(),
  role: ingredientRoleSchema,
  speciesKey: z.string().nullable(),
  process: ingredientProcessSchema.nullable(),
  /** Decimal string, e.g. "12.50". */
  costPerKg: z.string(),
  currency: z.string(),
  densityGPerMl: z.number().nullable(),
  cpJPerGK: z.number().nullable(),
  sources: z.array(z.string()),
  notes: z.string(),
  needs: z.array(ingredientNeedSchema),
  version: z.number(),
  createdBy: z.string().nullable(),
  updatedBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Ingredient = z.infer<typeof ingredientSchema>;

export const INGREDIENT_SORT_KEYS = ['name', 'costPerKg', 'role', 'updatedAt'] as const;
export const INGREDIENT_SORTS = INGREDIENT_SORT_KEYS.flatMap((k) => [k, `-${k}` as const]);
export const ingredientListQuerySchema = pagedQuerySchema(INGREDIENT_SORT_KEYS, 'name').extend({
  q: searchTextSchema.optional(),
  role: ingredientRoleSchema.optional(),
});
export type IngredientListQuery = z.infer<typeof ingredientListQuerySchema>;
export const ingredientListResponseSchema = paged(ingredientSchema);

export const deleteIngredientQuerySchema = z.object({
  /** When given, the delete is refused (409) if the ingredient changed since this version. */
  version: z.coerce.number().int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`).optional(),
});

export const auditEventSchema = z.object({
  id: z.number(),
  action: z.string(),
  actor: z.string().nullable(),
  at: z.string(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
  detail: z.record(z.string(), z.unknown()),
});
/** GET /api/ingredients/:id/history: a page of its audit events, oldest first unless asked. */
export const ingredientHistoryQuerySchema = pagedQuerySchema(['at'], 'at');
export const ingredientHistoryResponseSchema = paged(auditEventSchema);

/** Columns of the ingredient CSV (import and export), in order. */
export const INGREDIENT_CSV_COLUMNS = [
  'name',
  'grade',
  'role',
  'speciesKey',
  'process',
  'costPerKg',
  'currency',
  'densityGPerMl',
  'cpJPerGK',
  'sources',
  'notes',
] as const;
/** Several citations share the one `sources` cell, separated by this. */
export const CSV_SOURCES_SEPARATOR = ' | ';

export const importQuerySchema = z.object({
  dryRun: z
    .enum(['true', 'false'], { error: 'must be true or false' })
    .optional()
    .transform((v) => v === 'true'),
});
export const importResponseSchema = z.object({
  dryRun: z.boolean(),
  rows: z.number(),
  created: z.number(),
  updated: z.number(),
});
export type ImportResponse = z.infer<typeof importResponseSchema>;

export const attachmentSchema = z.object({
  id: z.number(),
  ingredientId: z.number(),
  filename: z.string(),
  contentType: z.string(),
  sizeBytes: z.number(),
  sha256: z.string(),
  uploadedBy: z.string().nullable(),
  createdAt: z.string(),
});
export type Attachment = z.infer<typeof attachmentSchema>;
/** GET /api/ingredients/:id/attachments: a page of its attachments, newest first unless asked. */
export const attachmentListQuerySchema = pagedQuerySchema(['createdAt', 'filename'], '-createdAt');
export const attachmentListResponseSchema = paged(attachmentSchema);
export const ingredientAttachmentParamsSchema = z.object({ id: z.coerce.number().int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`) });
