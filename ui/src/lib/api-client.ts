import type { ErrorBody } from '@beamwright/link-core/contracts';
import { env } from '@/config/env';
import { clearSessionToken, getSessionToken } from '@/lib/session-token';

/**
 * An answer other than 2xx. `body` is what the server sent, unchecked: read it with the contract
 * schema of the status you expect (`ErrorBodySchema`, `RevisionConflictBodySchema`,
 * `TooManyRequestsBodySchema` of `@beamwright/link-core/contracts`; `lib/form-errors.ts` for 400).
 */
export class ApiError extends Error {
  readonly status: number;
  readonly body: unknown;
  /** seconds to wait before trying again, from the Retry-After header (e.g. on a 429); null without one */
  readonly retryAfterS: number | null;

  constructor(status: number, body: unknown, fallbackMessage: string, retryAfterS: number | null = null) {
    super(messageOf(body) || fallbackMessage);
    this.name = 'ApiError';
    this.status = status;
    this.body = body;
    this.retryAfterS = retryAfterS;
  }
}

/** The sentence of an error body (`ErrorBody.message`); Nest's own errors may send a list. */
function messageOf(body: unknown): string | undefined {
  const message = body && typeof body === 'object' ? (body as Partial<Record<keyof ErrorBody, unknown>>).message : undefined;
  if (typeof message === 'string') return message;
  if (Array.isArray(message)) return message.filter((part) => typeof part === 'string').join('; ');
  return undefined;
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

type QueryValue = string | number | boolean | null | undefined;

export interface RequestOptions {
  params?: Record<string, QueryValue>;
  signal?: AbortSignal;
  /** false for the sign-in call itself: a 401 there means wrong credentials, not an expired session */
  authenticated?: boolean;
  /**
   * false where a 401 must not drop the stored token: the sign-out call, whose answer may arrive
   * after the next user has signed in
   */
  dropSessionOn401?: boolean;
}

function buildUrl(path: string, params?: Record<string, QueryValue>): string {
  const base = env.API_URL.replace(/\/$/, '');
  const url = `${base}${path.startsWith('/') ? path : `/${path}`}`;
  if (!params) return url;
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== null && value !== '') search.set(key, String(value));
  }
  const query = search.toString();
  return query ? `${url}?${query}` : url;
}

/** Retry-After in seconds: the delay form (`120`) or an HTTP date; null when absent or unreadable. */
export function parseRetryAfter(value: string | null, nowMs = Date.now()): number | null {
  if (value === null || value.trim() === '') return null;
  if (/^\d+$/.test(value.trim())) return Number(value.trim());
  const atMs = Date.parse(value);
  return Number.isNaN(atMs) ? null : Math.max(0, Math.ceil((atMs - nowMs) / 1000));
}

async function readBody(response: Response): Promise<unknown> {
  if (response.status === 204) return null;
  const text = await response.text();
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

async function request<T>(method: string, path: string, body: unknown, options: RequestOptions = {}): Promise<T> {
  const authenticated = options.authenticated ?? true;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  const token = authenticated ? getSessionToken() : null;
  if (token) headers.Authorization = `Bearer ${token}`;

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.params), {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, null, 'The server could not be reached. Check your connection and try again.');
  }

  const payload = await readBody(response);
  if (!response.ok) {
    // An authenticated call refused with 401 means the session is over: dropping the token
    // makes the route guard send the user back to the sign-in page.
    if (response.status === 401 && authenticated && (options.dropSessionOn401 ?? true)) clearSessionToken();
    throw new ApiError(
      response.status,
      payload && typeof payload === 'object' ? payload : null,
      `Request failed (${response.status} ${response.statusText || 'error'})`,
      parseRetryAfter(response.headers.get('Retry-After')),
    );
  }
  return payload as T;
}

/** The one api client of the app. */
export const api = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, undefined, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, body ?? {}, options),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PUT', path, body ?? {}, options),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, body ?? {}, options),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, undefined, options),
};

export interface UploadOptions {
  /** called as the request body goes out: bytes sent and the total (0 while unknown) */
  onUploadProgress?: (sentBytes: number, totalBytes: number) => void;
  signal?: AbortSignal;
  headers?: Record<string, string>;
}

/**
 * A multipart upload (`FormData`) with its upload progress, which fetch does not report: through
 * XMLHttpRequest, with the same session header and error shape as the rest of the client. Resolves
 * with the status too, as an upload may answer 201 or 202.
 */
export function uploadForm<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<{ status: number; body: T }> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', buildUrl(path));
    request.setRequestHeader('Accept', 'application/json');
    const token = getSessionToken();
    if (token) request.setRequestHeader('Authorization', `Bearer ${token}`);
    for (const [name, value] of Object.entries(options.headers ?? {})) request.setRequestHeader(name, value);
    request.upload.onprogress = (event) => options.onUploadProgress?.(event.loaded, event.lengthComputable ? event.total : 0);
    request.onload = () => {
      let payload: unknown;
      try {
        payload = request.responseText ? JSON.parse(request.responseText) : null;
      } catch {
        payload = null;
      }
      if (request.status >= 200 && request.status < 300) return resolve({ status: request.status, body: payload as T });
      if (request.status === 401) clearSessionToken();
      reject(new ApiError(request.status, payload && typeof payload === 'object' ? payload : null, `Upload failed (${request.status})`, parseRetryAfter(request.getResponseHeader('Retry-After'))));
    };
    request.onerror = () => reject(new ApiError(0, null, 'The server could not be reached. Check your connection and try again.'));
    request.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'));
    options.signal?.addEventListener('abort', () => request.abort(), { once: true });
    request.send(form);
  });
}
