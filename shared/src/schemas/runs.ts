import { z } from 'zod';
import { briefSchema, candidateSchema, infeasibleSetSchema } from './briefs';

/**
 * A complete brief (the output of briefSchema) inside a response. Declared as an object for the
 * OpenAPI document; its fields are those of briefSchema.
 */
const briefSpecSchema = z
  .custom<z.output<typeof briefSchema>>((v) => typeof v === 'object' && v !== null)
  .meta({ type: 'object', description: 'A complete brief, defaults applied (see POST /api/briefs)' });

/** A stored brief: its spec (a complete brief, defaults applied) plus record fields. */
export const briefRecordSchema = z.object({
  id: z.number(),
  name: z.string(),
  packType: z.enum(['cold', 'warm']),
  spec: briefSpecSchema,
  version: z.number(),
  createdBy: z.string(),
  updatedBy: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
  lastRun: z
    .object({ id: z.number(), status: z.string(), createdAt: z.string(), candidates: z.number() })
    .nullable(),
  /** When the brief was archived (null while active) and by whom. */
  archivedAt: z.string().nullable(),
  archivedBy: z.string().nullable(),
});
export type BriefRecord = z.infer<typeof briefRecordSchema>;
export const briefListResponseSchema = z.object({ briefs: z.array(briefRecordSchema) });
/** GET /api/briefs: active briefs by default; `archived=true` lists the archived ones instead. */
export const briefListQuerySchema = z.object({
  archived: z.enum(['true', 'false'], { error: 'must be true or false' }).optional(),
});

export const RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export const runStatusSchema = z.enum(RUN_STATUSES);
export type RunStatus = z.infer<typeof runStatusSchema>;

export const CANDIDATE_STATES = ['proposed', 'shortlisted'] as const;
export const candidateStateSchema = z.enum(CANDIDATE_STATES);

/** A candidate as stored: the optimiser's answer plus its record fields. */
export const candidateRecordSchema = candidateSchema.extend({
  id: z.number(),
  runId: z.number(),
  briefId: z.number(),
  state: z.string(),
  setKey: z.string(),
});
export type CandidateRecord = z.infer<typeof candidateRecordSchema>;

export const runSummarySchema = z.object({
  id: z.number(),
  briefId: z.number(),
  briefVersion: z.number(),
  status: runStatusSchema,
  progress: z.object({ done: z.number(), total: z.number() }),
  error: z.string().nullable(),
  attempts: z.number(),
  createdBy: z.string(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  timings: z.record(z.string(), z.number()).nullable(),
});
export type RunSummary = z.infer<typeof runSummarySchema>;

/** GET /api/runs/:id (DESIGN.md §5): status, progress, ranked candidates and the infeasible sets. */
export const runDetailSchema = runSummarySchema.extend({
  objective: z.string().nullable(),
  objectiveUnit: z.string().nullable(),
  currency: z.string(),
  brief: briefSpecSchema,
  candidates: z.array(candidateRecordSchema),
  infeasible: z.array(infeasibleSetSchema),
  excludedIngredients: z.array(z.object({ ingredientId: z.string(), name: z.string(), reason: z.string() })),
  sweep: z.unknown().nullable(),
  stats: z.record(z.string(), z.number()).nullable(),
  warnings: z.array(z.object({ code: z.string(), message: z.string() })),
  /** What the run used: ingredient versions, species count, so results stay reproducible. */
  dataSnapshot: z.object({ ingredients: z.array(z.object({ id: z.string(), name: z.string(), version: z.number() })), speciesCount: z.number(), calibrations: z.record(z.string(), z.unknown()).optional() }),
});
export type RunDetail = z.infer<typeof runDetailSchema>;
export const runListResponseSchema = z.object({ runs: z.array(runSummarySchema) });
export const createRunResponseSchema = z.object({ runId: z.number() });
export const candidateResponseSchema = z.object({ candidate: candidateRecordSchema, currency: z.string(), brief: briefSpecSchema });
export const briefIdParamsSchema = z.object({ id: z.coerce.number().int('must be a whole number').positive('must be a positive id') });
