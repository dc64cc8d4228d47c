import type { Refusal, SendOutcome } from './outbox-types';

const noSignal = 'No signal: it stays on this phone and goes out when the connection returns.';

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Reads Varden's `{ error: { code, message, fields, confirmable } }`; a fallback when the body is something else. */
export function refusalOf(status: number, body: unknown): Refusal {
  const error = isRecord(body) && isRecord(body.error) ? body.error : {};
  const fields: Record<string, string> = {};
  if (isRecord(error.fields)) {
    for (const [path, message] of Object.entries(error.fields)) if (typeof message === 'string') fields[path] = message;
  }
  return {
    status,
    code: typeof error.code === 'string' ? error.code : 'refused',
    message: typeof error.message === 'string' ? error.message : `The server refused it (HTTP ${status}).`,
    fields,
    confirmable: error.confirmable === true,
  };
}

/**
 * What one answer means for an outbox item. Sent: any 2xx (201 new, 200 the stored one on a
 * retry). Kept and tried again later: no answer at all (status 0), 408, 429, any 5xx, and 401
 * (the session ended: it goes out once the technician signs in again). Refused, shown on the
 * item and not retried blindly: every other 4xx.
 */
export function outcomeOf(status: number, body: unknown): SendOutcome {
  if (status >= 200 && status < 300) return { kind: 'sent', status, body };
  if (status === 0) return { kind: 'retry', status, message: noSignal };
  if (status === 401) return { kind: 'retry', status, message: 'Signed out: sign in again and it will be sent.' };
  if (status === 408 || status === 429 || status >= 500) {
    const said = refusalOf(status, body);
    const why = said.code === 'refused' ? `The server could not take it now (HTTP ${status}).` : said.message;
    return { kind: 'retry', status, message: `${why} It will be tried again.` };
  }
  return { kind: 'refused', refusal: refusalOf(status, body) };
}

/** Waiting time before the next try after `failures` failed passes in a row: 2 s doubling to 1 min, ±20 %. */
export function backoffDelayMs(failures: number, random: () => number = Math.random): number {
  const base = Math.min(60_000, 2_000 * 2 ** Math.max(0, failures));
  return Math.round(base * (0.8 + 0.4 * random()));
}

/** An idempotency key matching the contract (16–64 of A–Z a–z 0–9 - _): a UUID without dashes. */
export function newIdempotencyKey(): string {
  return crypto.randomUUID().replaceAll('-', '');
}
