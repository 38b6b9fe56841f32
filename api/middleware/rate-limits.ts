/**
 * Rate limits of the unauthenticated entry points (sign-in, password-reset
 * requests), each per IP + e-mail and per IP. Limits are settings so tests can
 * reach them quickly. Counts live in process memory: one API process.
 */
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../errors';

export interface RateLimitSettings {
  windowMs: number;
  /** Failed sign-ins per IP + e-mail in the window (successful ones are not counted). */
  signInPerIpAndEmail: number;
  /** All sign-in attempts per IP in the window. */
  signInPerIp: number;
  passwordResetPerIpAndEmail: number;
  passwordResetPerIp: number;
}

export const DEFAULT_RATE_LIMITS: RateLimitSettings = {
  windowMs: 10 * 60 * 1000,
  signInPerIpAndEmail: 10,
  signInPerIp: 100,
  passwordResetPerIpAndEmail: 3,
  passwordResetPerIp: 20,
};

function ipKey(req: Request): string {
  return ipKeyGenerator(req.ip ?? 'unknown');
}

function ipAndEmailKey(req: Request): string {
  const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
  return `${ipKey(req)}|${email}`;
}

function limiter(limit: number, windowMs: number, key: (req: Request) => string, skipSuccessfulRequests = false): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    keyGenerator: key,
    skipSuccessfulRequests,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'too many attempts; try again later')),
  });
}

export function createRateLimits(settings: RateLimitSettings): { signIn: RequestHandler[]; passwordReset: RequestHandler[] } {
  const { windowMs } = settings;
  return {
    signIn: [limiter(settings.signInPerIp, windowMs, ipKey), limiter(settings.signInPerIpAndEmail, windowMs, ipAndEmailKey, true)],
    passwordReset: [
      limiter(settings.passwordResetPerIp, windowMs, ipKey),
      limiter(settings.passwordResetPerIpAndEmail, windowMs, ipAndEmailKey),
    ],
  };
}
