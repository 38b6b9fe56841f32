import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { Card } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { isApiError } from '../../lib/api-client';
import { formatDateTimeUtc } from '../../lib/format';
import { savedComparisonQueryOptions, useSavedComparison } from '../../features/fit-comparison/api/get-saved-comparison';
import { ComparisonView } from '../../features/fit-comparison/components/comparison-view';
import { requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) await queryClient.prefetchQuery(savedComparisonQueryOptions(params.id));
    return null;
  };

export default function SavedComparisonRoute() {
  const { id = '' } = useParams();
  const saved = useSavedComparison(id);
  if (saved.isPending) return <LoadingPanel label="Loading the comparison…" />;
  if (saved.isError) {
    const error = saved.error;
    return (
      <Page title={`Comparison #${id}`} description={<TextLink to={paths.pulsars.href()}>← All pulsars</TextLink>}>
        {isApiError(error) && error.status === 404 ? (
          <ErrorPanel error={error} title="No saved comparison with this id" />
        ) : isApiError(error) && error.code === 'comparison_unavailable' ? (
          <Alert tone="error" title="This comparison can no longer be computed">
            <p>{error.message}</p>
            <p className="mt-1">The comment is kept, but at least one of its fit runs no longer has stored results. Compare the pulsar’s current fits instead.</p>
          </Alert>
        ) : (
          <ErrorPanel error={error} onRetry={() => void saved.refetch()} title="Could not load the comparison" />
        )}
      </Page>
    );
  }
  const s = saved.data;
  return (
    <Page
      title={`Comparison #${s.id}`}
      description={
        <span className="flex flex-wrap gap-x-3">
          <TextLink to={paths.pulsar.href(String(s.pulsarId))}>← Back to the pulsar</TextLink>
          <TextLink to={paths.fitComparison.href(s.pulsarId, s.fitRunIds)}>Open as a live comparison</TextLink>
        </span>
      }
    >
      <div className="flex flex-col gap-6">
        <Card aria-label="Comment">
          <p className="whitespace-pre-line text-night-100">{s.comment}</p>
          <p className="mt-2 text-xs text-night-400">
            Saved by {s.createdBy?.displayName ?? 'a deleted account'} on {formatDateTimeUtc(s.createdAt)} · runs{' '}
            {s.fitRunIds.map((r) => `#${r}`).join(', ')}, run #{s.fitRunIds[0]} the reference · figures recomputed from the stored fits
          </p>
        </Card>
        <ComparisonView comparison={s.comparison} />
      </div>
    </Page>
  );
}
