import { noteAnswer } from './offline';

// The one way the client talks to the API: JSON in and out, the session cookie sent
// along (same origin), and every failure turned into an ApiError carrying the
// server's code, message and per-field messages so forms can show them in place.

export type FieldErrors = Record<string, string>;

export interface ApiErrorBody {
  code: string;
  message: string;
  details?: unknown;
}

export interface Pagination {
  [key: string]: unknown;
}

export interface ApiEnvelope<T> {
  data: T;
  pagination?: Pagination;
}

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;
  readonly fields: FieldErrors;

  constructor(status: number, body: ApiErrorBody) {
    super(body.message);
    this.name = 'ApiError';
    this.status = status;
    this.code = body.code;
    this.details = body.details ?? null;
    this.fields = fieldsOf(body.details);
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

export function isUnauthorized(error: unknown): boolean {
  return isApiError(error) && error.status === 401;
}

function fieldsOf(details: unknown): FieldErrors {
  if (!details || typeof details !== 'object') return {};
  const fields = (details as { fields?: unknown }).fields;
  if (!fields || typeof fields !== 'object') return {};
  const out: FieldErrors = {};
  for (const [name, message] of Object.entries(fields)) {
    if (typeof message === 'string') out[name] = message;
    else if (Array.isArray(message) && typeof message[0] === 'string') out[name] = message[0];
  }
  return out;
}

// What the user reads when the answer is not one of ours (a proxy page, a crash).
function fallbackMessage(status: number): string {
  if (status === 401) return 'Please sign in again.';
  if (status === 403) return 'Your role in this workspace does not allow that.';
  if (status === 404) return 'That was not found.';
  if (status === 413) return 'That is too large to send.';
  if (status === 429) return 'Too many attempts. Wait a minute and try again.';
  if (status >= 500) return 'The server could not answer just now. Try again in a moment.';
  return `The server refused the request (${status}).`;
}

// No answer at all. Offline, a read that fails is one this device never saved, and a
// write says plainly that it needs the network; the form keeps what was typed.
function networkError(method: string): ApiError {
  const offline = !navigator.onLine;
  if (method !== 'GET' && method !== 'HEAD') {
    return new ApiError(0, {
      code: offline ? 'offline' : 'network-error',
      message: offline
        ? 'This needs the network, and this device is offline. Nothing you typed is lost: try again when you have a signal.'
        : 'Could not reach the Bindery server, so nothing was changed. What you typed is still here: try again in a moment.',
    });
  }
  return new ApiError(0, {
    code: offline ? 'offline' : 'network-error',
    message: offline
      ? 'This device is offline and has no saved copy of this. Open it once with a signal to have it at the field.'
      : 'Could not reach the Bindery server. Check the connection and try again.',
  });
}

export interface RequestOptions {
  method?: string;
  /** Sent as JSON. */
  json?: unknown;
  /** Sent as is (a FormData upload or a YAML text); `headers` may name its type. */
  body?: BodyInit;
  headers?: Record<string, string>;
  signal?: AbortSignal;
}

export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<ApiEnvelope<T>> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  let body = options.body;
  if (options.json !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.json);
  }

  const method = options.method ?? (body === undefined ? 'GET' : 'POST');
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body,
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw networkError(method);
  }
  noteAnswer(path, response);

  const payload = await readJson(response);
  if (payload === NOT_JSON && response.ok) {
    throw new ApiError(response.status, {
      code: 'unexpected-response',
      message: 'The server answered with something other than JSON. Is the API running?',
    });
  }

  if (!response.ok) {
    const error = payload && typeof payload === 'object' ? (payload as { error?: unknown }).error : undefined;
    if (error && typeof error === 'object' && typeof (error as ApiErrorBody).message === 'string') {
      const body = error as ApiErrorBody;
      throw new ApiError(response.status, {
        code: typeof body.code === 'string' ? body.code : `http-${response.status}`,
        message: body.message,
        details: body.details,
      });
    }
    throw new ApiError(response.status, { code: `http-${response.status}`, message: fallbackMessage(response.status) });
  }

  if (payload && typeof payload === 'object' && 'data' in payload) return payload as ApiEnvelope<T>;
  return { data: payload as T };
}

const NOT_JSON = Symbol('not-json');

async function readJson(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined;
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return NOT_JSON;
  }
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => apiRequest<T>(path, { method: 'GET', signal }),
  post: <T>(path: string, json?: unknown) => apiRequest<T>(path, { method: 'POST', json }),
  put: <T>(path: string, json?: unknown) => apiRequest<T>(path, { method: 'PUT', json }),
  patch: <T>(path: string, json?: unknown) => apiRequest<T>(path, { method: 'PATCH', json }),
  delete: <T>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
};
