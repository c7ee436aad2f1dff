import { z } from 'zod';

/** A message the local mail sink received over SMTP (development and tests only). */
export const mailMessageSchema = z.object({
  id: z.number(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  receivedAt: z.string(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;
export const mailMessageListResponseSchema = z.object({
  enabled: z.boolean(),
  messages: z.array(mailMessageSchema),
});
