import type { FieldIssue } from '@/lib/schemas/errors';

/**
 * The one way a handler (or anything it calls) refuses a request: throw an HttpError and the route
 * wrapper answers `{ message, ...extra }` with its status. `fields` become the usual `errors` list.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: Record<string, unknown> & { errors?: FieldIssue[] } = {},
    readonly headers?: HeadersInit,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export function notFound(label: string, id: number | string): HttpError {
  return new HttpError(404, `No ${label} with id ${id}.`);
}
