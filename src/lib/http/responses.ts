import { NextResponse } from 'next/server';
import type { ZodError } from 'zod';
import { formatZodIssues, type FieldIssue } from '@/lib/schemas/errors';
import { HttpError } from './errors';
import { BodyTooLarge, JSON_BODY_LIMIT_BYTES, kilobytes, readLimitedBytes } from './body-limit';

// One shape for every error the API answers, so forms and tests read them the same way.
export type FieldError = FieldIssue;

export function validationFailed(errors: ZodError | FieldError[]): NextResponse {
  const list = Array.isArray(errors) ? errors : formatZodIssues(errors);
  return NextResponse.json({ message: 'Some fields need attention.', errors: list }, { status: 422 });
}

export function errorResponse(
  status: number,
  message: string,
  extra: Record<string, unknown> = {},
  headers?: HeadersInit,
): NextResponse {
  return NextResponse.json({ message, ...extra }, { status, headers });
}

/**
 * Parses a JSON body of at most `limitBytes` (counted as it streams in, 413 past it); a body that is
 * not JSON is the client's mistake (400), never a crash. Throws an HttpError for the route kit.
 */
export async function readJsonBody(request: Request, limitBytes = JSON_BODY_LIMIT_BYTES): Promise<unknown> {
  let bytes: Uint8Array;
  try {
    bytes = await readLimitedBytes(request, limitBytes);
  } catch (error) {
    if (error instanceof BodyTooLarge) {
      throw new HttpError(
        413,
        `The request body is larger than ${kilobytes(limitBytes)}, the limit for this request.`,
        { errors: [{ field: '(body)', message: `larger than ${kilobytes(limitBytes)}` }] },
      );
    }
    throw new HttpError(400, 'The request body could not be read.', {
      errors: [{ field: '(body)', message: 'unreadable' }],
    });
  }
  try {
    return JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw new HttpError(400, 'The request body must be valid JSON.', {
      errors: [{ field: '(body)', message: 'not valid JSON' }],
    });
  }
}

/** A 422 to throw: the fields and what is wrong with each. */
export function invalidFields(errors: ZodError | FieldError[]): HttpError {
  return new HttpError(422, 'Some fields need attention.', {
    errors: Array.isArray(errors) ? errors : formatZodIssues(errors),
  });
}
