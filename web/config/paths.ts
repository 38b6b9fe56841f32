// Every client route in one place: `path` is the router pattern, `href` builds a link.
export const paths = {
  signIn: {
    path: '/sign-in',
    href: (redirectTo?: string) =>
      redirectTo && redirectTo !== '/' ? `/sign-in?redirectTo=${encodeURIComponent(redirectTo)}` : '/sign-in',
  },
  resetPassword: { path: '/reset-password', href: () => '/reset-password' },
  resetPasswordComplete: {
    path: '/reset-password/:token',
    href: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  },
  acceptInvitation: {
    path: '/invitations/:token',
    href: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  dashboard: { path: '/', href: () => '/' },
  pulsars: { path: '/pulsars', href: () => '/pulsars' },
  pulsar: { path: '/pulsars/:id', href: (id: string) => `/pulsars/${encodeURIComponent(id)}` },
  pulsarModel: {
    path: '/pulsars/:id/model',
    href: (id: string, revisionId?: number | string) =>
      `/pulsars/${encodeURIComponent(id)}/model${revisionId === undefined ? '' : `?revision=${encodeURIComponent(String(revisionId))}`}`,
  },
  campaigns: { path: '/campaigns', href: () => '/campaigns' },
  campaign: { path: '/campaigns/:id', href: (id: string | number) => `/campaigns/${encodeURIComponent(String(id))}` },
  pulsarUpload: { path: '/pulsars/:id/upload', href: (id: string) => `/pulsars/${encodeURIComponent(id)}/upload` },
  fitRun: { path: '/fit-runs/:id', href: (id: string) => `/fit-runs/${encodeURIComponent(id)}` },
  searchRun: { path: '/search-runs/:id', href: (id: string | number) => `/search-runs/${encodeURIComponent(String(id))}` },
  residualExplorer: {
    path: '/pulsars/:id/explorer',
    href: (id: string, fitRunId?: number | string) =>
      `/pulsars/${encodeURIComponent(id)}/explorer${fitRunId === undefined ? '' : `?fit=${encodeURIComponent(String(fitRunId))}`}`,
  },
  fitComparison: {
    path: '/pulsars/:id/compare',
    href: (id: string | number, fitRunIds: readonly number[]) =>
      `/pulsars/${encodeURIComponent(String(id))}/compare?runs=${fitRunIds.map((r) => encodeURIComponent(String(r))).join(',')}`,
  },
  savedComparison: { path: '/comparisons/:id', href: (id: string | number) => `/comparisons/${encodeURIComponent(String(id))}` },
  pulsarAuditLog: { path: '/pulsars/:id/audit-log', href: (id: string | number) => `/pulsars/${encodeURIComponent(String(id))}/audit-log` },
  observatories: { path: '/observatories', href: () => '/observatories' },
  users: { path: '/users', href: () => '/users' },
  outbox: { path: '/outbox', href: () => '/outbox' },
} as const;

/**
 * Returns `target` when it is a same-site path (starts with one "/", not "//"), else "/".
 * Used on the sign-in redirect so a crafted link cannot send the user to another site.
 */
export function safeRedirectTarget(target: string | null | undefined): string {
  if (!target || !target.startsWith('/') || target.startsWith('//') || target.startsWith('/\\')) return '/';
  return target;
}
