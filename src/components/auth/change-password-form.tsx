'use client';

import { Form, Formik } from 'formik';
import { useState } from 'react';
import { PASSWORD_MAX, PASSWORD_MIN } from '@/lib/schemas/auth';
import { formErrors, sendJson } from '@/lib/api-client';
import { changePasswordChecks } from '@/lib/forms/account-checks';
import { TextField } from '@/components/ui/formik-fields';
import { Banner } from '@/components/ui/banner';
import { SubmitButton } from '@/components/ui/button';

type Values = { currentPassword: string; newPassword: string; repeat: string };

export function ChangePasswordForm() {
  const [result, setResult] = useState<{ tone: 'ok' | 'fault'; text: string } | null>(null);
  return (
    <Formik<Values>
      initialValues={{ currentPassword: '', newPassword: '', repeat: '' }}
      validate={changePasswordChecks}
      onSubmit={async (values, helpers) => {
        const answer = await sendJson('POST', '/api/account/password', {
          currentPassword: values.currentPassword,
          newPassword: values.newPassword,
        });
        if (answer.status === 200) {
          const others = Number(answer.body.otherSessionsEnded ?? 0);
          setResult({
            tone: 'ok',
            text: `Your password is changed.${others ? ` ${others} other session${others === 1 ? '' : 's'} signed out.` : ''}`,
          });
          helpers.resetForm();
          return;
        }
        if (answer.status === 422) helpers.setErrors(formErrors<Values>(answer));
        setResult({ tone: 'fault', text: answer.body.message ?? 'That did not work. Try again.' });
      }}
    >
      {({ isSubmitting }) => (
        <Form className="flex max-w-md flex-col gap-4" noValidate>
          {result ? <Banner tone={result.tone}>{result.text}</Banner> : null}
          <TextField
            namedErrors
            name="currentPassword"
            label="Current password"
            type="password"
            autoComplete="current-password"
            maxLength={PASSWORD_MAX}
          />
          <TextField
            namedErrors
            name="newPassword"
            label="New password"
            type="password"
            autoComplete="new-password"
            maxLength={PASSWORD_MAX}
            hint={`${PASSWORD_MIN} characters or more.`}
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
            <SubmitButton busy={isSubmitting}>Change password</SubmitButton>
          </div>
        </Form>
      )}
    </Formik>
  );
}
