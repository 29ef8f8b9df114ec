import type { z } from 'zod';

export type FieldIssue = { field: string; message: string };

function dotted(path: readonly PropertyKey[]): string {
  return path.map((p) => (typeof p === 'symbol' ? (p.description ?? 'symbol') : String(p))).join('.');
}

/**
 * Turns a zod error into one { field, message } per problem, field being the dotted path
 * ("engine.boreIn", "3.lsa"). Unknown keys are listed one per key so the form can point at each.
 * The API answers these in a 422; the CLI prints them on stderr.
 */
export function formatZodIssues(error: z.ZodError, prefix?: string): FieldIssue[] {
  const out: FieldIssue[] = [];
  const join = (path: readonly PropertyKey[]) => {
    const p = dotted(path);
    const full = prefix ? (p ? `${prefix}.${p}` : prefix) : p;
    return full || '(root)';
  };
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) out.push({ field: join([...issue.path, key]), message: 'unknown field' });
      continue;
    }
    out.push({ field: join(issue.path), message: issue.message });
  }
  return out;
}
