import http from 'node:http';

// An upload the server must refuse from its declared size alone. The client sends the headers (with
// the large Content-Length) and the start of the body, then waits: a client still pumping megabytes
// when the server answers and closes gets EPIPE or a reset that can swallow the answer, which made the
// 2 MB import test fail now and then on a busy machine. Waiting is also what a careful client does.
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
