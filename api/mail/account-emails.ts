/** Texts of the invitation and password-reset e-mails (plain text + escaped HTML). */
import type { OutgoingMail } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function invitationEmail(to: string, role: string, link: string): OutgoingMail {
  const text = [
    `You have been invited to Pulsekeeper with the role "${role}".`,
    '',
    `Choose your name and password here (the link works once, for 7 days):`,
    link,
  ].join('\n');
  const html =
    `<p>You have been invited to Pulsekeeper with the role &quot;${escapeHtml(role)}&quot;.</p>` +
    `<p>Choose your name and password here (the link works once, for 7 days):<br>` +
    `<a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`;
  return { to, subject: 'Your invitation to Pulsekeeper', text, html };
}

export function passwordResetEmail(to: string, link: string): OutgoingMail {
  const text = [
    'Someone asked to reset the password of your Pulsekeeper account.',
    '',
    'Choose a new password here (the link works once, for 1 hour):',
    link,
    '',
    'If this was not you, ignore this message; your password stays as it is.',
  ].join('\n');
  const html =
    '<p>Someone asked to reset the password of your Pulsekeeper account.</p>' +
    `<p>Choose a new password here (the link works once, for 1 hour):<br><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>` +
    '<p>If this was not you, ignore this message; your password stays as it is.</p>';
  return { to, subject: 'Reset your Pulsekeeper password', text, html };
}
