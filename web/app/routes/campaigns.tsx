import type { QueryClient } from '@tanstack/react-query';
import { useNavigate, type LoaderFunctionArgs } from 'react-router-dom';
import { Card, CardTitle } from '../../components/card';
import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { paths } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { campaignsQueryOptions, useCampaigns } from '../../features/campaigns/api/get-campaigns';
import { CampaignTable } from '../../features/campaigns/components/campaign-table';
import { CreateCampaignForm } from '../../features/campaigns/components/create-campaign-form';
import { usePulsars } from '../../features/pulsars/api/get-pulsars';
import { RequirePermission } from '../require-permission';
import { hasPermission, requireSession } from '../session';

// Permission names of docs/api-workflow.md; campaigns:read is new in the API table with this issue.
const READ = 'campaigns:read';
const START = 'campaigns:start';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await requireSession(queryClient, request);
    if (me.permissions.includes(READ)) await queryClient.prefetchQuery(campaignsQueryOptions());
    return null;
  };

function CampaignList() {
  const campaigns = useCampaigns();
  if (campaigns.isPending) return <LoadingPanel label="Loading campaigns…" />;
  if (campaigns.isError) return <ErrorPanel error={campaigns.error} onRetry={() => void campaigns.refetch()} title="Could not load the campaigns" />;
  if (campaigns.data.length === 0) {
    return <EmptyState title="No campaigns yet">A campaign refits many pulsars at once and reports how their χ² and RMS changed.</EmptyState>;
  }
  return <CampaignTable campaigns={campaigns.data} />;
}

function NewCampaign() {
  const pulsars = usePulsars();
  const navigate = useNavigate();
  return (
    <Card>
      <CardTitle>Start a campaign</CardTitle>
      {pulsars.isError ? <ErrorPanel error={pulsars.error} onRetry={() => void pulsars.refetch()} title="Could not load the pulsars" /> : null}
      <CreateCampaignForm
        pulsars={pulsars.data ?? []}
        pulsarsLoading={pulsars.isPending}
        onCreated={(campaign) => navigate(paths.campaign.href(campaign.id))}
      />
    </Card>
  );
}

export default function CampaignsRoute() {
  const me = useMe();
  const canStart = hasPermission(me.data, START);
  return (
    <Page title="Campaigns" description="Refit many pulsars in one go and compare the fits before and after.">
      <RequirePermission permission={READ}>
        <div className={canStart ? 'grid grid-cols-1 gap-6 xl:grid-cols-[1fr_24rem]' : undefined}>
          <div>
            <CampaignList />
          </div>
          {canStart ? <NewCampaign /> : null}
        </div>
      </RequirePermission>
    </Page>
  );
}
