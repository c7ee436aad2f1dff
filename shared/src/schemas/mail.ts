import { z } from 'zod';
import { paged, pagedQuerySchema } from './common';

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
/** GET /api/mail-messages: a page of the sink's messages for this workspace, newest first unless asked. */
export const mailMessageListQuerySchema = pagedQuerySchema(['receivedAt'], '-receivedAt');
/** The page, and whether the local sink runs at all. */
export const mailMessageListResponseSchema = paged(mailMessageSchema).extend({ enabled: z.boolean() });
