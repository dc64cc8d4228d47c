import { createHash } from 'node:crypto';
import { eq, lt, sql } from 'drizzle-orm';
import { LRUCache } from 'lru-cache';
import type { Executor } from '../access/executor';
import type { Database } from './client';
import { perDatabase } from './prepared';
import { readCache, readRevision } from './schema/index';

/**
 * Stored answers of heavy reads, checked against the data's revision in the database.
 *
 * Every write that succeeds moves the one revision row on before its answer is sent
 * (http/read-revision.ts for the API; jobs and tools that write call bumpReadRevision). A read
 * sends a stored answer only when it was computed at the current revision and in the current
 * quarter hour: from this process's copy when the revision (one check shared by the reads of
 * one turn of the event loop) still matches it, else from `read_cache` (revision and answer in
 * one query). Otherwise it computes (once for all the readers of that key at that revision),
 * stores with the revision read *before* computing, and sends. A write that lands while an
 * answer is being computed moves the revision past the one stored with it, so a stale answer
 * is never served, and any number of API processes share the store.
 */

const revisionBump = perDatabase((db) =>
  db
    .update(readRevision)
    .set({ revision: sql`${readRevision.revision} + 1` })
    .where(eq(readRevision.id, 1))
    .prepare(),
);

/** Per database: the bump being sent, and the one that waits for it, shared by every caller since it was sent. */
const bumpsOf = perDatabase(() => ({ sent: undefined as Promise<void> | undefined, next: undefined as Promise<void> | undefined }));

/**
 * Moves the revision on; resolves once an UPDATE sent after the call has committed, so every
 * write the caller made before calling is behind the new revision. Writers that call while one
 * UPDATE is on its way share the next one (as group commit does): under load, a stream of writes
 * moves the one hot row once per round trip instead of once per write.
 */
export function bumpReadRevision(db: Database): Promise<void> {
  const bumps = bumpsOf(db);
  if (!bumps.next) {
    const waitFor = bumps.sent;
    const send = async (self: () => Promise<void>) => {
      // The next UPDATE goes once the one on its way has answered, with every caller since.
      await waitFor?.catch(() => undefined);
      bumps.next = undefined;
      bumps.sent = self();
      try {
        await revisionBump(db).execute();
      } finally {
        if (bumps.sent === self()) bumps.sent = undefined;
      }
    };
    const next: Promise<void> = send(() => next);
    bumps.next = next;
  }
  return bumps.next;
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
  /** The answer as JSON, encoded (UTF-8) and ready to send. */
  body: Buffer;
  /** The site the answer belongs to, for the reader's scope check; null for answers over many sites. */
  siteId: number | null;
}

const storedLookup = perDatabase((db) =>
  db
    .select({ current: readRevision.revision, stored: readCache.revision, validFor: readCache.validFor, siteId: readCache.siteId, body: readCache.body })
    .from(readRevision)
    .leftJoin(readCache, eq(readCache.cacheKey, sql.placeholder('key')))
    .where(eq(readRevision.id, 1))
    .prepare(),
);

const revisionLookup = perDatabase((db) => db.select({ current: readRevision.revision }).from(readRevision).where(eq(readRevision.id, 1)).prepare());

/**
 * The current revision, read by one query for all the callers of one turn of the event loop.
 * The query is sent only after they have all asked (setImmediate), so it sees every write whose
 * answer any of them had received before asking; a caller that comes after it was sent waits
 * for the next one. Under load, reads that arrive together share one round trip.
 */
const pendingRevisionReads = new WeakMap<Database, Promise<number | undefined>>();
function currentRevision(db: Database): Promise<number | undefined> {
  let pending = pendingRevisionReads.get(db);
  if (!pending) {
    pending = new Promise((resolve, reject) => {
      setImmediate(() => {
        pendingRevisionReads.delete(db);
        revisionLookup(db)
          .execute()
          .then((rows) => resolve(rows[0]?.current), reject);
      });
    });
    pendingRevisionReads.set(db, pending);
  }
  return pending;
}

interface Copy extends Answer {
  revision: number;
  validFor: string;
}

/**
 * This process's copies of answers it has read or computed, per database and key, each with the
 * revision and quarter hour it holds for. A copy saves fetching the body from the database and
 * encoding it again; it is sent only after the database has said that its revision is still the
 * current one, so every process still answers from the one revision. At most 32 MB per
 * database, least recently used first out.
 */
const copiesOf = perDatabase(() => new LRUCache<string, Copy>({ maxSize: 32 * 1024 * 1024, sizeCalculation: (copy) => copy.body.length + 256 }));

/**
 * The answer stored under `key` if it is current, else `compute()`'s, stored for the next read.
 * `compute` returns the value to send and the site it belongs to.
 */
export async function readThrough(
  db: Database,
  key: string,
  compute: () => Promise<{ value: unknown; siteId: number | null }>,
  now = new Date(),
): Promise<Answer> {
  const bucket = quarterHourOf(now);
  const copies = copiesOf(db);
  const copy = copies.get(key);
  if (copy && copy.validFor === bucket) {
    if ((await currentRevision(db)) === copy.revision) return { body: copy.body, siteId: copy.siteId };
  }
  const [row] = await storedLookup(db).execute({ key });
  if (row && row.stored === row.current && row.validFor === bucket && row.body !== null) {
    const stored = { body: Buffer.from(row.body), siteId: row.siteId };
    copies.set(key, { ...stored, revision: row.current, validFor: bucket });
    return stored;
  }

  // Readers of one key at one revision and quarter hour wait for one computation, not one each.
  if (!row) return computeAndStore(db, key, compute, undefined, bucket, now);
  const flight = `${key}\u0000${row.current}\u0000${bucket}`;
  const flights = flightsOf(db);
  let answer = flights.get(flight);
  if (!answer) {
    answer = computeAndStore(db, key, compute, row.current, bucket, now).finally(() => flights.delete(flight));
    flights.set(flight, answer);
  }
  return answer;
}

/** Computations under way, by key, revision and quarter hour. */
const flightsOf = perDatabase(() => new Map<string, Promise<Answer>>());

/** Computes an answer and stores it with `revision`, the one read before computing (none: a database not migrated to 0006). */
async function computeAndStore(
  db: Database,
  key: string,
  compute: () => Promise<{ value: unknown; siteId: number | null }>,
  revision: number | undefined,
  bucket: string,
  now: Date,
): Promise<Answer> {
  const { value, siteId } = await compute();
  const text = JSON.stringify(value);
  const body = Buffer.from(text);
  if (revision !== undefined) {
    const values = { cacheKey: key, siteId, revision, validFor: bucket, body: text, storedAt: now };
    await db
      .insert(readCache)
      .values(values)
      .onDuplicateKeyUpdate({ set: { siteId, revision, validFor: bucket, body: text, storedAt: now } });
    copiesOf(db).set(key, { body, siteId, revision, validFor: bucket });
  }
  return { body, siteId };
}

/** Drops answers stored before `before`: they can no longer be current (a job runs this). */
export async function pruneReadCache(db: Executor, before: Date): Promise<void> {
  await db.delete(readCache).where(lt(readCache.storedAt, before));
}
