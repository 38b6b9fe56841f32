import { useParams } from 'react-router-dom';
import { Button } from '../../components/button';
import { EmptyState } from '../../components/empty-state';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';
import { PERMISSIONS } from '../../config/permissions';
import { useAuditLog } from '../../features/audit-log/api/get-audit-log';
import { AuditLogList } from '../../features/audit-log/components/audit-log-list';
import { RequirePermission } from '../require-permission';

function AuditLogPanel({ pulsarId }: { pulsarId: string }) {
  const log = useAuditLog(pulsarId);
  if (log.isPending) return <LoadingPanel label="Loading the audit log…" />;
  if (log.isError) return <ErrorPanel error={log.error} onRetry={() => void log.refetch()} title="Could not load the audit log" />;
  const entries = log.data.pages.flat();
  if (entries.length === 0) {
    return (
      <EmptyState title="Nothing recorded yet">
        Saving a model revision, releasing one, excluding TOAs, deleting a TOA batch or saving a fit comparison each leaves an entry here.
      </EmptyState>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <AuditLogList entries={entries} />
      {log.hasNextPage ? (
        <div>
          <Button variant="secondary" busy={log.isFetchingNextPage} onClick={() => void log.fetchNextPage()}>
            Show older entries
          </Button>
        </div>
      ) : (
        <p className="text-xs text-night-400">{entries.length === 1 ? 'One entry' : `${entries.length} entries`}, back to the first.</p>
      )}
    </div>
  );
}

export default function AuditLogRoute() {
  const { id = '' } = useParams();
  return (
    <Page
      title="Audit log"
      description={
        <>
          <TextLink to={paths.pulsar.href(id)}>← Back to the pulsar</TextLink>
          <span className="ml-2">Who changed what, and when: newest first.</span>
        </>
      }
    >
      <RequirePermission permission={PERMISSIONS.readAuditLog}>
        <AuditLogPanel pulsarId={id} />
      </RequirePermission>
    </Page>
  );
}
