import type { FormikErrors } from 'formik';
import type { z } from 'zod';

// Lets a formik form validate with the same zod schema the route handler uses, so the limits and
// messages are written once (src/lib/schemas/*).
export function zodValidate<T extends object>(schema: z.ZodType): (values: T) => FormikErrors<T> {
  return (values: T) => {
    const result = schema.safeParse(values);
    if (result.success) return {};
    const errors: Record<string, string> = {};
    for (const issue of result.error.issues) {
      const field = issue.path.map(String).join('.') || '(body)';
      errors[field] ??= issue.message;
    }
    return errors as FormikErrors<T>;
  };
}
