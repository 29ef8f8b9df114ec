import { HttpError } from './errors';

/** A record id from the path: 1 to 10 digits, a safe integer above zero; anything else is "no such record" (404). */
export function idFromParam(raw: string | undefined, label: string): number {
  const text = raw ?? '';
  const n = Number(text);
  if (!/^\d{1,10}$/.test(text) || !Number.isSafeInteger(n) || n < 1)
    throw new HttpError(404, `No ${label} with id ${text}.`);
  return n;
}
