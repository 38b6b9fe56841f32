import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { PERMISSIONS } from '../../config/permissions';
import { useOutbox } from '../../features/outbox/api/get-outbox';
import { OutboxList } from '../../features/outbox/components/outbox-list';
import { RequirePermission } from '../require-permission';

function OutboxPanel() {
  const outbox = useOutbox();
  if (outbox.isPending) return <LoadingPanel label="Loading captured e-mails…" />;
  if (outbox.isError) return <ErrorPanel error={outbox.error} onRetry={() => void outbox.refetch()} title="Could not load the outbox" />;
  if (outbox.data.length === 0) {
    return <EmptyState title="No e-mails captured yet">Invitations and password resets sent by the app appear here.</EmptyState>;
  }
  return <OutboxList messages={outbox.data} />;
}

export default function OutboxRoute() {
  return (
    <Page title="Outbox" description="E-mails the app has sent, as caught by the development mail sink. Newest first.">
      <RequirePermission permission={PERMISSIONS.readOutbox}>
        <OutboxPanel />
      </RequirePermission>
    </Page>
  );
}
