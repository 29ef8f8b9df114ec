import { NextResponse } from 'next/server';
import { inviteStaff } from '@/lib/auth/staff-accounts';
import { clientIp } from '@/lib/auth/request-info';
import { listStaff } from '@/lib/db/queries/users';
import { route } from '@/lib/http/route';
import { inviteUserSchema } from '@/lib/schemas/user';

export const GET = route({ permission: 'staff.manage' }, async () => NextResponse.json({ users: await listStaff() }));

/** Invites a new staff member; a refused invitation e-mail creates nothing (502). */
export const POST = route({ permission: 'staff.manage', body: inviteUserSchema }, async ({ request, user, body }) => {
  const created = await inviteStaff(body, user, clientIp(request.headers));
  return NextResponse.json({ user: { ...created, lastSignInAt: null } }, { status: 201 });
});
