import { z } from 'zod';

/** A finite number above zero (zod 4 rejects NaN and ±Infinity), with a message naming the quantity. */
export const positive = (what: string) => z.number({ error: `${what}: enter a number` }).gt(0, `${what} must be above 0`);

/** A calendar date as YYYY-MM-DD. */
export const isoDate = z.iso.date({ error: 'A date as YYYY-MM-DD' });

/** The version a client last read; a stale one gets 409. */
export const version = z.number({ error: 'The record version is required' }).int().min(1);

/**
 * Server-side paging, sorting and search for list endpoints: page from 1, pageSize up to 200,
 * sort as a field name with an optional leading '-' for descending.
 */
export function listQuery<const S extends readonly [string, ...string[]]>(sorts: S, defaultSort: S[number]) {
  return z.object({
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(25),
    sort: z.enum(sorts).default(defaultSort as never),
    q: z.string().trim().max(200).optional(),
  });
}

export const listResponse = <T extends z.ZodType>(item: T) => z.object({ items: z.array(item), total: z.number() });

type Unwrapped<T> = T extends z.ZodDefault<infer Inner> ? Inner : T;

/**
 * The PATCH form of a create schema's fields: every field optional and without its default,
 * so a partial update never resets a field the client did not send.
 */
export function patchOf<T extends z.ZodRawShape>(fields: z.ZodObject<T>) {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, schema] of Object.entries(fields.shape)) {
    const inner = schema instanceof z.ZodDefault ? (schema.unwrap() as z.ZodType) : (schema as z.ZodType);
    shape[key] = inner.optional();
  }
  return z.object(shape) as unknown as z.ZodObject<{ [K in keyof T]: z.ZodOptional<Unwrapped<T[K]>> }>;
}
