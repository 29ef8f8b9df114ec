import { findUserByEmail } from '@/lib/db/queries/users';
import { appBaseUrl } from '@/lib/env';
import { sendMail } from '@/lib/mail';

// ASVS V2.2.3: the owner hears when their account is being guessed at, and what still works.
function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );
}

/** Tells an active account's owner that sign-ins from new devices are paused; silent for anyone else. */
export async function sendThrottleNotice(email: string, pauseSeconds: number): Promise<void> {
  try {
    const user = await findUserByEmail(email);
    if (!user || !user.active) return;
    const minutes = Math.round(pauseSeconds / 60);
    const reset = `${appBaseUrl()}/forgot-password`;
    const name = user.name || user.email;
    const lines = [
      `Hello ${name},`,
      `Someone typed a wrong password for your Lobewise staff account 10 times, so sign-ins from browsers that have not signed in to it before are paused for ${minutes} minutes.`,
      'Browsers where you signed in before still work with your right password.',
      `If this was not you, choose a new password: ${reset}`,
    ];
    await sendMail({
      to: user.email,
      subject: 'Lobewise: sign-ins to your account were paused',
      text: lines.join('\n\n'),
      html: lines.map((line) => `<p>${escapeHtml(line)}</p>`).join(''),
    });
  } catch (error) {
    console.error('[lobewise] sign-in pause notice failed:', error instanceof Error ? error.message : error);
  }
}
