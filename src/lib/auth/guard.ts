import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { PATH_HEADER, safeNextPath, signInUrl } from './guard-paths';
import { roleCan, type Permission } from './policy';
import type { SessionUser, StaffRole } from './roles';
import { currentSession } from './session';

// The session checks. Route handlers get theirs from the route kit (lib/http/route.ts); server
// components call requireAccessForPage(permission). There are no server actions: every change goes
// through a route handler.

export type { SessionUser, StaffRole } from './roles';
export { ALL_STAFF } from './roles';

export { PATH_HEADER, safeNextPath, signInUrl };

export async function currentUser(): Promise<SessionUser | null> {
  const session = await currentSession();
  return session ? { ...session.user } : null;
}

export function roleAllows(user: SessionUser, roles: readonly StaffRole[]): boolean {
  return roles.length === 0 || roles.includes(user.role);
}

/**
 * For server components: the page's permission from the one table (lib/auth/policy.ts). Signed out:
 * redirects to /sign-in?next=<this page>; a role without the permission goes to the staff home, which
 * says the page is not open to that role.
 */
export async function requireAccessForPage(permission: Permission): Promise<SessionUser> {
  const user = await currentUser();
  const path = (await headers()).get(PATH_HEADER);
  if (!user) redirect(signInUrl(path));
  if (!roleCan(user.role, permission)) redirect(`/dashboard?denied=${encodeURIComponent(safeNextPath(path, '/'))}`);
  return user;
}
