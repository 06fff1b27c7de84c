import type { NextFunction, Request, Response } from 'express';
import { BaseError, ConnectionError, UniqueConstraintError, ValidationError, TimeoutError } from 'sequelize';
import { MulterError } from 'multer';
import type { Logger } from 'pino';
import { HttpError, databaseUnavailable, payloadTooLarge } from './errors';

/** True for the errors Sequelize and the mariadb connector raise when the server is unreachable. */
export function isDatabaseDown(err: unknown): boolean {
  if (err instanceof ConnectionError || err instanceof TimeoutError) return true;
  if (err instanceof BaseError) {
    const parent = (err as BaseError & { parent?: { code?: string; fatal?: boolean } }).parent;
    if (parent?.fatal || ['ECONNREFUSED', 'ER_GET_CONNECTION_TIMEOUT', 'ER_SOCKET_UNEXPECTED_CLOSE', 'ECONNRESET'].includes(parent?.code ?? '')) return true;
  }
  const code = (err as { code?: string } | null)?.code;
  return code === 'ECONNREFUSED' || code === 'ER_GET_CONNECTION_TIMEOUT';
}

/** Maps every error to `{ error: { code, message, details } }`; unknown errors become a bare 500. */
export function errorHandler(logger: Logger, uploadMaxMb: number) {
  return (err: unknown, req: Request, res: Response, _next: NextFunction) => {
    let http: HttpError;
    if (err instanceof HttpError) http = err;
    else if (err instanceof MulterError) {
      http =
        err.code === 'LIMIT_FILE_SIZE'
          ? payloadTooLarge(`The file is larger than the ${uploadMaxMb} MB upload limit`)
          : new HttpError(400, 'bad_upload', `Upload rejected: ${err.message} (field ${err.field ?? 'file'})`);
    } else if (isDatabaseDown(err)) http = databaseUnavailable();
    else if (err instanceof UniqueConstraintError) {
      http = new HttpError(409, 'duplicate', 'A record with the same key already exists', err.errors.map((e) => ({ field: e.path, message: e.message })));
    } else if (err instanceof ValidationError) {
      http = new HttpError(400, 'validation_failed', err.message, err.errors.map((e) => ({ field: e.path, message: e.message })));
    } else if ((err as { type?: string }).type === 'entity.too.large') {
      http = payloadTooLarge('The request body is too large');
    } else if ((err as { type?: string }).type === 'entity.parse.failed') {
      http = new HttpError(400, 'bad_json', 'The request body is not valid JSON');
    } else {
      logger.error({ err, url: req.originalUrl }, 'unhandled error');
      http = new HttpError(500, 'internal', 'Something went wrong on the server; the details are in its log');
    }
    if (http.status === 503) logger.warn({ url: req.originalUrl }, 'database unavailable');
    res.status(http.status).json({ error: { code: http.code, message: http.message, ...(http.details !== undefined ? { details: http.details } : {}) } });
  };
}
