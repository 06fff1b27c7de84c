/** An error with an HTTP status and a stable code; the error middleware renders it. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: unknown) => new HttpError(400, 'bad_request', message, details);
export const validationFailed = (details: unknown, message = 'The request is not valid') =>
  new HttpError(400, 'validation_failed', message, details);
export const unauthorized = (message = 'Sign in to continue') => new HttpError(401, 'unauthorized', message);
export const invalidCredentials = () => new HttpError(401, 'invalid_credentials', 'E-mail or password is wrong');
export const forbidden = (message = 'Your role does not allow this') => new HttpError(403, 'forbidden', message);
export const csrfInvalid = () =>
  new HttpError(403, 'csrf_invalid', 'Missing or wrong X-CSRF-Token header; fetch one from GET /api/v1/auth/csrf');
export const notFound = (what = 'Resource') => new HttpError(404, 'not_found', `${what} not found`);
export const conflict = (code: string, message: string, details?: unknown) => new HttpError(409, code, message, details);
export const gone = (message: string) => new HttpError(410, 'gone', message);
export const payloadTooLarge = (message: string) => new HttpError(413, 'payload_too_large', message);
export const unprocessable = (code: string, message: string, details?: unknown) => new HttpError(422, code, message, details);
export const tooManyRequests = (message: string) => new HttpError(429, 'too_many_requests', message);
export const databaseUnavailable = () =>
  new HttpError(503, 'database_unavailable', 'The database is not reachable right now; try again shortly');
