import { z } from 'zod';
import { textSchema, MAX_ID } from './common';
import { contactCaseSchema } from './briefs';
import { idFilterSchema, pagedQuerySchema } from './common';

/** Payloads of /api/lab-logs and /api/calibrations. */

export const columnMappingSchema = z.object({
  timeColumn: z.number({ error: 'must be a column number' }).int().min(0),
  timeUnit: z.enum(['s', 'min', 'clock'], { error: 'must be s, min or clock' }),
  tempColumns: z.array(z.number().int().min(0)).min(1, 'choose at least one temperature column').max(8, 'choose at most 8 temperature columns'),
  tempUnit: z.enum(['C', 'F'], { error: 'must be C or F' }),
});
export type ColumnMappingInput = z.infer<typeof columnMappingSchema>;

export const labConditionsSchema = z.object({
  ambientC: z.number({ error: 'must be a temperature in °C' }).min(-60).max(80),
  contact: contactCaseSchema,
  /** Mass of the whole pack tested, g (for the pouch area when no area is given). */
  packMassG: z.number().positive('must be greater than 0').max(100_000).optional(),
  packAreaM2: z.number().positive().max(10).optional(),
  /** Temperature at the start; default the first reading of the compared channel. */
  initialTempC: z.number().min(-60).max(150).optional(),
  /** Which mapped temperature channel is the pack (index into the mapping's tempColumns). */
  channel: z.number().int().min(0).max(7).default(0),
});
export type LabConditions = z.infer<typeof labConditionsSchema>;

export const labComponentSchema = z
  .object({
    ingredientId: z.number().int().positive().max(MAX_ID, `must be at most ${MAX_ID}`).optional(),
    formula: textSchema().trim().min(1).max(60).optional(),
    massG: z.number().positive('must be greater than 0').max(100_000),
  })
  .refine((c) => (c.ingredientId === undefined) !== (c.formula === undefined), { message: 'give an ingredientId or a formula, not both' });

/** The JSON in the `meta` field of the multipart upload. */
export const createLabLogSchema = z
  .object({
    name: textSchema().trim().min(1, 'is required').max(120),
    candidateId: z.number().int().positive().max(MAX_ID, `must be at most ${MAX_ID}`).optional(),
    components: z.array(labComponentSchema).min(1).max(12).optional(),
    mapping: columnMappingSchema,
    conditions: labConditionsSchema,
    notes: textSchema().max(2000).optional(),
  })
  .refine((m) => (m.candidateId === undefined) !== (m.components === undefined), {
    message: 'give a candidateId or the mixture components, one of the two',
    path: ['candidateId'],
  });
export type CreateLabLogRequest = z.infer<typeof createLabLogSchema>;

/** GET /api/lab-logs: a page of the workspace's lab logs (of one candidate when asked), newest first unless asked. */
export const labLogListQuerySchema = pagedQuerySchema(['createdAt', 'name'], '-createdAt').extend({
  candidateId: idFilterSchema.optional(),
});
export type LabLogListQuery = z.output<typeof labLogListQuerySchema>;

/** GET /api/calibrations: a page of the workspace's calibrations, active and retired unless `active` is given. */
export const calibrationListQuerySchema = pagedQuerySchema(['createdAt'], '-createdAt').extend({
  active: z.enum(['true', 'false'], { error: 'must be true or false' }).transform((v) => v === 'true').optional(),
});
export type CalibrationListQuery = z.output<typeof calibrationListQuerySchema>;

export const fitRequestSchema = z.object({
  fit: z.array(z.enum(['ua', 'enthalpy', 'rate'])).min(1).max(3).default(['ua', 'enthalpy', 'rate']),
});

export const applyCalibrationSchema = z
  .object({
    labLogId: z.number({ error: 'is required' }).int().positive().max(MAX_ID, `must be at most ${MAX_ID}`),
    scope: z.enum(['contact', 'ingredient']),
    /** For scope contact: the case whose UA the fitted multiplier scales (default the log's). */
    contact: contactCaseSchema.optional(),
    /** For scope ingredient: the ingredient whose rate constant and enthalpy factor are set. */
    ingredientId: z.number().int().positive().max(MAX_ID, `must be at most ${MAX_ID}`).optional(),
    note: textSchema().max(500).optional(),
  })
  .refine((b) => b.scope !== 'ingredient' || b.ingredientId !== undefined, { message: 'is required for an ingredient calibration', path: ['ingredientId'] });
export type ApplyCalibrationRequest = z.infer<typeof applyCalibrationSchema>;

/** GET /api/candidates/:id/confidence: Monte Carlo band around the predicted curve. */
export const candidateConfidenceSchema = z.object({
  band: z.array(z.object({ tMin: z.number(), p5: z.number(), p50: z.number(), p95: z.number() })),
  nominal: z.array(z.object({ tMin: z.number(), tempC: z.number() })),
  probabilityMeetsBrief: z.number().min(0).max(1).nullable(),
  samples: z.number().int(),
  spreads: z.record(z.string(), z.number()),
  spreadBasis: z.record(z.string(), z.string()),
  targetBand: z.object({ minC: z.number(), maxC: z.number() }),
  calibrated: z.boolean(),
  elapsedMs: z.number(),
});
export const candidateConfidenceResponseSchema = z.object({ confidence: candidateConfidenceSchema });
export type CandidateConfidence = z.infer<typeof candidateConfidenceSchema>;
