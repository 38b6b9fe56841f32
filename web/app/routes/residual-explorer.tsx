import type { QueryClient } from '@tanstack/react-query';
import { useId } from 'react';
import { useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { Select } from '../../components/select';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';
import { formatDateTimeUtc } from '../../lib/format';
import { useMe } from '../../features/auth/api/get-me';
import { fitRunsQueryOptions, useFitRuns } from '../../features/fit-runs/api/get-fit-runs';
import { formatRmsUs } from '../../features/fit-runs/lib/format-fit';
import { pulsarQueryOptions, usePulsar } from '../../features/pulsars/api/get-pulsar';
import { WORKFLOW_PERMISSIONS } from '../../features/pulsars/lib/workflow-permissions';
import { useExplorerData } from '../../features/residual-explorer/api/get-explorer-data';
import { exclusionsQueryOptions, useExclusions } from '../../features/residual-explorer/api/get-exclusions';
import { ResidualExplorer } from '../../features/residual-explorer/components/residual-explorer';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) {
      await Promise.all([
        queryClient.prefetchQuery(pulsarQueryOptions(params.id)),
        queryClient.prefetchQuery(fitRunsQueryOptions(params.id)),
        queryClient.prefetchQuery(exclusionsQueryOptions(params.id)),
      ]);
    }
    return null;
  };

const TOA_EXCLUDE_PERMISSION = 'toas:exclude';

function ExplorerForFit({ pulsarId, fitRunId }: { pulsarId: string; fitRunId: string }) {
  const me = useMe();
  const data = useExplorerData(fitRunId);
  const exclusions = useExclusions(pulsarId);
  if (data.isPending) return <LoadingPanel label="Loading the residuals and delays of this fit…" />;
  if (data.isError) {
    if (isApiError(data.error) && data.error.code === 'explorer_not_stored') {
      return (
        <EmptyState title="This fit has no explorer data">
          It was fitted before the explorer stored its inputs. Queue the same revision again on the{' '}
          <TextLink to={paths.pulsar.href(pulsarId)}>pulsar page</TextLink> (ask for a recompute) and open the new fit here.
        </EmptyState>
      );
    }
    return <ErrorPanel error={data.error} onRetry={() => void data.refetch()} title="Could not load the explorer data" />;
  }
  if (data.data.pulsarId !== Number(pulsarId)) {
    return <ErrorPanel error={new Error('mismatch')} title={`Fit #${fitRunId} belongs to another pulsar`} />;
  }
  if (data.data.count === 0) {
    return <EmptyState title="This fit has no TOAs">Upload TOAs on the pulsar page, then queue a fit.</EmptyState>;
  }
  return (
    <>
      {exclusions.isError ? (
        <ErrorPanel error={exclusions.error} onRetry={() => void exclusions.refetch()} title="Could not load the current exclusions; the fit-time ones are shown" />
      ) : null}
      <ResidualExplorer
        key={fitRunId}
        pulsarId={pulsarId}
        table={data.data}
        exclusions={exclusions.data ?? null}
        canExclude={hasPermission(me.data, TOA_EXCLUDE_PERMISSION)}
        canRunFits={hasPermission(me.data, WORKFLOW_PERMISSIONS.runFits)}
        canEditModels={hasPermission(me.data, WORKFLOW_PERMISSIONS.editModels)}
      />
    </>
  );
}

export default function ResidualExplorerRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const fitSelectId = useId();
  const pulsar = usePulsar(id);
  const runs = useFitRuns(id);

  const succeeded = runs.data?.filter((r) => r.status === 'succeeded') ?? [];
  const fitRunId = search.get('fit') ?? (succeeded[0] ? String(succeeded[0].id) : null);
  const title = pulsar.data ? `Residual explorer · ${pulsar.data.name}` : 'Residual explorer';

  let body;
  if (pulsar.isPending || runs.isPending) body = <LoadingPanel label="Loading the pulsar and its fits…" />;
  else if (pulsar.isError) body = <ErrorPanel error={pulsar.error} onRetry={() => void pulsar.refetch()} title="Could not load the pulsar" />;
  else if (runs.isError) body = <ErrorPanel error={runs.error} onRetry={() => void runs.refetch()} title="Could not load the fit runs" />;
  else if (fitRunId === null) {
    body = (
      <EmptyState title="No finished fit yet">
        The explorer works on a finished fit. Queue a fit of a model revision on the <TextLink to={paths.pulsar.href(id)}>pulsar page</TextLink>; when
        it has succeeded, come back here.
      </EmptyState>
    );
  } else body = <ExplorerForFit pulsarId={id} fitRunId={fitRunId} />;

  return (
    <Page
      title={title}
      description={<TextLink to={paths.pulsar.href(id)}>← Pulsar</TextLink>}
      actions={
        succeeded.length > 0 ? (
          <div className="flex items-center gap-2">
            <label htmlFor={fitSelectId} className="text-sm text-night-300">
              Fit
            </label>
            <Select
              id={fitSelectId}
              className="h-9 w-80"
              value={fitRunId ?? ''}
              onChange={(event) => navigate(paths.residualExplorer.href(id, event.target.value))}
            >
              {fitRunId !== null && !succeeded.some((r) => String(r.id) === fitRunId) ? <option value={fitRunId}>#{fitRunId}</option> : null}
              {succeeded.map((r) => (
                <option key={r.id} value={String(r.id)}>
                  #{r.id} · revision #{r.revisionId} · {formatRmsUs(r.result?.weightedRmsUs)}
                  {r.finishedAt ? ` · ${formatDateTimeUtc(r.finishedAt)}` : ''}
                </option>
              ))}
            </Select>
          </div>
        ) : null
      }
    >
      {body}
    </Page>
  );
}
