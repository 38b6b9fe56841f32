/** The invitation behind a token if it is unused and unexpired, else 404 (no reason given). */
import type { Knex } from 'knex';
import type { Role } from '../../auth/permissions';
import { sha256Hex } from '../../auth/tokens';
import { notFound } from '../../errors';

export interface InvitationRow {
  id: number;
  email: string;
  role: Role;
  token_sha256: string;
  invited_by: number | null;
  expires_at: Date;
  accepted_at: Date | null;
  created_at: Date;
}

export async function findOpenInvitation(knex: Knex, token: string, forUpdate = false): Promise<InvitationRow> {
  const query = knex<InvitationRow>('invitations')
    .where({ token_sha256: sha256Hex(token) })
    .whereNull('accepted_at')
    .where('expires_at', '>', new Date());
  const row = await (forUpdate ? query.forUpdate() : query).first();
  if (!row) throw notFound('invitation');
  return row as InvitationRow;
}
