import { NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { clientIp, isCrossSite } from '@/lib/auth/request-info';
import { currentSession, endSession } from '@/lib/auth/session';
import { errorResponse } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

/** Ends this browser's session. Signing out when already signed out is harmless (200). */
export async function POST(request: Request) {
  if (isCrossSite(request)) return errorResponse(403, 'This request came from another site and was refused.');
  const session = await currentSession();
  await endSession();
  if (session) {
    await recordAudit({ user: session.user, action: 'auth.signed-out', entityType: 'user', entityId: session.user.id, ip: clientIp(request.headers) });
  }
  return NextResponse.json({ signedOut: true });
}
