/**
 * One page of a pulsar's audit log, newest first: who (name and e-mail), what
 * (action, target, details, a sentence) and when. Pages by entry id: pass the
 * page's `nextBefore` as `before` for the next, older page.
 */
import type { Knex } from 'knex';
import type { AuditLogEntry, AuditLogPageMeta, AuditLogQuery } from '../../contracts/audit-log';
import { notFound } from '../../errors';
import { describeAuditEntry } from './describe-audit-entry';

interface AuditJoinRow {
  id: number | string;
  pulsar_id: number;
  user_id: number | null;
  action: string;
  details: string | Record<string, unknown>;
  created_at: Date;
  display_name: string | null;
  email: string | null;
}

/** Throws 404 for an unknown pulsar. */
export async function listAuditLog(knex: Knex, pulsarId: number, query: AuditLogQuery): Promise<{ entries: AuditLogEntry[]; meta: AuditLogPageMeta }> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex('audit_log')
    .leftJoin('users', 'users.id', 'audit_log.user_id')
    .where('audit_log.pulsar_id', pulsarId)
    .modify((q) => {
      if (query.before !== undefined) q.where('audit_log.id', '<', query.before);
    })
    .orderBy('audit_log.id', 'desc') // ids grow with time: the same order as created_at, without ties
    .limit(query.limit + 1) // one more tells whether an older page exists
    .select('audit_log.*', 'users.display_name', 'users.email')) as AuditJoinRow[];
  const page = rows.slice(0, query.limit);
  const entries = page.map((row): AuditLogEntry => {
    const details = (typeof row.details === 'string' ? JSON.parse(row.details) : row.details) as Record<string, unknown>;
    return {
      id: Number(row.id),
      pulsarId: row.pulsar_id,
      actor: row.user_id === null || row.display_name === null ? null : { id: row.user_id, displayName: row.display_name, email: row.email ?? '' },
      action: row.action,
      ...describeAuditEntry(row.action, details),
      details,
      createdAt: row.created_at.toISOString(),
    };
  });
  const nextBefore = rows.length > query.limit && page.length > 0 ? entries[entries.length - 1].id : null;
  return { entries, meta: { nextBefore, limit: query.limit } };
}
