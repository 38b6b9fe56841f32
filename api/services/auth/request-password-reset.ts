/**
 * Starts a password reset: for an active account, stores the hash of a new
 * 1-hour token and e-mails the link. The work runs after the caller has
 * answered (202 either way), so neither the answer nor its timing reveals
 * whether the address has an account. Failures are logged.
 */
import type { MailDeps } from '../../app-deps';
import { newToken } from '../../auth/tokens';
import { findUserByEmail } from '../../db/users';
import { passwordResetEmail } from '../../mail/account-emails';

export const PASSWORD_RESET_LIFETIME_MS = 60 * 60 * 1000;

async function sendReset(deps: MailDeps, email: string): Promise<void> {
  const user = await findUserByEmail(deps.knex, email);
  if (!user || !user.active) return;
  const { token, tokenSha256 } = newToken();
  await deps.knex('password_resets').insert({
    user_id: user.id,
    token_sha256: tokenSha256,
    expires_at: new Date(Date.now() + PASSWORD_RESET_LIFETIME_MS),
  });
  await deps.mailer.send(passwordResetEmail(user.email, `${deps.publicUrl}/reset-password/${token}`));
}

export function requestPasswordReset(deps: MailDeps, email: string): void {
  setImmediate(() => {
    sendReset(deps, email).catch((err: unknown) => deps.log('password reset e-mail failed', err));
  });
}
