import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { campaignQueryOptions, useCampaign } from '../../features/campaigns/api/get-campaigns';
import { CampaignDetail } from '../../features/campaigns/components/campaign-detail';
import { RequirePermission } from '../require-permission';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    const me = await requireSession(queryClient, request);
    if (params.id && me.permissions.includes('campaigns:read')) await queryClient.prefetchQuery(campaignQueryOptions(params.id));
    return null;
  };

function Body({ id }: { id: string }) {
  const me = useMe();
  const campaign = useCampaign(id);
  if (campaign.isPending) return <LoadingPanel label="Loading the campaign…" />;
  if (campaign.isError) {
    return isApiError(campaign.error) && campaign.error.status === 404 ? (
      <ErrorPanel error={campaign.error} title="No campaign with this id" />
    ) : (
      <ErrorPanel error={campaign.error} onRetry={() => void campaign.refetch()} title="Could not load the campaign" />
    );
  }
  return <CampaignDetail campaign={campaign.data} canCancel={hasPermission(me.data, 'campaigns:start')} />;
}

export default function CampaignRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const campaign = useCampaign(id, hasPermission(me.data, 'campaigns:read'));
  return (
    <Page title={campaign.data?.name ?? `Campaign ${id}`} description={<TextLink to={paths.campaigns.href()}>← All campaigns</TextLink>}>
      <RequirePermission permission="campaigns:read">
        <Body id={id} />
      </RequirePermission>
    </Page>
  );
}
