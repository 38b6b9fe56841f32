import { QueryErrorResetBoundary } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { PageHeader } from './page-header';
import { PanelErrorBoundary } from './panel-error-boundary';

/** A page's header plus its main panel, the panel wrapped in its own error boundary. */
export function Page({ title, description, actions, children }: { title: string; description?: ReactNode; actions?: ReactNode; children: ReactNode }) {
  return (
    <>
      <PageHeader title={title} description={description} actions={actions} />
      <QueryErrorResetBoundary>
        {({ reset }) => <PanelErrorBoundary onReset={reset}>{children}</PanelErrorBoundary>}
      </QueryErrorResetBoundary>
    </>
  );
}
