// The one fetch wrapper: JSON in and out, the CSRF token on every state-changing request,
// errors turned into ApiError with the server's code and field messages, and a 401
// reported so the app can send the user to sign-in.
import { clientConfig } from '@/config';
import type { ErrorBody, ErrorCode, FieldErrors } from '@shared/errors';

export class ApiError extends Error {
  /** recorded: on a 409 for a field step already taken, what the server already records. */
  constructor(readonly status: number, readonly code: ErrorCode, message: string, readonly fields: FieldErrors = {}, readonly recorded?: unknown) {
    super(message);
  }
}

let csrfToken: string | null = null;
let onUnauthenticated: (() => void) | null = null;

export function setUnauthenticatedHandler(handler: () => void) {
  onUnauthenticated = handler;
}

export function rememberCsrfToken(token: string | undefined) {
  if (token) csrfToken = token;
}

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch(`${clientConfig.apiBase}/auth/csrf`, { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  csrfToken = body.csrfToken;
  return csrfToken;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export interface RequestOptions {
  body?: unknown;
  query?: Record<string, string | number | boolean | undefined | null>;
  /** Don't redirect to sign-in on 401 (the session check itself). */
  quiet401?: boolean;
  signal?: AbortSignal;
  /** Extra request headers (e.g. Idempotency-Key on field records). */
  headers?: Record<string, string>;
}

function urlFor(path: string, query?: RequestOptions['query']) {
  const url = new URL(`${clientConfig.apiBase}${path}`, window.location.origin);
  for (const [key, value] of Object.entries(query ?? {})) if (value !== undefined && value !== null && value !== '') url.searchParams.set(key, String(value));
  return url.pathname + url.search;
}

export async function request<T>(method: Method, path: string, options: RequestOptions = {}, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  const isForm = options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken ?? (await fetchCsrfToken());
  const res = await fetch(urlFor(path, options.query), {
    method,
    headers,
    credentials: 'same-origin',
    body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
    signal: options.signal,
  });
  const text = await res.text();
  const body = text ? (JSON.parse(text) as unknown) : undefined;
  if (res.ok) {
    rememberCsrfToken((body as { csrfToken?: string } | undefined)?.csrfToken);
    return body as T;
  }
  const error = (body as ErrorBody | undefined)?.error ?? { code: 'internal' as const, message: res.statusText };
  if (res.status === 403 && error.code === 'csrf_invalid' && !retried) {
    await fetchCsrfToken();
    return request<T>(method, path, options, true);
  }
  if (res.status === 401 && !options.quiet401) onUnauthenticated?.();
  throw new ApiError(res.status, error.code, error.message, error.fields ?? {}, error.recorded);
}

export const http = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
};
