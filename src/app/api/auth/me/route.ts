import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';

export const GET = route({ permission: 'account.self' }, ({ user }) => NextResponse.json({ user }));
