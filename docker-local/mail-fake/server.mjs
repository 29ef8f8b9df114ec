// Local stand-in for the hosted e-mail API, shaped so the official `resend` SDK
// works against it unchanged (RESEND_BASE_URL=http://127.0.0.1:4025).
// Plain Node built-ins only, so it runs anywhere `node` does.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { fileURLToPath } from 'node:url';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const PORT = Number(process.env.MAIL_FAKE_PORT ?? 4025);
const HOST = process.env.MAIL_FAKE_HOST ?? '127.0.0.1';
const API_KEY = process.env.MAIL_FAKE_API_KEY ?? 're_test_local';
const DATA_DIR = path.resolve(repoRoot, process.env.MAIL_FAKE_DATA_DIR ?? 'var/mail-fake');
const STORE_FILE = path.join(DATA_DIR, 'messages.json');
const MAX_BODY_BYTES = 10 * 1024 * 1024;
const MAX_BATCH = 100;

// ---------- storage ----------

function loadMessages() {
  try {
    return JSON.parse(fs.readFileSync(STORE_FILE, 'utf8')).messages ?? [];
  } catch (err) {
    if (err.code === 'ENOENT') return [];
    throw new Error(`mail-fake: cannot read ${STORE_FILE}: ${err.message}`);
  }
}

// Rename is atomic on one filesystem, so a crash mid-write never leaves half a file.
function saveMessages() {
  fs.mkdirSync(DATA_DIR, { recursive: true });
  const tmp = `${STORE_FILE}.${process.pid}.tmp`;
  fs.writeFileSync(tmp, JSON.stringify({ messages }, null, 2));
  fs.renameSync(tmp, STORE_FILE);
}

let messages = loadMessages(); // oldest first; reversed when listed
// Replays are only promised within one run; a restart forgets keys.
const idempotent = new Map();

// ---------- helpers ----------

class ApiError extends Error {
  constructor(statusCode, name, message) {
    super(message);
    this.statusCode = statusCode;
    this.name = name;
  }
}

function sendJson(res, status, body) {
  const text = JSON.stringify(body);
  res.writeHead(status, {
    'Content-Type': 'application/json; charset=utf-8',
    'Content-Length': Buffer.byteLength(text),
  });
  res.end(text);
}

function sendError(res, err) {
  sendJson(res, err.statusCode, { statusCode: err.statusCode, name: err.name, message: err.message });
}

function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let size = 0;
    req.on('data', (chunk) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        reject(new ApiError(413, 'validation_error', 'Request body is too large.'));
        req.destroy();
      } else chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function parseJson(text) {
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError(422, 'validation_error', 'Request body must be valid JSON.');
  }
}

function authorize(req) {
  const header = req.headers.authorization ?? '';
  const match = /^Bearer\s+(.+)$/i.exec(header);
  if (!match) {
    throw new ApiError(
      401,
      'missing_api_key',
      'Missing API key in the authorization header. Include the following header in the request: Authorization: Bearer YOUR_API_KEY',
    );
  }
  if (match[1].trim() !== API_KEY) throw new ApiError(403, 'invalid_api_key', 'API key is invalid');
}

const listOf = (value) => (value == null ? [] : Array.isArray(value) ? value : [value]);
// Accepts both `a@b.c` and `Name <a@b.c>`; returns the bare address or null.
function addressOf(value) {
  if (typeof value !== 'string') return null;
  const match =
    /<([^<>\s]+@[^<>\s]+\.[^<>\s]+)>\s*$/.exec(value) ?? /^\s*([^<>\s]+@[^<>\s]+\.[^<>\s]+)\s*$/.exec(value);
  return match ? match[1].toLowerCase() : null;
}

function validateEmail(body) {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw new ApiError(422, 'validation_error', 'Request body must be a JSON object.');
  }
  for (const field of ['from', 'to', 'subject']) {
    const value = body[field];
    if (value == null || value === '' || (Array.isArray(value) && value.length === 0)) {
      throw new ApiError(422, 'missing_required_field', `Missing \`${field}\` field.`);
    }
  }
  if (!body.html && !body.text) throw new ApiError(422, 'missing_required_field', 'Missing `html` or `text` field.');
  if (!addressOf(body.from)) {
    throw new ApiError(
      422,
      'validation_error',
      'Invalid `from` field. The email address needs to follow the `email@example.com` or `Name <email@example.com>` format.',
    );
  }
  for (const field of ['to', 'cc', 'bcc', 'reply_to']) {
    const list = listOf(body[field]);
    if (list.length > 50) throw new ApiError(422, 'validation_error', `Too many recipients in \`${field}\` (max 50).`);
    const bad = list.find((entry) => !addressOf(entry));
    if (bad !== undefined) {
      throw new ApiError(
        422,
        'validation_error',
        `Invalid \`${field}\` field. ${JSON.stringify(bad)} is not a valid email address.`,
      );
    }
  }
  if (typeof body.subject !== 'string')
    throw new ApiError(422, 'validation_error', 'Invalid `subject` field. Expected a string.');
}

function toStored(body) {
  return {
    id: crypto.randomUUID(),
    from: body.from,
    to: listOf(body.to),
    cc: listOf(body.cc),
    bcc: listOf(body.bcc),
    replyTo: listOf(body.reply_to),
    subject: body.subject,
    html: body.html ?? null,
    text: body.text ?? null,
    headers: body.headers ?? {},
    tags: body.tags ?? [],
    // Contents are dropped: the inbox only needs to show that something was attached.
    attachments: listOf(body.attachments).map((a) => ({
      filename: a?.filename ?? null,
      size: a?.content?.length ?? 0,
    })),
    scheduledAt: body.scheduled_at ?? null,
    createdAt: new Date().toISOString(),
  };
}

// Same key + same body replays the first answer; a different body is a client bug worth surfacing.
async function withIdempotency(req, rawBody, handler) {
  const key = req.headers['idempotency-key'];
  if (!key) return handler();
  const fingerprint = `${req.method} ${req.url} ${crypto.createHash('sha256').update(rawBody).digest('hex')}`;
  const previous = idempotent.get(key);
  if (previous) {
    if (previous.fingerprint !== fingerprint) {
      throw new ApiError(
        409,
        'invalid_idempotent_request',
        'Same idempotency key used with a different request payload. Change your idempotency key or payload.',
      );
    }
    return previous.result;
  }
  const result = handler();
  idempotent.set(key, { fingerprint, result });
  return result;
}

function apiView(m) {
  return {
    object: 'email',
    id: m.id,
    from: m.from,
    to: m.to,
    cc: m.cc,
    bcc: m.bcc,
    reply_to: m.replyTo,
    subject: m.subject,
    html: m.html,
    text: m.text,
    tags: m.tags,
    created_at: m.createdAt,
    scheduled_at: m.scheduledAt,
    last_event: 'delivered',
  };
}

function listView(m) {
  return {
    id: m.id,
    from: m.from,
    to: m.to,
    cc: m.cc,
    subject: m.subject,
    html: m.html,
    text: m.text,
    attachments: m.attachments ?? [],
    createdAt: m.createdAt,
  };
}

function newestFirst(to) {
  const wanted = to ? (addressOf(to) ?? to.toLowerCase()) : null;
  return messages
    .filter((m) => !wanted || [...m.to, ...m.cc, ...m.bcc].some((r) => addressOf(r) === wanted))
    .slice()
    .reverse();
}

// ---------- inbox page ----------

const escapeHtml = (value) => String(value ?? '').replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function inboxPage(selectedId, to) {
  const list = newestFirst(to);
  const selected = messages.find((m) => m.id === selectedId) ?? null;
  const query = to ? `&to=${encodeURIComponent(to)}` : '';
  const items = list
    .map(
      (m) => `
      <li class="${m.id === selectedId ? 'on' : ''}"><a href="/?id=${encodeURIComponent(m.id)}${query}">
        <strong>${escapeHtml(m.subject)}</strong><br>
        <small>${escapeHtml(m.to.join(', '))} · ${escapeHtml(m.createdAt)}</small></a></li>`,
    )
    .join('');
  let detail = '<p class="muted">Select a message.</p>';
  if (selected) {
    // sandbox="" (no allow-scripts, no allow-same-origin) keeps mail HTML from running code or reading this page.
    const body =
      selected.html != null
        ? `<iframe sandbox="" srcdoc="${escapeHtml(selected.html)}" title="message body"></iframe>`
        : `<pre>${escapeHtml(selected.text)}</pre>`;
    detail = `
      <h2>${escapeHtml(selected.subject)}</h2>
      <dl><dt>From</dt><dd>${escapeHtml(selected.from)}</dd>
      <dt>To</dt><dd>${escapeHtml(selected.to.join(', '))}</dd>
      ${selected.cc.length ? `<dt>Cc</dt><dd>${escapeHtml(selected.cc.join(', '))}</dd>` : ''}
      <dt>Date</dt><dd>${escapeHtml(selected.createdAt)}</dd>
      <dt>Id</dt><dd><code>${escapeHtml(selected.id)}</code></dd></dl>
      ${body}
      ${selected.html != null && selected.text ? `<details><summary>Plain-text part</summary><pre>${escapeHtml(selected.text)}</pre></details>` : ''}`;
  }
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Local mail (${list.length})</title>
<style>
  body { margin: 0; font: 14px/1.4 system-ui, sans-serif; display: grid; grid-template-columns: 22rem 1fr; height: 100vh; }
  nav { border-right: 1px solid #ccc; overflow: auto; } nav h1 { font-size: 1rem; padding: 0 .75rem; }
  ul { list-style: none; margin: 0; padding: 0; } li a { display: block; padding: .5rem .75rem; color: inherit; text-decoration: none; border-bottom: 1px solid #eee; }
  li.on a, li a:hover { background: #eef3ff; } main { padding: 1rem 1.5rem; overflow: auto; }
  dl { display: grid; grid-template-columns: 4rem 1fr; gap: .2rem; } dt { color: #666; } dd { margin: 0; }
  iframe { width: 100%; height: 60vh; border: 1px solid #ccc; } pre { white-space: pre-wrap; } .muted { color: #888; }
</style></head>
<body><nav><h1>Local mail · ${list.length} message${list.length === 1 ? '' : 's'}${to ? ` to ${escapeHtml(to)}` : ''}</h1>
<ul>${items || '<li class="muted" style="padding:.75rem">No messages yet.</li>'}</ul></nav>
<main>${detail}</main></body></html>`;
}

// ---------- routes ----------

async function route(req, res) {
  const url = new URL(req.url, 'http://localhost');
  const { pathname } = url;
  const method = req.method;

  if (method === 'GET' && pathname === '/health') return sendJson(res, 200, { status: 'ok' });

  if (method === 'GET' && pathname === '/') {
    const html = inboxPage(url.searchParams.get('id'), url.searchParams.get('to'));
    res.writeHead(200, {
      'Content-Type': 'text/html; charset=utf-8',
      'Content-Security-Policy': "script-src 'none'; object-src 'none'; base-uri 'none'; form-action 'none'",
    });
    return res.end(html);
  }

  // Inspection endpoints for people and tests; deliberately unauthenticated.
  if (pathname === '/messages') {
    if (method === 'GET') return sendJson(res, 200, newestFirst(url.searchParams.get('to')).map(listView));
    if (method === 'DELETE') {
      const deleted = messages.length;
      messages = [];
      idempotent.clear();
      saveMessages();
      return sendJson(res, 200, { deleted });
    }
  }

  if (method === 'POST' && pathname === '/emails') {
    authorize(req);
    const raw = await readBody(req);
    const body = parseJson(raw);
    const result = await withIdempotency(req, raw, () => {
      validateEmail(body);
      const stored = toStored(body);
      messages.push(stored);
      saveMessages();
      return { id: stored.id };
    });
    return sendJson(res, 200, result);
  }

  if (method === 'POST' && pathname === '/emails/batch') {
    authorize(req);
    const raw = await readBody(req);
    const body = parseJson(raw);
    if (!Array.isArray(body)) throw new ApiError(422, 'validation_error', 'Batch body must be a JSON array of emails.');
    if (body.length > MAX_BATCH)
      throw new ApiError(422, 'validation_error', `A batch may hold at most ${MAX_BATCH} emails.`);
    const permissive = req.headers['x-batch-validation'] === 'permissive';
    const result = await withIdempotency(req, raw, () => {
      const errors = [];
      const valid = [];
      body.forEach((email, index) => {
        try {
          validateEmail(email);
          valid.push(email);
        } catch (err) {
          if (!(err instanceof ApiError)) throw err;
          errors.push({ index, message: err.message });
        }
      });
      // Strict mode is all-or-nothing, matching the hosted API's default.
      if (errors.length && !permissive)
        throw new ApiError(422, 'validation_error', `emails[${errors[0].index}]: ${errors[0].message}`);
      const stored = valid.map(toStored);
      messages.push(...stored);
      if (stored.length) saveMessages();
      return permissive
        ? { data: stored.map(({ id }) => ({ id })), errors }
        : { data: stored.map(({ id }) => ({ id })) };
    });
    return sendJson(res, 200, result);
  }

  const emailMatch = /^\/emails\/([^/]+)$/.exec(pathname);
  if (method === 'GET' && emailMatch) {
    authorize(req);
    const found = messages.find((m) => m.id === decodeURIComponent(emailMatch[1]));
    if (!found) throw new ApiError(404, 'not_found', 'Email not found');
    return sendJson(res, 200, apiView(found));
  }

  const known = ['/', '/health', '/messages', '/emails', '/emails/batch'].includes(pathname) || emailMatch;
  if (known) throw new ApiError(405, 'method_not_allowed', 'Method is not allowed for the requested path.');
  throw new ApiError(404, 'not_found', 'The requested endpoint does not exist.');
}

const server = http.createServer((req, res) => {
  const started = Date.now();
  res.on('finish', () => {
    console.log(
      `[mail-fake] ${new Date().toISOString()} ${req.method} ${req.url} ${res.statusCode} ${Date.now() - started}ms`,
    );
  });
  route(req, res).catch((err) => {
    if (res.headersSent) return res.destroy();
    if (err instanceof ApiError) return sendError(res, err);
    console.error('[mail-fake] unexpected error', err);
    sendError(res, new ApiError(500, 'application_error', 'Internal server error.'));
  });
});

server.listen(PORT, HOST, () => {
  const { port } = server.address();
  console.log(`[mail-fake] listening on http://${HOST}:${port} (data: ${STORE_FILE}, ${messages.length} stored)`);
});

function shutdown(signal) {
  console.log(`[mail-fake] ${signal} received, shutting down`);
  server.close(() => process.exit(0));
  server.closeAllConnections();
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
