/**
 * Synchronizer-token CSRF protection (csrf-sync): the token lives in the
 * session, the client sends it in `x-csrf-token` on every state-changing
 * request. A missing or wrong token is 403 csrf_invalid in the error shape.
 */
import type { Request, RequestHandler } from 'express';
import { csrfSync } from 'csrf-sync';
import { AppError } from '../errors';

export interface Csrf {
  protect: RequestHandler;
  tokenFor(req: Request): string;
}

export function createCsrf(): Csrf {
  const csrf = csrfSync({ size: 32, getTokenFromRequest: (req) => req.get('x-csrf-token') });
  return {
    protect: (req, res, next) => {
      csrf.csrfSynchronisedProtection(req, res, (err?: unknown) => {
        if (err === csrf.invalidCsrfTokenError) next(new AppError(403, 'csrf_invalid', 'missing or invalid CSRF token'));
        else next(err);
      });
    },
    tokenFor: (req) => csrf.generateToken(req),
  };
}
