/** Codes the API answers with; each maps to one HTTP status in the error middleware. */
export const errorStatus = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  locked: 409,
  too_large: 413,
  unsupported_media: 415,
  throttled: 429,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

/**
 * A failure a caller can act on. Services throw it with a code of the domain; only the
 * error middleware turns it into HTTP.
 */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly retryAfterSeconds?: number,
    /** More for the client to act on, sent inside the error object (e.g. per-row import errors). */
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}
