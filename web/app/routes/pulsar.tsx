import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Card, CardTitle } from '../../components/card';
import { EmptyState } from '../../components/empty-state';
import { Fact } from '../../components/fact';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PERMISSIONS } from '../../config/permissions';
import { isApiError } from '../../lib/api-client';
import { formatCount, formatDateTimeUtc, formatMjd } from '../../lib/format';
import { useMe } from '../../features/auth/api/get-me';
import { isFinalFitStatus } from '../../features/fit-runs/api/get-fit-run';
import { fitRunsQueryOptions, useFitRuns } from '../../features/fit-runs/api/get-fit-runs';
import { FitComparisonSection } from '../../features/fit-comparison/components/fit-comparison-section';
import { FitRunList } from '../../features/fit-runs/components/fit-run-list';
import { QueueFitPanel } from '../../features/fit-runs/components/queue-fit-panel';
import { formatReducedChi2, formatRmsUs } from '../../features/fit-runs/lib/format-fit';
import { pulsarQueryOptions, usePulsar } from '../../features/pulsars/api/get-pulsar';
import { pulsarKeys } from '../../features/pulsars/api/get-pulsars';
import { NotifyToggle } from '../../features/pulsars/components/notify-toggle';
import { StatisticsJobPanel } from '../../features/pulsars/components/statistics-job-panel';
import { WORKFLOW_PERMISSIONS } from '../../features/pulsars/lib/workflow-permissions';
import { ResidualPlotPanel } from '../../features/residual-plot/components/lazy-residual-plot';
import { revisionsQueryOptions, useRevisions } from '../../features/revisions/api/get-revisions';
import { RevisionDiff } from '../../features/revisions/components/revision-diff';
import { RevisionTimeline } from '../../features/revisions/components/revision-timeline';
import { CompanionSearchSection } from '../../features/search-runs/components/companion-search-section';
import { SEARCH_PERMISSIONS } from '../../features/search-runs/lib/search-permissions';
import { toaBatchesQueryOptions, useToaBatches } from '../../features/toa-batches/api/get-toa-batches';
import { ToaBatchTable } from '../../features/toa-batches/components/toa-batch-table';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) {
      // Warm every section at once; each section shows its own error if its request fails.
      await Promise.all([
        queryClient.prefetchQuery(pulsarQueryOptions(params.id)),
        queryClient.prefetchQuery(toaBatchesQueryOptions(params.id)),
        queryClient.prefetchQuery(revisionsQueryOptions(params.id)),
        queryClient.prefetchQuery(fitRunsQueryOptions(params.id)),
      ]);
    }
    return null;
  };

const actionLinkClasses =
  'inline-flex h-9 items-center rounded-md border border-night-600 bg-night-800 px-3 text-sm font-medium text-night-100 hover:border-night-500 hover:bg-night-700 focus-ring';

function ToaBatchesSection({ pulsarId, canDelete, canUpload }: { pulsarId: string; canDelete: boolean; canUpload: boolean }) {
  const batches = useToaBatches(pulsarId);
  return (
    <Card aria-labelledby="toa-batches-title">
      <CardTitle>
        <span id="toa-batches-title">TOA batches</span>
      </CardTitle>
      {batches.isPending ? (
        <LoadingPanel label="Loading TOA batches…" />
      ) : batches.isError ? (
        <ErrorPanel error={batches.error} onRetry={() => void batches.refetch()} title="Could not load the TOA batches" />
      ) : batches.data.length === 0 ? (
        <EmptyState title="No TOAs yet — an observer can upload a file">
          {canUpload ? <TextLink to={paths.pulsarUpload.href(pulsarId)}>Upload TOAs</TextLink> : null}
        </EmptyState>
      ) : (
        <ToaBatchTable batches={batches.data} canDelete={canDelete} />
      )}
    </Card>
  );
}

function RevisionsSection({ pulsarId, canEdit, canRelease }: { pulsarId: string; canEdit: boolean; canRelease: boolean }) {
  const revisions = useRevisions(pulsarId);
  const [selectedIds, setSelectedIds] = useState<number[]>([]);
  const pair =
    revisions.data && selectedIds.length === 2
      ? [...selectedIds].sort(
          (a, b) => revisions.data.findIndex((r) => r.id === b) - revisions.data.findIndex((r) => r.id === a), // older first
        )
      : null;
  return (
    <Card aria-labelledby="revisions-title">
      <CardTitle>
        <span id="revisions-title">Model revisions</span>
      </CardTitle>
      {revisions.isPending ? (
        <LoadingPanel label="Loading revisions…" />
      ) : revisions.isError ? (
        <ErrorPanel error={revisions.error} onRetry={() => void revisions.refetch()} title="Could not load the revisions" />
      ) : revisions.data.length === 0 ? (
        <EmptyState title="No model yet">
          {canEdit ? <TextLink to={paths.pulsarModel.href(pulsarId)}>Write the first model</TextLink> : 'An analyst can write the first model.'}
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-xs text-night-400">Tick two revisions to see what changed between their models.</p>
          <RevisionTimeline revisions={revisions.data} selectedIds={selectedIds} onSelectedIdsChange={setSelectedIds} canRelease={canRelease} />
          {pair ? <RevisionDiff olderId={pair[0]} newerId={pair[1]} /> : null}
        </div>
      )}
    </Card>
  );
}

function FitRunsSection({ pulsarId, canRun }: { pulsarId: string; canRun: boolean }) {
  const runs = useFitRuns(pulsarId);
  const revisions = useRevisions(pulsarId);
  const latestSucceeded = runs.data?.find((r) => r.status === 'succeeded');
  // When the last unfinished run finishes, the pulsar's `latestFit` (header, list, dashboard) is stale.
  const queryClient = useQueryClient();
  const anyActive = runs.data?.some((r) => !isFinalFitStatus(r.status)) ?? false;
  const wasActive = useRef(anyActive);
  useEffect(() => {
    if (wasActive.current && !anyActive) void queryClient.invalidateQueries({ queryKey: pulsarKeys.all });
    wasActive.current = anyActive;
  }, [anyActive, queryClient]);
  return (
    <>
      <Card aria-labelledby="fit-runs-title">
        <CardTitle>
          <span id="fit-runs-title">Fit runs</span>
        </CardTitle>
        {canRun && revisions.data ? (
          <div className="mb-5">
            <QueueFitPanel pulsarId={pulsarId} revisions={revisions.data} />
          </div>
        ) : null}
        {runs.isPending ? (
          <LoadingPanel label="Loading fit runs…" />
        ) : runs.isError ? (
          <ErrorPanel error={runs.error} onRetry={() => void runs.refetch()} title="Could not load the fit runs" />
        ) : runs.data.length === 0 ? (
          <EmptyState title="No fits yet — queue one">
            {canRun ? 'Choose a model revision above and queue a fit.' : 'An analyst can queue a fit of this pulsar.'}
          </EmptyState>
        ) : (
          <FitRunList runs={runs.data} />
        )}
      </Card>
      {latestSucceeded ? (
        <Card aria-labelledby="residuals-title">
          <CardTitle>
            <span id="residuals-title">Residuals of the latest fit</span>
          </CardTitle>
          <p className="mb-3 text-xs text-night-400">
            <TextLink to={paths.fitRun.href(String(latestSucceeded.id))}>Run #{latestSucceeded.id}</TextLink>
            {latestSucceeded.finishedAt ? `, finished ${formatDateTimeUtc(latestSucceeded.finishedAt)}` : ''}: reduced χ²{' '}
            {formatReducedChi2(latestSucceeded.result?.reducedChi2)}, weighted RMS {formatRmsUs(latestSucceeded.result?.weightedRmsUs)}
            {' · '}
            <TextLink to={paths.residualExplorer.href(pulsarId, latestSucceeded.id)}>Open in explorer</TextLink>
          </p>
          <ResidualPlotPanel fitRunId={String(latestSucceeded.id)} />
        </Card>
      ) : null}
    </>
  );
}

export default function PulsarRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const pulsar = usePulsar(id);
  const can = (permission: string) => hasPermission(me.data, permission);

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
    <Page
      title={p.name}
      description={<TextLink to={paths.pulsars.href()}>← All pulsars</TextLink>}
      actions={
        <div className="flex flex-wrap items-center gap-3">
          {can(WORKFLOW_PERMISSIONS.uploadToas) ? (
            <Link to={paths.pulsarUpload.href(id)} className={actionLinkClasses}>
              Upload TOAs
            </Link>
          ) : null}
          {can(WORKFLOW_PERMISSIONS.editModels) ? (
            <Link to={paths.pulsarModel.href(id)} className={actionLinkClasses}>
              Edit model
            </Link>
          ) : null}
          {can(PERMISSIONS.readAuditLog) ? (
            <Link to={paths.pulsarAuditLog.href(id)} className={actionLinkClasses}>
              Audit log
            </Link>
          ) : null}
          <NotifyToggle pulsarId={id} />
        </div>
      }
    >
      <div className="flex flex-col gap-6">
        <Card aria-label="Summary">
          <dl className="grid grid-cols-2 gap-4 text-sm md:grid-cols-4">
            <Fact label="Right ascension (hh:mm:ss)">{p.raHms}</Fact>
            <Fact label="Declination (±dd:mm:ss)">{p.decDms}</Fact>
            <Fact label="TOAs">{formatCount(p.toaCount)}</Fact>
            <Fact label="Model revisions">{formatCount(p.revisionCount)}</Fact>
            <Fact label="First TOA (MJD)">{formatMjd(p.firstMjd, 5)}</Fact>
            <Fact label="Last TOA (MJD)">{formatMjd(p.lastMjd, 5)}</Fact>
            <Fact label="Observatories">{p.observatories.length ? p.observatories.join(', ') : '—'}</Fact>
            <Fact label="Statistics counted">{p.statisticsUpdatedAt ? formatDateTimeUtc(p.statisticsUpdatedAt) : 'not yet'}</Fact>
          </dl>
        </Card>
        <ToaBatchesSection pulsarId={id} canDelete={can(WORKFLOW_PERMISSIONS.deleteToaBatches)} canUpload={can(WORKFLOW_PERMISSIONS.uploadToas)} />
        <div className="grid grid-cols-1 items-start gap-6 xl:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <RevisionsSection pulsarId={id} canEdit={can(WORKFLOW_PERMISSIONS.editModels)} canRelease={can(PERMISSIONS.releaseModels)} />
          <div className="flex min-w-0 flex-col gap-6">
            <FitRunsSection pulsarId={id} canRun={can(WORKFLOW_PERMISSIONS.runFits)} />
            <FitComparisonSection pulsarId={id} canSave={can(PERMISSIONS.compareFits)} />
          </div>
        </div>
        <CompanionSearchSection pulsarId={id} canRun={can(SEARCH_PERMISSIONS.runSearches)} />
        {can(PERMISSIONS.startJobs) ? (
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
