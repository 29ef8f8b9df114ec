import Link from 'next/link';
import { currentUser, type SessionUser } from '@/lib/auth/guard';
import { ROLE_NAMES, linksFor } from '@/lib/auth/staff-nav';
import { SignOutButton } from './sign-out-button';

/** The signed-in person, or null (also while the database is away: the shell must still render). */
async function headerUser(): Promise<SessionUser | null> {
  try {
    return await currentUser();
  } catch {
    return null;
  }
}

/** The header's right-hand side: staff links for the person's role, who they are, sign-out. */
export async function StaffHeaderNav() {
  const user = await headerUser();
  if (!user) {
    // Signed out means a customer's page (or the start page): no prefetch of the staff sign-in on their data plan.
    return (
      <Link href="/sign-in" prefetch={false} className="rounded px-3 py-1.5 ring-1 ring-steel-500 hover:bg-steel-900">
        Staff sign-in
      </Link>
    );
  }
  return (
    <>
      <ul className="flex flex-wrap items-center gap-x-1 gap-y-1">
        {linksFor(user.role).map((link) => (
          <li key={link.href}>
            <Link href={link.href} className="whitespace-nowrap rounded px-1.5 py-1 hover:bg-steel-900">
              {link.label}
            </Link>
          </li>
        ))}
      </ul>
      {/* A long name is cut short (in full on hover) rather than pushing the header onto a second row. */}
      <span className="flex items-baseline gap-1 whitespace-nowrap text-steel-300">
        <span className="inline-block max-w-[11rem] truncate align-bottom" title={user.name}>
          {user.name}
        </span>{' '}
        · <span className="font-semibold text-paper">{ROLE_NAMES[user.role]}</span>
      </span>
      <SignOutButton />
    </>
  );
}
