import { z } from 'zod';
import { ROLES } from './roles';

/** The four roles of a workspace member (DEVELOPERS.md, "Roles"); the list and its labels live in roles.ts (no zod). */
export { ROLES, ROLE_LABELS } from './roles';
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

// Text: every text field of every request goes through textSchema (validation/text.ts, below every layer).
export { textRuleError, textRuleErrorsDeep, textSchema } from '../validation/text';
import { textSchema } from '../validation/text';

/** The largest id PostgreSQL's integer columns hold (2^31 − 1). */
export const MAX_ID = 2_147_483_647;

/** Record ids are positive integers; path parameters arrive as strings. */
export const idSchema = z.coerce.number().int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`);
export const idParamsSchema = z.object({ id: idSchema });

export const emailSchema = textSchema({ error: 'is required' })
  .trim()
  .toLowerCase()
  .max(254, 'must be at most 254 characters')
  .pipe(z.email({ error: 'must be a valid e-mail address' }));

export const PASSWORD_MIN_LENGTH = 10;
/**
 * bcrypt reads only the first 72 bytes of a password (bcryptjs README: "The maximum input length
 * is 72 bytes"; OpenBSD bcrypt(3) likewise), so two passwords that differ only after byte 72
 * would both sign in. Longer ones are refused, counted in UTF-8 bytes.
 */
export const PASSWORD_MAX_BYTES = 72;
const utf8Bytes = (value: string) => new TextEncoder().encode(value).length;
const passwordTooLong = `must be at most ${PASSWORD_MAX_BYTES} bytes (${PASSWORD_MAX_BYTES} plain letters or digits; accented letters and symbols take 2–4 bytes each)`;
/** A new password (sign-up, reset, invitation): 10 characters up to 72 bytes. */
export const passwordSchema = textSchema({ error: 'is required' })
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .refine((value) => utf8Bytes(value) <= PASSWORD_MAX_BYTES, { message: passwordTooLong });
/** A password given to sign in: any non-empty text up to the same 72 bytes. */
export const loginPasswordSchema = textSchema({ error: 'is required' })
  .min(1, 'is required')
  .refine((value) => utf8Bytes(value) <= PASSWORD_MAX_BYTES, { message: passwordTooLong });

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
export const searchTextSchema = textSchema().trim().max(100, 'must be at most 100 characters');

/** An optional id filter in a query string (`?candidateId=12`). */
export const idFilterSchema = z.coerce.number({ error: 'must be a whole number' }).int('must be a whole number').positive('must be a positive id').max(MAX_ID, `must be at most ${MAX_ID}`);

/** One error shape for every API failure (DEVELOPERS.md, "The API"). */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
    /** With 429: seconds until a retry can succeed (also the Retry-After header). */
    retryAfterSeconds: z.number().int().positive().optional(),
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
