import type { Metadata } from 'next';
import { ChangePasswordForm } from '@/components/auth/change-password-form';
import { requireAccessForPage } from '@/lib/auth/guard';
import { ROLE_NAMES } from '@/lib/auth/staff-nav';

export const metadata: Metadata = { title: 'Your account' };

export default async function AccountPage() {
  const user = await requireAccessForPage('account.self');
  return (
    <div className="flex flex-col gap-6">
      <header>
        <h1 className="text-2xl font-semibold">Your account</h1>
        <dl className="mt-2 grid max-w-md grid-cols-[8rem_1fr] gap-y-1 text-sm">
          <dt className="text-ink-muted">Name</dt>
          <dd>{user.name}</dd>
          <dt className="text-ink-muted">E-mail</dt>
          <dd>{user.email}</dd>
          <dt className="text-ink-muted">Role</dt>
          <dd>{ROLE_NAMES[user.role]}</dd>
        </dl>
      </header>
      <section aria-labelledby="password-title" className="rounded-lg border border-steel-300 bg-paper-raised p-6">
        <h2 id="password-title" className="mb-1 text-lg font-semibold">
          Change your password
        </h2>
        <p className="mb-4 text-sm text-ink-soft">
          Your other signed-in devices are signed out; this one stays signed in.
        </p>
        <ChangePasswordForm />
      </section>
    </div>
  );
}
