import { Alert } from '../../../components/alert';
import { describeError } from '../../../components/query-state';
import { cn } from '../../../lib/cn';
import { useNotifications, useSetPulsarNotification } from '../../notifications/api/notifications';

/** "Notify me by e-mail" switch for one pulsar: the initial state comes from the caller's subscriptions. */
export function NotifyToggle({ pulsarId }: { pulsarId: string }) {
  const subscriptions = useNotifications();
  const set = useSetPulsarNotification(pulsarId);
  const subscribed = set.isPending
    ? set.variables
    : (subscriptions.data?.pulsarIds.map(String).includes(pulsarId) ?? false);
  const unknown = subscriptions.isPending || subscriptions.isError;
  return (
    <div className="flex flex-col items-end gap-1">
      <label className="inline-flex cursor-pointer items-center gap-2 text-sm text-night-200">
        <button
          type="button"
          role="switch"
          aria-checked={subscribed}
          aria-label="Notify me by e-mail"
          disabled={unknown || set.isPending}
          onClick={() => set.mutate(!subscribed)}
          className={cn(
            'relative inline-flex h-5 w-9 items-center rounded-full border transition-colors focus-ring disabled:opacity-60',
            subscribed ? 'border-ember-500 bg-ember-500/80' : 'border-night-600 bg-night-800',
          )}
        >
          <span className={cn('inline-block size-3.5 rounded-full bg-night-100 transition-transform', subscribed ? 'translate-x-4' : 'translate-x-0.5')} />
        </button>
        <span aria-hidden="true">Notify me by e-mail</span>
      </label>
      {subscriptions.isError ? <span className="text-xs text-alarm-300">Subscriptions could not be loaded.</span> : null}
      {set.isError ? <Alert tone="error">{describeError(set.error)}</Alert> : null}
    </div>
  );
}
