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
  // A FormData body (file uploads) sets its own multipart content type.
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  return fetch(url, {
    method,
    credentials: 'same-origin',
    headers,
    body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
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

/**
 * A file answer (CSV, PDF, a raw upload): returns the bytes and the name the server suggests.
 * Errors still arrive in the JSON error shape and throw ApiError.
 */
async function requestFile(
  method: Method,
  url: string,
  options: RequestOptions = {},
): Promise<{ blob: Blob; filename: string }> {
  const response = await send(method, url, options);
  if (!response.ok) {
    const payload = (await response.json().catch(() => null)) as ApiErrorBody | null;
    throw new ApiError(
      response.status,
      payload?.error?.code ?? 'http_error',
      payload?.error?.message ?? `The server answered ${response.status} ${response.statusText}.`,
      payload?.error?.details ?? [],
      payload,
    );
  }
  const disposition = response.headers.get('content-disposition') ?? '';
  const filename = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(disposition)?.[1] ?? 'download';
  return { blob: await response.blob(), filename: decodeURIComponent(filename) };
}

/** Hands a downloaded file to the browser as a save. */
export function saveFile({ blob, filename }: { blob: Blob; filename: string }): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/**
 * A multipart upload that reports how much has been sent (fetch cannot): XMLHttpRequest with the
 * same credentials, CSRF header, JSON answer and ApiError as every other call.
 */
function upload<T>(url: string, form: FormData, onProgress?: (fraction: number) => void, retried = false): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('accept', 'application/json');
    for (const [name, value] of Object.entries(csrfHeaders)) xhr.setRequestHeader(name, value);
    if (onProgress) xhr.upload.onprogress = (event) => event.lengthComputable && onProgress(event.loaded / event.total);
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The server could not be reached; try again.'));
    xhr.onload = () => {
      const payload: unknown = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      if (xhr.status >= 200 && xhr.status < 300) return resolve(payload as T);
      const error = (payload as ApiErrorBody | null)?.error;
      if (xhr.status === 403 && error?.code === 'csrf_invalid' && !retried) {
        refreshCsrfToken().then(() => upload<T>(url, form, onProgress, true).then(resolve, reject), reject);
        return;
      }
      reject(
        new ApiError(
          xhr.status,
          error?.code ?? 'http_error',
          error?.message ?? `The server answered ${xhr.status}.`,
          error?.details ?? [],
          payload,
        ),
      );
    };
    xhr.send(form);
  });
}

export const apiClient = {
  upload,
  file: (method: Method, url: string, body?: unknown) => requestFile(method, url, { body }),
  get: <T>(url: string, options?: RequestOptions) => request<T>('GET', url, options),
  post: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('POST', url, { ...options, body }),
  put: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', url, { ...options, body }),
  patch: <T>(url: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', url, { ...options, body }),
  delete: <T>(url: string, options?: RequestOptions) => request<T>('DELETE', url, options),
};
