import { NextResponse } from 'next/server';
import { changeOwnPassword } from '@/lib/auth/password-changes';
import { clientIp } from '@/lib/auth/request-info';
import { currentSession } from '@/lib/auth/session';
import { route } from '@/lib/http/route';
import { changePasswordSchema } from '@/lib/schemas/auth';

/** Changes the signed-in person's own password; their other sessions and any unused reset links end, this session stays. */
export const POST = route(
  { permission: 'account.self', body: changePasswordSchema },
  async ({ request, user, body }) => {
    const { otherSessionsEnded } = await changeOwnPassword(
      user,
      body,
      (await currentSession())?.sessionId,
      clientIp(request.headers),
    );
    return NextResponse.json({ message: 'Your password is changed.', otherSessionsEnded });
  },
);
