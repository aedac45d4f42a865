import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { fieldErrors } from '../../shared/api-error.js';
import { validationFailed } from '../errors.js';

const BODY = Symbol('validBody');
const QUERY = Symbol('validQuery');
type WithValid = Request & { [BODY]?: unknown; [QUERY]?: unknown };

/** Parses the JSON body with a shared zod schema; 400 with field paths when it does not fit. */
export function validateBody(schema: z.ZodType): RequestHandler {
  return (req, _res, next) => {
    const result = schema.safeParse(req.body ?? {});
    if (!result.success) return next(validationFailed(fieldErrors(result.error.issues)));
    (req as WithValid)[BODY] = result.data;
    next();
  };
}

/** Parses the query string with a shared zod schema; 400 with field paths when it does not fit. */
export function validateQuery(schema: z.ZodType): RequestHandler {
  return (req, _res, next) => {
    const result = schema.safeParse(req.query);
    if (!result.success) return next(validationFailed(fieldErrors(result.error.issues)));
    (req as WithValid)[QUERY] = result.data;
    next();
  };
}

/** The body as parsed by `validateBody(schema)` earlier in the same route. */
export function validBody<S extends z.ZodType>(req: Request, _schema: S): z.output<S> {
  const value = (req as WithValid)[BODY];
  if (value === undefined) throw new Error('validBody read on a route without validateBody');
  return value as z.output<S>;
}

export function validQuery<S extends z.ZodType>(req: Request, _schema: S): z.output<S> {
  const value = (req as WithValid)[QUERY];
  if (value === undefined) throw new Error('validQuery read on a route without validateQuery');
  return value as z.output<S>;
}
