import { execFileSync } from 'node:child_process';

// The text of a PDF, read by pdf-parse in a plain Node process: its PDF engine loads a worker through a
// dynamic import, which Jest's module sandbox does not allow.
const SCRIPT = `
const { PDFParse } = require(require.resolve('pdf-parse', { paths: [process.cwd()] }));
const chunks = [];
process.stdin.on('data', (c) => chunks.push(c));
process.stdin.on('end', async () => {
  const parser = new PDFParse({ data: new Uint8Array(Buffer.concat(chunks)) });
  const { text } = await parser.getText();
  await parser.destroy();
  process.stdout.write(text);
});`;

export function pdfText(bytes: Buffer): string {
  return execFileSync(process.execPath, ['-e', SCRIPT], { input: bytes, encoding: 'utf8', timeout: 20_000 });
}
