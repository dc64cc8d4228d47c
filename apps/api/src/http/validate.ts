import type { RequestHandler } from 'express';
import { z } from 'zod';

// The shared schemas are written with zod/mini, which loads no messages of its own; classic zod
// loads its English ones when imported, and this says so where the API parses its input: a check
// without a message of its own still answers what is wrong ("Too big: expected number to be <=120").
z.config(z.locales.en());

interface Schemas {
  body?: z.core.$ZodType;
  query?: z.core.$ZodType;
  params?: z.core.$ZodType;
}

/**
 * Parses body, query and params once with the shared zod schemas and puts the results in
 * res.locals (Express 5's req.query is read-only). A ZodError reaches the error middleware as a 400.
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, res, next) => {
    if (schemas.params) res.locals.params = z.parse(schemas.params, req.params);
    if (schemas.query) res.locals.query = z.parse(schemas.query, req.query);
    if (schemas.body) res.locals.body = z.parse(schemas.body, req.body ?? {});
    next();
  };
}
