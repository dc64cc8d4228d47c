/**
 * The one way the web app talks to /api. It returns parsed data or throws an ApiError; it
 * never shows a notice and never navigates. Callers (queries, forms, route boundaries)
 * decide what a failure means for the person using the page.
 */

/** Codes made up on this side, for answers that did not come from Varden's API. */
export const clientErrorCodes = {
  /** The request never got an answer from Varden: offline, refused, or a proxy answered. */
  unreachable: 'unreachable',
  /** An answer came, but not in a shape Varden's API gives. */
  unexpectedResponse: 'unexpected_response',
} as const;

export type FieldErrors = Readonly<Record<string, string>>;

export class ApiError extends Error {
  override readonly name = 'ApiError';
  /** HTTP status; 0 when no answer arrived at all. */
  readonly status: number;
  /** The API's error code (`invalid`, `not_found`, `conflict` …) or one of clientErrorCodes. */
  readonly code: string;
  /** Field path → message, for a 400 to go back into its form with setError. */
  readonly fields: FieldErrors;

  constructor(status: number, code: string, message: string, fields: FieldErrors = {}, options?: ErrorOptions) {
    super(message, options);
    this.status = status;
    this.code = code;
    this.fields = fields;
  }

  /** True when Varden's server itself could not be reached. */
  get isUnreachable(): boolean {
    return this.code === clientErrorCodes.unreachable || this.code === clientErrorCodes.unexpectedResponse;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

const unreachableMessage = 'Could not reach the server. Check the connection and try again.';
const unexpectedMessage = 'The server answered in a way Varden did not expect.';

type ErrorBody = { code: string; message: string; fields: FieldErrors };

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Reads `{ "error": { "code", "message", "fields" } }`; undefined when the body is not that shape. */
function readErrorBody(json: unknown): ErrorBody | undefined {
  if (!isRecord(json) || !isRecord(json.error)) return undefined;
  const { code, message, fields } = json.error;
  if (typeof code !== 'string' || typeof message !== 'string') return undefined;
  const fieldMessages: Record<string, string> = {};
  if (isRecord(fields)) {
    for (const [path, fieldMessage] of Object.entries(fields)) {
      if (typeof fieldMessage === 'string') fieldMessages[path] = fieldMessage;
    }
  }
  return { code, message, fields: fieldMessages };
}

async function readJson(response: Response): Promise<{ ok: true; json: unknown } | { ok: false }> {
  const text = await response.text();
  if (text === '') return { ok: true, json: undefined };
  try {
    return { ok: true, json: JSON.parse(text) as unknown };
  } catch {
    return { ok: false };
  }
}

/** Turns a failed answer into an ApiError, whether or not Varden's API wrote it. */
export async function parseApiError(response: Response): Promise<ApiError> {
  const body = await readJson(response);
  const errorBody = body.ok ? readErrorBody(body.json) : undefined;
  if (errorBody) return new ApiError(response.status, errorBody.code, errorBody.message, errorBody.fields);
  // A gateway or dev proxy answers 5xx without Varden's error shape when the API is down.
  if (response.status >= 500) return new ApiError(response.status, clientErrorCodes.unreachable, unreachableMessage);
  return new ApiError(response.status, clientErrorCodes.unexpectedResponse, unexpectedMessage);
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export type ApiRequestOptions<T> = {
  method?: HttpMethod;
  /** Sent as JSON. */
  body?: unknown;
  /** Checks the answer's shape at runtime and types it (a shared zod schema's `parse`). */
  parse: (json: unknown) => T;
  signal?: AbortSignal;
  headers?: Readonly<Record<string, string>>;
  /**
   * Non-2xx statuses whose body is data rather than an error, e.g. the health check's 503,
   * which carries the same report with the failing service marked down.
   */
  acceptStatuses?: readonly number[];
};

type Transport = (path: string, init: RequestInit) => Promise<Response>;

/** The browser's fetch, or the server render's (entry-server.tsx), which adds the visitor's cookie. */
let transport: Transport = (path, init) => fetch(path, init);

/** For the server render only: where its requests go and with which cookie. */
export function setApiTransport(next: Transport): void {
  transport = next;
}

export async function apiRequest<T>(path: string, options: ApiRequestOptions<T>): Promise<T> {
  const { method = 'GET', body, parse, signal, headers, acceptStatuses = [] } = options;
  const init: RequestInit = {
    method,
    credentials: 'same-origin',
    headers: {
      Accept: 'application/json',
      ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
      ...headers,
    },
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    ...(signal ? { signal } : {}),
  };

  let response: Response;
  try {
    response = await transport(path, init);
  } catch (error) {
    // A cancelled query must stay an AbortError so TanStack Query treats it as cancelled.
    if (signal?.aborted || (error instanceof DOMException && error.name === 'AbortError')) throw error;
    throw new ApiError(0, clientErrorCodes.unreachable, unreachableMessage, {}, { cause: error });
  }

  if (!response.ok && !acceptStatuses.includes(response.status)) throw await parseApiError(response);

  const result = await readJson(response);
  if (!result.ok) throw new ApiError(response.status, clientErrorCodes.unexpectedResponse, unexpectedMessage);
  try {
    return parse(result.json);
  } catch (error) {
    throw new ApiError(response.status, clientErrorCodes.unexpectedResponse, unexpectedMessage, {}, { cause: error });
  }
}
