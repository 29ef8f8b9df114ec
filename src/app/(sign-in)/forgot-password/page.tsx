import type { Metadata } from 'next';
import Link from 'next/link';
import { ForgotPasswordForm } from '@/components/auth/forgot-password-form';

export const metadata: Metadata = { title: 'Forgot password' };

export default function ForgotPasswordPage() {
  return (
    <section aria-labelledby="forgot-title" className="rounded-lg border border-steel-300 bg-paper-raised p-6">
      <h1 id="forgot-title" className="text-2xl font-semibold">
        Forgot your password?
      </h1>
      <p className="mb-6 mt-1 text-sm text-ink-soft">
        Give the e-mail address of your staff account and we will send a link to reset the password. The link works
        once, for one hour.
      </p>
      <ForgotPasswordForm />
      <p className="mt-6 text-sm">
        <Link href="/sign-in" className="text-gauge-700 underline">
          Back to sign-in
        </Link>
      </p>
    </section>
  );
}
