/** An administrator invites an address with a role: stores the token hash (7 days) and e-mails the link. */
import type { MailDeps } from '../../app-deps';
import type { Role } from '../../auth/permissions';
import { newToken } from '../../auth/tokens';
import { findUserByEmail, normaliseEmail } from '../../db/users';
import { conflict } from '../../errors';
import { invitationEmail } from '../../mail/account-emails';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

export interface InvitationCreated {
  id: number;
  email: string;
  role: Role;
  expiresAt: string;
}

export async function inviteUser(deps: MailDeps, input: { email: string; role: Role }, invitedBy: number): Promise<InvitationCreated> {
  const email = normaliseEmail(input.email);
  if (await findUserByEmail(deps.knex, email)) throw conflict(`${email} already has an account`);
  const { token, tokenSha256 } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  const [id] = await deps.knex('invitations').insert({
    email,
    role: input.role,
    token_sha256: tokenSha256,
    invited_by: invitedBy,
    expires_at: expiresAt,
  });
  await deps.mailer.send(invitationEmail(email, input.role, `${deps.publicUrl}/invitations/${token}`));
  return { id, email, role: input.role, expiresAt: expiresAt.toISOString() };
}
