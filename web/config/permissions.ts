// Role and permission names as the API uses them (docs/api.md; the server's one table lives in api/auth/).
export const ROLES = ['viewer', 'observer', 'analyst', 'lead', 'admin'] as const; // lowest to highest
export type Role = (typeof ROLES)[number];

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
