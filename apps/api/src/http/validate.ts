import type { RequestHandler } from 'express';
import type { z } from 'zod';

interface Schemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

/**
 * Parses body, query and params once with the shared zod schemas and puts the results in
 * res.locals (Express 5's req.query is read-only). A ZodError reaches the error middleware as a 400.
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, res, next) => {
    if (schemas.params) res.locals.params = schemas.params.parse(req.params);
    if (schemas.query) res.locals.query = schemas.query.parse(req.query);
    if (schemas.body) res.locals.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
