import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { Fact } from '../../components/fact';
import { Page } from '../../components/page';
import { StageProgressBar } from '../../components/progress-bar';
import { LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { formatCount } from '../../lib/format';
import { useMe } from '../../features/auth/api/get-me';
import { formatDurationMs, formatReducedChi2, formatRmsUs } from '../../features/fit-runs/lib/format-fit';
import { RunCancelControl, RunEndedAlert, RunLoadError, RunSection as Section, RunTimeline } from '../../features/jobs/components/run-page-parts';
import { useCancelSearchRun } from '../../features/search-runs/api/cancel-search-run';
import { isFinalSearchStatus, searchRunQueryOptions, useSearchRun, type SearchResult, type SearchRun } from '../../features/search-runs/api/get-search-run';
import { CandidatesTable } from '../../features/search-runs/components/candidates-table';
import { DerivedMassesTable } from '../../features/search-runs/components/derived-masses-table';
import { FinalFitParameters } from '../../features/search-runs/components/final-fit-parameters';
import { SaveSearchRevisionPanel } from '../../features/search-runs/components/save-search-revision-panel';
import { SearchRounds } from '../../features/search-runs/components/search-rounds';
import { SearchSettingsList } from '../../features/search-runs/components/search-settings-list';
import { SearchStatusBadge } from '../../features/search-runs/components/search-status-badge';
import { SearchWarnings } from '../../features/search-runs/components/search-warnings';
import { isAccepted } from '../../features/search-runs/lib/candidate-elements';
import { SEARCH_PERMISSIONS } from '../../features/search-runs/lib/search-permissions';
import { stopReasonText } from '../../features/search-runs/lib/stop-reasons';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) await queryClient.prefetchQuery(searchRunQueryOptions(params.id));
    return null;
  };

// api/contracts/search-runs.ts: each SearchValue carries its 1σ uncertainty in its unit.
const UNCERTAINTY_NOTE = 'Uncertainties: 1σ from the fit; “held fixed” values were not fitted.';

function InProgress({ run, canCancel }: { run: SearchRun; canCancel: boolean }) {
  const cancel = useCancelSearchRun(String(run.id));
  return (
    <Section title={run.status === 'queued' ? 'Waiting for a worker' : 'Searching'}>
      <div className="flex flex-col gap-4">
        <StageProgressBar className="min-w-40" label="Search progress" percent={run.progress?.percent ?? 0} stage={run.progress?.stage ?? run.status} />
        <RunCancelControl cancel={cancel} canCancel={canCancel} label="Cancel search" finishedText="The search had already finished." />
      </div>
    </Section>
  );
}

function Outcome({ run, result }: { run: SearchRun; result: SearchResult }) {
  const found = result.companionsFound;
  const rejected = result.candidates.filter((c) => !isAccepted(c)).length;
  const fit = result.finalFit;
  const settings: Record<string, string | undefined> = { ...run.settings, ...result.engineSettings };
  return (
    <div className="flex flex-col gap-4">
      <p className="text-base text-night-100">
        {found === 0 ? 'No companion found' : `${found} companion${found === 1 ? '' : 's'} found`}
        {rejected > 0 ? `; ${rejected} candidate${rejected === 1 ? '' : 's'} rejected` : ''}.{' '}
        <span className="text-sm text-night-300">Stopped: {stopReasonText(result.stopReason)}.</span>
      </p>
      <dl className="grid grid-cols-2 gap-4 text-sm sm:grid-cols-4" aria-label="Final fit">
        <Fact label="χ² (final fit)">{Number.isFinite(fit.chi2) ? fit.chi2.toFixed(1) : '—'}</Fact>
        <Fact label="Degrees of freedom">{formatCount(fit.dof)}</Fact>
        <Fact label="Reduced χ²">{formatReducedChi2(fit.reducedChi2)}</Fact>
        <Fact label="Weighted RMS">{formatRmsUs(fit.weightedRmsUs)}</Fact>
        <Fact label="Converged">{fit.converged ? 'yes' : 'no'}</Fact>
        <Fact label="Iterations">{formatCount(fit.iterations)}</Fact>
        <Fact label="TOAs">
          {formatCount(run.toaCount)}
          {(run.excludedCount ?? 0) > 0 ? ` (${formatCount(run.excludedCount)} excluded)` : ''}
        </Fact>
        <Fact label="Duration">{formatDurationMs(run.durationMs)}</Fact>
      </dl>
      <p className="text-xs text-night-400">
        Produced with ephemeris {settings.ephemeris ?? '—'}, clock chain {settings.clock ?? '—'}, time scale {settings.timeScale ?? '—'}
        {settings.engineVersion ? ` (${settings.engineVersion})` : ''}; all settings at the foot of the page.
      </p>
    </div>
  );
}

function Finished({ run, canSave, canRunFits }: { run: SearchRun; canSave: boolean; canRunFits: boolean }) {
  if (run.status === 'failed' || run.status === 'cancelled') return <RunEndedAlert run={run} noun="search" />;
  const result = run.result;
  if (!result) return <Alert tone="error">The search succeeded but carries no result.</Alert>;
  return (
    <div className="flex flex-col gap-6">
      <SearchWarnings run={run} />
      <Section title="Outcome">
        <Outcome run={run} result={result} />
      </Section>
      <Section title="Candidates" description={`${UNCERTAINTY_NOTE} Rejected candidates are not in the resulting model.`}>
        {result.candidates.length === 0 ? (
          <p className="text-sm text-night-300">No peak passed the false-alarm threshold, so no companion was tried.</p>
        ) : (
          <CandidatesTable candidates={result.candidates} />
        )}
      </Section>
      <Section title="Derived masses and separations">
        <DerivedMassesTable candidates={result.candidates} assumedPulsarMassSolar={run.options.assumedPulsarMassSolar} />
      </Section>
      <Section title="Final fit parameters" description={UNCERTAINTY_NOTE}>
        <FinalFitParameters parameters={result.finalFit.parameters} />
      </Section>
      <Section title="Resulting model">
        <SaveSearchRevisionPanel run={run} canSave={canSave} canRunFits={canRunFits} />
      </Section>
      <Section title="Periodogram rounds" description="Each round looks at the residuals left after the companions found so far.">
        <SearchRounds
          searchRunId={String(run.id)}
          peaks={result.peaks}
          candidates={result.candidates}
          falseAlarmThreshold={run.options.falseAlarmThreshold}
        />
      </Section>
      <Section title="Settings" description="These options and engine settings produced the result above.">
        <SearchSettingsList run={run} />
      </Section>
    </div>
  );
}

export default function SearchRunRoute() {
  const { id = '' } = useParams();
  const me = useMe();
  const run = useSearchRun(id);

  if (run.isPending) return <LoadingPanel label="Loading the companion search…" />;
  if (run.isError) {
    return <RunLoadError title="Companion search" noun="companion search" error={run.error} onRetry={() => void run.refetch()} />;
  }
  const r = run.data;
  return (
    <Page
      title={`Companion search #${r.id}`}
      description={
        <span className="flex flex-wrap items-center gap-2">
          <TextLink to={paths.pulsar.href(String(r.pulsarId))}>← Pulsar</TextLink>
          <span>· revision #{r.revisionId}</span>
          <SearchStatusBadge status={r.status} />
        </span>
      }
    >
      <div className="flex flex-col gap-6">
        <RunTimeline run={r} />
        {isFinalSearchStatus(r.status) ? (
          <Finished
            run={r}
            canSave={hasPermission(me.data, SEARCH_PERMISSIONS.editModels)}
            canRunFits={hasPermission(me.data, SEARCH_PERMISSIONS.runFits)}
          />
        ) : (
          <InProgress run={r} canCancel={hasPermission(me.data, SEARCH_PERMISSIONS.runSearches)} />
        )}
      </div>
    </Page>
  );
}
