import type { ApiErrorBody } from '@ladderwright/shared/api';

/** A non-2xx answer from the API, carrying the server's error body. */
export class ApiError extends Error {
  readonly status: number;
  readonly body: ApiErrorBody;
  /** Seconds to wait before retrying, from `Retry-After` (429), else null. */
  readonly retryAfterS: number | null;

  constructor(body: ApiErrorBody, retryAfterS: number | null = null) {
    super(body.message);
    this.name = 'ApiError';
    this.status = body.statusCode;
    this.body = body;
    this.retryAfterS = retryAfterS;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

type UnauthorizedHandler = () => void;

let unauthorizedHandler: UnauthorizedHandler | null = null;

/** Registers what happens when a request answers 401 (the app sends the user to the sign-in page). */
export function setUnauthorizedHandler(handler: UnauthorizedHandler | null): void {
  unauthorizedHandler = handler;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** For calls where 401 is an expected answer (sign-in, who-am-I): no redirect to sign-in. */
  isUnauthorizedExpected?: boolean;
}

const statusMessages: Record<number, string> = {
  400: 'The request was not accepted.',
  401: 'You are not signed in.',
  403: 'You do not have permission for this.',
  404: 'Not found.',
  409: 'This changed meanwhile. Reload and try again.',
  429: 'Too many attempts. Wait a moment and try again.',
};

function parseRetryAfterS(header: string | null): number | null {
  if (!header) return null;
  const seconds = Number(header);
  return Number.isFinite(seconds) && seconds >= 0 ? seconds : null;
}

function isApiErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as ApiErrorBody).message === 'string' &&
    typeof (value as ApiErrorBody).code === 'string'
  );
}

async function readErrorBody(response: Response): Promise<ApiErrorBody> {
  const fallback: ApiErrorBody = {
    statusCode: response.status,
    code: `http_${response.status}`,
    message: statusMessages[response.status] ?? `The server answered ${response.status}.`,
  };
  try {
    const parsed: unknown = await response.json();
    return isApiErrorBody(parsed) ? { ...parsed, statusCode: response.status } : fallback;
  } catch {
    return fallback;
  }
}

/** Calls the API with JSON in and out and the session cookie; throws `ApiError` on any non-2xx answer. */
export async function apiRequest<T>(url: string, options: RequestOptions = {}): Promise<T> {
  const { method = 'GET', body, signal, isUnauthorizedExpected = false } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  const response = await fetch(url, {
    method,
    headers,
    body: body === undefined ? undefined : JSON.stringify(body),
    credentials: 'include',
    signal,
  });

  if (!response.ok) {
    const errorBody = await readErrorBody(response);
    if (response.status === 401 && !isUnauthorizedExpected) unauthorizedHandler?.();
    throw new ApiError(errorBody, parseRetryAfterS(response.headers.get('Retry-After')));
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** Sends a multipart form (file uploads) with the session cookie; errors as `apiRequest`. */
export async function apiFormRequest<T>(
  url: string,
  form: FormData,
  options: { signal?: AbortSignal } = {},
): Promise<T> {
  const response = await fetch(url, {
    method: 'POST',
    headers: { Accept: 'application/json' },
    body: form,
    credentials: 'include',
    signal: options.signal,
  });
  if (!response.ok) {
    const errorBody = await readErrorBody(response);
    if (response.status === 401) unauthorizedHandler?.();
    throw new ApiError(errorBody, parseRetryAfterS(response.headers.get('Retry-After')));
  }
  return (await response.json()) as T;
}

/** Fetches a file (e.g. a PDF) with the session cookie; errors as `apiRequest`. */
export async function apiBlobRequest(url: string, options: { signal?: AbortSignal } = {}): Promise<Blob> {
  const response = await fetch(url, { credentials: 'include', signal: options.signal });
  if (!response.ok) {
    const errorBody = await readErrorBody(response);
    if (response.status === 401) unauthorizedHandler?.();
    throw new ApiError(errorBody, parseRetryAfterS(response.headers.get('Retry-After')));
  }
  return response.blob();
}
