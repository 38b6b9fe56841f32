/**
 * Parses a request's body, params and query with zod schemas and keeps the
 * parsed values in res.locals.body / .params / .query (Express 5's req.query is
 * a getter). Failures become 400 validation_failed with one detail per problem.
 */
import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';
import { detailsFromIssues, validationError, type ErrorDetail } from '../errors';

export interface RequestSchemas {
  body?: ZodType;
  params?: ZodType;
  query?: ZodType;
}

export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, res, next) => {
    const details: ErrorDetail[] = [];
    const parts: [keyof RequestSchemas, unknown][] = [
      ['params', req.params],
      ['query', req.query],
      ['body', req.body ?? {}], // Express 5 leaves req.body undefined without a JSON body
    ];
    for (const [part, input] of parts) {
      const schema = schemas[part];
      if (!schema) continue;
      const parsed = schema.safeParse(input);
      if (parsed.success) res.locals[part] = parsed.data;
      else details.push(...detailsFromIssues(parsed.error.issues, part === 'body' ? [] : [part]));
    }
    if (details.length > 0) {
      next(validationError(details));
      return;
    }
    next();
  };
}
