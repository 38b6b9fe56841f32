import type { QueryClient } from '@tanstack/react-query';
import { Link, Navigate, Outlet, useLocation, useNavigate, useNavigation, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/button';
import { Logo } from '../../components/logo';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { paths } from '../../config/paths';
import { roleLabel } from '../../config/permissions';
import { isApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { useSignOut } from '../../features/auth/api/sign-out';
import { AppNavigation } from '../navigation';
import { requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    return null;
  };

function SignOutButton() {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <Button
      variant="secondary"
      size="sm"
      busy={signOut.isPending}
      onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn.href(), { replace: true }) })}
    >
      Sign out
    </Button>
  );
}

/** The signed-in shell: logo, navigation by permission, who is signed in, and the page. */
export default function AppLayout() {
  const me = useMe();
  const location = useLocation();
  const navigation = useNavigation();

  if (me.isError && isApiError(me.error) && me.error.status === 401) {
    return <Navigate to={paths.signIn.href(location.pathname + location.search)} replace />;
  }

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-3 focus:z-50 focus:rounded-md focus:bg-night-800 focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="sticky top-0 z-40 border-b border-night-800 bg-night-950/90 backdrop-blur">
        {navigation.state === 'loading' ? (
          <div className="absolute inset-x-0 top-0 h-0.5 animate-pulse bg-ember-500" aria-hidden="true" />
        ) : null}
        <div className="mx-auto flex h-16 max-w-7xl items-center gap-6 px-6">
          <Link to={paths.dashboard.href()} className="rounded-md focus-ring" aria-label="Pulsekeeper, dashboard">
            <Logo />
          </Link>
          {me.data ? <AppNavigation permissions={me.data.permissions} /> : null}
          <div className="ml-auto flex items-center gap-4">
            {me.data ? (
              <p className="text-right text-sm leading-tight">
                <span className="block font-medium text-night-100">{me.data.user.displayName}</span>
                <span className="block text-xs text-night-400">{roleLabel(me.data.user.role)}</span>
              </p>
            ) : null}
            <SignOutButton />
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">
        {me.isPending ? <LoadingPanel /> : me.isError ? <ErrorPanel error={me.error} onRetry={() => void me.refetch()} /> : <Outlet />}
      </main>
    </div>
  );
}
