import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/button';
import { Card, CardTitle } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { PERMISSIONS } from '../../config/permissions';
import { useMe } from '../../features/auth/api/get-me';
import { observatoriesQueryOptions, useObservatories, type Observatory } from '../../features/observatories/api/get-observatories';
import { ObservatoryForm } from '../../features/observatories/components/observatory-form';
import { ObservatoryTable } from '../../features/observatories/components/observatory-table';
import { hasPermission, requireSession } from '../session';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    await queryClient.prefetchQuery(observatoriesQueryOptions());
    return null;
  };

type Editor = { mode: 'closed' } | { mode: 'create' } | { mode: 'edit'; observatory: Observatory };

export default function ObservatoriesRoute() {
  const me = useMe();
  const observatories = useObservatories();
  const canManage = hasPermission(me.data, PERMISSIONS.manageObservatories);
  const [editor, setEditor] = useState<Editor>({ mode: 'closed' });

  return (
    <Page
      title="Observatories"
      description="Registered telescopes: ITRF position in metres and clock-correction points."
      actions={
        canManage && editor.mode === 'closed' ? <Button onClick={() => setEditor({ mode: 'create' })}>Add observatory</Button> : null
      }
    >
      {canManage && editor.mode !== 'closed' ? (
        <Card className="mb-6">
          <div className="flex items-start justify-between">
            <CardTitle>{editor.mode === 'edit' ? `Edit ${editor.observatory.code}` : 'Add an observatory'}</CardTitle>
            <Button variant="ghost" size="sm" onClick={() => setEditor({ mode: 'closed' })}>
              Close
            </Button>
          </div>
          <ObservatoryForm
            key={editor.mode === 'edit' ? editor.observatory.code : 'new'}
            observatory={editor.mode === 'edit' ? editor.observatory : undefined}
            onDone={() => setEditor({ mode: 'closed' })}
          />
        </Card>
      ) : null}
      {observatories.isPending ? (
        <LoadingPanel label="Loading observatories…" />
      ) : observatories.isError ? (
        <ErrorPanel error={observatories.error} onRetry={() => void observatories.refetch()} title="Could not load the observatories" />
      ) : (
        <ObservatoryTable
          observatories={observatories.data}
          onEdit={canManage ? (observatory) => setEditor({ mode: 'edit', observatory }) : undefined}
        />
      )}
    </Page>
  );
}
