/**
 * The per-pulsar audit log as the API sends it (docs/api.md, "Audit log"):
 * who did what when, newest first, paginated by entry id. Shared by api/ and web/.
 */
import { z } from 'zod';

export const DEFAULT_AUDIT_LOG_LIMIT = 50;
export const MAX_AUDIT_LOG_LIMIT = 200;

/** GET /api/pulsars/:id/audit-log?before=<entry id>&limit=<1–200> */
export const AuditLogQuery = z.strictObject({
  before: z.coerce
    .number({ error: 'must be an audit entry id' })
    .int('must be an audit entry id')
    .positive('must be an audit entry id')
    .optional(),
  limit: z.coerce
    .number({ error: 'must be a number' })
    .int('must be a whole number')
    .min(1, 'must be at least 1')
    .max(MAX_AUDIT_LOG_LIMIT, `must be at most ${MAX_AUDIT_LOG_LIMIT}`)
    .default(DEFAULT_AUDIT_LOG_LIMIT),
});
export type AuditLogQuery = z.infer<typeof AuditLogQuery>;

/** The actions written so far, with their `details` (other strings may appear in future rows). */
export const AUDIT_ACTIONS = [
  'revision.create', // { revisionId, message, parentId }
  'revision.release', // { revisionId, note }
  'revision.withdraw-release', // { revisionId, previousNote, releasedBy }
  'toas.exclude', // { toaIds, reason, count }
  'toas.restore', // { toaIds, count }
  'toa-batch.delete', // { batchId, fileName, rowCount, checksumSha256 }
  'comparison.save', // { comparisonId, fitRunIds, comment }
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export type AuditTargetKind = 'revision' | 'toas' | 'toa-batch' | 'comparison' | 'other';

export interface AuditLogEntry {
  id: number;
  pulsarId: number;
  /** who: null when the account has been deleted */
  actor: { id: number; displayName: string; email: string } | null;
  /** what: the action name (AuditAction, or a newer one the client does not know) */
  action: string;
  /** what it acted on: e.g. { kind: 'revision', id: 7 }; toas → id null (the ids are in details.toaIds) */
  target: { kind: AuditTargetKind; id: number | null };
  /** one plain sentence, e.g. 'released revision 7: "ready for the campaign"' */
  summary: string;
  details: Record<string, unknown>;
  /** when: ISO 8601 UTC, millisecond precision */
  createdAt: string;
}

/** `{ data: AuditLogEntry[], meta: AuditLogPageMeta }` — newest first. */
export interface AuditLogPageMeta {
  /** pass as `before` for the next (older) page; null when there is none */
  nextBefore: number | null;
  limit: number;
}
