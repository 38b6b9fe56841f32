import type { QueryClient } from '@tanstack/react-query';
import { useSearchParams, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { MAX_COMPARED_RUNS, MIN_COMPARED_RUNS } from '../../../api/contracts/comparisons';
import { Alert } from '../../components/alert';
import { Card, CardTitle } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PERMISSIONS } from '../../config/permissions';
import { useMe } from '../../features/auth/api/get-me';
import { fitComparisonQueryOptions, useFitComparison } from '../../features/fit-comparison/api/get-fit-comparison';
import { ComparisonView } from '../../features/fit-comparison/components/comparison-view';
import { SaveComparisonForm } from '../../features/fit-comparison/components/save-comparison-form';
import { parseRunIds } from '../../features/fit-comparison/lib/comparison-format';
import { usePulsar } from '../../features/pulsars/api/get-pulsar';
import { hasPermission, requireSession } from '../session';

function runIdsOf(search: URLSearchParams): number[] | null {
  const ids = parseRunIds(search.get('runs'));
  return ids && ids.length >= MIN_COMPARED_RUNS && ids.length <= MAX_COMPARED_RUNS ? ids : null;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    const ids = runIdsOf(new URL(request.url).searchParams);
    // Errors show on the page itself, with the API's reason.
    if (params.id && ids) await queryClient.prefetchQuery(fitComparisonQueryOptions(params.id, ids));
    return null;
  };

function ComparisonPanel({ pulsarId, fitRunIds }: { pulsarId: string; fitRunIds: number[] }) {
  const me = useMe();
  const [, setSearch] = useSearchParams();
  const comparison = useFitComparison(pulsarId, fitRunIds);
  if (comparison.isPending) return <LoadingPanel label="Comparing the fits…" />;
  if (comparison.isError) {
    return (
      <ErrorPanel
        error={comparison.error}
        onRetry={() => void comparison.refetch()}
        title="Could not compare these fit runs"
      />
    );
  }
  const makeReference = (fitRunId: number) =>
    setSearch({ runs: [fitRunId, ...fitRunIds.filter((id) => id !== fitRunId)].join(',') }, { replace: true });
  return (
    <div aria-busy={comparison.isPlaceholderData || undefined} className={comparison.isPlaceholderData ? 'opacity-70' : undefined}>
      <ComparisonView
        comparison={comparison.data}
        onMakeReference={makeReference}
        aside={
          <Card aria-label="Save comparison">
            <CardTitle>Save this comparison</CardTitle>
            <SaveComparisonForm
              key={fitRunIds.join(',')}
              pulsarId={pulsarId}
              fitRunIds={fitRunIds}
              canSave={hasPermission(me.data, PERMISSIONS.compareFits)}
            />
          </Card>
        }
      />
    </div>
  );
}

export default function FitComparisonRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const pulsar = usePulsar(id);
  const fitRunIds = runIdsOf(search);
  return (
    <Page
      title={pulsar.data ? `Compare fits of ${pulsar.data.name}` : 'Compare fits'}
      description={
        <span>
          <TextLink to={paths.pulsar.href(id)}>← Back to the pulsar</TextLink>
          {fitRunIds ? <span className="ml-2">Runs {fitRunIds.map((r) => `#${r}`).join(', ')}; run #{fitRunIds[0]} is the reference.</span> : null}
        </span>
      }
    >
      {fitRunIds ? (
        <ComparisonPanel pulsarId={id} fitRunIds={fitRunIds} />
      ) : (
        <Alert tone="error" title="Choose the runs to compare">
          This address names no valid set of runs. On the pulsar page, tick {MIN_COMPARED_RUNS} to {MAX_COMPARED_RUNS} finished fit runs under
          “Compare fits” and open the comparison from there.
        </Alert>
      )}
    </Page>
  );
}
