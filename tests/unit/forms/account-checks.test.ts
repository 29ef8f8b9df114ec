import { changePasswordChecks, inviteChecks, resetPasswordChecks, signInChecks } from '@/lib/forms/account-checks';
import { NAME_MAX } from '@/lib/schemas/user';
import { PASSWORD_MIN } from '@/lib/schemas/auth';

// The account forms' browser checks (yup, from the limits lib/schemas exports); the form names the field.
describe('account form checks', () => {
  it('asks for both sign-in fields and a real e-mail address', () => {
    expect(signInChecks({ email: '', password: '' })).toEqual({ email: 'required', password: 'required' });
    expect(signInChecks({ email: 'counter@', password: 'x' })).toEqual({ email: 'not an e-mail address' });
    expect(signInChecks({ email: 'counter@lobewise.test', password: 'x' })).toEqual({});
  });

  it('holds a new password to the schema’s minimum and the repeat to the password', () => {
    const short = 'x'.repeat(PASSWORD_MIN - 1);
    expect(resetPasswordChecks({ password: short, repeat: short })).toEqual({
      password: `at least ${PASSWORD_MIN} characters`,
    });
    expect(resetPasswordChecks({ password: 'x'.repeat(PASSWORD_MIN), repeat: 'y' })).toEqual({
      repeat: 'does not match the new password',
    });
  });

  it('refuses a new password equal to the current one', () => {
    const same = 'z'.repeat(PASSWORD_MIN);
    expect(changePasswordChecks({ currentPassword: same, newPassword: same, repeat: same })).toEqual({
      newPassword: 'must differ from the current password',
    });
  });

  it('checks an invitation’s name length and role', () => {
    expect(inviteChecks({ email: 'new@lobewise.test', name: 'n'.repeat(NAME_MAX + 1), role: 'owner' })).toEqual({
      name: `at most ${NAME_MAX} characters`,
      role: 'must be manager, counter or tech',
    });
  });
});
