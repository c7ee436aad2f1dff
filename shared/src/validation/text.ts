import { z } from 'zod';

/** A field and the rule its value breaks (the shape of schemas/common.ts's FieldError). */
export interface TextFieldError {
  field: string;
  message: string;
}

// Text: every text field of every request goes through textSchema.

/**
 * Lone UTF-16 surrogates (a high surrogate without its low half, or the reverse). With the `u`
 * flag a regular expression reads a string by code points, so a well-formed pair is one code
 * point above U+FFFF and does not match; only an unpaired half does.
 */
const LONE_SURROGATE = /[\uD800-\uDFFF]/u;

/**
 * The rule a text value breaks, or null: PostgreSQL text and jsonb cannot hold U+0000 (NUL),
 * and a lone surrogate is not Unicode text at all (it cannot be encoded as UTF-8). Both are
 * refused rather than altered, so what is stored is what was sent.
 */
export function textRuleError(value: string): string | null {
  if (value.includes('\u0000')) return 'must not contain NUL characters (U+0000)';
  if (LONE_SURROGATE.test(value)) return 'must not contain a lone UTF-16 surrogate (text that is not valid Unicode)';
  return null;
}

/**
 * The one string schema of request fields: a zod string that refuses NUL characters and lone
 * surrogates with a 400 naming the field (see {@link textRuleError}). Chain `.trim()`,
 * `.min()`, `.max()` as on `z.string()`.
 *
 * @example textSchema({ error: 'is required' }).trim().min(1, 'is required').max(120)
 */
export function textSchema(params?: Parameters<typeof z.string>[0]) {
  return z.string(params).superRefine((value, ctx) => {
    const message = textRuleError(value);
    if (message) ctx.addIssue({ code: 'custom', message });
  });
}

/**
 * Every string (and object key) anywhere in a request part that breaks {@link textRuleError},
 * named by its dotted path. `validate()` runs it over what the schemas let through, so a free
 * form value (a checklist record, an unknown key) cannot carry one to the database either.
 */
export function textRuleErrorsDeep(value: unknown, prefix?: string): TextFieldError[] {
  const errors: TextFieldError[] = [];
  const seen = new Set<unknown>();
  const walk = (v: unknown, path: string[]) => {
    if (errors.length >= 20) return;
    if (typeof v === 'string') {
      const message = textRuleError(v);
      if (message) errors.push({ field: [prefix, ...path].filter(Boolean).join('.') || '(body)', message });
      return;
    }
    if (v === null || typeof v !== 'object' || seen.has(v)) return;
    seen.add(v);
    if (Array.isArray(v)) {
      v.forEach((item, k) => walk(item, [...path, String(k)]));
      return;
    }
    for (const [key, item] of Object.entries(v)) {
      const keyMessage = textRuleError(key);
      if (keyMessage) errors.push({ field: [prefix, ...path].filter(Boolean).join('.') || '(body)', message: `has a key that ${keyMessage}` });
      else walk(item, [...path, key]);
    }
  };
  walk(value, []);
  return errors;
}

