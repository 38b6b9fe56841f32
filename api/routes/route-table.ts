/**
 * The route registry: every API route is added through a RouteTable, which
 * records `{ method, path, access }` and mounts the route behind the matching
 * access check. Tests enumerate `routesOf(app)` to check every route × role.
 */
import type { Application, RequestHandler } from 'express';
import { requirePermission, requireSignedIn } from '../auth/current-user';
import type { Permission } from '../auth/permissions';

export type RouteAccess = Permission | 'public' | 'signed-in';
export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec {
  method: HttpMethod;
  path: string;
  access: RouteAccess;
}

const passThrough: RequestHandler = (_req, _res, next) => next();

function accessCheck(access: RouteAccess): RequestHandler {
  if (access === 'public') return passThrough;
  if (access === 'signed-in') return requireSignedIn;
  return requirePermission(access);
}

export class RouteTable {
  readonly routes: RouteSpec[] = [];

  constructor(private readonly app: Application) {}

  /** Records the route and mounts `handlers` (validation, rate limits, the handler) behind its access check. */
  add(spec: RouteSpec, ...handlers: RequestHandler[]): void {
    if (this.routes.some((r) => r.method === spec.method && r.path === spec.path)) {
      throw new Error(`route ${spec.method.toUpperCase()} ${spec.path} added twice`);
    }
    this.routes.push(spec);
    this.app[spec.method](spec.path, accessCheck(spec.access), ...handlers);
  }
}

export function routesOf(app: Application): readonly RouteSpec[] {
  const table = app.locals.routeTable as RouteTable | undefined;
  if (!table) throw new Error('not an app built by createApp');
  return table.routes;
}
