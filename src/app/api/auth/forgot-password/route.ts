import { after, NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { issuePasswordLink } from '@/lib/auth/password-links';
import { clientIp, isCrossSite } from '@/lib/auth/request-info';
import { countRecentTokens } from '@/lib/db/queries/password-tokens';
import { findUserByEmail } from '@/lib/db/queries/users';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import { forgotPasswordSchema } from '@/lib/schemas/auth';

export const dynamic = 'force-dynamic';

const ANSWER = 'If that address belongs to a staff account, a link to choose a new password is on its way. It works once, for one hour.';
const MAX_LINKS_PER_HOUR = 5;

/**
 * Always the same answer, given before anything about the address is looked up: the lookup, the token
 * and the e-mail run after the response is sent (next/server `after`), so neither the answer nor its
 * timing tells a caller whether the address belongs to a staff account.
 */
export async function POST(request: Request) {
  if (isCrossSite(request)) return errorResponse(403, 'This request came from another site and was refused.');
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = forgotPasswordSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);

  const { email } = parsed.data;
  const ip = clientIp(request.headers);
  after(() => sendResetLinkIfStaff(email, ip));
  return NextResponse.json({ message: ANSWER }, { status: 202 });
}

async function sendResetLinkIfStaff(email: string, ip: string | null): Promise<void> {
  try {
    const user = await findUserByEmail(email);
    if (!user || !user.active || (await countRecentTokens(user.id, 60 * 60 * 1000)) >= MAX_LINKS_PER_HOUR) return;
    await issuePasswordLink(user, 'reset');
    await recordAudit({ actor: user.email, action: 'auth.password-reset-requested', entityType: 'user', entityId: user.id, ip });
  } catch (error) {
    console.error('[lobewise] password reset e-mail failed:', error);
  }
}
