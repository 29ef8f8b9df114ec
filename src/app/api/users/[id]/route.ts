import { NextResponse } from 'next/server';
import { updateStaffAccount } from '@/lib/auth/staff-accounts';
import { clientIp } from '@/lib/auth/request-info';
import { readBody } from '@/lib/http/parse';
import { invalidFields } from '@/lib/http/responses';
import { route } from '@/lib/http/route';
import { updateUserSchema, userIdParam } from '@/lib/schemas/user';

/** Changes a staff member's role, name or active flag. `version` must be the one last read (else 409). */
export const PATCH = route({ permission: 'staff.manage' }, async ({ request, user, params }) => {
  // The id is checked before the body, and one that is not a number is a field error (422): this route's contract.
  const id = userIdParam.safeParse(params.id);
  if (!id.success) throw invalidFields([{ field: 'id', message: id.error.issues[0]?.message ?? 'not valid' }]);
  const change = await readBody(request, updateUserSchema);
  return NextResponse.json({ user: await updateStaffAccount(id.data, change, user, clientIp(request.headers)) });
});
