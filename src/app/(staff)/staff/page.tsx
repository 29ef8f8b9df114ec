import type { Metadata } from 'next';
import { StaffManager } from '@/components/auth/staff-manager';
import { requireAccessForPage } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Staff' };

export default async function StaffPage() {
  const manager = await requireAccessForPage('staff.manage');
  return (
    <div className="flex flex-col gap-6">
      <header>
        <h1 className="text-2xl font-semibold">Staff</h1>
        <p className="text-sm text-ink-soft">
          Who can sign in, and what their role lets them do. Switching an account off signs it out everywhere at once.
        </p>
      </header>
      <StaffManager selfId={manager.id} />
    </div>
  );
}
