'use client';

import { Form, Formik } from 'formik';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { EMAIL_MAX, PASSWORD_MAX } from '@/lib/schemas/auth';
import { formErrors, sendJson } from '@/lib/api-client';
import { signInChecks } from '@/lib/forms/account-checks';
import { TextField } from '@/components/ui/formik-fields';
import { Banner } from '@/components/ui/banner';
import { SubmitButton } from '@/components/ui/button';

type Values = { email: string; password: string };

export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Formik<Values>
      initialValues={{ email: '', password: '' }}
      validate={signInChecks}
      onSubmit={async (values, helpers) => {
        setProblem(null);
        const answer = await sendJson('POST', '/api/auth/sign-in', values);
        if (answer.status === 200) {
          router.push(next);
          router.refresh();
          return;
        }
        if (answer.status === 422) helpers.setErrors(formErrors<Values>(answer));
        setProblem(answer.body.message ?? 'Signing in did not work. Try again.');
        helpers.setFieldValue('password', '', false);
      }}
    >
      {({ isSubmitting }) => (
        <Form className="flex flex-col gap-4" noValidate>
          {problem ? <Banner tone="fault">{problem}</Banner> : null}
          <TextField
            namedErrors
            name="email"
            label="E-mail"
            type="email"
            autoComplete="username"
            autoFocus
            maxLength={EMAIL_MAX}
          />
          <TextField
            namedErrors
            name="password"
            label="Password"
            type="password"
            autoComplete="current-password"
            maxLength={PASSWORD_MAX}
          />
          <div className="flex items-center justify-between gap-4">
            <SubmitButton busy={isSubmitting}>Sign in</SubmitButton>
            <Link href="/forgot-password" className="text-sm text-gauge-700 underline">
              Forgot your password?
            </Link>
          </div>
        </Form>
      )}
    </Formik>
  );
}
