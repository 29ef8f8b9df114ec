import { after, NextResponse } from 'next/server';
import { sendResetLinkIfStaff } from '@/lib/auth/password-changes';
import { clientIp } from '@/lib/auth/request-info';
import { route } from '@/lib/http/route';
import { forgotPasswordSchema } from '@/lib/schemas/auth';

const ANSWER =
  'If that address belongs to a staff account, a link to choose a new password is on its way. It works once, for one hour.';

/**
 * Always the same answer, given before anything about the address is looked up: the lookup, the token
 * and the e-mail run after the response is sent (next/server `after`), so neither the answer nor its
 * timing tells a caller whether the address belongs to a staff account.
 */
export const POST = route({ permission: 'public', body: forgotPasswordSchema }, async ({ request, body }) => {
  const ip = clientIp(request.headers);
  after(() => sendResetLinkIfStaff(body.email, ip));
  return NextResponse.json({ message: ANSWER }, { status: 202 });
});
