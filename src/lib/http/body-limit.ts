// Request bodies are counted while they stream in and refused at the limit (413), so a 60 MB post is
// never buffered or parsed: a declared Content-Length over the limit is refused before one byte is
// read, and a chunked body is cut off as soon as it passes the limit.

/** JSON bodies of the API; a route that needs more passes its own limit. */
export const JSON_BODY_LIMIT_BYTES = 256 * 1024;

export class BodyTooLarge extends Error {
  constructor(readonly limitBytes: number) {
    super(`the body is larger than ${limitBytes} bytes`);
  }
}

export function declaredTooLarge(request: Request, limitBytes: number): boolean {
  const declared = Number(request.headers.get('content-length') ?? '');
  return Number.isFinite(declared) && declared > limitBytes;
}

/**
 * The body as a stream that errors with BodyTooLarge once more than `limitBytes` have arrived;
 * `passedLimit()` says so even when a consumer (formData) wraps the error in its own.
 */
export function limitedBody(
  request: Request,
  limitBytes: number,
): { stream: ReadableStream<Uint8Array> | null; passedLimit: () => boolean } {
  let seen = 0;
  const passedLimit = () => seen > limitBytes;
  if (!request.body) return { stream: null, passedLimit };
  const stream = request.body.pipeThrough(
    new TransformStream<Uint8Array, Uint8Array>({
      transform(chunk, controller) {
        seen += chunk.byteLength;
        if (seen > limitBytes) controller.error(new BodyTooLarge(limitBytes));
        else controller.enqueue(chunk);
      },
    }),
  );
  return { stream, passedLimit };
}

/** All of the body as bytes, or BodyTooLarge (thrown) past the limit. */
export async function readLimitedBytes(request: Request, limitBytes: number): Promise<Uint8Array> {
  if (declaredTooLarge(request, limitBytes)) throw new BodyTooLarge(limitBytes);
  const { stream } = limitedBody(request, limitBytes);
  if (!stream) return new Uint8Array(0);
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = stream.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    total += value.byteLength;
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}

export function kilobytes(bytes: number): string {
  return `${Math.round(bytes / 1024)} kB`;
}
