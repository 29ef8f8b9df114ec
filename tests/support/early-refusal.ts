import http from 'node:http';

// A body the server must refuse from its declared size alone. The client sends the headers (with
// the large Content-Length) and the start of the body, then waits, as a careful client does. A client
// still pumping megabytes when the server answers and closes gets EPIPE, or a reset that can swallow
// the answer: the 2 MB import test failed that way now and then on a busy machine, and once an EPIPE
// arriving after its test had passed (most likely the 60 MB lead post or the 2 MB webhook, the last
// bodies written before it) crashed the whole in-band jest run.
export function postDeclaringSize(
  url: string,
  headers: Record<string, string>,
  bodyStart: Buffer,
  declaredBytes: number,
): Promise<{ status: number; json: { message?: string } }> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: 'POST', headers: { ...headers, 'Content-Length': String(declaredBytes) } });
    req.on('response', (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (text += chunk));
      res.on('end', () => {
        req.destroy();
        try {
          resolve({ status: res.statusCode ?? 0, json: JSON.parse(text) as { message?: string } });
        } catch (error) {
          reject(error);
        }
      });
    });
    req.on('error', reject);
    req.write(bodyStart);
  });
}
