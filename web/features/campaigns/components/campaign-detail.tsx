import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Card, CardTitle } from '../../../components/card';
import { EmptyState } from '../../../components/empty-state';
import { describeError } from '../../../components/query-state';
import { formatDateTimeUtc } from '../../../lib/format';
import { useCancelCampaign } from '../api/cancel-campaign';
import { FINAL_CAMPAIGN_STATUSES, type Campaign } from '../api/get-campaigns';
import { CampaignNotifySwitch } from './campaign-notify-switch';
import { CampaignRunsTable } from './campaign-runs-table';
import { CampaignProgressBar, StatusBadge } from './campaign-status';
import { CampaignSummaryTable } from './campaign-summary-table';

/** One campaign: status and progress while it works, the runs per pulsar, then the before → after summary. */
export function CampaignDetail({ campaign, canCancel }: { campaign: Campaign; canCancel: boolean }) {
  const cancel = useCancelCampaign(String(campaign.id));
  const final = FINAL_CAMPAIGN_STATUSES.has(campaign.status);
  return (
    <div className="flex flex-col gap-6">
      <Card>
        <div className="flex flex-wrap items-start justify-between gap-4">
          <div className="flex flex-col gap-2 text-sm">
            <p>
              Status: <StatusBadge status={campaign.status} />
            </p>
            <p className="text-night-300">
              Revision used: {campaign.revisionChoice === 'released' ? 'latest released' : 'latest'} · started {formatDateTimeUtc(campaign.createdAt)}
              {campaign.finishedAt ? ` · finished ${formatDateTimeUtc(campaign.finishedAt)}` : ''}
            </p>
          </div>
          <div className="flex flex-col items-end gap-3">
            <CampaignNotifySwitch campaignId={campaign.id} />
            {canCancel && !final ? (
              <Button variant="danger" size="sm" busy={cancel.isPending} onClick={() => cancel.mutate()}>
                Cancel campaign
              </Button>
            ) : null}
          </div>
        </div>
        {!final ? (
          <div className="mt-5">
            <CampaignProgressBar label="Campaign progress" {...campaign.progress} />
          </div>
        ) : null}
        {cancel.isError ? (
          <Alert tone="error" className="mt-4">
            {describeError(cancel.error)}
          </Alert>
        ) : null}
      </Card>

      {campaign.summary ? (
        <Card>
          <CardTitle>What changed</CardTitle>
          {campaign.summary.length === 0 ? <p className="text-sm text-night-400">No pulsar was refitted.</p> : <CampaignSummaryTable rows={campaign.summary} />}
        </Card>
      ) : null}

      <Card>
        <CardTitle>Runs per pulsar</CardTitle>
        {campaign.runs.length === 0 ? (
          <EmptyState title={final ? 'No runs' : 'Preparing the runs'}>{final ? 'This campaign queued no fits.' : 'The fits appear here as they are queued.'}</EmptyState>
        ) : (
          <CampaignRunsTable runs={campaign.runs} />
        )}
      </Card>
    </div>
  );
}
