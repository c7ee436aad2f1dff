import { z } from 'zod';
import { ROLES } from './roles';

/** The four roles of a workspace member (DESIGN.md §1); the list and its labels live in roles.ts (no zod). */
export { ROLES, ROLE_LABELS } from './roles';
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** Record ids are positive integers; path parameters arrive as strings. */
export const idSchema = z.coerce.number().int('must be a whole number').positive('must be a positive id');
export const idParamsSchema = z.object({ id: idSchema });

export const emailSchema = z
  .string({ error: 'is required' })
  .trim()
  .toLowerCase()
  .max(254, 'must be at most 254 characters')
  .pipe(z.email({ error: 'must be a valid e-mail address' }));

export const PASSWORD_MIN_LENGTH = 10;
export const passwordSchema = z
  .string({ error: 'is required' })
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, 'must be at most 200 characters');

export const pagingQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'must be 1 or more').default(1),
  pageSize: z.coerce.number().int().min(1, 'must be 1 or more').max(200, 'must be at most 200').default(50),
});

/** One error shape for every API failure (DESIGN.md §5). */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
export type FieldError = { field: string; message: string };

/** Turns a zod error into field/message pairs named by their dotted path. */
export function fieldErrorsFromZod(error: z.ZodError, prefix?: string): FieldError[] {
  return error.issues.map((issue) => {
    const path = issue.path.map(String).join('.');
    const field = [prefix, path].filter(Boolean).join('.') || '(body)';
    return { field, message: issue.message };
  });
}
