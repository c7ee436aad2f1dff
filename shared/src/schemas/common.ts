import { z } from 'zod';

/** The four roles of a workspace member (DESIGN.md §1). */
export const ROLES = ['designer', 'chemist', 'reviewer', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  designer: 'Product designer',
  chemist: 'Chemist',
  reviewer: 'Regulatory reviewer',
  admin: 'Administrator',
};

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

/** Page sizes of every list endpoint: 50 unless asked, at most 200 per page. */
export const PAGE_SIZE_DEFAULT = 50;
export const PAGE_SIZE_MAX = 200;

/** `page` and `pageSize` of a list request (query strings arrive as text). */
export const pagingQuerySchema = z.object({
  page: z.coerce.number({ error: 'must be a whole number' }).int('must be a whole number').min(1, 'must be 1 or more').max(1_000_000, 'must be at most 1000000').default(1),
  pageSize: z.coerce
    .number({ error: 'must be a whole number' })
    .int('must be a whole number')
    .min(1, 'must be 1 or more')
    .max(PAGE_SIZE_MAX, `must be at most ${PAGE_SIZE_MAX}`)
    .default(PAGE_SIZE_DEFAULT),
});

/** A sort parameter's values: each whitelisted key ascending (`name`) or descending (`-name`). */
export type SortValue<K extends string> = K | `-${K}`;

/**
 * The query of a list endpoint: `page`, `pageSize` and `sort`, one of the whitelisted keys, `-key`
 * for descending. Anything else is a 400 naming the field. Extend it with the list's filters.
 */
export function pagedQuerySchema<const K extends string>(sortKeys: readonly [K, ...K[]], defaultSort: SortValue<NoInfer<K>>) {
  const values = sortKeys.flatMap((k) => [k, `-${k}`]) as [SortValue<K>, ...SortValue<K>[]];
  return pagingQuerySchema.extend({
    // The cast: TypeScript cannot see that a generic default is one of the generic enum's values.
    sort: z.enum(values, { error: `must be one of ${values.join(', ')}` }).default(defaultSort as never),
  });
}

/** One page of a list: its items, the page asked for, the page size and the number of matches in all. */
export function paged<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), page: z.number().int(), pageSize: z.number().int(), total: z.number().int() });
}
export interface Paged<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

/** The text filter of a list (`q`): trimmed, at most 100 characters, no NUL and no lone UTF-16 surrogate. */
export const searchTextSchema = z
  .string({ error: 'must be text' })
  .trim()
  .max(100, 'must be at most 100 characters')
  .refine((s) => !s.includes('\u0000'), 'must not contain NUL characters')
  .refine((s) => !/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/.test(s), 'must be valid Unicode text');

/** An optional id filter in a query string (`?candidateId=12`). */
export const idFilterSchema = z.coerce.number({ error: 'must be a whole number' }).int('must be a whole number').positive('must be a positive id');

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
