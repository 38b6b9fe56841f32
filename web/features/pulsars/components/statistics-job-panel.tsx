import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { StageProgressBar } from '../../../components/progress-bar';
import { describeError } from '../../../components/query-state';
import { Spinner } from '../../../components/spinner';
import { useJob } from '../../jobs/api/get-job';
import { pulsarKeys } from '../api/get-pulsars';
import { useStartStatisticsJob } from '../api/start-statistics-job';

function ResultList({ result }: { result: unknown }) {
  if (result === null || typeof result !== 'object') {
    return <p className="font-mono text-sm">{String(result ?? '—')}</p>;
  }
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm">
      {Object.entries(result as Record<string, unknown>).map(([key, value]) => (
        <div key={key} className="contents">
          <dt className="text-night-300">{key}</dt>
          <dd className="font-mono text-night-100">{Array.isArray(value) ? value.join(', ') : String(value ?? '—')}</dd>
        </div>
      ))}
    </dl>
  );
}

/** "Recount TOA statistics": queues the job, polls it until completed/failed, and shows the result. */
export function StatisticsJobPanel({ pulsarId }: { pulsarId: string }) {
  const queryClient = useQueryClient();
  const start = useStartStatisticsJob(pulsarId);
  const [jobId, setJobId] = useState<string | null>(null);
  const job = useJob(jobId);
  const state = job.data?.state;

  useEffect(() => {
    // Fresh counts on the detail page and lists once the job has written them.
    if (state === 'completed') void queryClient.invalidateQueries({ queryKey: pulsarKeys.all });
  }, [state, queryClient]);

  const running = jobId !== null && state !== 'completed' && state !== 'failed' && !job.isError;

  return (
    <div className="flex flex-col gap-4">
      <div>
        <Button
          onClick={() => start.mutate(undefined, { onSuccess: ({ jobId: id }) => setJobId(String(id)) })}
          busy={start.isPending}
          disabled={running}
        >
          Recount TOA statistics
        </Button>
      </div>
      {start.isError ? <Alert tone="error">{describeError(start.error)}</Alert> : null}
      {jobId !== null && job.isPending ? <Spinner label="Queued…" /> : null}
      {job.isError ? <Alert tone="error" title="Could not follow the job">{describeError(job.error)}</Alert> : null}
      {job.data && running ? (
        <StageProgressBar label="Recount progress" percent={job.data.progress?.percent ?? 0} stage={job.data.progress?.stage ?? job.data.state} />
      ) : null}
      {state === 'completed' ? (
        <Alert tone="success" title="Statistics recounted">
          <ResultList result={job.data?.result} />
        </Alert>
      ) : null}
      {state === 'failed' ? (
        <Alert tone="error" title="The recount failed">
          {job.data?.failedReason ?? 'No reason was given.'}
        </Alert>
      ) : null}
    </div>
  );
}
