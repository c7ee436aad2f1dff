import { z } from 'zod';
import { contactSchema } from '../thermal/contact';
import { FORMULA_PROCESS_KINDS } from '../thermal/formula-process';
import { ingredientProcessSchema } from '../thermal/process';
import { loadSchema } from './briefs';
import { idSchema, textSchema } from './common';

/**
 * Payloads of POST /api/mixtures/evaluate (DEVELOPERS.md, "The API"). The request names ingredients by id
 * (or a bare formula); the backend resolves each to its stored process and calls
 * `evaluateMixture` with the resolved input.
 */

const tempC = (what: string) => z.number({ error: `${what} must be a number (°C)` }).min(-80, `${what} must be at least −80 °C`).max(400, `${what} must be at most 400 °C`);

export const targetBandSchema = z
  .object({ minC: tempC('targetBand.minC'), maxC: tempC('targetBand.maxC') })
  .refine((b) => b.maxC >= b.minC, { message: 'maxC must be at least minC', path: ['maxC'] });

const conditions = {
  initialTempC: tempC('initialTempC'),
  ambientC: tempC('ambientC'),
  contact: contactSchema.optional(),
  uaWPerK: z.number().min(0, 'uaWPerK must be 0 or more').max(1000).optional(),
  packHeatCapacityJPerK: z.number().min(0, 'packHeatCapacityJPerK must be 0 or more').max(1e6).default(0),
  /** Pack surface area, m², for O2 supply when UA is given directly. */
  packAreaM2: z.number().positive().optional(),
  holdMin: z.number().positive('holdMin must be greater than 0').max(10080, 'holdMin must be at most one week'),
  targetTempC: tempC('targetTempC').optional(),
  targetBand: targetBandSchema.optional(),
  /** What the pack heats or cools (briefs.ts); the target and band then apply to it. */
  load: loadSchema.optional(),
};

const oneExchange = <T extends { contact?: unknown; uaWPerK?: unknown }>(v: T) => (v.contact === undefined) !== (v.uaWPerK === undefined);
const oneExchangeMessage = { message: 'give either contact or uaWPerK (exactly one)', path: ['uaWPerK'] };

export const mixtureComponentRequestSchema = z
  .object({
    ingredientId: idSchema.optional(),
    formula: textSchema().trim().min(1).optional(),
    massG: z.number().min(0, 'massG must be 0 or more').max(1e5),
    /** For a bare formula: the process the bench chose or confirmed (thermal/formula-process.ts); default the expected one. */
    process: z.enum(FORMULA_PROCESS_KINDS, { error: `process must be one of ${FORMULA_PROCESS_KINDS.join(', ')}` }).optional(),
  })
  .refine((c) => (c.ingredientId === undefined) !== (c.formula === undefined), {
    message: 'give either ingredientId or formula (exactly one)',
    path: ['ingredientId'],
  })
  .refine((c) => c.process === undefined || c.formula !== undefined, {
    message: 'process is chosen only for a bare formula; a library ingredient carries its own',
    path: ['process'],
  });

export const evaluateMixtureRequestSchema = z
  .object({ components: z.array(mixtureComponentRequestSchema).min(1, 'give at least one component').max(50), ...conditions })
  .refine(oneExchange, oneExchangeMessage);
export type EvaluateMixtureRequest = z.infer<typeof evaluateMixtureRequestSchema>;

/** A component with its process resolved (what `evaluateMixture` takes). */
export const resolvedMixtureComponentSchema = z.object({
  key: z.string().min(1).optional(),
  formula: z.string().min(1).optional(),
  massG: z.number().min(0).max(1e5),
  process: ingredientProcessSchema,
});

export const resolvedMixtureSchema = z
  .object({ components: z.array(resolvedMixtureComponentSchema).min(1).max(50), ...conditions })
  .refine(oneExchange, oneExchangeMessage);
export type ResolvedMixture = z.input<typeof resolvedMixtureSchema>;

const warningSchema = z.object({ code: z.string(), message: z.string() });

export const mixtureSoluteResultSchema = z.object({
  key: z.string(),
  soluteKey: z.string(),
  dissolvedFraction: z.number().min(0).max(1),
  limitedBy: z.enum(['none', 'solubility', 'ice']),
});

export const energyBreakdownSchema = z.object({
  processes: z.array(z.object({ label: z.string(), kind: z.string(), heatReleasedJ: z.number() })),
  sensible: z.array(z.object({ part: z.string(), heatStoredJ: z.number() })),
  heatCapacityChangeJ: z.number(),
  heatReleasedJ: z.number(),
  heatStoredJ: z.number(),
  heatLostJ: z.number(),
  balanceErrorJ: z.number(),
  relativeBalanceError: z.number(),
});

export const evaluateMixtureResponseSchema = z.object({
  /** Temperature at the end of the hold, °C. */
  endTempC: z.number(),
  minTempC: z.number(),
  maxTempC: z.number(),
  /** Adiabatic equilibrium temperature (no heat exchange, all processes at equilibrium), °C. */
  adiabaticEndTempC: z.number(),
  /** Mass-weighted fraction of all dissolving solids dissolved at the end of the hold (1 when none). */
  dissolvedFraction: z.number().min(0).max(1),
  solutes: z.array(mixtureSoluteResultSchema),
  iceG: z.number(),
  curve: z.array(z.object({ tMin: z.number(), tempC: z.number() })),
  timeToTargetMin: z.number().nullable(),
  minutesInBand: z.number().nullable(),
  massG: z.number(),
  uaWPerK: z.number(),
  envTempC: z.number(),
  areaM2: z.number().nullable(),
  energy: energyBreakdownSchema,
  warnings: z.array(warningSchema),
  /** With a load: its curve and temperatures (timeToTargetMin and minutesInBand are then the load's). */
  load: z
    .object({
      curve: z.array(z.object({ tMin: z.number(), tempC: z.number() })),
      endTempC: z.number(),
      minTempC: z.number(),
      maxTempC: z.number(),
      heatFromPackJ: z.number(),
    })
    .nullable()
    .optional(),
});
export type EvaluateMixtureResponse = z.infer<typeof evaluateMixtureResponseSchema>;
