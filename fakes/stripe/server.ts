// Local stand-in for the parts of the Stripe API that Tidewarden uses, plus hosted checkout and billing
// portal pages of our own, signed webhook deliveries, and test controls under /__control.
//
//   node --import tsx fakes/stripe/server.ts
//
// Environment:
//   FAKE_STRIPE_PORT         port on 127.0.0.1 (default 12111; 0 picks a free one, printed on start)
//   FAKE_STRIPE_WEBHOOK_URL  the app's webhook endpoint; when unset events are recorded but not posted
//   STRIPE_WEBHOOK_SECRET    signing secret (default whsec_tidewarden_local)
//   FAKE_STRIPE_PUBLIC_URL   base URL browsers use for the hosted pages (default http://127.0.0.1:<port>)
//   FAKE_STRIPE_STATE_FILE   optional JSON file: state is loaded on start and written after every change
//   FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS  back-off between delivery attempts in ms (default: the hosted
//                            service's, 1 min, 5 min, 30 min, 2 h, ... about three days in all)
//
// Webhooks are fire-and-forget: API responses never wait for deliveries. The two browser flows are the
// exception: the checkout pay button and the portal's buttons answer (redirect) only after each event they
// caused has been attempted once (up to REDIRECT_WAIT_MS), so that when the browser lands back on the
// app, the app has already processed the webhooks and shows the new state. Retries continue in the
// background and do not hold the redirect.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { FormParseError, Params, parseForm } from './form';
import { API_VERSION, ApiError, newId, type Json } from './api';
import { Store, type StateFile } from './store';
import { createCustomer, getCustomer, listCustomers, updateCustomer } from './customers';
import { getPrice, listPrices } from './prices';
import { checkoutView, createCheckoutSession, expireCheckoutSession, getCheckoutSession, listCheckoutSessions, payCheckout } from './checkout-sessions';
import { advance, cancelSubscription, createSubscription, getSubscription, listSubscriptions, updateSubscription } from './subscriptions';
import { createPortalSession, portalCancel, portalChangePlan, portalView } from './portal-sessions';
import { invoiceView, listInvoices } from './invoices';
import { eventPayload, listEvents, takeEmitted } from './events';
import { applyExpand } from './expand';
import { checkoutPage, invoicePage, messagePage, portalPage } from './pages';
import { DEFAULT_RETRY_DELAYS_MS, WebhookQueue, type Delivery } from './webhooks';

// ----- configuration --------------------------------------------------------------------------------------

const env = process.env;
const requestedPort = Number(env.FAKE_STRIPE_PORT ?? 12111);
const webhookUrl = env.FAKE_STRIPE_WEBHOOK_URL?.trim() || null;
const webhookSecret = env.STRIPE_WEBHOOK_SECRET?.trim() || 'whsec_tidewarden_local';
const stateFile = env.FAKE_STRIPE_STATE_FILE?.trim() ? path.resolve(env.FAKE_STRIPE_STATE_FILE.trim()) : null;
// Tests shorten the hosted service's three-day schedule with this variable.
const retryDelaysMs = env.FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS?.trim()
  ? env.FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS.split(',')
      .map((s) => s.trim())
      .filter(Boolean)
      .map(Number)
  : DEFAULT_RETRY_DELAYS_MS;
const MAX_BODY_BYTES = 1024 * 1024;
const REDIRECT_WAIT_MS = 15_000;
const LOG_PREFIX = '[fake-stripe]';

if (!Number.isInteger(requestedPort) || requestedPort < 0 || requestedPort > 65535) {
  console.error(`${LOG_PREFIX} FAKE_STRIPE_PORT must be a port number, got ${env.FAKE_STRIPE_PORT}`);
  process.exit(1);
}
if (retryDelaysMs.some((n) => !Number.isFinite(n) || n < 0)) {
  console.error(`${LOG_PREFIX} FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS must be a comma-separated list of milliseconds`);
  process.exit(1);
}

const log = (line: string) => console.log(`${LOG_PREFIX} ${line}`);

// ----- state and persistence ------------------------------------------------------------------------------

const store = new Store(env.FAKE_STRIPE_PUBLIC_URL?.replace(/\/+$/, '') || `http://127.0.0.1:${requestedPort}`);

interface PersistedFile {
  store: StateFile;
  deliveries: Record<string, Delivery>;
}

let saveScheduled = false;

function saveNow(): void {
  if (!stateFile) return;
  const data: PersistedFile = { store: store.toJSON(), deliveries: queue.snapshot() };
  const tmp = `${stateFile}.${process.pid}.tmp`;
  try {
    fs.mkdirSync(path.dirname(stateFile), { recursive: true });
    fs.writeFileSync(tmp, JSON.stringify(data));
    fs.renameSync(tmp, stateFile); // atomic: a crash never leaves half a file
  } catch (error) {
    log(`could not write ${stateFile}: ${(error as Error).message}`);
  }
}

/** Coalesces the many small changes of one request (and of delivery updates) into one write. */
function scheduleSave(): void {
  if (!stateFile || saveScheduled) return;
  saveScheduled = true;
  setImmediate(() => {
    saveScheduled = false;
    saveNow();
  });
}

const queue = new WebhookQueue({
  url: webhookUrl,
  secret: webhookSecret,
  retryDelaysMs,
  timeoutMs: 10_000,
  payloadFor: (id) => eventPayload(store, id),
  onUpdate: () => scheduleSave(),
  log,
});

function loadState(): void {
  if (!stateFile || !fs.existsSync(stateFile)) return;
  const data = JSON.parse(fs.readFileSync(stateFile, 'utf8')) as PersistedFile;
  store.load(data.store);
  queue.restore(data.deliveries ?? {});
  // Deliveries still pending when the fake stopped go on where their schedule left them, in their original order.
  for (const event of store.events) {
    const delivery = data.deliveries?.[event.id as string];
    if (delivery?.state === 'pending') {
      void queue.enqueue(event.id as string, { dueAt: delivery.next_attempt_at ?? Date.now(), attempt: Math.min(delivery.attempts.length, retryDelaysMs.length) });
    }
  }
}

/**
 * Hands the events recorded by the last change to the webhook queue and saves the state. The promise
 * resolves when each of them has been attempted once; API handlers do not wait for it.
 */
function flushEvents(): { ids: string[]; attempted: Promise<void> } {
  const ids = takeEmitted(store);
  const attempts = ids.map((id) => queue.enqueue(id));
  scheduleSave();
  return { ids, attempted: Promise.all(attempts).then(() => undefined) };
}

/** For the browser flows: wait for the first delivery attempts, but never longer than REDIRECT_WAIT_MS. */
function flushEventsAndWait(): Promise<void> {
  return Promise.race([flushEvents().attempted, new Promise<void>((resolve) => setTimeout(resolve, REDIRECT_WAIT_MS).unref())]);
}

// ----- HTTP helpers ---------------------------------------------------------------------------------------

class BodyTooLarge extends Error {}

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        reject(new BodyTooLarge());
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function sendJson(res: http.ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers });
  res.end(text);
}

function sendHtml(res: http.ServerResponse, status: number, html: string): void {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
  res.end(html);
}

function redirect(res: http.ServerResponse, location: string): void {
  res.writeHead(303, { location, 'cache-control': 'no-store' });
  res.end();
}

function errorBody(error: ApiError): Json {
  const body: Json = { type: error.type, message: error.message };
  if (error.code) body.code = error.code;
  if (error.param) body.param = error.param;
  if (error.type === 'card_error') body.decline_code = 'generic_decline';
  return { error: body };
}

/** Maps anything thrown by a handler to an ApiError (400 for bad params, 500 for our own bugs). */
function toApiError(error: unknown): ApiError {
  if (error instanceof ApiError) return error;
  if (error instanceof FormParseError) return new ApiError(400, 'invalid_request_error', error.message, 'parameter_invalid', error.param);
  log(`internal error: ${(error as Error).stack ?? String(error)}`);
  return new ApiError(500, 'api_error', 'The local Stripe stand-in hit an internal error; see its log.');
}

// ----- /v1 API --------------------------------------------------------------------------------------------

interface ApiContext {
  params: Params;
  match: string[];
}

type Handler = (ctx: ApiContext) => Json;

const ID = '([A-Za-z0-9_]+)';

const routes: { method: string; pattern: RegExp; handler: Handler }[] = [];
const route = (method: string, pathPattern: string, handler: Handler) =>
  routes.push({ method, pattern: new RegExp(`^${pathPattern}$`), handler });

route('POST', '/v1/customers', ({ params }) => createCustomer(store, params));
route('GET', '/v1/customers', ({ params }) => listCustomers(store, params));
route('GET', `/v1/customers/${ID}`, ({ match }) => getCustomer(store, match[1]));
route('POST', `/v1/customers/${ID}`, ({ params, match }) => updateCustomer(store, match[1], params));

route('GET', '/v1/prices', ({ params }) => listPrices(store, params));
route('GET', `/v1/prices/${ID}`, ({ match }) => getPrice(store, match[1]));

route('POST', '/v1/checkout/sessions', ({ params }) => createCheckoutSession(store, params));
route('GET', '/v1/checkout/sessions', ({ params }) => listCheckoutSessions(store, params));
route('POST', `/v1/checkout/sessions/${ID}/expire`, ({ match }) => expireCheckoutSession(store, match[1]));
route('GET', `/v1/checkout/sessions/${ID}`, ({ params, match }) => getCheckoutSession(store, match[1], params.stringArray('expand') ?? []));

route('POST', '/v1/subscriptions', ({ params }) => createSubscription(store, params));
route('GET', '/v1/subscriptions', ({ params }) => listSubscriptions(store, params));
route('GET', `/v1/subscriptions/${ID}`, ({ match }) => getSubscription(store, match[1]));
route('POST', `/v1/subscriptions/${ID}`, ({ params, match }) => updateSubscription(store, match[1], params));
route('DELETE', `/v1/subscriptions/${ID}`, ({ match }) => cancelSubscription(store, match[1]));

route('POST', '/v1/billing_portal/sessions', ({ params }) => createPortalSession(store, params));

route('GET', '/v1/invoices', ({ params }) => listInvoices(store, params));

route('GET', '/v1/events', ({ params }) => listEvents(store, params));

/** Accepts `Authorization: Bearer sk_test_...` (what the SDK sends) and curl's `-u sk_test_...:`. */
function apiKeyOf(req: http.IncomingMessage): string | null {
  const header = req.headers.authorization ?? '';
  const bearer = /^Bearer\s+(\S+)$/i.exec(header);
  if (bearer) return bearer[1];
  const basic = /^Basic\s+(\S+)$/i.exec(header);
  if (basic) return Buffer.from(basic[1], 'base64').toString('utf8').split(':')[0] || null;
  return null;
}

// Idempotency-Key replay. The SDK sends a key with every POST and, even with maxNetworkRetries: 0,
// retries once on a connection closed mid-request; replaying keeps such a retry from creating twice.
interface IdempotentResult {
  fingerprint: string;
  status: number;
  body: unknown;
}
const idempotency = new Map<string, IdempotentResult>();
const IDEMPOTENCY_MAX = 5000;

async function handleApi(req: http.IncomingMessage, res: http.ServerResponse, url: URL): Promise<void> {
  const requestId = newId('req', 14);
  const headers: Record<string, string> = {
    'request-id': requestId,
    'stripe-version': String(req.headers['stripe-version'] ?? API_VERSION),
  };
  const fail = (error: ApiError) => sendJson(res, error.status, errorBody(error), headers);

  const key = apiKeyOf(req);
  if (!key) {
    return fail(
      new ApiError(401, 'invalid_request_error', 'You did not provide an API key. Send it as "Authorization: Bearer sk_test_...".'),
    );
  }
  if (!key.startsWith('sk_test_')) {
    return fail(new ApiError(401, 'invalid_request_error', `Invalid API Key provided: ${key.slice(0, 8)}***. This local stand-in accepts test secret keys (sk_test_...) only.`, 'api_key_invalid'));
  }

  let body = '';
  try {
    body = await readBody(req);
  } catch (error) {
    if (error instanceof BodyTooLarge) return fail(new ApiError(413, 'invalid_request_error', 'Request body too large.'));
    throw error;
  }
  const method = req.method ?? 'GET';
  const found = routes.find((r) => r.method === method && r.pattern.test(url.pathname));
  if (!found) {
    return fail(
      new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${url.pathname}). This local stand-in implements only the endpoints Tidewarden uses.`),
    );
  }

  const idempotencyKey = method === 'POST' ? (req.headers['idempotency-key'] as string | undefined) : undefined;
  const fingerprint = `${method} ${url.pathname}?${url.search} ${body}`;
  if (idempotencyKey) {
    const previous = idempotency.get(idempotencyKey);
    if (previous) {
      if (previous.fingerprint !== fingerprint) {
        return fail(new ApiError(400, 'idempotency_error', `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`));
      }
      return sendJson(res, previous.status, previous.body, { ...headers, 'idempotency-key': idempotencyKey, 'idempotent-replayed': 'true' });
    }
    headers['idempotency-key'] = idempotencyKey;
  }

  let status = 200;
  let result: unknown;
  try {
    const contentType = req.headers['content-type'] ?? '';
    if (body && contentType.includes('json')) {
      throw new ApiError(400, 'invalid_request_error', "Stripe's v1 API takes form-encoded bodies (application/x-www-form-urlencoded), not JSON.");
    }
    // Query parameters count on every method; for POST and DELETE the body's win.
    const raw = { ...parseForm(url.search.slice(1)), ...parseForm(body) };
    const params = new Params(raw);
    const match = found.pattern.exec(url.pathname)!.map((part) => decodeURIComponent(part ?? ''));
    const value = found.handler({ params, match });
    const expand = params.stringArray('expand') ?? [];
    result = applyExpand(store, value, expand);
  } catch (error) {
    const apiError = toApiError(error);
    status = apiError.status;
    result = errorBody(apiError);
  }
  // Events are queued whatever the outcome (a GET can expire a checkout session, for one); not awaited.
  void flushEvents();

  if (idempotencyKey && status < 500) {
    idempotency.set(idempotencyKey, { fingerprint, status, body: result });
    if (idempotency.size > IDEMPOTENCY_MAX) idempotency.delete(idempotency.keys().next().value!);
  }
  sendJson(res, status, result, headers);
}

// ----- browser pages --------------------------------------------------------------------------------------

async function readForm(req: http.IncomingMessage): Promise<Params> {
  return new Params(parseForm(await readBody(req)));
}

async function handlePages(req: http.IncomingMessage, res: http.ServerResponse, url: URL): Promise<boolean> {
  const method = req.method ?? 'GET';
  let m: RegExpExecArray | null;

  if ((m = /^\/checkout\/([A-Za-z0-9_]+)$/.exec(url.pathname)) && method === 'GET') {
    const view = checkoutView(store, m[1]);
    void flushEvents(); // viewing can expire the session
    if (!view) sendHtml(res, 404, messagePage('Checkout not found', 'There is no checkout session with this address.'));
    else sendHtml(res, 200, checkoutPage(view));
    return true;
  }

  if ((m = /^\/checkout\/([A-Za-z0-9_]+)\/pay$/.exec(url.pathname)) && method === 'POST') {
    const form = await readForm(req);
    const view = checkoutView(store, m[1]);
    if (!view) {
      sendHtml(res, 404, messagePage('Checkout not found', 'There is no checkout session with this address.'));
      return true;
    }
    const outcome = payCheckout(store, m[1], form.string('card') ?? '');
    if (outcome.ok) {
      await flushEventsAndWait();
      redirect(res, outcome.redirect);
    } else {
      void flushEvents();
      sendHtml(res, outcome.status, checkoutPage(checkoutView(store, m[1])!, outcome.message));
    }
    return true;
  }

  if ((m = /^\/portal\/([A-Za-z0-9_]+)$/.exec(url.pathname)) && method === 'GET') {
    const view = portalView(store, m[1]);
    if (!view) {
      sendHtml(res, 404, messagePage('Billing portal not found', 'There is no billing portal session with this address.'));
      return true;
    }
    const done = url.searchParams.get('done');
    const flashes: Record<string, string> = {
      changed: 'Your plan was changed.',
      period_end: 'Your subscription will end at the end of the current period.',
      resume: 'Your subscription will continue.',
      now: 'Your subscription was cancelled.',
    };
    sendHtml(res, 200, portalPage(view, done && flashes[done] ? { kind: 'ok', text: flashes[done] } : undefined));
    return true;
  }

  if ((m = /^\/portal\/([A-Za-z0-9_]+)\/(change|cancel)$/.exec(url.pathname)) && method === 'POST') {
    const [, portalId, action] = m;
    const form = await readForm(req);
    try {
      const subscription = form.requiredString('subscription');
      let done: string;
      if (action === 'change') {
        portalChangePlan(store, portalId, subscription, form.requiredString('price'));
        done = 'changed';
      } else {
        done = form.oneOf('when', ['period_end', 'now', 'resume'] as const) ?? 'period_end';
        portalCancel(store, portalId, subscription, done as 'period_end' | 'now' | 'resume');
      }
      await flushEventsAndWait();
      redirect(res, `/portal/${portalId}?done=${done}`);
    } catch (error) {
      const apiError = toApiError(error);
      const view = portalView(store, portalId);
      if (!view) sendHtml(res, 404, messagePage('Billing portal not found', 'There is no billing portal session with this address.'));
      else sendHtml(res, apiError.status, portalPage(view, { kind: 'error', text: apiError.message }));
    }
    return true;
  }

  if ((m = /^\/invoice\/([A-Za-z0-9_]+)$/.exec(url.pathname)) && method === 'GET') {
    const view = invoiceView(store, m[1]);
    if (!view) sendHtml(res, 404, messagePage('Invoice not found', 'There is no invoice with this address.'));
    else sendHtml(res, 200, invoicePage(view.invoice, view.customer));
    return true;
  }
  return false;
}

// ----- /__control (test helpers, not part of Stripe's API) ------------------------------------------------

async function handleControl(req: http.IncomingMessage, res: http.ServerResponse, url: URL): Promise<void> {
  const method = req.method ?? 'GET';
  const wait = url.searchParams.get('wait') === '1';
  const fail = (status: number, message: string) => sendJson(res, status, { error: { type: 'invalid_request_error', message } });
  let m: RegExpExecArray | null;

  if (url.pathname === '/__control/health' && method === 'GET') {
    return sendJson(res, 200, {
      ok: true,
      api_version: API_VERSION,
      public_url: store.publicUrl,
      webhook_url: webhookUrl,
      webhook_retry_delays_ms: retryDelaysMs,
      state_file: stateFile,
      counts: store.counts(),
    });
  }

  if (url.pathname === '/__control/reset' && method === 'POST') {
    await readBody(req);
    store.reset();
    queue.clear();
    idempotency.clear();
    saveNow();
    return sendJson(res, 200, { ok: true, counts: store.counts() });
  }

  if (url.pathname === '/__control/advance' && method === 'POST') {
    let input: { subscription?: unknown; outcome?: unknown };
    try {
      input = JSON.parse((await readBody(req)) || '{}') as typeof input;
    } catch {
      return fail(400, 'The body must be JSON: {"subscription":"sub_...","outcome":"paid"|"failed"}.');
    }
    if (typeof input.subscription !== 'string') return fail(400, 'subscription (a sub_... id) is required.');
    const outcome = input.outcome ?? 'paid';
    if (outcome !== 'paid' && outcome !== 'failed') return fail(400, 'outcome must be "paid" or "failed".');
    try {
      const result = advance(store, input.subscription, outcome);
      const { ids, attempted } = flushEvents();
      if (wait) await attempted;
      return sendJson(res, 200, { ...result, event_ids: ids });
    } catch (error) {
      const apiError = toApiError(error);
      return fail(apiError.status, apiError.message);
    }
  }

  if (url.pathname === '/__control/events' && method === 'GET') {
    const type = url.searchParams.get('type');
    const data = store.events
      .filter((e) => !type || e.type === type)
      .map((e) => ({ ...e, delivery: queue.deliveryOf(e.id as string) ?? { state: webhookUrl ? 'pending' : 'not_configured', attempts: [] } }));
    return sendJson(res, 200, { object: 'list', data, webhook_url: webhookUrl });
  }

  if ((m = /^\/__control\/resend\/([A-Za-z0-9_]+)$/.exec(url.pathname)) && method === 'POST') {
    const eventId = m[1];
    if (!store.eventIndex.has(eventId)) return fail(404, `No such event: '${eventId}'`);
    if (!webhookUrl) return fail(409, 'FAKE_STRIPE_WEBHOOK_URL is not set, so there is nowhere to send the event.');
    const delivered = queue.enqueue(eventId);
    if (wait) await delivered;
    return sendJson(res, 202, { id: eventId, queued: true, delivery: queue.deliveryOf(eventId) });
  }

  if (url.pathname === '/__control/idle' && method === 'GET') {
    const timeout = Math.min(Number(url.searchParams.get('timeout_ms') ?? 10_000) || 10_000, 60_000);
    return sendJson(res, 200, { idle: await queue.idle(timeout) });
  }

  return fail(404, `Unknown control endpoint (${method} ${url.pathname}).`);
}

// ----- server ---------------------------------------------------------------------------------------------

const server = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', 'http://127.0.0.1');
  const handle = async () => {
    if (url.pathname.startsWith('/v1/')) return handleApi(req, res, url);
    if (url.pathname.startsWith('/__control/')) return handleControl(req, res, url);
    if (await handlePages(req, res, url)) return;
    if (url.pathname === '/' && req.method === 'GET') {
      return sendHtml(res, 200, messagePage('Local payment stand-in', 'This server imitates the parts of the Stripe API that Tidewarden uses. See fakes/stripe/server.ts.'));
    }
    sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${req.method}: ${url.pathname}).` } });
  };
  handle().catch((error: unknown) => {
    const apiError = toApiError(error);
    if (!res.headersSent) sendJson(res, apiError.status, errorBody(apiError));
    else res.destroy();
  });
});

server.on('error', (error: NodeJS.ErrnoException) => {
  console.error(`${LOG_PREFIX} ${error.code === 'EADDRINUSE' ? `port ${requestedPort} on 127.0.0.1 is already in use` : error.message}`);
  process.exit(1);
});

try {
  loadState();
} catch (error) {
  console.error(`${LOG_PREFIX} could not load ${stateFile}: ${(error as Error).message}`);
  process.exit(1);
}

server.listen(requestedPort, '127.0.0.1', () => {
  const port = (server.address() as { port: number }).port;
  if (!env.FAKE_STRIPE_PUBLIC_URL) store.publicUrl = `http://127.0.0.1:${port}`;
  log(
    `listening on http://127.0.0.1:${port} (hosted pages at ${store.publicUrl}; webhooks ${webhookUrl ? `→ ${webhookUrl}` : 'recorded, not posted'}; state ${stateFile ?? 'in memory'})`,
  );
});

let stopping = false;
function shutdown(): void {
  if (stopping) return;
  stopping = true;
  saveNow();
  server.close(() => process.exit(0));
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 1000).unref();
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
