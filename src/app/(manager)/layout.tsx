import { requireRoleForPage } from '@/lib/auth/guard';

// Manager-only pages.
export default async function ManagerLayout({ children }: { children: React.ReactNode }) {
  await requireRoleForPage('manager');
  return <div className="mx-auto max-w-6xl px-4 py-8">{children}</div>;
}
