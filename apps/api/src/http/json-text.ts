import type { Response } from 'express';

/** Sends JSON already serialised and encoded (a stored answer, db/read-cache.ts) as `res.json` would send it. */
export function sendJsonText(res: Response, body: Buffer): void {
  res.type('application/json').send(body);
}
