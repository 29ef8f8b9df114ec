import { NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { clientIp } from '@/lib/auth/request-info';
import { currentSession, endSession } from '@/lib/auth/session';
import { route } from '@/lib/http/route';

/** Ends this browser's session. Signing out when already signed out is harmless (200), so it is public. */
export const POST = route({ permission: 'public' }, async ({ request }) => {
  const session = await currentSession();
  await endSession();
  if (session) {
    await recordAudit({
      user: session.user,
      action: 'auth.signed-out',
      entityType: 'user',
      entityId: session.user.id,
      ip: clientIp(request.headers),
    });
  }
  return NextResponse.json({ signedOut: true });
});
