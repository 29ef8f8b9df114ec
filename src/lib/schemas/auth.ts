import { z } from 'zod';
import { text } from './text';

// Sign-in, password reset and password change. The limits are exported for the forms.
export const EMAIL_MAX = 254;
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;
/** Reset and invitation tokens are 32 random bytes, base64url: 43 characters. */
export const TOKEN_LENGTH = 43;

export const emailField = text('e-mail', { error: 'required' })
  .min(1, 'required')
  .max(EMAIL_MAX, `at most ${EMAIL_MAX} characters`)
  .pipe(z.email({ error: 'not an e-mail address' }))
  .transform((value) => value.toLowerCase());

/** A new password: long enough to resist guessing; any characters allowed (it is hashed, never stored or mailed). */
export const newPasswordField = z
  .string({ error: 'required' })
  .min(PASSWORD_MIN, `at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `at most ${PASSWORD_MAX} characters`);

/** A password being checked: only bounded, never judged (old passwords may be shorter). */
const givenPasswordField = z
  .string({ error: 'required' })
  .min(1, 'required')
  .max(PASSWORD_MAX, `at most ${PASSWORD_MAX} characters`);

export const signInSchema = z.strictObject({ email: emailField, password: givenPasswordField });
export type SignInInput = z.infer<typeof signInSchema>;

export const forgotPasswordSchema = z.strictObject({ email: emailField });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

export const resetPasswordSchema = z.strictObject({
  token: text('token', { error: 'required' }).regex(/^[A-Za-z0-9_-]{43}$/, 'this link is not valid; ask for a new one'),
  password: newPasswordField,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const changePasswordSchema = z
  .strictObject({ currentPassword: givenPasswordField, newPassword: newPasswordField })
  .refine((value) => value.currentPassword !== value.newPassword, {
    path: ['newPassword'],
    message: 'must differ from the current password',
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
