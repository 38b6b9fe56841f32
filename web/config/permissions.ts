// Role and permission names as the API uses them; the one table is api/auth/permissions.ts.
import { ROLES, type Role } from '../../api/auth/permissions';

export { ROLES, type Role };

export const PERMISSIONS = {
  manageUsers: 'users:manage',
  manageObservatories: 'observatories:manage',
  createPulsars: 'pulsars:create',
  startJobs: 'jobs:start',
  readOutbox: 'outbox:read',
} as const;
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
