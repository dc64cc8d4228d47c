import type { RequestHandler, Response } from 'express';

/**
 * The requests this process is still answering, so that stopping it lets them finish (a write's
 * answer waits for its revision bump, db/read-cache.ts) before the database pools close under
 * them. A request counts from its first middleware until its answer is handed to the socket;
 * one whose client has gone still counts until its handler ends it.
 */
export interface InFlight {
  readonly count: number;
  /** Resolves true once nothing is being answered, or false after `timeoutMs` with requests still running. */
  drained(timeoutMs: number): Promise<boolean>;
  /** First in the app's middleware, so every later wrapper of `res.end` (the revision bump) runs inside it. */
  middleware: RequestHandler;
}

export function createInFlight(): InFlight {
  let count = 0;
  const waiters = new Set<() => void>();
  const finished = () => {
    count -= 1;
    if (count === 0) for (const wake of [...waiters]) wake();
  };
  const middleware: RequestHandler = (_req, res, next) => {
    count += 1;
    let done = false;
    const end = res.end;
    res.end = function (this: Response, ...args: unknown[]) {
      const result = (end as (...a: unknown[]) => Response).apply(this, args);
      if (!done) {
        done = true;
        finished();
      }
      return result;
    } as Response['end'];
    next();
  };
  return {
    get count() {
      return count;
    },
    drained(timeoutMs) {
      if (count === 0) return Promise.resolve(true);
      return new Promise((resolve) => {
        const wake = () => {
          clearTimeout(timer);
          waiters.delete(wake);
          resolve(true);
        };
        const timer = setTimeout(() => {
          waiters.delete(wake);
          resolve(false);
        }, timeoutMs);
        waiters.add(wake);
      });
    },
    middleware,
  };
}
