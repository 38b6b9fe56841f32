// Role and permission names come from the API's one table (api/auth/permissions.ts, pure data),
// so a renamed permission fails the type check here instead of hiding a link.
import { ROLES, type Permission as ApiPermission, type Role } from '../../api/auth/permissions';

export { ROLES, type Role };

export const PERMISSIONS = {
  manageUsers: 'users:manage',
  manageObservatories: 'observatories:manage',
  createPulsars: 'pulsars:create',
  startJobs: 'jobs:start',
  readOutbox: 'outbox:read',
  readAuditLog: 'audit-log:read',
  compareFits: 'fits:compare',
  releaseModels: 'models:release',
} as const satisfies Record<string, ApiPermission>;
export type Permission = (typeof PERMISSIONS)[keyof typeof PERMISSIONS];

export const ROLE_LABELS: Record<Role, string> = {
  viewer: 'Viewer',
  observer: 'Observer',
  analyst: 'Analyst',
  lead: 'Lead',
  admin: 'Administrator',
};

export function roleLabel(role: string): string {
  return (ROLE_LABELS as Record<string, string>)[role] ?? role;
}
