import { NextResponse } from 'next/server';
import type { ZodError } from 'zod';
import { formatZodIssues, type FieldIssue } from '@/lib/schemas/errors';
import { BodyTooLarge, JSON_BODY_LIMIT_BYTES, kilobytes, readLimitedBytes } from './body-limit';

// One shape for every error the API answers, so forms and tests read them the same way.
export type FieldError = FieldIssue;

export function validationFailed(errors: ZodError | FieldError[]): NextResponse {
  const list = Array.isArray(errors) ? errors : formatZodIssues(errors);
  return NextResponse.json({ message: 'Some fields need attention.', errors: list }, { status: 422 });
}

export function errorResponse(status: number, message: string, extra: Record<string, unknown> = {}, headers?: HeadersInit): NextResponse {
  return NextResponse.json({ message, ...extra }, { status, headers });
}

/**
 * Parses a JSON body of at most `limitBytes` (counted as it streams in, 413 past it); a body that is
 * not JSON is the client's mistake (400), never a crash.
 */
export async function readJson(request: Request, limitBytes = JSON_BODY_LIMIT_BYTES): Promise<{ ok: true; value: unknown } | { ok: false; response: NextResponse }> {
  let bytes: Uint8Array;
  try {
    bytes = await readLimitedBytes(request, limitBytes);
  } catch (error) {
    if (error instanceof BodyTooLarge) {
      return { ok: false, response: errorResponse(413, `The request body is larger than ${kilobytes(limitBytes)}, the limit for this request.`, { errors: [{ field: '(body)', message: `larger than ${kilobytes(limitBytes)}` }] }) };
    }
    return { ok: false, response: errorResponse(400, 'The request body could not be read.', { errors: [{ field: '(body)', message: 'unreadable' }] }) };
  }
  try {
    return { ok: true, value: JSON.parse(new TextDecoder().decode(bytes)) };
  } catch {
    return { ok: false, response: errorResponse(400, 'The request body must be valid JSON.', { errors: [{ field: '(body)', message: 'not valid JSON' }] }) };
  }
}
