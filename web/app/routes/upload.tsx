import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Card } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { pulsarQueryOptions, usePulsar } from '../../features/pulsars/api/get-pulsar';
import { ToaUploadPanel } from '../../features/upload/components/toa-upload-panel';
import { RequirePermission } from '../require-permission';
import { requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) await queryClient.prefetchQuery(pulsarQueryOptions(params.id));
    return null;
  };

export default function UploadRoute() {
  const { id = '' } = useParams();
  const pulsar = usePulsar(id);
  const name = pulsar.data?.name ?? `pulsar ${id}`;
  return (
    <Page
      title={`Upload TOAs for ${name}`}
      description={<TextLink to={paths.pulsar.href(id)}>← Back to {name}</TextLink>}
    >
      <RequirePermission permission="toas:upload">
        {pulsar.isPending ? (
          <LoadingPanel label="Loading the pulsar…" />
        ) : pulsar.isError ? (
          <ErrorPanel error={pulsar.error} onRetry={() => void pulsar.refetch()} title="Could not load the pulsar" />
        ) : (
          <Card>
            <p className="mb-5 text-sm text-night-300">
              The whole file is checked before anything is stored: a single bad row rejects it, and every problem is listed by line and
              column.
            </p>
            <ToaUploadPanel pulsarId={id} pulsarHref={paths.pulsar.href(id)} />
          </Card>
        )}
      </RequirePermission>
    </Page>
  );
}
