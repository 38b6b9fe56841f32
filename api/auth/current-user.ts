/**
 * Loads the signed-in user on every request (so deactivation and role changes
 * take effect at once) into res.locals.user; access checks for routes.
 */
import type { RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import { AppError } from '../errors';
import { findUserById, type UserRow } from '../db/users';
import { hasPermission, type Permission } from './permissions';

export function loadCurrentUser(knex: Knex): RequestHandler {
  return async (req, res, next) => {
    const userId = req.session?.userId;
    if (userId !== undefined) {
      const user = await findUserById(knex, userId);
      if (user && user.active) res.locals.user = user;
      else delete req.session.userId; // deleted or deactivated: the session no longer signs anyone in
    }
    next();
  };
}

/** The signed-in user; only call behind requireSignedIn / requirePermission. */
export function currentUser(res: Response): UserRow {
  const user = res.locals.user as UserRow | undefined;
  if (!user) throw new AppError(401, 'not_signed_in', 'sign in first');
  return user;
}

export const requireSignedIn: RequestHandler = (_req, res, next) => {
  if (!res.locals.user) next(new AppError(401, 'not_signed_in', 'sign in first'));
  else next();
};

export function requirePermission(permission: Permission): RequestHandler {
  return (_req, res, next) => {
    const user = res.locals.user as UserRow | undefined;
    if (!user) next(new AppError(401, 'not_signed_in', 'sign in first'));
    else if (!hasPermission(user.role, permission)) next(new AppError(403, 'forbidden', `needs permission ${permission}`));
    else next();
  };
}
