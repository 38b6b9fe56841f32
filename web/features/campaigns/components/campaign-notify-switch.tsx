import { Alert } from '../../../components/alert';
import { describeError } from '../../../components/query-state';
import { cn } from '../../../lib/cn';
import { useNotifications, useSetCampaignNotification } from '../../notifications/api/notifications';

/** "E-mail me when it finishes" for one campaign, read from and written to the caller's subscriptions. */
export function CampaignNotifySwitch({ campaignId }: { campaignId: number }) {
  const subscriptions = useNotifications();
  const set = useSetCampaignNotification(campaignId);
  const subscribed = subscriptions.data?.campaignIds.includes(campaignId) ?? false;
  const label = 'E-mail me when this campaign finishes';
  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        role="switch"
        aria-checked={subscribed}
        aria-label={label}
        disabled={subscriptions.isPending || set.isPending}
        onClick={() => set.mutate(!subscribed)}
        className="inline-flex items-center gap-3 rounded-full text-sm text-night-200 focus-ring disabled:opacity-60"
      >
        <span className={cn('relative inline-flex h-5 w-9 items-center rounded-full border transition-colors', subscribed ? 'border-ember-400 bg-ember-500/80' : 'border-night-600 bg-night-800')}>
          <span className={cn('inline-block size-3.5 rounded-full bg-night-100 transition-transform', subscribed ? 'translate-x-4.5' : 'translate-x-0.5')} />
        </span>
        <span aria-hidden="true">{subscribed ? 'E-mail on finish: on' : 'E-mail on finish: off'}</span>
      </button>
      {subscriptions.isError ? <Alert tone="error">Could not read your e-mail settings: {describeError(subscriptions.error)}</Alert> : null}
      {set.isError ? <Alert tone="error">{describeError(set.error)}</Alert> : null}
    </div>
  );
}
