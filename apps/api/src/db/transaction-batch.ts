import type { Database } from './client';
import { transactionOnConnection, type Together, type TransactionPool } from './connection-transaction';
import type { AnyStatement } from './statement-batch';

/**
 * Several units of work in one transaction on one connection, as group commit does for a
 * database's log: under load, the hot write path's transactions queue for the CPU, and each one
 * pays for its own round trips, statements' dispatch and COMMIT. A batcher lets the works that
 * arrive while earlier batches are running share one transaction: what they send with
 * `together` at the same moment goes in one round trip, and one COMMIT ends them all.
 *
 * Each work is written as for transactionOnConnection and is unaware of the others; they must
 * not touch the same rows (the caller claims what a work owns with `claim` and gives up the rest).
 * A work that fails with an error `isolated` allows (a refusal decided before it wrote anything)
 * fails alone; any other failure, or a failed COMMIT, rolls the whole batch back, and each of its
 * other works is rejected with RunAlone, for its caller to run it again in a transaction of its
 * own. At low load a batch holds one work and costs what transactionOnConnection does.
 */

/** The batch's works could not be committed together; run this one on its own. */
export class RunAlone extends Error {
  constructor(cause?: unknown) {
    super('the batch this work ran in was rolled back; run it in a transaction of its own', { cause });
    this.name = 'RunAlone';
  }
}

/** What a work in a batch may ask of the others: whether it may own a key (a row it will write). */
export interface BatchClaims {
  /** True for the first work of the batch to claim `key`; a later claimer must give the row up (throw RunAlone). */
  claim(key: string): boolean;
}

export type BatchWork<T> = (tx: Database, together: Together, claims: BatchClaims) => Promise<T>;

export interface TransactionBatcher {
  run<T>(work: BatchWork<T>): Promise<T>;
}

interface Queued {
  work: BatchWork<unknown>;
  resolve: (value: unknown) => void;
  reject: (error: unknown) => void;
}

export interface BatcherOptions {
  /** Works per batch at most. */
  maxWorks: number;
  /** Batches running at once at most (each on its own connection). */
  maxBatches: number;
  /** A work's own failure that leaves the batch fit to commit (it wrote nothing). */
  isolated: (error: unknown) => boolean;
}

export function createTransactionBatcher(pool: TransactionPool, options: BatcherOptions): TransactionBatcher {
  const queue: Queued[] = [];
  let running = 0;
  let scheduled = false;

  // A batch starts once the turn of the event loop that queued its first work has run its
  // callbacks (setImmediate), so the works one poll of the sockets brought in go together.
  const schedule = () => {
    if (scheduled) return;
    scheduled = true;
    setImmediate(() => {
      scheduled = false;
      pump();
    });
  };

  const pump = () => {
    while (running < options.maxBatches && queue.length > 0) {
      const batch = queue.splice(0, options.maxWorks);
      running += 1;
      void runBatch(pool, batch, options).finally(() => {
        running -= 1;
        schedule();
      });
    }
  };

  return {
    run<T>(work: BatchWork<T>) {
      return new Promise<T>((resolve, reject) => {
        queue.push({ work: work as BatchWork<unknown>, resolve: resolve as (value: unknown) => void, reject });
        schedule();
      });
    },
  };
}

interface Waiting {
  statements: readonly AnyStatement[];
  commit: boolean;
  resolve: (answers: unknown[]) => void;
  reject: (error: unknown) => void;
}

async function runBatch(pool: TransactionPool, batch: Queued[], options: BatcherOptions): Promise<void> {
  const outcomes: Array<PromiseSettledResult<unknown>> = [];
  try {
    await transactionOnConnection(pool, async (tx, together) => {
      const claimed = new Set<string>();
      const claims: BatchClaims = {
        claim: (key) => {
          if (claimed.has(key)) return false;
          claimed.add(key);
          return true;
        },
      };
      let active = batch.length;
      let doomed = false;
      const waiting: Waiting[] = [];
      // Sends what the works wait on once every work still running waits: one round trip at a time.
      const flush = () => {
        if (waiting.length === 0 || waiting.length < active) return;
        const trip = waiting.splice(0);
        const statements = trip.flatMap((w) => w.statements);
        // COMMIT goes with the writes only when they are every running work's last and no work
        // has failed in a way that dooms the batch (its rollback would come too late).
        const commit = !doomed && trip.every((w) => w.commit);
        together(statements, { commit }).then(
          (answers: unknown[]) => {
            let at = 0;
            for (const w of trip) {
              w.resolve(answers.slice(at, at + w.statements.length));
              at += w.statements.length;
            }
          },
          (error: unknown) => {
            for (const w of trip) w.reject(error);
          },
        );
      };
      const shared = ((statements, opts) =>
        new Promise((resolve, reject) => {
          waiting.push({ statements, commit: opts?.commit ?? false, resolve: resolve as (answers: unknown[]) => void, reject });
          flush();
        })) as Together;
      const settled = await Promise.allSettled(
        batch.map((q) =>
          Promise.resolve()
            .then(() => q.work(tx, shared, claims))
            .catch((error: unknown) => {
              if (!options.isolated(error) && !(error instanceof RunAlone)) doomed = true;
              throw error;
            })
            .finally(() => {
              active -= 1;
              flush();
            }),
        ),
      );
      outcomes.push(...settled);
      const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected' && !options.isolated(s.reason) && !(s.reason instanceof RunAlone));
      // Thrown, the transaction rolls back (transactionOnConnection); otherwise it commits.
      if (failed) throw failed.reason;
    });
  } catch (error) {
    // Rolled back, or the COMMIT failed: nothing of the batch is stored.
    batch.forEach((q, i) => {
      const own = outcomes[i];
      if (own?.status === 'rejected' && options.isolated(own.reason)) q.reject(own.reason);
      else if (batch.length === 1) q.reject(own?.status === 'rejected' ? own.reason : error);
      else q.reject(new RunAlone(error));
    });
    return;
  }
  batch.forEach((q, i) => {
    const own = outcomes[i]!;
    if (own.status === 'fulfilled') q.resolve(own.value);
    else q.reject(own.reason);
  });
}
