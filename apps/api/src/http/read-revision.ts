import type { RequestHandler, Response } from 'express';
import type { Logger } from '../logger';
import type { Database } from '../db/client';
import { bumpReadRevision } from '../db/read-cache';

const reading = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * For every request that may write (POST, PUT, PATCH, DELETE): the data's revision moves on
 * before the answer leaves, so the client's next read, from any API process, never gets an
 * answer stored before the write (db/read-cache.ts). Refused requests (4xx) are refused before
 * anything is written and leave the revision as it is, so a stream of bad requests never forces
 * the heavy reads to be computed again; a 5xx may come after part of the work was stored, so it
 * moves the revision on like a success.
 */
export function readRevisionOnWrite(db: Database, log: Logger): RequestHandler {
  return (req, res, next) => {
    if (reading.has(req.method)) return next();
    const end = res.end;
    res.end = function (this: Response, ...args: unknown[]) {
      const send = () => (end as (...a: unknown[]) => Response).apply(this, args);
      if (res.statusCode >= 400 && res.statusCode < 500) return send();
      bumpReadRevision(db).then(send, (error: unknown) => {
        // The write itself went through; the stored answers may lag until the next write.
        log.error({ err: error }, 'could not move the read revision on after a write');
        send();
      });
      return this;
    } as Response['end'];
    next();
  };
}
