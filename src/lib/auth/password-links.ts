import type { Transaction } from 'sequelize';
import { createPasswordToken } from '@/lib/db/queries/password-tokens';
import type { TokenPurpose } from '@/lib/db/models/auth';
import { appBaseUrl } from '@/lib/env';
import { sendMail } from '@/lib/mail';
import { hashToken, randomToken } from './tokens';

// E-mailed links for setting a password: a reset (asked for on the sign-in page) or an invitation
// (sent by a manager). Only the token's hash is stored; the link works once, until it expires.
export const RESET_LINK_TTL_MS = 60 * 60 * 1000;
export const INVITE_LINK_TTL_MS = 72 * 60 * 60 * 1000;

function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );
}

export async function issuePasswordLink(
  user: { id: number; email: string; name: string },
  purpose: TokenPurpose,
  options: { invitedBy?: string; transaction?: Transaction } = {},
): Promise<void> {
  const token = randomToken();
  const ttl = purpose === 'invite' ? INVITE_LINK_TTL_MS : RESET_LINK_TTL_MS;
  await createPasswordToken(
    { userId: user.id, tokenHash: hashToken(token), purpose, expiresAt: new Date(Date.now() + ttl) },
    options.transaction,
  );
  const link = `${appBaseUrl()}/reset-password?token=${encodeURIComponent(token)}${purpose === 'invite' ? '&welcome=1' : ''}`;
  const name = user.name || user.email;
  if (purpose === 'invite') {
    const who = options.invitedBy ? `${options.invitedBy} has` : 'You have been';
    const lead = options.invitedBy
      ? `${who} added you to the shop's Lobewise staff.`
      : `${who} added to the shop's Lobewise staff.`;
    await sendMail({
      to: user.email,
      subject: 'Your Lobewise staff account: choose a password',
      text: `Hello ${name},\n\n${lead} Choose your password here (the link works once, for 72 hours):\n\n${link}\n\nIf you were not expecting this, you can ignore this e-mail.`,
      html: `<p>Hello ${escapeHtml(name)},</p><p>${escapeHtml(lead)} Choose your password here (the link works once, for 72 hours):</p><p><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p><p>If you were not expecting this, you can ignore this e-mail.</p>`,
    });
    return;
  }
  await sendMail({
    to: user.email,
    subject: 'Reset your Lobewise password',
    text: `Hello ${name},\n\nSomeone (hopefully you) asked to reset the password of this Lobewise staff account. Choose a new one here (the link works once, for one hour):\n\n${link}\n\nIf you did not ask, ignore this e-mail; your password stays as it is.`,
    html: `<p>Hello ${escapeHtml(name)},</p><p>Someone (hopefully you) asked to reset the password of this Lobewise staff account. Choose a new one here (the link works once, for one hour):</p><p><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p><p>If you did not ask, ignore this e-mail; your password stays as it is.</p>`,
  });
}
