import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { fieldErrorsFromZod, textRuleErrorsDeep } from '@shared/schemas';
import { AppError } from './errors';

interface RequestSchemas<B extends z.ZodType, Q extends z.ZodType, P extends z.ZodType> {
  body?: B;
  query?: Q;
  params?: P;
}

/** Parsed, typed request parts, stored on `res.locals.valid` by {@link validate}. */
export interface Valid<B = unknown, Q = unknown, P = unknown> {
  body: B;
  query: Q;
  params: P;
}

/**
 * Validates body, query and params with the shared zod schemas. Failure answers 400 naming
 * every field and rule; success stores the parsed values on `res.locals.valid`. What a schema
 * lets through is also checked for text the database cannot hold (NUL, lone surrogates) in
 * free-form values and keys, so none of it reaches a query.
 */
export function validate<B extends z.ZodType = z.ZodUnknown, Q extends z.ZodType = z.ZodUnknown, P extends z.ZodType = z.ZodUnknown>(
  schemas: RequestSchemas<B, Q, P>,
): RequestHandler {
  return (req, res, next) => {
    const fields = [];
    const valid: Record<string, unknown> = { body: undefined, query: undefined, params: undefined };
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const input: unknown = part === 'body' ? (req.body ?? {}) : req[part];
      const prefix = part === 'body' ? undefined : part;
      const result = schema.safeParse(input);
      if (!result.success) fields.push(...fieldErrorsFromZod(result.error, prefix));
      else {
        const textErrors = textRuleErrorsDeep(input, prefix);
        if (textErrors.length > 0) fields.push(...textErrors);
        else valid[part] = result.data;
      }
    }
    if (fields.length > 0) {
      const summary = fields.map((f) => `${f.field} ${f.message}`).join('; ');
      next(AppError.validation(`Invalid request: ${summary}`, fields));
      return;
    }
    res.locals.valid = valid;
    next();
  };
}

/** Reads what {@link validate} parsed, typed by the same schemas. */
export function validated<B extends z.ZodType = z.ZodUnknown, Q extends z.ZodType = z.ZodUnknown, P extends z.ZodType = z.ZodUnknown>(
  res: { locals: Record<string, unknown> },
  _schemas?: RequestSchemas<B, Q, P>,
): Valid<z.output<B>, z.output<Q>, z.output<P>> {
  return res.locals.valid as Valid<z.output<B>, z.output<Q>, z.output<P>>;
}
