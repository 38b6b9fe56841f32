/**
 * What an audit row acted on and one plain sentence saying what happened,
 * from its action and details (the actions of api/contracts/audit-log.ts;
 * an unknown action gets a generic sentence, never an error).
 */
import type { AuditLogEntry } from '../../contracts/audit-log';

type Details = Record<string, unknown>;

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const text = (v: unknown): string => (typeof v === 'string' ? v : '');
const quoted = (v: unknown): string => (text(v) === '' ? '' : `: "${text(v)}"`);
const toas = (n: number | null): string => (n === 1 ? '1 TOA' : `${n ?? 'some'} TOAs`);

/** The target and summary of one audit row. */
export function describeAuditEntry(action: string, details: Details): Pick<AuditLogEntry, 'target' | 'summary'> {
  switch (action) {
    case 'revision.create':
      return { target: { kind: 'revision', id: num(details.revisionId) }, summary: `saved revision ${num(details.revisionId) ?? '?'}${quoted(details.message)}` };
    case 'revision.release':
      return { target: { kind: 'revision', id: num(details.revisionId) }, summary: `released revision ${num(details.revisionId) ?? '?'}${quoted(details.note)}` };
    case 'revision.withdraw-release':
      return { target: { kind: 'revision', id: num(details.revisionId) }, summary: `withdrew the release of revision ${num(details.revisionId) ?? '?'}` };
    case 'toas.exclude':
      return { target: { kind: 'toas', id: null }, summary: `excluded ${toas(num(details.count))} from fits${quoted(details.reason)}` };
    case 'toas.restore':
      return { target: { kind: 'toas', id: null }, summary: `included ${toas(num(details.count))} in fits again` };
    case 'toa-batch.delete':
      return {
        target: { kind: 'toa-batch', id: num(details.batchId) },
        summary: `deleted TOA batch ${num(details.batchId) ?? '?'} (${text(details.fileName) || 'unnamed file'}, ${toas(num(details.rowCount))})`,
      };
    case 'comparison.save': {
      const runs = Array.isArray(details.fitRunIds) ? details.fitRunIds.join(', ') : '?';
      return { target: { kind: 'comparison', id: num(details.comparisonId) }, summary: `saved comparison ${num(details.comparisonId) ?? '?'} of fit runs ${runs}${quoted(details.comment)}` };
    }
    default:
      return { target: { kind: 'other', id: null }, summary: action };
  }
}
