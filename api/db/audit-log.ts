/** The audit log: one row per audited action, written in the transaction of the action itself. */
import type { Knex } from 'knex';

export interface AuditEntry {
  pulsarId: number | null;
  userId: number | null;
  action: string; // e.g. 'toa-batch.delete', 'toas.exclude', 'toas.restore'
  details: Record<string, unknown>;
}

export interface AuditRow {
  id: number | string;
  pulsar_id: number | null;
  user_id: number | null;
  action: string;
  details: string | Record<string, unknown>;
  created_at: Date;
}

/** Records one action; pass the transaction of the change so both commit or neither does. Returns the row id. */
export async function recordAudit(trx: Knex | Knex.Transaction, entry: AuditEntry): Promise<number> {
  const [id] = await trx('audit_log').insert({
    pulsar_id: entry.pulsarId,
    user_id: entry.userId,
    action: entry.action,
    details: JSON.stringify(entry.details),
  });
  return Number(id);
}
