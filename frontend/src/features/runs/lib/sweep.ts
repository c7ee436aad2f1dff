import { z } from 'zod';

/**
 * The target sweep a run may carry (shared/src/optimiser/sweep.ts, `SweepResult`): the best
 * objective of the linear model against the target temperature or the hold time. The run's
 * schema leaves it open, so it is read here and anything else is treated as no sweep.
 */
const sweepSchema = z.object({
  parameter: z.enum(['targetTempC', 'holdMin']),
  objective: z.string().optional(),
  objectiveUnit: z.string().optional(),
  points: z.array(
    z.object({
      value: z.number(),
      bestObjective: z.number().nullable(),
      bestSetIds: z.array(z.string()).optional(),
      feasibleSets: z.number().optional(),
    }),
  ),
});
export type Sweep = z.infer<typeof sweepSchema>;

/** The run's sweep (the first, when it carries several), or null when it has none usable. */
export function parseSweep(value: unknown): Sweep | null {
  const first = Array.isArray(value) ? value[0] : value;
  const parsed = sweepSchema.safeParse(first);
  if (!parsed.success || parsed.data.points.length === 0) return null;
  return { ...parsed.data, points: [...parsed.data.points].sort((a, b) => a.value - b.value) };
}
