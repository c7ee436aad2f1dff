import { z } from 'zod';
import { MAX_ID } from './common';
import { briefSchema, candidateSchema, infeasibleSetSchema } from './briefs';
import { idFilterSchema, paged, pagedQuerySchema, searchTextSchema } from './common';

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
/** GET /api/briefs: a page of the workspace's active (or archived) briefs, searched by name, filtered by pack type. */
export const BRIEF_SORT_KEYS = ['name', 'updatedAt', 'createdAt'] as const;
export const briefListQuerySchema = pagedQuerySchema(BRIEF_SORT_KEYS, '-updatedAt').extend({
  q: searchTextSchema.optional(),
  packType: z.enum(['cold', 'warm'], { error: 'must be cold or warm' }).optional(),
  /** Active briefs by default; `archived=true` lists the archived ones instead. */
  archived: z.enum(['true', 'false'], { error: 'must be true or false' }).optional(),
});
export type BriefListQuery = z.output<typeof briefListQuerySchema>;
export const briefListResponseSchema = paged(briefRecordSchema);

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
  /** Attempts a run may take (the first plus the retries). */
  maxAttempts: z.number(),
  /** How often the run's worker stopped responding (no heartbeat) and the run was re-queued or failed. */
  interruptions: z.number(),
  lastInterruptedAt: z.string().nullable(),
  /** Seconds since the executing worker's last heartbeat, while running; null otherwise. */
  silentForS: z.number().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  timings: z.record(z.string(), z.number()).nullable(),
});
export type RunSummary = z.infer<typeof runSummarySchema>;

/** GET /api/runs/:id (DEVELOPERS.md, "The API"): status, progress, ranked candidates and the infeasible sets. */
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
/** GET /api/briefs/:id/runs: a page of the brief's runs, newest first unless asked. */
export const runListQuerySchema = pagedQuerySchema(['createdAt', 'status'], '-createdAt').extend({
  status: runStatusSchema.optional(),
});
export type RunListQuery = z.output<typeof runListQuerySchema>;
export const runListResponseSchema = paged(runSummarySchema);

/** GET /api/candidates: a page of the workspace's candidates in one state (shortlisted unless asked). */
export const candidateListQuerySchema = pagedQuerySchema(['updatedAt', 'rank', 'createdAt'], '-updatedAt').extend({
  state: z.string().trim().min(1).max(40).regex(/^[a-z-]+$/, 'must be a candidate state such as shortlisted').default('shortlisted'),
  briefId: idFilterSchema.optional(),
});
export type CandidateListQuery = z.output<typeof candidateListQuerySchema>;
export const candidateListResponseSchema = paged(candidateRecordSchema);
export const createRunResponseSchema = z.object({ runId: z.number() });
export const candidateResponseSchema = z.object({ candidate: candidateRecordSchema, currency: z.string(), brief: briefSpecSchema });
export const briefIdParamsSchema = z.object({ id: z.coerce.number().int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`) });

/** GET /api/candidates/:id/curve: the candidate's curve under its brief, as its run's data and calibrations give it. */
export const candidateCurveSchema = z.object({
  curve: z.array(z.object({ tMin: z.number(), tempC: z.number() })),
  band: z.object({ minC: z.number(), maxC: z.number() }),
  timeToTargetMin: z.number().nullable(),
  minutesInBand: z.number().nullable(),
  /** Why there is no curve, or null. */
  error: z.string().nullable(),
});
export type CandidateCurve = z.infer<typeof candidateCurveSchema>;
