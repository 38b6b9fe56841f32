import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert } from '../../components/alert';
import { Field } from '../../components/field';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { Select } from '../../components/select';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { formatDateTimeUtc } from '../../lib/format';
import { ModelEditor } from '../../features/model-editor/components/model-editor';
import { blankModel } from '../../features/model-editor/lib/blank-model';
import { pulsarQueryOptions, usePulsar } from '../../features/pulsars/api/get-pulsar';
import { useRevision } from '../../features/revisions/api/get-revision';
import { revisionsQueryOptions, useRevisions } from '../../features/revisions/api/get-revisions';
import { RequirePermission } from '../require-permission';
import { requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    if (params.id) {
      await Promise.all([queryClient.prefetchQuery(pulsarQueryOptions(params.id)), queryClient.prefetchQuery(revisionsQueryOptions(params.id))]);
    }
    return null;
  };

function chosenRevisionId(raw: string | null): number | null {
  if (raw === null || !/^\d+$/.test(raw)) return null;
  return Number(raw);
}

function EditorBody({ pulsarId }: { pulsarId: string }) {
  const [search, setSearch] = useSearchParams();
  const [savedId, setSavedId] = useState<number | null>(null);
  const pulsar = usePulsar(pulsarId);
  const revisions = useRevisions(pulsarId);
  const requested = chosenRevisionId(search.get('revision'));
  const revisionId = requested ?? revisions.data?.[0]?.id ?? null;
  const revision = useRevision(revisionId);

  if (pulsar.isPending || revisions.isPending) return <LoadingPanel label="Loading the model…" />;
  if (pulsar.isError) return <ErrorPanel error={pulsar.error} onRetry={() => void pulsar.refetch()} title="Could not load the pulsar" />;
  if (revisions.isError) return <ErrorPanel error={revisions.error} onRetry={() => void revisions.refetch()} title="Could not load the revisions" />;
  if (revisionId !== null && revision.isPending) return <LoadingPanel label={`Loading revision #${revisionId}…`} />;
  if (revisionId !== null && revision.isError) {
    return <ErrorPanel error={revision.error} onRetry={() => void revision.refetch()} title={`Could not load revision #${revisionId}`} />;
  }

  const startModel = revision.data ? revision.data.model : blankModel(pulsar.data.name, pulsar.data.raHms, pulsar.data.decDms);
  return (
    <div className="flex flex-col gap-6">
      {revisions.data.length === 0 ? (
        <Alert tone="info" title="No model yet">
          This pulsar has no saved model. Fill in the form (or import a model file) and save the first revision.
        </Alert>
      ) : (
        <Field label="Start from revision" hint="Saving always creates a new revision; this one becomes its parent.">
          {(control) => (
            <Select {...control} className="max-w-xl" value={String(revisionId)} onChange={(event) => setSearch({ revision: event.target.value })}>
              {revisions.data.map((r, index) => (
                <option key={r.id} value={r.id}>
                  #{r.id}
                  {index === 0 ? ' (latest)' : ''}
                  {r.releasedAt ? ' (released)' : ''} — {r.message} — {formatDateTimeUtc(r.createdAt)}
                </option>
              ))}
            </Select>
          )}
        </Field>
      )}
      {savedId !== null && savedId === revisionId ? <Alert tone="success">Saved as revision #{savedId}.</Alert> : null}
      <ModelEditor
        key={revisionId ?? 'blank'}
        pulsarId={pulsarId}
        initialModel={startModel}
        parentId={revisionId}
        onSaved={(saved) => {
          setSavedId(saved.id);
          setSearch({ revision: String(saved.id) });
        }}
      />
    </div>
  );
}

export default function ModelEditorRoute() {
  const { id = '' } = useParams();
  const pulsar = usePulsar(id);
  const name = pulsar.data?.name ?? `pulsar ${id}`;
  return (
    <Page title={`Model of ${name}`} description={<TextLink to={paths.pulsar.href(id)}>← Back to {name}</TextLink>}>
      <RequirePermission permission="models:edit">
        <EditorBody pulsarId={id} />
      </RequirePermission>
    </Page>
  );
}
