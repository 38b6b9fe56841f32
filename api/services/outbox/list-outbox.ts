/** Mail captured by the local sink, newest first (the last 200). */
import type { Knex } from 'knex';

export interface CapturedEmail {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

export const OUTBOX_LIMIT = 200;

export async function listOutbox(knex: Knex): Promise<CapturedEmail[]> {
  const rows = await knex('captured_emails').orderBy('id', 'desc').limit(OUTBOX_LIMIT);
  return rows.map((r) => ({
    id: r.id,
    to: r.to_addresses,
    subject: r.subject,
    text: r.text_body ?? '',
    html: r.html_body,
    receivedAt: (r.received_at as Date).toISOString(),
  }));
}
