import { NextResponse } from 'next/server';
import type { ZodError } from 'zod';
import { formatZodIssues, type FieldIssue } from '@/lib/schemas/errors';

// One shape for every error the API answers, so forms and tests read them the same way.
export type FieldError = FieldIssue;

export function validationFailed(errors: ZodError | FieldError[]): NextResponse {
  const list = Array.isArray(errors) ? errors : formatZodIssues(errors);
  return NextResponse.json({ message: 'Some fields need attention.', errors: list }, { status: 422 });
}

export function errorResponse(status: number, message: string, extra: Record<string, unknown> = {}, headers?: HeadersInit): NextResponse {
  return NextResponse.json({ message, ...extra }, { status, headers });
}

/** Parses a JSON body; a body that is not JSON is the client's mistake (400), never a crash. */
export async function readJson(request: Request): Promise<{ ok: true; value: unknown } | { ok: false; response: NextResponse }> {
  try {
    return { ok: true, value: await request.json() };
  } catch {
    return { ok: false, response: errorResponse(400, 'The request body must be valid JSON.', { errors: [{ field: '(body)', message: 'not valid JSON' }] }) };
  }
}
