import * as z from 'zod/mini';

// The contracts are written with zod/mini, zod's functional form: a phone loads only the parts of
// zod the schemas use (the classic API's methods come as one block). zod/mini loads no messages of
// its own, so every check a person can fail carries its message here; the API loads zod's English
// messages for the rest (apps/api/src/http/validate.ts) and the web forms do too
// (apps/web/src/lib/schema-messages.ts).

/** A finite number above zero (zod 4 rejects NaN and ±Infinity), with a message naming the quantity. */
export const positive = (what: string) => z.number({ error: `${what}: enter a number` }).check(z.gt(0, `${what} must be above 0`));

/** A trimmed text of at most `max` characters. */
export const text = (max: number) => z.string().check(z.trim(), z.maxLength(max, `At most ${max} characters`));

/** A trimmed text that may not be empty. */
export const required = (max: number) => text(max).check(z.minLength(1, 'Required'));

/** A calendar date as YYYY-MM-DD. */
export const isoDate = z.iso.date({ error: 'A date as YYYY-MM-DD' });

/** The version a client last read; a stale one gets 409. */
export const version = z.number({ error: 'The record version is required' }).check(z.int(), z.gte(1));

/** A whole number of at least 1 (a record's id in a body or a query). */
export const recordId = z.number().check(z.int(), z.positive());

/** A record's id from a query string, as a whole number of at least 1. */
export const queryId = z.coerce.number().check(z.int(), z.positive());

/**
 * Server-side paging, sorting and search for list endpoints: page from 1, pageSize up to 200,
 * sort as a field name with an optional leading '-' for descending.
 */
export function listQuery<const S extends readonly [string, ...string[]]>(sorts: S, defaultSort: S[number]) {
  return z.object({
    page: z._default(z.coerce.number().check(z.int(), z.gte(1)), 1),
    pageSize: z._default(z.coerce.number().check(z.int(), z.gte(1), z.lte(200)), 25),
    sort: z._default(z.enum(sorts), defaultSort as never),
    q: z.optional(z.string().check(z.trim(), z.maxLength(200))),
  });
}

export const listResponse = <T extends z.ZodMiniType>(item: T) => z.object({ items: z.array(item), total: z.number() });

type Unwrapped<T> = T extends z.ZodMiniDefault<infer Inner> ? Inner : T;

/**
 * The PATCH form of a create schema's fields: every field optional and without its default,
 * so a partial update never resets a field the client did not send.
 */
export function patchOf<T extends z.core.$ZodLooseShape>(fields: z.ZodMiniObject<T>) {
  const shape: Record<string, z.ZodMiniType> = {};
  for (const [key, schema] of Object.entries(fields.shape) as Array<[string, z.ZodMiniType]>) {
    const inner = schema instanceof z.ZodMiniDefault ? (schema.def.innerType as z.ZodMiniType) : schema;
    shape[key] = z.optional(inner);
  }
  return shape as { [K in keyof T]: z.ZodMiniOptional<Unwrapped<T[K]>> };
}
