import type { Response } from 'express';

/** Sends JSON already serialised (a stored answer, db/read-cache.ts) as `res.json` would send it. */
export function sendJsonText(res: Response, body: string): void {
  res.type('application/json').send(body);
}
