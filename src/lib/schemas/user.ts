import { z } from 'zod';
import { text } from './text';
import { emailField } from './auth';

// Staff accounts as the manager's staff page edits them. Limits exported for the forms.
export const STAFF_ROLE_VALUES = ['manager', 'counter', 'tech'] as const;
export const NAME_MAX = 120;

export const ROLE_LABELS: Record<(typeof STAFF_ROLE_VALUES)[number], string> = {
  manager: 'Manager',
  counter: 'Counter',
  tech: 'Technician',
};

const roleField = z.enum(STAFF_ROLE_VALUES, { error: 'must be manager, counter or tech' });
const nameField = text('name', { error: 'required' })
  .min(1, 'required')
  .max(NAME_MAX, `at most ${NAME_MAX} characters`);

export const inviteUserSchema = z.strictObject({ email: emailField, name: nameField, role: roleField });
export type InviteUserInput = z.infer<typeof inviteUserSchema>;

export const updateUserSchema = z
  .strictObject({
    version: z
      .number({ error: 'required (the version you last saw)' })
      .int('a whole number')
      .positive('a whole number from 1'),
    role: roleField.optional(),
    active: z.boolean({ error: 'must be true or false' }).optional(),
    name: nameField.optional(),
  })
  .refine((value) => value.role !== undefined || value.active !== undefined || value.name !== undefined, {
    path: ['(body)'],
    message: 'nothing to change: give role, active or name',
  });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const userIdParam = z.coerce
  .number({ error: 'must be a number' })
  .int('a whole number')
  .positive('a whole number from 1');
