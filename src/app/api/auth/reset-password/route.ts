import { NextResponse } from 'next/server';
import { setPasswordFromLink } from '@/lib/auth/password-changes';
import { clientIp } from '@/lib/auth/request-info';
import { route } from '@/lib/http/route';
import { resetPasswordSchema } from '@/lib/schemas/auth';

/** Sets a new password from an e-mailed link (reset or invitation); a bad, spent or expired link is 400 naming `token`. */
export const POST = route({ permission: 'public', body: resetPasswordSchema }, async ({ request, body }) => {
  const { email } = await setPasswordFromLink(body, clientIp(request.headers));
  return NextResponse.json({ message: 'Your password is set. Sign in with it now.', email });
});
