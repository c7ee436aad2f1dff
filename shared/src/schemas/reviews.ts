import { z } from 'zod';
import { textSchema, MAX_ID } from './common';
import { REVIEW_STAGES, REVIEW_STATES, REVIEW_VERDICTS } from './review-states';
import { candidateHazardsSchema, ingredientHazardDataSchema, labelElementsSchema, hazardNoteSchema } from './hazards';
import { candidateRecordSchema } from './runs';
import { paged, pagedQuerySchema } from './common';

export const reviewStateSchema = z.enum(REVIEW_STATES);
export const reviewStageSchema = z.enum(REVIEW_STAGES, { error: 'must be chemistry or regulatory' });
export const reviewVerdictSchema = z.enum(REVIEW_VERDICTS, { error: 'must be approved, changes-requested or rejected' });

/** A lab log attached to the candidate, or waived with the reason. */
export const labLogChecklistSchema = z.union([
  z.object({ attached: z.boolean({ error: 'must be true or false' }) }).strict(),
  z.object({ waivedReason: textSchema().trim().max(1000) }).strict(),
]);

export const chemistryChecklistSchema = z.object({
  dataSourcesChecked: z.boolean().default(false),
  modelValidInRegime: z.boolean().default(false),
  labLog: labLogChecklistSchema.optional(),
});
export type ChemistryChecklist = z.infer<typeof chemistryChecklistSchema>;

export const regulatoryChecklistSchema = z.object({
  classificationChecked: z.boolean().default(false),
  labelElementsChecked: z.boolean().default(false),
  cautionsChecked: z.boolean().default(false),
  regulatoryFlagsChecked: z.boolean().default(false),
});
export type RegulatoryChecklist = z.infer<typeof regulatoryChecklistSchema>;

export const CHEMISTRY_CHECKLIST_LABELS = {
  dataSourcesChecked: 'Data sources checked',
  modelValidInRegime: 'The model is valid in this regime',
  labLog: 'Lab log attached, or waived with a reason',
} as const;
export const REGULATORY_CHECKLIST_LABELS = {
  classificationChecked: 'Classification checked',
  labelElementsChecked: 'Label elements checked',
  cautionsChecked: 'Cautions checked',
  regulatoryFlagsChecked: 'Regulatory flags checked',
} as const;

/**
 * POST /api/candidates/:id/reviews. A decision that is not an approval needs a comment; an
 * approval needs every checklist item of its stage (chemistry: the lab log attached or waived
 * with a reason).
 */
export const reviewDecisionRequestSchema = z
  .object({
    stage: reviewStageSchema,
    verdict: reviewVerdictSchema,
    checklist: z.record(textSchema(), z.unknown()).default({}),
    comment: textSchema().trim().max(4000, 'must be at most 4000 characters').default(''),
  })
  .transform((body, ctx) => {
    const schema = body.stage === 'chemistry' ? chemistryChecklistSchema : regulatoryChecklistSchema;
    const parsed = schema.safeParse(body.checklist);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', path: ['checklist', ...issue.path.map(String)], message: issue.message });
      return z.NEVER;
    }
    const checklist = parsed.data as ChemistryChecklist | RegulatoryChecklist;
    if (body.verdict !== 'approved' && body.comment.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'is required when the decision is not an approval: say what must change or why it is rejected' });
    }
    if (body.verdict === 'approved') {
      if (body.stage === 'chemistry') {
        const c = checklist as ChemistryChecklist;
        if (!c.dataSourcesChecked) ctx.addIssue({ code: 'custom', path: ['checklist', 'dataSourcesChecked'], message: 'must be checked to approve' });
        if (!c.modelValidInRegime) ctx.addIssue({ code: 'custom', path: ['checklist', 'modelValidInRegime'], message: 'must be checked to approve' });
        const log = c.labLog;
        const ok = log && ('attached' in log ? log.attached : log.waivedReason.length > 0);
        if (!ok) ctx.addIssue({ code: 'custom', path: ['checklist', 'labLog'], message: 'must be attached, or waived with a reason, to approve' });
      } else {
        const r = checklist as RegulatoryChecklist;
        for (const key of Object.keys(REGULATORY_CHECKLIST_LABELS) as (keyof RegulatoryChecklist)[]) {
          if (!r[key]) ctx.addIssue({ code: 'custom', path: ['checklist', key], message: 'must be checked to approve' });
        }
      }
    }
    return { ...body, checklist };
  });
export type ReviewDecisionRequest = z.input<typeof reviewDecisionRequestSchema>;

export const reviewRecordSchema = z.object({
  id: z.number(),
  candidateId: z.number(),
  stage: reviewStageSchema,
  verdict: reviewVerdictSchema,
  checklist: z.record(z.string(), z.unknown()),
  comment: z.string(),
  reviewer: z.object({ id: z.number().nullable(), name: z.string(), role: z.string() }),
  fromState: z.string(),
  toState: z.string(),
  createdAt: z.string(),
});
export type ReviewRecord = z.infer<typeof reviewRecordSchema>;

/** One entry of a candidate's history (its earlier versions included): submissions, decisions and revisions, oldest first. */
export const reviewEventSchema = z.object({
  kind: z.enum(['submitted', 'review', 'revised']),
  at: z.string(),
  actor: z.string(),
  actorRole: z.string(),
  /** The version the event happened to, and its revision number. */
  candidateId: z.number(),
  revision: z.number(),
  from: z.string(),
  to: z.string(),
  comment: z.string(),
  review: reviewRecordSchema.nullable(),
  /** For `revised`: the new version. */
  newCandidateId: z.number().nullable(),
});
export type ReviewEvent = z.infer<typeof reviewEventSchema>;

export const reviewStatusSchema = z.object({
  candidateId: z.number(),
  state: reviewStateSchema,
  revision: z.number(),
  parentCandidateId: z.number().nullable(),
  /** The next version, once this one was revised. */
  childCandidateId: z.number().nullable(),
  submittedAt: z.string().nullable(),
  submittedBy: z.string().nullable(),
  version: z.number(),
});
export type ReviewStatus = z.infer<typeof reviewStatusSchema>;

export const reviewHistoryResponseSchema = z.object({ status: reviewStatusSchema, reviews: z.array(reviewRecordSchema), events: z.array(reviewEventSchema) });
export type ReviewHistoryResponse = z.infer<typeof reviewHistoryResponseSchema>;

export const submitRequestSchema = z.object({ comment: textSchema().trim().max(4000).default('') });

export const reviseRequestSchema = z.object({
  composition: z
    .array(z.object({ ingredientId: z.coerce.number().int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`), massG: z.number({ error: 'must be a number of grams' }).min(0, 'must be 0 g or more').max(1e5) }))
    .min(1, 'give at least one ingredient')
    .max(30),
  comment: textSchema().trim().max(4000).default(''),
});
export type ReviseRequest = z.input<typeof reviseRequestSchema>;

export const transitionResponseSchema = z.object({ candidate: candidateRecordSchema, status: reviewStatusSchema });

export const reviewQueueItemSchema = z.object({
  candidateId: z.number(),
  state: reviewStateSchema,
  revision: z.number(),
  briefId: z.number(),
  briefName: z.string(),
  setNames: z.array(z.string()),
  updatedAt: z.string(),
});
/**
 * GET /api/reviews: one queue, paged, most recently changed first. `waiting` is what waits for the
 * signed-in role; `recent` is every candidate in or past review, for everyone to follow.
 */
export const REVIEW_QUEUES = ['waiting', 'recent'] as const;
export const reviewQueueQuerySchema = pagedQuerySchema(['updatedAt'], '-updatedAt').extend({
  queue: z.enum(REVIEW_QUEUES, { error: `must be one of ${REVIEW_QUEUES.join(', ')}` }).default('waiting'),
});
export type ReviewQueueQuery = z.output<typeof reviewQueueQuerySchema>;
export const reviewQueueResponseSchema = paged(reviewQueueItemSchema).extend({ role: z.string(), queue: z.enum(REVIEW_QUEUES) });
export type ReviewQueueResponse = z.infer<typeof reviewQueueResponseSchema>;

// ---- hazard data on ingredients ----

export const ingredientHazardsResponseSchema = z.object({
  ingredientId: z.number(),
  name: z.string(),
  hazardData: ingredientHazardDataSchema.nullable(),
  hazardVersion: z.number(),
});
export type IngredientHazardsResponse = z.infer<typeof ingredientHazardsResponseSchema>;

export const updateIngredientHazardsRequestSchema = z.object({
  hazardData: ingredientHazardDataSchema.nullable(),
  version: z.number({ error: 'is required: the hazard version you loaded' }).int().min(0).max(MAX_ID, `must be at most ${MAX_ID}`),
});
export type UpdateIngredientHazardsRequest = z.input<typeof updateIngredientHazardsRequestSchema>;

export const hStatementsResponseSchema = z.object({ statements: z.array(z.object({ code: z.string(), text: z.string() })), source: z.string() });

// ---- dossier ----

export const dossierSchema = z.object({
  generatedAt: z.string(),
  workspace: z.object({ name: z.string(), currency: z.string() }),
  candidate: candidateRecordSchema,
  status: reviewStatusSchema,
  brief: z.custom<Record<string, unknown>>((v) => typeof v === 'object' && v !== null).meta({ type: 'object', description: 'The brief the candidate answers' }),
  composition: z.array(
    z.object({ ingredientId: z.string(), name: z.string(), grade: z.string(), role: z.string(), massG: z.number(), massFraction: z.number(), sources: z.array(z.string()), hazardSource: z.string().nullable() }),
  ),
  curve: z.array(z.object({ tMin: z.number(), tempC: z.number() })),
  band: z.object({ minC: z.number(), maxC: z.number() }),
  hazards: candidateHazardsSchema.nullable(),
  hazardNotes: z.array(hazardNoteSchema),
  label: labelElementsSchema.nullable(),
  standingCaution: z.string(),
  history: z.array(reviewEventSchema),
  signOffs: z.array(reviewRecordSchema),
});
export type Dossier = z.infer<typeof dossierSchema>;

/** GET /api/candidates/:id/hazards: the computed hazards, the standing caution, and the ingredients that lack hazard data. */
export const candidateHazardsResponseSchema = z.object({
  hazards: candidateHazardsSchema,
  standingCaution: z.string(),
  ingredientsWithoutHazardData: z.array(z.string()),
});
export type CandidateHazardsResponse = z.infer<typeof candidateHazardsResponseSchema>;
