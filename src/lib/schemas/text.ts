import { z } from 'zod';

// The one base for every free-text field. JSON can carry text that the database cannot store (an
// unpaired UTF-16 surrogate such as "\ud800" breaks utf8mb4 and the JSON CHECK constraints) or that
// is dangerous further on (NUL, terminal escapes, CR/LF that could split an e-mail header). Such text
// is refused here with a 422 naming the field, so it never reaches a query or a mail header.

const UNPAIRED_SURROGATE = /\p{Cs}/u;
// C0 controls except tab and line feed, DEL, and the C1 block.
const CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;
const LINE_BREAK = /[\n\u2028\u2029]/;

type TextOptions = {
  /** Keeps line breaks (notes, policies); CRLF and lone CR become LF first. Single-line text refuses them. */
  multiline?: boolean;
  /** Trims surrounding white space before the checks (default true; trailing newlines are not an error). */
  trim?: boolean;
  /** The message when the value is missing or not a string; default "<label> is required / must be text". */
  error?: string | ((issue: { input?: unknown }) => string);
};

/** Why a value is refused, or null when it is safe text of the given kind. */
export function unsafeTextReason(value: string, multiline = false): string | null {
  if (UNPAIRED_SURROGATE.test(value)) return 'holds a broken character (an unpaired surrogate)';
  if (value.includes('\u0000')) return 'holds a NUL character';
  if (CONTROL.test(value) || (!multiline && value.includes('\r'))) return 'holds a control character';
  if (!multiline && LINE_BREAK.test(value)) return 'must be on one line';
  return null;
}

/** Line breaks as LF only, so "\r" never survives into stored text or an e-mail. */
export function normaliseNewlines(value: string): string {
  return value.replace(/\r\n?/g, '\n');
}

/**
 * A string field that only ever holds storable, printable text. Chain the usual checks after it:
 * `text('name').min(1, ...).max(120, ...)`.
 */
export function text(label: string, options: TextOptions = {}) {
  const { multiline = false, trim = true } = options;
  const error =
    options.error ??
    ((issue: { input?: unknown }) => (issue.input === undefined ? `${label} is required` : `${label} must be text`));
  let schema = z.string({ error });
  if (multiline) schema = schema.overwrite(normaliseNewlines);
  if (trim) schema = schema.trim();
  return schema.superRefine((value, ctx) => {
    const reason = unsafeTextReason(value, multiline);
    if (reason) ctx.addIssue({ code: 'custom', message: `${label} ${reason}`, input: value });
  });
}
