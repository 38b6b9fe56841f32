/** Waiting for mail that the in-process sink captured into `captured_emails`. */
import type { Knex } from 'knex';

export interface CapturedRow {
  id: number;
  to_addresses: string;
  subject: string;
  text_body: string | null;
  html_body: string | null;
}

/** The newest captured message to `to` with id above `afterId`, polling up to `timeoutMs`. */
export async function waitForMail(knex: Knex, to: string, afterId = 0, timeoutMs = 5_000): Promise<CapturedRow> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const row = await knex<CapturedRow>('captured_emails').where('to_addresses', to).where('id', '>', afterId).orderBy('id', 'desc').first();
    if (row) return row as CapturedRow;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export async function lastMailId(knex: Knex): Promise<number> {
  const row = await knex('captured_emails').max({ id: 'id' }).first();
  return Number(row?.id ?? 0);
}

/** The token at the end of `${publicUrl}/<route>/<token>` in a message text. */
export function tokenFromLink(text: string, publicUrl: string, route: 'invitations' | 'reset-password'): string {
  const escaped = `${publicUrl}/${route}/`.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const match = new RegExp(`${escaped}([A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`no ${route} link in: ${text}`);
  return match[1];
}
