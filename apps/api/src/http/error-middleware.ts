import type { ErrorRequestHandler, RequestHandler } from 'express';
import { z } from 'zod';
import { AppError, errorStatus } from './app-error';

const databaseDownCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'POOL_CLOSED',
]);

function causeCode(error: unknown): string | undefined {
  let current: unknown = error;
  for (let depth = 0; depth < 5 && current && typeof current === 'object'; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string' && databaseDownCodes.has(code)) return code;
    // mysql2 reports a command on a connection the server closed with this message and no code.
    const message = (current as { message?: unknown }).message;
    if (typeof message === 'string' && /connection is in closed state|Connection lost: The server closed/i.test(message)) return 'CLOSED';
    current = (current as { cause?: unknown }).cause;
  }
  return undefined;
}

/** Turns a ZodError into `{ "a.b": "message" }` keyed by the field's path. */
export function fieldMessages(error: z.core.$ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route ${req.method} ${req.baseUrl}${req.path}`));
};

/** The one place errors become HTTP: `{ error: { code, message, fields } }`. */
export const errorMiddleware: ErrorRequestHandler = (error: unknown, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; fields?: Record<string, string>; [more: string]: unknown } = {
    code: 'internal',
    message: `Something went wrong on the server. Quote request id ${String(req.id)} when reporting it.`,
  };
  if (error instanceof AppError) {
    status = errorStatus[error.code];
    body = {
      ...error.details,
      code: error.code,
      message: error.message,
      ...(error.fields ? { fields: error.fields } : {}),
    };
    if (error.retryAfterSeconds !== undefined) res.setHeader('Retry-After', String(error.retryAfterSeconds));
  } else if (error instanceof z.core.$ZodError) {
    // Classic zod's ZodError and zod/mini's (a shared schema's own parse) alike.
    status = 400;
    body = { code: 'invalid', message: 'Some fields are not valid.', fields: fieldMessages(error) };
  } else if (isBodyParserError(error)) {
    status = error.status;
    body =
      error.type === 'entity.too.large'
        ? { code: 'too_large', message: `The request body is larger than the limit of ${error.limit ?? ''} bytes.` }
        : { code: 'invalid', message: 'The request body is not valid JSON.' };
  } else if (isSealedRefusal(error)) {
    status = 409;
    body = { code: 'locked', message: 'This work order is sealed (signed off); its record can no longer change.' };
  } else if (causeCode(error)) {
    status = 503;
    body = { code: 'unavailable', message: 'The database is not reachable right now. Try again in a moment.' };
    res.setHeader('Retry-After', '2');
  }
  if (status === 503) req.log?.warn({ err: error }, 'a dependency is down');
  else if (status >= 500) req.log?.error({ err: error }, 'request failed');
  res.status(status).json({ error: body });
};

function isBodyParserError(error: unknown): error is { status: number; type: string; limit?: number } {
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { status?: unknown }).status === 'number' &&
    typeof (error as { type?: unknown }).type === 'string' &&
    (error as { status: number }).status >= 400 &&
    (error as { status: number }).status < 500
  );
}

/** The database triggers of drizzle/0004 refuse changes to sealed orders with this marker. */
function isSealedRefusal(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 5; depth++) {
    const message = (e as { sqlMessage?: unknown; message?: unknown }).sqlMessage ?? (e as { message?: unknown }).message;
    if (typeof message === 'string' && message.includes('VARDEN_LOCKED')) return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}
