import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Card, CardTitle } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PERMISSIONS } from '../../config/permissions';
import { isApiError } from '../../lib/api-client';
import { formatCount, formatDateTimeUtc, formatMjd } from '../../lib/format';
import { useMe } from '../../features/auth/api/get-me';
import { pulsarQueryOptions, usePulsar } from '../../features/pulsars/api/get-pulsar';
import { StatisticsJobPanel } from '../../features/pulsars/components/statistics-job-panel';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) await queryClient.prefetchQuery(pulsarQueryOptions(params.id));
    return null;
  };

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-night-400">{label}</dt>
      <dd className="mt-0.5 font-mono text-night-100">{children}</dd>
    </div>
  );
}

export default function PulsarRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const pulsar = usePulsar(id);
  const canRecount = hasPermission(me.data, PERMISSIONS.startJobs);

  if (pulsar.isPending) return <LoadingPanel label="Loading the pulsar…" />;
  if (pulsar.isError) {
    return (
      <Page title="Pulsar">
        {isApiError(pulsar.error) && pulsar.error.status === 404 ? (
          <ErrorPanel error={pulsar.error} title="No pulsar with this id" />
        ) : (
          <ErrorPanel error={pulsar.error} onRetry={() => void pulsar.refetch()} title="Could not load the pulsar" />
        )}
        <p className="mt-4 text-sm">
          <TextLink to={paths.pulsars.href()}>All pulsars</TextLink>
        </p>
      </Page>
    );
  }
  const p = pulsar.data;
  return (
    <Page title={p.name} description={<TextLink to={paths.pulsars.href()}>← All pulsars</TextLink>}>
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
        <Card>
          <CardTitle>Position and arrival times</CardTitle>
          <dl className="grid grid-cols-2 gap-4 text-sm">
            <Fact label="Right ascension (hh:mm:ss)">{p.raHms}</Fact>
            <Fact label="Declination (±dd:mm:ss)">{p.decDms}</Fact>
            <Fact label="TOAs">{formatCount(p.toaCount)}</Fact>
            <Fact label="Observatories">{p.observatories.length ? p.observatories.join(', ') : '—'}</Fact>
            <Fact label="First TOA (MJD)">{formatMjd(p.firstMjd, 5)}</Fact>
            <Fact label="Last TOA (MJD)">{formatMjd(p.lastMjd, 5)}</Fact>
            <Fact label="Statistics counted">{p.statisticsUpdatedAt ? formatDateTimeUtc(p.statisticsUpdatedAt) : 'not yet'}</Fact>
          </dl>
          <p className="mt-6 rounded-md border border-dashed border-night-600 px-4 py-3 text-sm text-night-300">
            TOAs, models and fits arrive here.
          </p>
        </Card>
        {canRecount ? (
          <Card>
            <CardTitle>TOA statistics</CardTitle>
            <p className="mb-4 text-sm text-night-300">Recount the TOAs, time span and observatories of this pulsar in the background.</p>
            <StatisticsJobPanel pulsarId={id} />
          </Card>
        ) : null}
      </div>
    </Page>
  );
}
