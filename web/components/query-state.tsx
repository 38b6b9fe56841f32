import { isApiError } from '../lib/api-client';
import { Alert } from './alert';
import { Button } from './button';
import { Spinner } from './spinner';

/** Human wording for a failed query or mutation; API messages are one line and safe to show. */
export function describeError(error: unknown): string {
  if (isApiError(error)) {
    if (error.status === 0) return error.message;
    if (error.code === 'forbidden') return 'Your role does not allow this.';
    if (error.code === 'rate_limited') return 'Too many attempts — wait a minute and try again.';
    if (error.code === 'service_unavailable') return 'The service is temporarily unavailable. Try again shortly.';
    if (error.code === 'internal' || error.status >= 500) return 'Something went wrong on the server. Try again shortly.';
    return error.message;
  }
  return 'Something unexpected happened.';
}

export function LoadingPanel({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex justify-center py-12">
      <Spinner label={label} />
    </div>
  );
}

export function ErrorPanel({ error, onRetry, title = 'Could not load this' }: { error: unknown; onRetry?: () => void; title?: string }) {
  return (
    <Alert tone="error" title={title}>
      <p>{describeError(error)}</p>
      {onRetry ? (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </Alert>
  );
}
