'use client';

import { Form, Formik } from 'formik';
import { useState } from 'react';
import { EMAIL_MAX } from '@/lib/schemas/auth';
import { formErrors, sendJson } from '@/lib/api-client';
import { forgotPasswordChecks } from '@/lib/forms/account-checks';
import { TextField } from '@/components/ui/formik-fields';
import { Banner } from '@/components/ui/banner';
import { SubmitButton } from '@/components/ui/button';

type Values = { email: string };

export function ForgotPasswordForm() {
  const [answer, setAnswer] = useState<{ tone: 'ok' | 'fault'; text: string } | null>(null);
  return (
    <Formik<Values>
      initialValues={{ email: '' }}
      validate={forgotPasswordChecks}
      onSubmit={async (values, helpers) => {
        const result = await sendJson('POST', '/api/auth/forgot-password', values);
        if (result.status === 202) return setAnswer({ tone: 'ok', text: result.body.message ?? 'Check your inbox.' });
        if (result.status === 422) helpers.setErrors(formErrors<Values>(result));
        setAnswer({ tone: 'fault', text: result.body.message ?? 'That did not work. Try again.' });
      }}
    >
      {({ isSubmitting }) => (
        <Form className="flex flex-col gap-4" noValidate>
          {answer ? <Banner tone={answer.tone}>{answer.text}</Banner> : null}
          <TextField
            namedErrors
            name="email"
            label="E-mail"
            type="email"
            autoComplete="username"
            autoFocus
            maxLength={EMAIL_MAX}
          />
          <div>
            <SubmitButton busy={isSubmitting}>Send the link</SubmitButton>
          </div>
        </Form>
      )}
    </Formik>
  );
}
