import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { fieldLabel, isGenericMessage } from '#shared/schemas/messages';
import { HttpError, zodIssues } from './errors';

interface Shapes {
  body?: z.ZodType;
  params?: z.ZodType;
  query?: z.ZodType;
}

/**
 * Parses the request with the shared schemas and stores the parsed values in res.locals
 * (Express 5 makes req.query read-only), so handlers only ever see validated input.
 */
export function validate(shapes: Shapes): RequestHandler {
  return (req, res, next) => {
    const issues: { path: string; message: string }[] = [];
    const parsed: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = shapes[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) parsed[part] = result.data;
      else
        issues.push(
          ...zodIssues(result.error).map((i) => ({
            ...i,
            path: i.path ? `${part}.${i.path}` : part,
          })),
        );
    }
    if (issues.length) {
      const first = issues[0]!;
      // "This is required." alone does not say what is; the one-line message names the field.
      const lead =
        isGenericMessage(first.message) && first.path
          ? `${fieldLabel(first.path)}: ${first.message}`
          : first.message;
      const message = issues.length === 1 ? lead : `${lead} (and ${issues.length - 1} more)`;
      return next(new HttpError(422, 'invalid', message, issues));
    }
    res.locals.input = parsed;
    next();
  };
}

/** The validated input stored by `validate`. */
export function input<T>(
  res: { locals: Record<string, unknown> },
  part: 'body' | 'params' | 'query',
): T {
  return (res.locals.input as Record<string, unknown>)[part] as T;
}
