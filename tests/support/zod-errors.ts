import type { z } from 'zod';

/** A zod schema's verdict in the shape validateWithYup gives: field path → its first message. */
export function zodErrors(schema: z.ZodType, payload: unknown): Record<string, string> {
  const result = schema.safeParse(payload);
  const out: Record<string, string> = {};
  if (!result.success) for (const issue of result.error.issues) out[issue.path.map(String).join('.')] ??= issue.message;
  return out;
}

/** The browser's yup checks flag exactly `flagged`, in the words the server's zod schema uses. */
export function expectSameVerdict(
  schema: z.ZodType,
  yupChecks: (payload: Record<string, unknown>) => Record<string, string>,
  payload: Record<string, unknown>,
  flagged: string[],
) {
  const server = zodErrors(schema, payload);
  expect(Object.keys(server).sort()).toEqual([...flagged].sort());
  expect(yupChecks(payload)).toEqual(server);
}
