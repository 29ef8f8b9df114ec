import { after, NextResponse } from 'next/server';
import { knownDeviceId, rememberDevice } from '@/lib/auth/device';
import { clientIp, isCrossSite, isHttps } from '@/lib/auth/request-info';
import { startSession } from '@/lib/auth/session';
import { WRONG_PAIR_MESSAGE, checkSignIn } from '@/lib/auth/sign-in';
import { sendThrottleNotice } from '@/lib/auth/throttle-notice';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import { signInSchema } from '@/lib/schemas/auth';

export const dynamic = 'force-dynamic';

export async function POST(request: Request) {
  if (isCrossSite(request)) return errorResponse(403, 'This request came from another site and was refused.');
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = signInSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);

  const { email, password } = parsed.data;
  const outcome = await checkSignIn(email, password, clientIp(request.headers), await knownDeviceId(email));
  if (outcome.kind === 'throttled') {
    // After the answer, like forgot-password: neither the answer nor its timing says whether the account exists.
    if (outcome.pauseStarted) after(() => sendThrottleNotice(email, outcome.retryAfterSeconds));
    const minutes = Math.ceil(outcome.retryAfterSeconds / 60);
    return errorResponse(
      429,
      `Too many sign-in attempts. Try again in about ${minutes} minute${minutes === 1 ? '' : 's'}, sign in from a browser you used before, or reset your password.`,
      { retryAfterSeconds: outcome.retryAfterSeconds },
      { 'Retry-After': String(outcome.retryAfterSeconds) },
    );
  }
  if (outcome.kind === 'wrong-pair') return errorResponse(401, WRONG_PAIR_MESSAGE);

  await startSession(outcome.user.id);
  await rememberDevice(email, isHttps(request.headers));
  return NextResponse.json({ user: outcome.user });
}
