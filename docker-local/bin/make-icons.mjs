// node docker-local/bin/make-icons.mjs — redraws public/'s icons from src/app/icon.svg (the one mark) with
// Debian's chromium: favicon.ico (16, 32 and 48 px PNGs in one ICO), apple-touch-icon.png (180 px) and the web
// manifest's 192 and 512 px icons. Run it after changing icon.svg and commit what it writes.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const svg = fs.readFileSync(path.join(ROOT, 'src/app/icon.svg'), 'utf8');
// Full-bleed variant for the home-screen icons: the platform rounds the corners itself.
const square = svg.replace(/ rx="6"/, '');
const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
  args: ['--no-sandbox'],
});
const page = await browser.newPage({ deviceScaleFactor: 1 });
const shot = async (src, size) => {
  await page.setViewportSize({ width: size, height: size });
  await page.setContent(
    `<html><body style="margin:0;background:transparent">${src.replace('<svg ', `<svg width="${size}" height="${size}" `)}</body></html>`,
  );
  return page.screenshot({ omitBackground: true, clip: { x: 0, y: 0, width: size, height: size } });
};
const out = path.join(ROOT, 'public');
const ico = [];
for (const size of [16, 32, 48]) ico.push([size, await shot(svg, size)]);
fs.writeFileSync(path.join(out, 'apple-touch-icon.png'), await shot(square, 180));
fs.writeFileSync(path.join(out, 'icon-192.png'), await shot(square, 192));
fs.writeFileSync(path.join(out, 'icon-512.png'), await shot(square, 512));
await browser.close();
// ICO: 6-byte header, one 16-byte entry per image, then the PNG bytes (Vista+ and every browser read PNG entries).
const header = Buffer.alloc(6);
header.writeUInt16LE(0, 0);
header.writeUInt16LE(1, 2);
header.writeUInt16LE(ico.length, 4);
let offset = 6 + 16 * ico.length;
const entries = ico.map(([size, png]) => {
  const e = Buffer.alloc(16);
  e.writeUInt8(size % 256, 0);
  e.writeUInt8(size % 256, 1);
  e.writeUInt8(0, 2);
  e.writeUInt8(0, 3);
  e.writeUInt16LE(1, 4);
  e.writeUInt16LE(32, 6);
  e.writeUInt32LE(png.length, 8);
  e.writeUInt32LE(offset, 12);
  offset += png.length;
  return e;
});
fs.writeFileSync(path.join(out, 'favicon.ico'), Buffer.concat([header, ...entries, ...ico.map(([, png]) => png)]));
