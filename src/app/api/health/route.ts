import { NextResponse } from 'next/server';
import { databaseIsUp } from '@/lib/db/queries/health';
import { APP_VERSION } from '@/lib/version';

export const dynamic = 'force-dynamic';

export async function GET() {
  if (await databaseIsUp()) {
    return NextResponse.json({ status: 'ok', db: 'up', version: APP_VERSION });
  }
  return NextResponse.json({ status: 'degraded', db: 'down', version: APP_VERSION }, { status: 503, headers: { 'Retry-After': '5' } });
}
