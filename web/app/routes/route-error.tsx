import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { AuthFrame } from '../../components/auth-frame';
import { describeError } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';

function messageFor(error: unknown): string {
  if (isRouteErrorResponse(error)) return error.status === 404 ? 'There is no page at this address.' : `${error.status} ${error.statusText}`;
  return describeError(error);
}

/** A route failed outside the app shell (or the shell itself failed). */
export function RouteErrorPage() {
  const error = useRouteError();
  return (
    <AuthFrame title="Something went wrong">
      <Alert tone="error">{messageFor(error)}</Alert>
      <p className="mt-4 text-sm">
        <TextLink to={paths.dashboard.href()}>Back to the dashboard</TextLink>
      </p>
    </AuthFrame>
  );
}

/** A page inside the shell failed to load or render; header and navigation stay usable. */
export function RouteErrorPanel() {
  const error = useRouteError();
  return (
    <Alert tone="error" title="This page could not be shown">
      <p>{messageFor(error)}</p>
    </Alert>
  );
}
