import { after, NextResponse } from 'next/server';
import { knownDeviceId, rememberDevice } from '@/lib/auth/device';
import { clientIp, isHttps } from '@/lib/auth/request-info';
import { startSession } from '@/lib/auth/session';
import { WRONG_PAIR_MESSAGE, checkSignIn, signInThrottled } from '@/lib/auth/sign-in';
import { sendThrottleNotice } from '@/lib/auth/throttle-notice';
import { HttpError } from '@/lib/http/errors';
import { route } from '@/lib/http/route';
import { signInSchema } from '@/lib/schemas/auth';

export const POST = route(
  { permission: 'public', body: signInSchema },
  async ({ request, body: { email, password } }) => {
    const outcome = await checkSignIn(email, password, clientIp(request.headers), await knownDeviceId(email));
    if (outcome.kind === 'throttled') {
      // After the answer, like forgot-password: neither the answer nor its timing says whether the account exists.
      if (outcome.pauseStarted) after(() => sendThrottleNotice(email, outcome.retryAfterSeconds));
      throw signInThrottled(outcome.retryAfterSeconds);
    }
    if (outcome.kind === 'wrong-pair') throw new HttpError(401, WRONG_PAIR_MESSAGE);
    await startSession(outcome.user.id);
    await rememberDevice(email, isHttps(request.headers));
    return NextResponse.json({ user: outcome.user });
  },
);
