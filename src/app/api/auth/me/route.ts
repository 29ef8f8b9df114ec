import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';

export const dynamic = 'force-dynamic';

export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  return NextResponse.json({ user });
}
