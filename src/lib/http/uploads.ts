import { BodyTooLarge, limitedBody } from '@/lib/http/body-limit';
import { HttpError } from '@/lib/http/errors';
import { invalidFields } from '@/lib/http/responses';

// Reading one uploaded file from a multipart body, with the size refused before the body is read when
// the client says how big it is, and counted while it streams in when it does not (chunked): either
// way a body past the limit answers 413 without being read to the end; not multipart at all is 415.
// Refusals are thrown as HttpError, which the route kit answers.

const MULTIPART_OVERHEAD = 64 * 1024;

export type Upload = { file: File; bytes: Buffer; form: FormData };

export function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(bytes % (1024 * 1024) === 0 ? 0 : 1)} MB`;
}

export async function readUpload(request: Request, maxBytes: number, what: string): Promise<Upload> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) {
    throw new HttpError(415, `Send the ${what} as a multipart form with the file in a field named "file".`, {
      errors: [{ field: 'file', message: 'expected multipart/form-data' }],
    });
  }
  const tooLarge = () =>
    new HttpError(
      413,
      `That file is larger than ${megabytes(maxBytes)}; the ${what} limit is ${megabytes(maxBytes)}.`,
      { errors: [{ field: 'file', message: `larger than ${megabytes(maxBytes)}` }] },
    );
  const declared = Number(request.headers.get('content-length') ?? '');
  if (Number.isFinite(declared) && declared > maxBytes + MULTIPART_OVERHEAD) throw tooLarge();
  let form: FormData;
  const body = limitedBody(request, maxBytes + MULTIPART_OVERHEAD);
  try {
    form = await new Response(body.stream, { headers: { 'content-type': type } }).formData();
  } catch (error) {
    if (error instanceof BodyTooLarge || body.passedLimit()) throw tooLarge();
    throw new HttpError(400, 'The upload could not be read as a multipart form.', {
      errors: [{ field: 'file', message: 'unreadable multipart body' }],
    });
  }
  const file = form.get('file');
  if (!(file instanceof File))
    throw invalidFields([{ field: 'file', message: `choose a ${what} to upload (field "file")` }]);
  if (file.size > maxBytes) throw tooLarge();
  if (file.size === 0) throw invalidFields([{ field: 'file', message: 'the file is empty' }]);
  return { file, bytes: Buffer.from(await file.arrayBuffer()), form };
}
