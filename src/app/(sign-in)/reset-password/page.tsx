import type { Metadata } from 'next';
import Link from 'next/link';
import { ResetPasswordForm } from '@/components/auth/reset-password-form';
import { Banner } from '@/components/ui/banner';

export const metadata: Metadata = { title: 'Choose a password', referrer: 'no-referrer' };

export default async function ResetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const params = await searchParams;
  const token = typeof params.token === 'string' ? params.token : '';
  const welcome = params.welcome === '1';
  return (
    <section aria-labelledby="reset-title" className="rounded-lg border border-steel-300 bg-paper-raised p-6">
      <h1 id="reset-title" className="text-2xl font-semibold">
        {welcome ? 'Welcome: choose your password' : 'Choose a new password'}
      </h1>
      <p className="mb-6 mt-1 text-sm text-ink-soft">
        {welcome
          ? 'Your manager has made you a staff account. Pick the password you will sign in with.'
          : 'Pick the password you will sign in with from now on. Other devices signed in to this account are signed out.'}
      </p>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Banner tone="fault">
          This page needs the link from the e-mail.{' '}
          <Link href="/forgot-password" className="underline">
            Ask for a new link
          </Link>
          .
        </Banner>
      )}
    </section>
  );
}
