/**
 * THE permission table: every permission and the roles that hold it. Routes
 * declare one permission (or 'public' / 'signed-in'); nothing else decides
 * access. Permissions marked "later" are documented now for coming issues and
 * are not used by any route yet.
 */

export const ROLES = ['viewer', 'observer', 'analyst', 'lead', 'admin'] as const; // lowest to highest
export type Role = (typeof ROLES)[number];

const ALL: readonly Role[] = ROLES;
const OBSERVER_UP: readonly Role[] = ['observer', 'analyst', 'lead', 'admin'];
const ANALYST_UP: readonly Role[] = ['analyst', 'lead', 'admin'];
const LEAD_UP: readonly Role[] = ['lead', 'admin'];
const ADMIN: readonly Role[] = ['admin'];

export const PERMISSIONS = {
  'users:manage': ADMIN,
  'outbox:read': ADMIN,
  'observatories:manage': ADMIN,
  'observatories:read': ALL,
  'pulsars:read': ALL,
  'pulsars:create': ANALYST_UP,
  'jobs:start': ANALYST_UP,
  'jobs:read': ALL,
  'campaigns:read': ALL,
  'audit-log:read': ANALYST_UP, // the log names people with their e-mail addresses
  'toas:upload': OBSERVER_UP,
  'toas:exclude': ANALYST_UP,
  'models:edit': ANALYST_UP,
  'fits:run': ANALYST_UP,
  'searches:run': ANALYST_UP,
  'models:release': LEAD_UP,
  'campaigns:start': LEAD_UP,
  'fits:compare': LEAD_UP,
  'toa-batches:delete': LEAD_UP,
  // later: observing forecasts
  'forecasts:download': OBSERVER_UP,
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

export function hasPermission(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** Every permission a role holds, in table order (sent to the client as me.permissions). */
export function permissionsOf(role: Role): Permission[] {
  return (Object.keys(PERMISSIONS) as Permission[]).filter((p) => hasPermission(role, p));
}
