import * as yup from 'yup';
import { EMAIL_MAX, PASSWORD_MAX, PASSWORD_MIN } from '@/lib/schemas/auth';
import { NAME_MAX, STAFF_ROLE_VALUES } from '@/lib/schemas/user';
import { validateWithYup } from './yup-limits';

// The sign-in, password and staff-invitation forms' checks in the browser, with yup from the limits
// lib/schemas/auth.ts and user.ts export. Messages are fragments, as the zod schemas' are: the form puts the
// field's name before them ("e-mail required"). The route handlers validate the same fields with zod.

const email = yup
  .string()
  .trim()
  .required('required')
  .max(EMAIL_MAX, `at most ${EMAIL_MAX} characters`)
  .email('not an e-mail address');
const givenPassword = yup.string().required('required').max(PASSWORD_MAX, `at most ${PASSWORD_MAX} characters`);
const newPassword = yup
  .string()
  .required('required')
  .min(PASSWORD_MIN, `at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `at most ${PASSWORD_MAX} characters`);
const repeatOf = (field: string) => yup.string().oneOf([yup.ref(field)], 'does not match the new password');

export const signInChecks = validateWithYup<{ email: string; password: string }>(
  yup.object({ email, password: givenPassword }),
);
export const forgotPasswordChecks = validateWithYup<{ email: string }>(yup.object({ email }));
export const resetPasswordChecks = validateWithYup<{ password: string; repeat: string }>(
  yup.object({ password: newPassword, repeat: repeatOf('password') }),
);
export const changePasswordChecks = validateWithYup<{ currentPassword: string; newPassword: string; repeat: string }>(
  yup.object({
    currentPassword: givenPassword,
    newPassword: newPassword.notOneOf([yup.ref('currentPassword')], 'must differ from the current password'),
    repeat: repeatOf('newPassword'),
  }),
);
export const inviteChecks = validateWithYup<{ email: string; name: string; role: string }>(
  yup.object({
    email,
    name: yup.string().trim().required('required').max(NAME_MAX, `at most ${NAME_MAX} characters`),
    role: yup.string().oneOf([...STAFF_ROLE_VALUES], 'must be manager, counter or tech'),
  }),
);
