import { requireAccessForPage } from '@/lib/auth/guard';

// Every page in this group is for signed-in staff; pages narrow the roles further.
export default async function StaffLayout({ children }: { children: React.ReactNode }) {
  await requireAccessForPage('staff-area.open');
  return <div className="mx-auto max-w-6xl px-4 py-8">{children}</div>;
}
