import type { z } from 'zod';
import type { csrfTokenSchema } from '@shared/schemas/auth';
import type { ApiErrorBody, FieldIssue } from '@shared/schemas/error';

/** A failed API call, carrying the server's error shape. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: FieldIssue[] = [],
    /** The parsed response body, for routes whose error answers carry more than the error shape. */
    readonly payload: unknown = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
}

const csrfHeaders: Record<string, string> = {};

/** Session answers and GET /api/csrf-token set the token here; every state-changing call sends it. */
export function setCsrfToken(token: string | null): void {
  if (token) csrfHeaders['x-csrf-token'] = token;
  else delete csrfHeaders['x-csrf-token'];
}

/** Asks the server for a fresh CSRF token and keeps it for the next state-changing call. */
export async function refreshCsrfToken(): Promise<void> {
  const { csrfToken } = await request<z.infer<typeof csrfTokenSchema>>('GET', '/api/csrf-token');
  setCsrfToken(csrfToken);
}

async function send(method: Method, url: string, options: RequestOptions): Promise<Response> {
  const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
  if (method !== 'GET') Object.assign(headers, csrfHeaders);
  if (options.body !== undefined) headers['content-type'] = 'application/json';
  return fetch(url, {
    method,
    credentials: 'same-origin',
    headers,
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    signal: options.signal,
  });
}

async function request<T>(method: Method, url: string, options: RequestOptions = {}, retried = false): Promise<T> {
  const response = await send(method, url, options);
  const text = await response.text();
  const payload: unknown = text ? JSON.parse(text) : null;
  if (!response.ok) {
    const error = (payload as ApiErrorBody | null)?.error;
    // The token may have rotated (a new session, a server restart): fetch a fresh one and try once more.
    if (response.status === 403 && error?.code === 'csrf_invalid' && method !== 'GET' && !retried) {
      await refreshCsrfToken();
      return request<T>(method, url, options, true);
    }
    throw new ApiError(
      response.status,
      error?.code ?? 'http_error',
      error?.message ?? `The server answered ${response.status} ${response.statusText}.`,
      error?.details ?? [],
      payload,
    );
  }
  return payload as T;
}

export const apiClient = {
  get: <T>(url: string, options?: RequestOptions) => request<T>('GET', url, options),
  post: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('POST', url, { ...options, body }),
  put: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', url, { ...options, body }),
  patch: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', url, { ...options, body }),
  delete: <T>(url: string, options?: RequestOptions) => request<T>('DELETE', url, options),
};
