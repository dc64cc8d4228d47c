import { createHash } from 'node:crypto';
import { eq, lt, sql } from 'drizzle-orm';
import type { Executor } from '../access/executor';
import { readCache, readRevision } from './schema/index';

/**
 * Stored answers of heavy reads, checked against the data's revision in the database.
 *
 * Every write that succeeds moves the one revision row on before its answer is sent
 * (http/read-revision.ts for the API; jobs and tools that write call bumpReadRevision). A read
 * fetches, in one query, the current revision and the answer stored under its key: when the
 * answer was computed at that revision and in the current quarter hour, it is sent as stored; otherwise it is
 * computed, stored with the revision read *before* computing, and sent. A write that lands
 * while an answer is being computed moves the revision past the one stored with it, so a stale
 * answer is never served, and any number of API processes share the store.
 */

export async function bumpReadRevision(db: Executor): Promise<void> {
  await db
    .update(readRevision)
    .set({ revision: sql`${readRevision.revision} + 1` })
    .where(eq(readRevision.id, 1));
}

/** The UTC quarter hour of `d`, as 2026-12-02T14:45: an answer stored in it holds until it ends. */
export function quarterHourOf(d: Date): string {
  const q = new Date(Math.floor(d.getTime() / 900_000) * 900_000);
  return q.toISOString().slice(0, 16);
}

/** A key of at most 190 characters: long parts (a viewer's list of sites) go in as a digest. */
export function cacheKey(...parts: Array<string | number>): string {
  const key = parts.join(':');
  return key.length <= 120 ? key : `${parts[0]}:${createHash('sha256').update(key).digest('hex')}`;
}

export interface Answer {
  /** The answer as JSON text, ready to send. */
  body: string;
  /** The site the answer belongs to, for the reader's scope check; null for answers over many sites. */
  siteId: number | null;
}

function storedLookup(db: Executor) {
  return db
    .select({ current: readRevision.revision, stored: readCache.revision, validFor: readCache.validFor, siteId: readCache.siteId, body: readCache.body })
    .from(readRevision)
    .leftJoin(readCache, eq(readCache.cacheKey, sql.placeholder('key')))
    .where(eq(readRevision.id, 1))
    .prepare();
}

/** Built once per database handle: every cached read runs it. */
const preparedLookups = new WeakMap<Executor, ReturnType<typeof storedLookup>>();

/**
 * The answer stored under `key` if it is current, else `compute()`'s, stored for the next read.
 * `compute` returns the value to send and the site it belongs to.
 */
export async function readThrough(
  db: Executor,
  key: string,
  compute: () => Promise<{ value: unknown; siteId: number | null }>,
  now = new Date(),
): Promise<Answer> {
  const bucket = quarterHourOf(now);
  let lookup = preparedLookups.get(db);
  if (!lookup) preparedLookups.set(db, (lookup = storedLookup(db)));
  const [row] = await lookup.execute({ key });
  if (row && row.stored === row.current && row.validFor === bucket && row.body !== null) return { body: row.body, siteId: row.siteId };

  const { value, siteId } = await compute();
  const body = JSON.stringify(value);
  // Without the revision row (a database not migrated to 0006) nothing is stored.
  if (row) {
    const values = { cacheKey: key, siteId, revision: row.current, validFor: bucket, body, storedAt: now };
    await db
      .insert(readCache)
      .values(values)
      .onDuplicateKeyUpdate({ set: { siteId, revision: row.current, validFor: bucket, body, storedAt: now } });
  }
  return { body, siteId };
}

/** Drops answers stored before `before`: they can no longer be current (a job runs this). */
export async function pruneReadCache(db: Executor, before: Date): Promise<void> {
  await db.delete(readCache).where(lt(readCache.storedAt, before));
}
