import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/components/auth/sign-in-form';
import { currentUser, safeNextPath } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const params = await searchParams;
  const next = safeNextPath(typeof params.next === 'string' ? params.next : null);
  if (await currentUser()) redirect(next);
  return (
    <section aria-labelledby="sign-in-title" className="rounded-lg border border-steel-300 bg-paper-raised p-6">
      <h1 id="sign-in-title" className="text-2xl font-semibold">
        Sign in
      </h1>
      <p className="mb-6 mt-1 text-sm text-ink-soft">
        For shop staff. Customers reach their quote through the link in their e-mail, no account needed.
      </p>
      <SignInForm next={next} />
    </section>
  );
}
