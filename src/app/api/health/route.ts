import { NextResponse } from 'next/server';
import { databaseIsUp } from '@/lib/db/queries/health';
import { route } from '@/lib/http/route';
import { APP_VERSION } from '@/lib/version';

/** Public; never reads the session, so it answers 503 (not a crash) while the database is away. */
export const GET = route({ permission: 'public' }, async () => {
  if (await databaseIsUp()) return NextResponse.json({ status: 'ok', db: 'up', version: APP_VERSION });
  return NextResponse.json(
    { status: 'degraded', db: 'down', version: APP_VERSION },
    { status: 503, headers: { 'Retry-After': '5' } },
  );
});
