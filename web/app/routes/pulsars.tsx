import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Card, CardTitle } from '../../components/card';
import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { PERMISSIONS } from '../../config/permissions';
import { useMe } from '../../features/auth/api/get-me';
import { pulsarsQueryOptions, usePulsars } from '../../features/pulsars/api/get-pulsars';
import { CreatePulsarForm } from '../../features/pulsars/components/create-pulsar-form';
import { PulsarTable } from '../../features/pulsars/components/pulsar-table';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    await queryClient.prefetchQuery(pulsarsQueryOptions());
    return null;
  };

export default function PulsarsRoute() {
  const me = useMe();
  const pulsars = usePulsars();
  const canCreate = hasPermission(me.data, PERMISSIONS.createPulsars);
  return (
    <Page title="Pulsars" description="Every pulsar your group times, with its TOAs, time span and latest fit.">
      <div className={canCreate ? 'grid grid-cols-1 gap-6 lg:grid-cols-[1fr_20rem]' : undefined}>
        <div>
          {pulsars.isPending ? (
            <LoadingPanel label="Loading pulsars…" />
          ) : pulsars.isError ? (
            <ErrorPanel error={pulsars.error} onRetry={() => void pulsars.refetch()} title="Could not load the pulsars" />
          ) : pulsars.data.length === 0 ? (
            <EmptyState title="No pulsars yet">
              {canCreate ? 'Add the first one with the form beside this list.' : 'An analyst can add one; it will appear here.'}
            </EmptyState>
          ) : (
            <PulsarTable pulsars={pulsars.data} />
          )}
        </div>
        {canCreate ? (
          <Card>
            <CardTitle>Add a pulsar</CardTitle>
            <CreatePulsarForm />
          </Card>
        ) : null}
      </div>
    </Page>
  );
}
