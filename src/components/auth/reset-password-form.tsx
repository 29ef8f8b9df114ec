'use client';

import { Form, Formik } from 'formik';
import Link from 'next/link';
import { useState } from 'react';
import { PASSWORD_MAX, PASSWORD_MIN } from '@/lib/schemas/auth';
import { formErrors, sendJson } from '@/lib/api-client';
import { resetPasswordChecks } from '@/lib/forms/account-checks';
import { TextField } from '@/components/ui/formik-fields';
import { Banner } from '@/components/ui/banner';
import { SubmitButton } from '@/components/ui/button';

type Values = { password: string; repeat: string };

export function ResetPasswordForm({ token }: { token: string }) {
  const [result, setResult] = useState<{ tone: 'ok' | 'fault'; text: string } | null>(null);
  if (result?.tone === 'ok') {
    return (
      <div className="flex flex-col gap-4">
        <Banner tone="ok">{result.text}</Banner>
        <Link
          href="/sign-in"
          className="self-start rounded bg-ember-500 px-4 py-2 font-semibold text-paper-raised hover:bg-ember-600"
        >
          Go to sign-in
        </Link>
      </div>
    );
  }
  return (
    <Formik<Values>
      initialValues={{ password: '', repeat: '' }}
      validate={resetPasswordChecks}
      onSubmit={async (values, helpers) => {
        const answer = await sendJson('POST', '/api/auth/reset-password', { token, password: values.password });
        if (answer.status === 200)
          return setResult({ tone: 'ok', text: answer.body.message ?? 'Your password is set.' });
        if (answer.status === 422) helpers.setErrors(formErrors<Values>(answer));
        setResult({ tone: 'fault', text: answer.body.message ?? 'That did not work. Try again.' });
      }}
    >
      {({ isSubmitting }) => (
        <Form className="flex flex-col gap-4" noValidate>
          {result ? <Banner tone={result.tone}>{result.text}</Banner> : null}
          <TextField
            namedErrors
            name="password"
            label="New password"
            type="password"
            autoComplete="new-password"
            autoFocus
            maxLength={PASSWORD_MAX}
            hint={`${PASSWORD_MIN} characters or more; a short sentence works well.`}
          />
          <TextField
            namedErrors
            name="repeat"
            label="New password again"
            type="password"
            autoComplete="new-password"
            maxLength={PASSWORD_MAX}
          />
          <div>
            <SubmitButton busy={isSubmitting}>Save the password</SubmitButton>
          </div>
        </Form>
      )}
    </Formik>
  );
}
