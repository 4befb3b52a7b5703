// The one way the client talks to the server over HTTP. Every failure, including a dropped
// connection, comes out as an ApiError so screens need a single error path.
import type { ApiErrorBody } from '@shared/auth-schemas';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export const UNREACHABLE_MESSAGE = 'Sporewell cannot be reached. Check your connection.';

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Serialised as JSON. */
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { code?: unknown }).code === 'string' &&
    typeof (error as { message?: unknown }).message === 'string'
  );
}

// Used when the body is not our error shape, e.g. a proxy's HTML page while the server is down.
function fallbackError(status: number): ApiError {
  if (status >= 502 && status <= 504) {
    return new ApiError(status, 'server_unavailable', 'Sporewell is not answering right now. Try again in a moment.');
  }
  if (status >= 500) return new ApiError(status, 'server_error', 'Something went wrong on our side. Try again in a moment.');
  if (status === 401) return new ApiError(status, 'not_signed_in', 'Please sign in first.');
  if (status === 403) return new ApiError(status, 'forbidden', 'You do not have access to this.');
  if (status === 404) return new ApiError(status, 'not_found', 'We could not find that.');
  return new ApiError(status, 'request_failed', 'Sporewell could not handle that request.');
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  // State-changing requests always declare JSON, even without a body: the server refuses
  // form and text/plain posts as a CSRF defence.
  if (method !== 'GET') headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    // An abort is the caller's own doing (TanStack Query cancels); let it through untouched.
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_unreachable', UNREACHABLE_MESSAGE);
  }

  if (response.status === 204) return undefined as T;

  const body = await readJson(response);
  if (!response.ok) {
    if (isErrorBody(body)) {
      const { code, message, fields } = body.error;
      throw new ApiError(response.status, code, message, fields);
    }
    throw fallbackError(response.status);
  }
  return body as T;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) => apiRequest<T>(path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'POST', body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PUT', body }),
  delete: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'DELETE' }),
};

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}
