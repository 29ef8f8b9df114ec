// Local stand-in for the hosted payments API: the small form-encoded subset the app
// uses, shaped so the official `stripe` SDK works against it unchanged
// (new Stripe(key, { host: '127.0.0.1', port: 12111, protocol: 'http' })).
// Plain Node built-ins only, so it runs anywhere `node` does.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { fileURLToPath } from 'node:url';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const env = process.env;
const PORT = Number(env.PAYMENTS_FAKE_PORT ?? 12111);
const HOST = env.PAYMENTS_FAKE_HOST ?? '127.0.0.1';
const API_KEY = env.PAYMENTS_FAKE_API_KEY ?? 'sk_test_local_fake';
const DATA_DIR = path.resolve(repoRoot, env.PAYMENTS_FAKE_DATA_DIR ?? 'var/payments-fake');
const STATE_FILE = path.join(DATA_DIR, 'state.json');
const WEBHOOK_URL = env.PAYMENTS_FAKE_WEBHOOK_URL || null;
const WEBHOOK_SECRET = env.PAYMENTS_FAKE_WEBHOOK_SECRET ?? 'whsec_local_fake';
const WEBHOOK_RETRIES = Number(env.PAYMENTS_FAKE_WEBHOOK_RETRIES ?? 4);
const WEBHOOK_RETRY_MS = Number(env.PAYMENTS_FAKE_WEBHOOK_RETRY_MS ?? 1000);
// The browser and the app may reach the fake under different names (e.g. inside Docker).
const PUBLIC_URL = env.PAYMENTS_FAKE_PUBLIC_URL?.replace(/\/+$/, '') || null;
const API_VERSION = '2026-10-28.endive';
const MAX_BODY_BYTES = 1024 * 1024;
const DAY = 24 * 60 * 60;

// ---------- storage ----------

function loadState() {
  const empty = { sessions: {}, paymentIntents: {}, charges: {}, refunds: {}, events: [], idempotency: {} };
  try {
    return { ...empty, ...JSON.parse(fs.readFileSync(STATE_FILE, 'utf8')) };
  } catch (err) {
    if (err.code === 'ENOENT') return empty;
    throw new Error(`payments-fake: cannot read ${STATE_FILE}: ${err.message}`);
  }
}

// Rename is atomic on one filesystem, so a crash mid-write never leaves half a file.
function save() {
  const cutoff = Date.now() - DAY * 1000;
  for (const [key, entry] of Object.entries(state.idempotency)) if (entry.at < cutoff) delete state.idempotency[key];
  fs.mkdirSync(DATA_DIR, { recursive: true });
  const tmp = `${STATE_FILE}.${process.pid}.tmp`;
  fs.writeFileSync(tmp, JSON.stringify(state, null, 2));
  fs.renameSync(tmp, STATE_FILE);
}

const state = loadState();

// ---------- helpers ----------

class ApiError extends Error {
  constructor(status, message, extra = {}) {
    super(message);
    this.status = status;
    this.body = { error: { type: 'invalid_request_error', message, ...extra } };
  }
}
const missing = (kind, id) => new ApiError(404, `No such ${kind}: '${id}'`, { code: 'resource_missing', param: 'id' });
const paramMissing = (param) =>
  new ApiError(400, `Missing required param: ${param}.`, { code: 'parameter_missing', param });
const paramInvalid = (param, message) => new ApiError(400, message, { code: 'parameter_invalid', param });

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix) => `${prefix}_${crypto.randomBytes(18).toString('base64url').replace(/[-_]/g, '0')}`;

function sendJson(res, status, body, headers = {}) {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, { 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(text), ...headers });
  res.end(text);
}

function sendHtml(res, status, html) {
  res.writeHead(status, {
    'Content-Type': 'text/html; charset=utf-8',
    // No form-action: it would also block the redirect to the app's success_url.
    'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'",
  });
  res.end(html);
}

function redirect(res, location) {
  res.writeHead(303, { Location: location });
  res.end();
}

function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let size = 0;
    req.on('data', (chunk) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        reject(new ApiError(413, 'Request body is too large.'));
        req.destroy();
      } else chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

// Turns `a[b][0][c]=v` pairs (what the SDK sends) into nested objects and arrays.
function parseForm(text) {
  const root = {};
  for (const [key, value] of new URLSearchParams(text)) {
    const head = key.split('[')[0];
    const rest = [...key.slice(head.length).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1]);
    let node = root;
    [head, ...rest].forEach((part, i, parts) => {
      const slot = part === '' ? String(Object.keys(node).length) : part;
      if (i === parts.length - 1) node[slot] = value;
      else node = node[slot] = typeof node[slot] === 'object' ? node[slot] : {};
    });
  }
  const arrayify = (node) => {
    if (typeof node !== 'object') return node;
    const keys = Object.keys(node);
    const isList = keys.length > 0 && keys.every((k) => /^\d+$/.test(k));
    if (isList) return keys.sort((a, b) => a - b).map((k) => arrayify(node[k]));
    return Object.fromEntries(keys.map((k) => [k, arrayify(node[k])]));
  };
  return arrayify(root);
}

function authorize(req) {
  const header = req.headers.authorization ?? '';
  const [scheme, value = ''] = header.split(/\s+/, 2);
  let key = null;
  if (/^bearer$/i.test(scheme)) key = value;
  if (/^basic$/i.test(scheme)) key = Buffer.from(value, 'base64').toString('utf8').split(':')[0];
  if (!key) {
    throw new ApiError(
      401,
      "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    );
  }
  if (key !== API_KEY) throw new ApiError(401, `Invalid API Key provided: ${key.slice(0, 8)}****${key.slice(-4)}`);
  return key;
}

function integer(value, param, { min = 0 } = {}) {
  if (value === undefined) return undefined;
  if (!/^-?\d+$/.test(String(value)) || Number(value) < min) {
    throw paramInvalid(param, `Invalid ${min > 0 ? 'positive ' : 'non-negative '}integer: ${value}`);
  }
  return Number(value);
}

function httpUrl(value, param) {
  if (value === undefined) return null;
  try {
    if (!/^https?:$/.test(new URL(value).protocol)) throw new Error();
  } catch {
    throw new ApiError(400, 'Not a valid URL', { code: 'url_invalid', param });
  }
  return value;
}

function metadata(value, param) {
  if (value === undefined || value === '') return {};
  if (typeof value !== 'object' || Array.isArray(value))
    throw paramInvalid(param, `Invalid object: ${param} must be a hash of strings.`);
  const entries = Object.entries(value);
  if (entries.length > 50) throw paramInvalid(param, 'Metadata can have at most 50 keys.');
  for (const [k, v] of entries) {
    if (typeof v !== 'string') throw paramInvalid(`${param}[${k}]`, 'Metadata values must be strings.');
    if (k.length > 40) throw paramInvalid(`${param}[${k}]`, 'Metadata keys can be at most 40 characters long.');
    if (v.length > 500) throw paramInvalid(`${param}[${k}]`, 'Metadata values can be at most 500 characters long.');
  }
  return value;
}

function rejectUnknown(params, allowed, prefix = '') {
  for (const key of Object.keys(params)) {
    if (!allowed.includes(key)) {
      const param = prefix ? `${prefix}[${key}]` : key;
      throw new ApiError(400, `Received unknown parameter: ${param}`, { code: 'parameter_unknown', param });
    }
  }
}

// ---------- events & webhooks ----------

const retryTimers = new Set();

function sign(body, timestamp) {
  const v1 = crypto.createHmac('sha256', WEBHOOK_SECRET).update(`${timestamp}.${body}`).digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

function recordEvent(type, object, apiVersion) {
  const event = {
    id: newId('evt'),
    object: 'event',
    api_version: apiVersion ?? API_VERSION,
    created: now(),
    data: { object: structuredClone(object) },
    livemode: false,
    pending_webhooks: WEBHOOK_URL ? 1 : 0,
    request: { id: null, idempotency_key: null },
    type,
  };
  const entry = { event, delivery: { status: WEBHOOK_URL ? 'pending' : 'skipped', url: WEBHOOK_URL, attempts: [] } };
  state.events.push(entry);
  save();
  return entry;
}

// One POST, re-signed each time with a fresh timestamp, as the hosted service does.
async function attemptDelivery(entry) {
  const body = JSON.stringify(entry.event, null, 2);
  const attempt = { at: new Date().toISOString(), statusCode: null, error: null };
  try {
    const response = await fetch(WEBHOOK_URL, {
      method: 'POST',
      headers: {
        'Content-Type': 'application/json; charset=utf-8',
        'Stripe-Signature': sign(body, now()),
        'User-Agent': 'payments-fake-webhooks/1',
      },
      body,
      signal: AbortSignal.timeout(5000),
    });
    attempt.statusCode = response.status;
    await response.arrayBuffer();
  } catch (err) {
    attempt.error = err.cause?.code ?? err.message;
  }
  entry.delivery.attempts.push(attempt);
  const ok = attempt.statusCode >= 200 && attempt.statusCode < 300;
  if (ok) {
    entry.delivery.status = 'delivered';
    entry.event.pending_webhooks = 0;
  }
  console.log(
    `[payments-fake] webhook ${entry.event.type} ${entry.event.id} attempt ${entry.delivery.attempts.length} -> ${attempt.statusCode ?? attempt.error}`,
  );
  save();
  return ok;
}

function scheduleRetry(entry) {
  const retriesDone = entry.delivery.attempts.length - 1;
  if (retriesDone >= WEBHOOK_RETRIES) {
    entry.delivery.status = 'failed';
    save();
    return;
  }
  const timer = setTimeout(
    async () => {
      retryTimers.delete(timer);
      if (!(await attemptDelivery(entry))) scheduleRetry(entry);
    },
    WEBHOOK_RETRY_MS * 2 ** retriesDone,
  );
  timer.unref();
  retryTimers.add(timer);
}

// Resolves after the first attempt so callers can wait for the app to have seen the event;
// failures keep retrying in the background with exponential back-off.
async function emit(type, object, apiVersion) {
  const entry = recordEvent(type, object, apiVersion);
  if (WEBHOOK_URL && !(await attemptDelivery(entry))) scheduleRetry(entry);
  return entry;
}

// ---------- resources ----------

function findSession(id) {
  const record = state.sessions[id];
  if (!record) throw missing('checkout.session', id);
  if (record.session.status === 'open' && now() >= record.session.expires_at) {
    expireSession(record);
  }
  return record;
}

function expireSession(record) {
  Object.assign(record.session, { status: 'expired', url: null });
  save();
  emit('checkout.session.expired', record.session, record.apiVersion);
}

function lineItemList(record) {
  return {
    object: 'list',
    data: record.lineItems,
    has_more: false,
    url: `/v1/checkout/sessions/${record.session.id}/line_items`,
  };
}

function expanded(record, expand = []) {
  const session = structuredClone(record.session);
  for (const field of [].concat(expand)) {
    if (field === 'payment_intent') session.payment_intent &&= state.paymentIntents[session.payment_intent];
    else if (field === 'line_items') session.line_items = lineItemList(record);
    else throw paramInvalid('expand', `This property cannot be expanded (${field}).`);
  }
  return session;
}

function createSession(params, req) {
  rejectUnknown(params, [
    'mode',
    'line_items',
    'success_url',
    'cancel_url',
    'customer_email',
    'metadata',
    'client_reference_id',
    'payment_intent_data',
    'expires_at',
    'locale',
    'payment_method_types',
    'submit_type',
    'expand',
  ]);
  if (!params.mode) throw paramMissing('mode');
  if (params.mode !== 'payment')
    throw paramInvalid('mode', `This local fake supports only mode=payment, not ${params.mode}.`);
  if (!Array.isArray(params.line_items) || params.line_items.length === 0) throw paramMissing('line_items');

  const lineItems = params.line_items.map((item, i) => {
    const p = `line_items[${i}]`;
    rejectUnknown(item, ['price_data', 'quantity'], p);
    if (!item.price_data) throw paramMissing(`${p}[price_data]`);
    rejectUnknown(item.price_data, ['currency', 'unit_amount', 'product_data'], `${p}[price_data]`);
    const { currency, unit_amount: unitAmount, product_data: product } = item.price_data;
    if (!currency) throw paramMissing(`${p}[price_data][currency]`);
    if (!/^[a-z]{3}$/i.test(currency))
      throw paramInvalid(`${p}[price_data][currency]`, `Invalid currency: ${currency}.`);
    if (unitAmount === undefined) throw paramMissing(`${p}[price_data][unit_amount]`);
    if (!product?.name) throw paramMissing(`${p}[price_data][product_data][name]`);
    if (item.quantity === undefined) throw paramMissing(`${p}[quantity]`);
    const amount = integer(unitAmount, `${p}[price_data][unit_amount]`);
    const quantity = integer(item.quantity, `${p}[quantity]`, { min: 1 });
    return {
      id: newId('li'),
      object: 'item',
      amount_subtotal: amount * quantity,
      amount_total: amount * quantity,
      currency: currency.toLowerCase(),
      description: product.name,
      quantity,
      price: {
        id: newId('price'),
        object: 'price',
        currency: currency.toLowerCase(),
        unit_amount: amount,
        product: newId('prod'),
      },
    };
  });
  const currency = lineItems[0].currency;
  if (lineItems.some((li) => li.currency !== currency)) {
    throw paramInvalid('line_items', 'All line items must use the same currency.');
  }
  if (params.customer_email !== undefined && !/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(params.customer_email)) {
    throw new ApiError(400, `Invalid email address: ${params.customer_email}`, {
      code: 'email_invalid',
      param: 'customer_email',
    });
  }
  if (params.client_reference_id !== undefined && String(params.client_reference_id).length > 200) {
    throw paramInvalid('client_reference_id', 'client_reference_id can be at most 200 characters long.');
  }
  const intentData = params.payment_intent_data ?? {};
  rejectUnknown(intentData, ['metadata', 'description', 'receipt_email'], 'payment_intent_data');

  const created = now();
  const expiresAt = integer(params.expires_at, 'expires_at') ?? created + DAY;
  if (expiresAt < created + 30 * 60 || expiresAt > created + DAY) {
    throw paramInvalid('expires_at', 'expires_at must be between 30 minutes and 24 hours from now.');
  }
  const total = lineItems.reduce((sum, li) => sum + li.amount_total, 0);
  const id = newId('cs_test');
  const base = PUBLIC_URL ?? `http://${req.headers.host}`;
  const session = {
    id,
    object: 'checkout.session',
    amount_subtotal: total,
    amount_total: total,
    cancel_url: httpUrl(params.cancel_url, 'cancel_url'),
    client_reference_id: params.client_reference_id ?? null,
    created,
    currency,
    customer_details: null,
    customer_email: params.customer_email ?? null,
    expires_at: expiresAt,
    livemode: false,
    locale: params.locale ?? null,
    metadata: metadata(params.metadata, 'metadata'),
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    success_url: httpUrl(params.success_url, 'success_url'),
    url: `${base}/pay/${id}`,
  };
  const record = {
    session,
    lineItems,
    intentData: { ...intentData, metadata: metadata(intentData.metadata, 'payment_intent_data[metadata]') },
    apiVersion: req.headers['stripe-version'] ?? API_VERSION,
  };
  state.sessions[id] = record;
  save();
  return expanded(record, params.expand);
}

// Shared by the hosted page's "Pay" button and the test endpoint.
async function completeSession(record) {
  const { session } = record;
  if (session.status !== 'open') {
    throw new ApiError(400, `This Checkout Session is not open (status: ${session.status}).`, {
      code: 'checkout_session_not_open',
    });
  }
  const created = now();
  const intentId = newId('pi');
  const chargeId = newId('ch');
  const common = {
    amount: session.amount_total,
    currency: session.currency,
    created,
    livemode: false,
    metadata: record.intentData.metadata,
    description: record.intentData.description ?? null,
    receipt_email: record.intentData.receipt_email ?? session.customer_email,
  };
  state.paymentIntents[intentId] = {
    id: intentId,
    object: 'payment_intent',
    ...common,
    amount_capturable: 0,
    amount_received: session.amount_total,
    latest_charge: chargeId,
    payment_method_types: ['card'],
    status: 'succeeded',
  };
  state.charges[chargeId] = {
    id: chargeId,
    object: 'charge',
    ...common,
    amount_captured: session.amount_total,
    amount_refunded: 0,
    captured: true,
    paid: true,
    refunded: false,
    payment_intent: intentId,
    status: 'succeeded',
  };
  Object.assign(session, {
    status: 'complete',
    payment_status: 'paid',
    payment_intent: intentId,
    url: null,
    customer_details: { email: session.customer_email ?? 'test-buyer@example.test', name: null },
  });
  save();
  return emit('checkout.session.completed', session, record.apiVersion);
}

function createRefund(params, req) {
  rejectUnknown(params, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand']);
  let charge;
  if (params.payment_intent) {
    const intent = state.paymentIntents[params.payment_intent];
    if (!intent)
      throw new ApiError(400, `No such payment_intent: '${params.payment_intent}'`, {
        code: 'resource_missing',
        param: 'payment_intent',
      });
    charge = state.charges[intent.latest_charge];
  } else if (params.charge) {
    charge = state.charges[params.charge];
    if (!charge)
      throw new ApiError(400, `No such charge: '${params.charge}'`, { code: 'resource_missing', param: 'charge' });
  } else {
    throw new ApiError(
      400,
      'One of the following params should be provided for this request: payment_intent or charge.',
      { code: 'parameter_missing' },
    );
  }
  if (params.reason !== undefined && !['duplicate', 'fraudulent', 'requested_by_customer'].includes(params.reason)) {
    throw paramInvalid('reason', `Invalid reason: must be one of duplicate, fraudulent, or requested_by_customer`);
  }
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining === 0) {
    throw new ApiError(400, `Charge ${charge.id} has already been refunded.`, { code: 'charge_already_refunded' });
  }
  const amount = integer(params.amount, 'amount', { min: 1 }) ?? remaining;
  if (amount > remaining) {
    throw new ApiError(400, `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining})`, {
      code: 'amount_too_large',
      param: 'amount',
    });
  }
  const refund = {
    id: newId('re'),
    object: 'refund',
    amount,
    charge: charge.id,
    created: now(),
    currency: charge.currency,
    metadata: metadata(params.metadata, 'metadata'),
    payment_intent: charge.payment_intent,
    reason: params.reason ?? null,
    status: 'succeeded',
  };
  state.refunds[refund.id] = refund;
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  save();
  const apiVersion = req.headers['stripe-version'];
  // Not awaited: the API call should not stall on the app's webhook endpoint.
  emit('charge.refunded', charge, apiVersion).then(() => emit('refund.created', refund, apiVersion));
  return refund;
}

// ---------- routes ----------

const expandOf = (query) => parseForm(query).expand;

async function apiRoute(method, pathname, params, query, req) {
  let m;
  if (method === 'POST' && pathname === '/v1/checkout/sessions') return createSession(params, req);
  if ((m = /^\/v1\/checkout\/sessions\/([^/]+)$/.exec(pathname)) && method === 'GET') {
    return expanded(findSession(m[1]), expandOf(query));
  }
  if ((m = /^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/.exec(pathname)) && method === 'GET') {
    return lineItemList(findSession(m[1]));
  }
  if ((m = /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/.exec(pathname)) && method === 'POST') {
    const record = findSession(m[1]);
    if (record.session.status !== 'open') {
      throw new ApiError(
        400,
        `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${record.session.status}".`,
      );
    }
    expireSession(record);
    return expanded(record, params.expand);
  }
  if ((m = /^\/v1\/payment_intents\/([^/]+)$/.exec(pathname)) && method === 'GET') {
    return state.paymentIntents[m[1]] ?? Promise.reject(missing('payment_intent', m[1]));
  }
  if ((m = /^\/v1\/charges\/([^/]+)$/.exec(pathname)) && method === 'GET') {
    return state.charges[m[1]] ?? Promise.reject(missing('charge', m[1]));
  }
  if (method === 'POST' && pathname === '/v1/refunds') return createRefund(params, req);
  if ((m = /^\/v1\/refunds\/([^/]+)$/.exec(pathname)) && method === 'GET') {
    return state.refunds[m[1]] ?? Promise.reject(missing('refund', m[1]));
  }
  if ((m = /^\/v1\/events\/([^/]+)$/.exec(pathname)) && method === 'GET') {
    return state.events.find((e) => e.event.id === m[1])?.event ?? Promise.reject(missing('event', m[1]));
  }
  throw new ApiError(
    404,
    `Unrecognized request URL (${method}: ${pathname}). This local fake supports only the checkout, payment intent, charge, refund and event calls listed in its README.`,
  );
}

async function handleApi(req, res, url) {
  const requestId = newId('req');
  const headers = { 'Request-Id': requestId };
  const apiKey = authorize(req);
  const raw = req.method === 'POST' ? await readBody(req) : '';
  const params = parseForm(raw);
  const idemKey = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
  const slot = idemKey && `${apiKey}:${idemKey}`;
  const fingerprint = `${req.method} ${url.pathname} ${raw}`;

  const previous = slot && state.idempotency[slot];
  if (previous) {
    if (previous.fingerprint !== fingerprint) {
      throw new ApiError(
        400,
        `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idemKey}' if you meant to execute a different request.`,
        { type: 'idempotency_error' },
      );
    }
    return sendJson(res, previous.status, previous.body, {
      ...headers,
      'Idempotent-Replayed': 'true',
      'Idempotency-Key': idemKey,
    });
  }

  let status = 200;
  let body;
  try {
    body = await apiRoute(req.method, url.pathname, params, url.search.slice(1), req);
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    status = err.status;
    body = err.body;
  }
  // Errors are cached too, so a retried request gets the same verdict, not a second attempt.
  if (slot) {
    state.idempotency[slot] = { fingerprint, status, body, at: Date.now() };
    save();
    headers['Idempotency-Key'] = idemKey;
  }
  sendJson(res, status, body, headers);
}

// ---------- hosted checkout page ----------

const escapeHtml = (value) => String(value ?? '').replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function money(amount, currency) {
  try {
    const digits = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits;
    return new Intl.NumberFormat('en', { style: 'currency', currency }).format(amount / 10 ** digits);
  } catch {
    return `${amount} ${currency.toUpperCase()}`;
  }
}

function page(title, content) {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; background: #f3f1ec; color: #222; display: grid; place-items: center; min-height: 100vh; margin: 0; }
  .card { background: #fff; border: 2px dashed #b59b5a; border-radius: 8px; padding: 1.5rem 2rem; width: min(28rem, 90vw); }
  .badge { display: inline-block; background: #b59b5a; color: #fff; font-size: .75rem; padding: .1rem .5rem; border-radius: 4px; }
  .total { font-size: 2rem; font-weight: 700; margin: .5rem 0; } table { width: 100%; border-collapse: collapse; margin: 1rem 0; }
  td { padding: .25rem 0; border-bottom: 1px solid #eee; } td:last-child { text-align: right; }
  form { display: inline; } button { font: inherit; padding: .6rem 1.2rem; border-radius: 6px; border: 1px solid #555; cursor: pointer; margin-right: .5rem; }
  button.pay { background: #2d5a3d; color: #fff; border-color: #2d5a3d; } .muted { color: #777; font-size: .875rem; }
</style></head><body><main class="card"><span class="badge">TEST MODE · no real money moves</span>${content}</main></body></html>`;
}

function checkoutPage(record) {
  const { session, lineItems } = record;
  const rows = lineItems
    .map(
      (li) =>
        `<tr><td>${escapeHtml(li.description)} × ${li.quantity}</td><td>${escapeHtml(money(li.amount_total, li.currency))}</td></tr>`,
    )
    .join('');
  const id = encodeURIComponent(session.id);
  const actions =
    session.status === 'open'
      ? `<form method="post" action="/pay/${id}/complete"><button class="pay" type="submit">Pay (test card)</button></form>
       <form method="post" action="/pay/${id}/cancel"><button type="submit">Cancel</button></form>`
      : `<p><strong>This checkout is ${escapeHtml(session.status)}${session.payment_status === 'paid' ? ' and paid' : ''}.</strong></p>`;
  return page(
    'Test checkout',
    `
    <h1>Deposit</h1>
    <div class="total">${escapeHtml(money(session.amount_total, session.currency))}</div>
    ${session.customer_email ? `<p class="muted">Receipt to ${escapeHtml(session.customer_email)}</p>` : ''}
    <table>${rows}</table>
    ${actions}
    <p class="muted">Session <code>${escapeHtml(session.id)}</code></p>`,
  );
}

async function hostedRoute(req, res, pathname) {
  const m = /^\/pay\/([^/]+)(\/complete|\/cancel)?$/.exec(pathname);
  const record = m && state.sessions[decodeURIComponent(m[1])];
  if (!record)
    return sendHtml(
      res,
      404,
      page('Not found', '<h1>Checkout not found</h1><p>This link is unknown to the local payments fake.</p>'),
    );
  const { session } = findSession(record.session.id);
  const action = m[2];
  if (!action && req.method === 'GET') return sendHtml(res, 200, checkoutPage(record));
  if (req.method !== 'POST') return sendHtml(res, 405, page('Not allowed', '<h1>Method not allowed</h1>'));

  const ownPage = `/pay/${encodeURIComponent(session.id)}`;
  if (action === '/cancel') return redirect(res, session.cancel_url ?? ownPage);
  // A second click on "Pay" should land where the first one did, not fail.
  if (session.status === 'open') await completeSession(record);
  if (session.status !== 'complete') return sendHtml(res, 409, checkoutPage(record));
  redirect(res, session.success_url ? session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id) : ownPage);
}

// ---------- test-only JSON endpoints ----------

async function testRoute(req, res, pathname) {
  const m = /^\/_test\/sessions\/([^/]+)\/complete$/.exec(pathname);
  if (m && req.method === 'POST') {
    const entry = await completeSession(findSession(decodeURIComponent(m[1])));
    return sendJson(res, 200, entry);
  }
  if (pathname === '/_test/events' && req.method === 'GET') {
    return sendJson(res, 200, { object: 'list', data: state.events.slice().reverse() });
  }
  throw new ApiError(404, `Unknown test endpoint (${req.method}: ${pathname}).`);
}

// ---------- server ----------

async function route(req, res) {
  const url = new URL(req.url, 'http://localhost');
  const { pathname } = url;
  if (pathname === '/health' && req.method === 'GET') return sendJson(res, 200, { status: 'ok' });
  if (pathname.startsWith('/v1/')) return handleApi(req, res, url);
  if (pathname.startsWith('/pay/')) return hostedRoute(req, res, pathname);
  if (pathname.startsWith('/_test/')) return testRoute(req, res, pathname);
  throw new ApiError(404, `Unrecognized request URL (${req.method}: ${pathname}).`);
}

const server = http.createServer((req, res) => {
  const started = Date.now();
  res.on('finish', () => {
    console.log(
      `[payments-fake] ${new Date().toISOString()} ${req.method} ${req.url} ${res.statusCode} ${Date.now() - started}ms`,
    );
  });
  route(req, res).catch((err) => {
    if (res.headersSent) return res.destroy();
    if (err instanceof ApiError) return sendJson(res, err.status, err.body);
    console.error('[payments-fake] unexpected error', err);
    sendJson(res, 500, { error: { type: 'api_error', message: 'Internal error in the local payments fake.' } });
  });
});

server.listen(PORT, HOST, () => {
  const { port } = server.address();
  console.log(
    `[payments-fake] listening on http://${HOST}:${port} (data: ${STATE_FILE}, webhooks: ${WEBHOOK_URL ?? 'off'})`,
  );
  // Deliveries interrupted by a restart pick up where they left off.
  if (WEBHOOK_URL) state.events.filter((e) => e.delivery.status === 'pending').forEach(scheduleRetry);
});

function shutdown(signal) {
  console.log(`[payments-fake] ${signal} received, shutting down`);
  retryTimers.forEach(clearTimeout);
  server.close(() => process.exit(0));
  server.closeAllConnections();
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
