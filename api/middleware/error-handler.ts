/**
 * The one error handler, registered last: AppError keeps its status and code;
 * body-parser failures map to invalid_json / payload_too_large; anything else
 * is logged and answered as 500 internal without leaking the message or stack.
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from '../errors';

interface BodyParserError {
  type?: string;
  status?: number;
}

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  const bodyError = err as BodyParserError;
  if (bodyError?.type === 'entity.parse.failed') return new AppError(400, 'invalid_json', 'request body is not valid JSON');
  if (bodyError?.type === 'entity.too.large') return new AppError(413, 'payload_too_large', 'request body is too large');
  if (bodyError?.type === 'charset.unsupported' || bodyError?.type === 'encoding.unsupported') {
    return new AppError(400, 'invalid_json', 'request body must be UTF-8 JSON');
  }
  return null;
}

export function errorHandler(log: (message: string, err: unknown) => void = defaultLog): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const known = toAppError(err);
    if (!known) log(`${req.method} ${req.originalUrl} failed`, err);
    const appError = known ?? new AppError(500, 'internal', 'internal error');
    const body: Record<string, unknown> = { code: appError.code, message: appError.message };
    if (appError.details) body.details = appError.details;
    res.status(appError.status).json({ error: body });
  };
}

/** Unknown /api routes: 404 in the error shape (registered after every route). */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', "no such API route"));
};

function defaultLog(message: string, err: unknown): void {
  console.error(message, err);
}
