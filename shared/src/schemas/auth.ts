import { z } from 'zod';
import { emailSchema, loginPasswordSchema, passwordSchema, roleSchema, textSchema } from './common';

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: loginPasswordSchema,
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const workspaceSummarySchema = z.object({ id: z.number(), name: z.string(), currency: z.string() });

export const sessionUserSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  workspace: workspaceSummarySchema,
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const loginResponseSchema = z.object({ user: sessionUserSchema, token: z.string() });
export type LoginResponse = z.infer<typeof loginResponseSchema>;

export const meResponseSchema = z.object({ user: sessionUserSchema });

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export const passwordResetConfirmSchema = z.object({
  token: textSchema({ error: 'is required' }).min(20, 'is not a valid link token').max(200, 'is not a valid link token'),
  password: passwordSchema,
});
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

export const messageResponseSchema = z.object({ message: z.string() });
