import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { formatDateTimeUtc } from '../../../lib/format';
import type { AuditLogEntry } from '../api/get-audit-log';

/** Plain words for the actions the API writes; a newer action shows its own name. */
const ACTION_LABELS: Record<string, string> = {
  'revision.create': 'Saved a revision',
  'revision.release': 'Released a revision',
  'revision.withdraw-release': 'Withdrew a release',
  'toas.exclude': 'Excluded TOAs',
  'toas.restore': 'Included TOAs again',
  'toa-batch.delete': 'Deleted a TOA batch',
  'comparison.save': 'Saved a fit comparison',
};

export function auditActionLabel(action: string): string {
  return ACTION_LABELS[action] ?? action;
}

/** Who did what when, newest first (one row per audit entry). */
export function AuditLogList({ entries }: { entries: AuditLogEntry[] }) {
  return (
    <Table aria-label="Audit log">
      <THead>
        <tr>
          <Th scope="col">When (UTC)</Th>
          <Th scope="col">Who</Th>
          <Th scope="col">Action</Th>
          <Th scope="col">Details</Th>
        </tr>
      </THead>
      <TBody>
        {entries.map((e) => (
          <Tr key={e.id}>
            <Td className="whitespace-nowrap font-mono text-xs">{formatDateTimeUtc(e.createdAt)}</Td>
            <Td>
              {e.actor ? (
                <span title={e.actor.email}>{e.actor.displayName}</span>
              ) : (
                <span className="italic text-night-400">deleted account</span>
              )}
            </Td>
            <Td className="whitespace-nowrap">{auditActionLabel(e.action)}</Td>
            <Td className="text-night-200">{e.summary}</Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
