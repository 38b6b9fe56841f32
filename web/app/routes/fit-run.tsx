import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { Page } from '../../components/page';
import { LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useCancelFitRun } from '../../features/fit-runs/api/cancel-fit-run';
import { fitRunQueryOptions, isFinalFitStatus, useFitRun, type FitRun } from '../../features/fit-runs/api/get-fit-run';
import { FitParametersTable } from '../../features/fit-runs/components/fit-parameters-table';
import { FitProgress } from '../../features/fit-runs/components/fit-progress';
import { FitSettingsList, FitStatistics, FitWarnings } from '../../features/fit-runs/components/fit-statistics';
import { FitStatusBadge } from '../../features/fit-runs/components/fit-status-badge';
import { fittedModelUrl, residualsCsvUrl } from '../../features/fit-runs/lib/fit-run-downloads';
import { RunCancelControl, RunEndedAlert, RunLoadError, RunSection as Section, RunTimeline } from '../../features/jobs/components/run-page-parts';
import { WORKFLOW_PERMISSIONS } from '../../features/pulsars/lib/workflow-permissions';
import { ResidualPlotPanel } from '../../features/residual-plot/components/lazy-residual-plot';
import { RevisionReleaseMark } from '../../features/revisions/components/revision-release-mark';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) await queryClient.prefetchQuery(fitRunQueryOptions(params.id));
    return null;
  };

// api/contracts/fit-runs.ts: `uncertainty` is the formal 1σ, not scaled by √(reduced χ²).
const UNCERTAINTY_NOTE = 'Uncertainties: unscaled (formal) 1σ.';

const downloadClasses =
  'inline-flex h-9 items-center rounded-md border border-night-600 bg-night-800 px-3 text-sm font-medium text-night-100 hover:border-night-500 hover:bg-night-700 focus-ring';

function InProgress({ run, canCancel }: { run: FitRun; canCancel: boolean }) {
  const cancel = useCancelFitRun(String(run.id));
  return (
    <Section title={run.status === 'queued' ? 'Waiting for a worker' : 'Fitting'}>
      <div className="flex flex-col gap-4">
        <FitProgress percent={run.progress?.percent ?? 0} stage={run.progress?.stage ?? run.status} />
        <RunCancelControl cancel={cancel} canCancel={canCancel} label="Cancel fit" finishedText="The run had already finished." />
      </div>
    </Section>
  );
}

function Finished({ run }: { run: FitRun }) {
  const id = String(run.id);
  if (run.status === 'failed' || run.status === 'cancelled') return <RunEndedAlert run={run} noun="fit" />;
  const result = run.result;
  if (!result) return <Alert tone="error">The run succeeded but carries no result.</Alert>;
  return (
    <div className="flex flex-col gap-6">
      <FitWarnings result={result} />
      <div className="flex flex-wrap gap-2">
        <a href={fittedModelUrl(id)} download className={downloadClasses}>
          Download fitted model
        </a>
        <a href={residualsCsvUrl(id)} download className={downloadClasses}>
          Download residuals CSV
        </a>
        <Link to={paths.residualExplorer.href(String(run.pulsarId), run.id)} className={downloadClasses}>
          Open in explorer
        </Link>
      </div>
      <Section title="Fit statistics">
        <FitStatistics run={run} result={result} />
      </Section>
      <Section title="Parameters">
        <p className="mb-3 text-xs text-night-400">
          {UNCERTAINTY_NOTE} Change is (fitted − start) in units of the uncertainty; moves over 3σ are highlighted.
        </p>
        {Object.keys(result.parameters).length === 0 ? (
          <p className="text-sm text-night-300">No parameter was solved for.</p>
        ) : (
          <FitParametersTable parameters={result.parameters} />
        )}
      </Section>
      <Section title="Residuals">
        <ResidualPlotPanel fitRunId={id} />
      </Section>
      <Section title="Engine settings">
        <p className="mb-3 text-xs text-night-400">These settings produced the result above.</p>
        <FitSettingsList settings={run.settings} />
      </Section>
    </div>
  );
}

export default function FitRunRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const run = useFitRun(id);

  if (run.isPending) return <LoadingPanel label="Loading the fit run…" />;
  if (run.isError) {
    return <RunLoadError title="Fit run" noun="fit run" error={run.error} onRetry={() => void run.refetch()} />;
  }
  const r = run.data;
  return (
    <Page
      title={`Fit run #${r.id}`}
      description={
        <span className="flex flex-wrap items-center gap-2">
          <TextLink to={paths.pulsar.href(String(r.pulsarId))}>← Pulsar</TextLink>
          <span>· revision #{r.revisionId}</span>
          <RevisionReleaseMark revisionId={r.revisionId} />
          <FitStatusBadge status={r.status} />
        </span>
      }
    >
      <div className="flex flex-col gap-6">
        <RunTimeline run={r} />
        {isFinalFitStatus(r.status) ? (
          <Finished run={r} />
        ) : (
          <InProgress run={r} canCancel={hasPermission(me.data, WORKFLOW_PERMISSIONS.runFits)} />
        )}
      </div>
    </Page>
  );
}
