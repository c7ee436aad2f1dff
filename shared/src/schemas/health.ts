import { z } from 'zod';

export const healthResponseSchema = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['up', 'down']) });
export type HealthResponse = z.infer<typeof healthResponseSchema>;

/** What is waiting for the signed-in member, shown on their home page. */
export const homeItemSchema = z.object({
  kind: z.string(),
  title: z.string(),
  detail: z.string(),
  href: z.string(),
});
export const homeResponseSchema = z.object({
  role: z.string(),
  waiting: z.array(homeItemSchema),
  counts: z.record(z.string(), z.number()),
});
export type HomeResponse = z.infer<typeof homeResponseSchema>;
