import { CSRF_HEADER, type ApiErrorBody, type CsrfResponse } from '@veracast/shared-types';
import { env } from './env';

/** A failed API call: the HTTP status (0 when the server was not reached) and the server's error code. */
export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** A sentence fit to show a person, whatever was thrown. */
export function describeError(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const UNSAFE_METHODS: ReadonlySet<HttpMethod> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export type QueryParams = Record<string, string | number | boolean | undefined>;

export interface RequestOptions {
  method?: HttpMethod;
  body?: unknown;
  query?: QueryParams;
  signal?: AbortSignal;
}

export interface ApiClient {
  request<T>(path: string, options?: RequestOptions): Promise<T>;
  get<T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  post<T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  patch<T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  put<T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  delete<T = void>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  /** Forgets the CSRF token; call when the session changes (sign-in, sign-out). */
  resetCsrfToken(): void;
}

export interface ApiClientOptions {
  /** Prefix of every path, e.g. `/api/v1`. */
  baseUrl: string;
  /** Defaults to the global `fetch`, looked up at call time. */
  fetch?: typeof fetch;
}

const FALLBACK_CODES: Record<number, string> = {
  400: 'bad_request',
  401: 'unauthorized',
  403: 'forbidden',
  404: 'not_found',
  409: 'conflict',
  410: 'gone',
  422: 'unprocessable',
  429: 'rate_limited',
  503: 'unavailable',
};

const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'You are not signed in.',
  403: 'You do not have access to this.',
  404: 'Not found.',
  429: 'Too many attempts. Wait a moment and try again.',
  503: 'The service is unavailable right now. Try again shortly.',
};

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const inner = (value as { error: unknown }).error;
  return (
    typeof inner === 'object' &&
    inner !== null &&
    typeof (inner as { code?: unknown }).code === 'string' &&
    typeof (inner as { message?: unknown }).message === 'string'
  );
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return text;
  }
}

async function toApiError(response: Response): Promise<ApiError> {
  const body = await readJson(response);
  if (isErrorBody(body)) {
    return new ApiError(response.status, body.error.code, body.error.message, body.error.details);
  }
  const code = FALLBACK_CODES[response.status] ?? (response.status >= 500 ? 'server_error' : 'http_error');
  const message =
    FALLBACK_MESSAGES[response.status] ??
    (response.status >= 500
      ? 'The server failed to answer. Try again shortly.'
      : `The request failed (HTTP ${response.status}).`);
  return new ApiError(response.status, code, message, body);
}

function buildUrl(baseUrl: string, path: string, query?: QueryParams): string {
  const url = `${baseUrl}${path.startsWith('/') ? path : `/${path}`}`;
  if (!query) return url;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined) params.set(key, String(value));
  const text = params.toString();
  return text ? `${url}?${text}` : url;
}

/**
 * A JSON client for the Veracast API. It sends the session cookie, adds the CSRF token to unsafe
 * requests (fetched once from `GET /auth/csrf` and kept until the session changes), refetches the
 * token and retries once when the server answers 403 `csrf_invalid`, and throws `ApiError` for
 * every failure.
 */
export function createApiClient(options: ApiClientOptions): ApiClient {
  const baseUrl = options.baseUrl.replace(/\/$/, '');
  const doFetch: typeof fetch = (input, init) => (options.fetch ?? globalThis.fetch)(input, init);

  let csrfToken: string | null = null;
  let csrfInFlight: Promise<string | null> | null = null;

  async function send(url: string, init: RequestInit): Promise<Response> {
    try {
      return await doFetch(url, { ...init, credentials: 'include' });
    } catch (error) {
      if (error instanceof DOMException && error.name === 'AbortError') throw error;
      throw new ApiError(0, 'network_error', 'The server could not be reached. Check the connection and try again.');
    }
  }

  async function loadCsrfToken(): Promise<string | null> {
    const response = await send(buildUrl(baseUrl, '/auth/csrf'), {
      method: 'GET',
      headers: { Accept: 'application/json' },
    });
    // Without a session there is no token to get; the request then goes without one.
    if (!response.ok) return null;
    const body = (await readJson(response)) as Partial<CsrfResponse> | undefined;
    return typeof body?.csrfToken === 'string' && body.csrfToken ? body.csrfToken : null;
  }

  function getCsrfToken(): Promise<string | null> {
    if (csrfToken) return Promise.resolve(csrfToken);
    if (!csrfInFlight) {
      const pending = loadCsrfToken()
        .then((token) => {
          if (csrfInFlight === pending) csrfToken = token;
          return token;
        })
        .finally(() => {
          if (csrfInFlight === pending) csrfInFlight = null;
        });
      csrfInFlight = pending;
    }
    return csrfInFlight;
  }

  function resetCsrfToken(): void {
    csrfToken = null;
    csrfInFlight = null;
  }

  async function request<T>(path: string, requestOptions: RequestOptions = {}): Promise<T> {
    const method = requestOptions.method ?? 'GET';
    const unsafe = UNSAFE_METHODS.has(method);
    const url = buildUrl(baseUrl, path, requestOptions.query);
    const hasBody = requestOptions.body !== undefined;

    const attempt = (token: string | null) => {
      const headers: Record<string, string> = { Accept: 'application/json' };
      if (hasBody) headers['Content-Type'] = 'application/json';
      if (token) headers[CSRF_HEADER] = token;
      return send(url, {
        method,
        headers,
        body: hasBody ? JSON.stringify(requestOptions.body) : undefined,
        signal: requestOptions.signal,
      });
    };

    let response = await attempt(unsafe ? await getCsrfToken() : null);

    if (!response.ok && unsafe && response.status === 403) {
      const error = await toApiError(response);
      if (error.code !== 'csrf_invalid') throw error;
      resetCsrfToken();
      response = await attempt(await getCsrfToken());
    }

    if (!response.ok) throw await toApiError(response);
    if (response.status === 204) return undefined as T;
    return (await readJson(response)) as T;
  }

  return {
    request,
    get: (path, opts) => request(path, { ...opts, method: 'GET' }),
    post: (path, body, opts) => request(path, { ...opts, method: 'POST', body }),
    patch: (path, body, opts) => request(path, { ...opts, method: 'PATCH', body }),
    put: (path, body, opts) => request(path, { ...opts, method: 'PUT', body }),
    delete: (path, opts) => request(path, { ...opts, method: 'DELETE' }),
    resetCsrfToken,
  };
}

/** The app's client, rooted at the configured API base (default `/api/v1`). */
export const apiClient = createApiClient({ baseUrl: env.apiBase });
