import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { formatCount } from '../../lib/format';
import { pulsarsQueryOptions, usePulsars } from '../../features/pulsars/api/get-pulsars';
import { PulsarCards } from '../../features/pulsars/components/pulsar-cards';
import { requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    await queryClient.prefetchQuery(pulsarsQueryOptions());
    return null;
  };

export default function DashboardRoute() {
  const pulsars = usePulsars();
  const totalToas = pulsars.data?.reduce((sum, p) => sum + (p.toaCount ?? 0), 0);
  return (
    <Page
      title="Dashboard"
      description={
        pulsars.data && pulsars.data.length > 0
          ? `${pulsars.data.length} pulsar${pulsars.data.length === 1 ? '' : 's'}, ${formatCount(totalToas)} TOAs in all.`
          : 'Your group’s pulsars at a glance.'
      }
    >
      {pulsars.isPending ? (
        <LoadingPanel label="Loading pulsars…" />
      ) : pulsars.isError ? (
        <ErrorPanel error={pulsars.error} onRetry={() => void pulsars.refetch()} title="Could not load the pulsars" />
      ) : pulsars.data.length === 0 ? (
        <EmptyState title="No pulsars yet">
          An analyst can add one from <TextLink to={paths.pulsars.href()}>Pulsars</TextLink>; its arrival times, counts and time
          span will then show here.
        </EmptyState>
      ) : (
        <PulsarCards pulsars={pulsars.data} />
      )}
    </Page>
  );
}
