// The local Stripe stand-in (fakes/stripe) driven by the real `stripe` SDK, exactly as the app uses it.
// The fake runs as a child process; a tiny HTTP server here plays the app's webhook endpoint. No database.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { parseForm } from '@/fakes/stripe/form';

const ROOT = path.resolve(import.meta.dirname, '../..');
const SECRET = 'whsec_stripe_fake_test';
const API_KEY = 'sk_test_tidewarden_fake';
const SUCCESS_CARD = '4242424242424242';
const DECLINE_CARD = '4000000000000002';

// ----- the app's webhook endpoint, as far as these tests need one ---------------------------------------

interface Received {
  body: string;
  signature: string;
  event: Stripe.Event;
}
const received: Received[] = [];
let failNextDeliveries = 0;

const receiver = http.createServer((req, res) => {
  const chunks: Buffer[] = [];
  req.on('data', (c: Buffer) => chunks.push(c));
  req.on('end', () => {
    const body = Buffer.concat(chunks).toString('utf8');
    if (failNextDeliveries > 0) {
      failNextDeliveries -= 1;
      res.writeHead(500).end('simulated outage');
      return;
    }
    received.push({ body, signature: String(req.headers['stripe-signature'] ?? ''), event: JSON.parse(body) as Stripe.Event });
    res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
  });
});

// ----- the fake -----------------------------------------------------------------------------------------

let child: ChildProcess;
let base = '';
let stripe: Stripe;

/** Starts a fake on a free port (FAKE_STRIPE_PORT=0) and resolves with its base URL, read from its start line. */
function spawnFake(extraEnv: Record<string, string>): { process: ChildProcess; url: Promise<string> } {
  const output: string[] = [];
  const proc = spawn(process.execPath, ['--import', 'tsx', 'fakes/stripe/server.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      FAKE_STRIPE_PORT: '0',
      FAKE_STRIPE_WEBHOOK_URL: '',
      STRIPE_WEBHOOK_SECRET: SECRET,
      FAKE_STRIPE_WEBHOOK_RETRY_DELAYS_MS: '100,200,300',
      FAKE_STRIPE_PUBLIC_URL: '',
      FAKE_STRIPE_STATE_FILE: '',
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the fake did not start:\n${output.join('')}`)), 20_000);
    const onData = (chunk: Buffer) => {
      output.push(chunk.toString());
      const match = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(output.join(''));
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    };
    proc.stdout!.on('data', onData);
    proc.stderr!.on('data', onData);
    proc.on('exit', (code) => reject(new Error(`the fake exited with ${code}:\n${output.join('')}`)));
  });
  return { process: proc, url };
}

async function stopFake(proc: ChildProcess): Promise<number | null> {
  if (proc.exitCode !== null) return proc.exitCode;
  const exited = new Promise<number | null>((resolve) => proc.once('exit', (code) => resolve(code)));
  proc.kill('SIGTERM');
  return exited;
}

const sdkFor = (url: string, key = API_KEY) =>
  new Stripe(key, { host: '127.0.0.1', port: Number(new URL(url).port), protocol: 'http', maxNetworkRetries: 0, telemetry: false });

beforeAll(async () => {
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const receiverPort = (receiver.address() as { port: number }).port;
  const fake = spawnFake({ FAKE_STRIPE_WEBHOOK_URL: `http://127.0.0.1:${receiverPort}/api/webhooks/stripe` });
  child = fake.process;
  base = await fake.url;
  stripe = sdkFor(base);
});

afterAll(async () => {
  if (child) await stopFake(child);
  await new Promise((resolve) => receiver.close(resolve));
});

// ----- helpers ------------------------------------------------------------------------------------------

async function waitFor<T>(probe: () => T | undefined | false | Promise<T | undefined | false>, what: string, timeoutMs = 5000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Deliveries about one customer's billing objects (sessions, subscriptions, invoices), in arrival order. */
function deliveriesFor(customerId: string): Received[] {
  return received.filter((r) => (r.event.data.object as { customer?: unknown }).customer === customerId);
}

/** Deliveries about the customer object itself (customer.created, customer.updated). */
function customerDeliveries(customerId: string): Received[] {
  return received.filter((r) => {
    const object = r.event.data.object as { id?: string; object?: string };
    return object.object === 'customer' && object.id === customerId;
  });
}

const typesFor = (customerId: string) => deliveriesFor(customerId).map((r) => r.event.type);

async function priceIds(): Promise<Record<string, string>> {
  const prices = await stripe.prices.list({ lookup_keys: ['tw_harbour_monthly', 'tw_fleet_monthly', 'tw_armada_monthly'] });
  return Object.fromEntries(prices.data.map((p) => [p.lookup_key!, p.id]));
}

const payForm = (sessionId: string, card: string) =>
  fetch(`${base}/checkout/${sessionId}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card }).toString(),
    redirect: 'manual',
  });

async function newCustomer(label: string) {
  return stripe.customers.create({ email: `${label}-${Date.now()}@example.test`, name: `Test ${label}`, metadata: { org_id: `org_${label}` } });
}

/** Customer + paid checkout on the given plan; returns once the three checkout webhooks arrived. */
async function subscribedCustomer(label: string, lookupKey = 'tw_fleet_monthly') {
  const customer = await newCustomer(label);
  const prices = await priceIds();
  const session = await stripe.checkout.sessions.create({
    mode: 'subscription',
    customer: customer.id,
    line_items: [{ price: prices[lookupKey], quantity: 1 }],
    success_url: 'http://127.0.0.1:3999/billing/done?session_id={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:3999/billing',
  });
  const paid = await payForm(session.id, SUCCESS_CARD);
  expect(paid.status).toBe(303);
  await waitFor(() => deliveriesFor(customer.id).some((r) => r.event.type === 'invoice.paid'), 'invoice.paid');
  const [subscription] = (await stripe.subscriptions.list({ customer: customer.id })).data;
  return { customer, subscription, prices };
}

const control = (pathname: string, body?: unknown) =>
  fetch(`${base}/__control/${pathname}`, {
    method: body === undefined ? 'GET' : 'POST',
    headers: body === undefined ? {} : { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });

interface ControlEvent {
  id: string;
  type: string;
  data: { object: { id: string; customer?: string } };
  delivery: { state: string; attempts: { status?: number; error?: string }[] };
}
const controlEvents = async () => ((await (await control('events')).json()) as { data: ControlEvent[] }).data;

// ----- tests --------------------------------------------------------------------------------------------

describe('form parsing (bracket notation)', () => {
  it('nests objects and turns indexed keys and [] into arrays', () => {
    const parsed = parseForm(
      'line_items[0][price]=price_a&line_items[0][quantity]=2&line_items[1][price]=price_b' +
        '&expand[]=subscription&expand[]=customer&metadata[org]=o%201&metadata[note]=a+b&lookup_keys[1]=y&lookup_keys[0]=x',
    );
    expect(parsed).toEqual({
      line_items: [{ price: 'price_a', quantity: '2' }, { price: 'price_b' }],
      expand: ['subscription', 'customer'],
      metadata: { org: 'o 1', note: 'a b' },
      lookup_keys: ['x', 'y'],
    });
  });

  it('refuses prototype keys and malformed brackets', () => {
    expect(() => parseForm('metadata[__proto__][x]=1')).toThrow(/Invalid parameter name/);
    expect(() => parseForm('a[b=1')).toThrow(/Invalid parameter name/);
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });
});

describe('the local Stripe stand-in, through the stripe SDK', () => {
  it('serves the three seeded plans by lookup key, with their products expanded', async () => {
    const prices = await stripe.prices.list({
      lookup_keys: ['tw_harbour_monthly', 'tw_fleet_monthly', 'tw_armada_monthly'],
      active: true,
      expand: ['data.product'],
    });
    expect(prices.object).toBe('list');
    expect(prices.has_more).toBe(false);
    const byKey: Record<string, Stripe.Price> = Object.fromEntries(prices.data.map((p) => [p.lookup_key!, p]));
    const summary = Object.entries(byKey)
      .map(([key, p]) => {
        const product = p.product as Stripe.Product;
        return [key, p.unit_amount, p.currency, p.recurring?.interval, product.name, product.metadata.max_assets, p.id.startsWith('price_'), product.id.startsWith('prod_')];
      })
      .sort();
    expect(summary).toEqual([
      ['tw_armada_monthly', 89000, 'eur', 'month', 'Armada', 'unlimited', true, true],
      ['tw_fleet_monthly', 29000, 'eur', 'month', 'Fleet', '25', true, true],
      ['tw_harbour_monthly', 4900, 'eur', 'month', 'Harbour', '3', true, true],
    ]);

    const one = await stripe.prices.list({ lookup_keys: ['tw_fleet_monthly'] });
    expect(one.data.map((p) => p.lookup_key)).toEqual(['tw_fleet_monthly']);
    expect(typeof one.data[0].product).toBe('string'); // not expanded unless asked
    expect((await stripe.prices.list({ active: false })).data).toEqual([]);
    expect((await stripe.prices.retrieve(byKey.tw_armada_monthly.id)).unit_amount).toBe(89000);
  });

  it('creates, retrieves and updates customers (metadata merges; empty value removes a key)', async () => {
    const created = await stripe.customers.create({ email: 'owner@example.test', name: 'Harbour Works', metadata: { org_id: 'org_1', tier: 'x' } });
    expect(created.id).toMatch(/^cus_/);
    expect(created.object).toBe('customer');
    expect(created.created).toBeGreaterThan(1_600_000_000);
    expect(created.created).toBeLessThanOrEqual(Math.floor(Date.now() / 1000) + 1);

    const updated = await stripe.customers.update(created.id, { name: 'Harbour Works Ltd', metadata: { tier: '', region: 'north' } });
    expect(updated.name).toBe('Harbour Works Ltd');
    expect(updated.email).toBe('owner@example.test');
    expect(updated.metadata).toEqual({ org_id: 'org_1', region: 'north' });
    expect((await stripe.customers.retrieve(created.id)) as Stripe.Customer).toMatchObject({ id: created.id, name: 'Harbour Works Ltd' });
  });

  it('completes a checkout with the succeeding card: 303 to success_url, then three signed webhooks in order', async () => {
    const customer = await newCustomer('checkout');
    const prices = await priceIds();
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: prices.tw_fleet_monthly, quantity: 1 }],
      success_url: 'http://127.0.0.1:3999/o/acme/billing?checkout={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:3999/o/acme/billing?cancelled=1',
      client_reference_id: 'org_acme',
      metadata: { org_id: 'org_acme' },
      subscription_data: { metadata: { org_id: 'org_acme' } },
    });
    expect(session).toMatchObject({
      object: 'checkout.session',
      url: `${base}/checkout/${session.id}`,
      status: 'open',
      payment_status: 'unpaid',
      customer: customer.id,
      mode: 'subscription',
      client_reference_id: 'org_acme',
      metadata: { org_id: 'org_acme' },
      subscription: null,
      success_url: 'http://127.0.0.1:3999/o/acme/billing?checkout={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:3999/o/acme/billing?cancelled=1',
    });
    expect(session.id).toMatch(/^cs_/);

    const page = await fetch(session.url!);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('<title>Test checkout — local payment stand-in</title>');
    expect(html).toContain('Fleet');
    expect(html).toContain('€290.00');
    expect(html).toContain('Pay with test card 4242 4242 4242 4242 (succeeds)');
    expect(html).toContain('Pay with test card 4000 0000 0000 0002 (declined)');
    expect(html).toContain('href="http://127.0.0.1:3999/o/acme/billing?cancelled=1">Cancel and go back');

    const paid = await payForm(session.id, SUCCESS_CARD);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://127.0.0.1:3999/o/acme/billing?checkout=${session.id}`);

    // The redirect is only sent after each event was attempted once, so the app already has them.
    const deliveries = deliveriesFor(customer.id);
    expect(deliveries.map((r) => r.event.type)).toEqual(['checkout.session.completed', 'customer.subscription.created', 'invoice.paid']);

    for (const delivery of deliveries) {
      const event = stripe.webhooks.constructEvent(delivery.body, delivery.signature, SECRET);
      expect(event.id).toMatch(/^evt_/);
      expect(event).toMatchObject({ object: 'event', livemode: false, pending_webhooks: 1, request: { id: null } });
      expect(delivery.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
      expect(() => stripe.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_wrong')).toThrow(Stripe.errors.StripeSignatureVerificationError);
      expect(() => stripe.webhooks.constructEvent(delivery.body.replace('"livemode": false', '"livemode": true'), delivery.signature, SECRET)).toThrow(
        Stripe.errors.StripeSignatureVerificationError,
      );
    }

    const [completed, created, invoicePaid] = deliveries.map((r) => r.event);
    const completedSession = completed.data.object as Stripe.Checkout.Session;
    const subscription = created.data.object as Stripe.Subscription;
    const invoice = invoicePaid.data.object as Stripe.Invoice & { subscription: string };
    expect(completedSession).toMatchObject({ id: session.id, status: 'complete', payment_status: 'paid', client_reference_id: 'org_acme', subscription: subscription.id });
    expect(subscription.id).toMatch(/^sub_/);
    expect(subscription).toMatchObject({ status: 'active', customer: customer.id, cancel_at_period_end: false, metadata: { org_id: 'org_acme' }, latest_invoice: invoice.id });
    expect(subscription.items.data[0].id).toMatch(/^si_/);
    expect(subscription.items.data[0].price).toMatchObject({ id: prices.tw_fleet_monthly, unit_amount: 29000, lookup_key: 'tw_fleet_monthly' });
    expect(subscription.items.data[0].current_period_end).toBeGreaterThan(subscription.items.data[0].current_period_start + 27 * 86400);
    expect(invoice.id).toMatch(/^in_/);
    expect(invoice).toMatchObject({ status: 'paid', customer: customer.id, subscription: subscription.id, amount_due: 29000, amount_paid: 29000, currency: 'eur' });
    expect(invoice.parent?.subscription_details?.subscription).toBe(subscription.id);

    const retrieved = await stripe.checkout.sessions.retrieve(session.id, { expand: ['subscription'] });
    expect(retrieved.status).toBe('complete');
    expect(retrieved.url).toBeNull();
    expect((retrieved.subscription as Stripe.Subscription).status).toBe('active');
    expect((retrieved.subscription as Stripe.Subscription).id).toBe(subscription.id);

    const withLines = await stripe.checkout.sessions.retrieve(session.id, { expand: ['line_items.data.price.product'] });
    const line = withLines.line_items!.data[0];
    expect([line.quantity, line.amount_total, (line.price!.product as Stripe.Product).name]).toEqual([1, 29000, 'Fleet']);

    const invoices = await stripe.invoices.list({ customer: customer.id, limit: 5 });
    expect(invoices.data.map((i) => [i.id, i.status, i.amount_paid])).toEqual([[invoice.id, 'paid', 29000]]);
    const hosted = await fetch(invoices.data[0].hosted_invoice_url!);
    expect(hosted.status).toBe(200);
    expect(await hosted.text()).toContain('€290.00');

    // Paying twice is refused and posts nothing more.
    const again = await payForm(session.id, SUCCESS_CARD);
    expect(again.status).toBe(409);
    expect(await again.text()).toContain('already complete');
  });

  it('declines the 0002 card: the page says so, nothing is created and nothing is posted', async () => {
    const customer = await newCustomer('declined');
    const prices = await priceIds();
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: prices.tw_harbour_monthly, quantity: 1 }],
      success_url: 'http://127.0.0.1:3999/ok',
    });
    const eventsBefore = (await controlEvents()).length;

    const declined = await payForm(session.id, DECLINE_CARD);
    expect(declined.status).toBe(402);
    const html = await declined.text();
    expect(html).toContain('Your card was declined.');
    expect(html).toContain('Pay with test card 4242 4242 4242 4242 (succeeds)'); // can try again

    await new Promise((r) => setTimeout(r, 300));
    expect(deliveriesFor(customer.id)).toEqual([]);
    expect((await controlEvents()).length).toBe(eventsBefore);
    expect((await stripe.subscriptions.list({ customer: customer.id, status: 'all' })).data).toEqual([]);
    expect((await stripe.invoices.list({ customer: customer.id })).data).toEqual([]);
    expect(await stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: 'open', payment_status: 'unpaid', subscription: null });
  });

  it('starts a trial when subscription_data.trial_period_days is given', async () => {
    const customer = await newCustomer('trial');
    const prices = await priceIds();
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: prices.tw_harbour_monthly, quantity: 1 }],
      success_url: 'http://127.0.0.1:3999/ok',
      subscription_data: { trial_period_days: 14 },
    });
    expect((await payForm(session.id, SUCCESS_CARD)).status).toBe(303);
    const [subscription] = (await stripe.subscriptions.list({ customer: customer.id })).data;
    expect(subscription.status).toBe('trialing');
    expect(subscription.trial_end! - subscription.trial_start!).toBe(14 * 86400);
    expect(subscription.items.data[0].current_period_end).toBe(subscription.trial_end);
    const [invoice] = (await stripe.invoices.list({ customer: customer.id })).data;
    expect([invoice.status, invoice.amount_due]).toEqual(['paid', 0]);
    expect(typesFor(customer.id)).toEqual(['checkout.session.completed', 'customer.subscription.created', 'invoice.paid']);
  });

  it('changes the plan through the SDK and posts customer.subscription.updated with the previous price', async () => {
    const { customer, subscription, prices } = await subscribedCustomer('change-plan');
    const updated = await stripe.subscriptions.update(subscription.id, {
      items: [{ id: subscription.items.data[0].id, price: prices.tw_armada_monthly }],
      proration_behavior: 'create_prorations',
    });
    expect(updated.items.data).toHaveLength(1);
    expect(updated.items.data[0].id).toBe(subscription.items.data[0].id);
    expect(updated.items.data[0].price.id).toBe(prices.tw_armada_monthly);

    const delivery = await waitFor(() => deliveriesFor(customer.id).find((r) => r.event.type === 'customer.subscription.updated'), 'the update webhook');
    const event = stripe.webhooks.constructEvent(delivery.body, delivery.signature, SECRET);
    const object = event.data.object as Stripe.Subscription;
    expect(object.items.data[0].price.id).toBe(prices.tw_armada_monthly);
    const previous = event.data.previous_attributes as { items: Stripe.ApiList<Stripe.SubscriptionItem> };
    expect(previous.items.data[0].price.id).toBe(prices.tw_fleet_monthly);
    expect((await stripe.subscriptions.retrieve(subscription.id)).items.data[0].price.lookup_key).toBe('tw_armada_monthly');

    // Quantity changes go through the same path.
    const more = await stripe.subscriptions.update(subscription.id, { items: [{ id: subscription.items.data[0].id, quantity: 2 }] });
    expect(more.items.data[0].quantity).toBe(2);
  });

  it('cancels at period end, then cancels now, each with its webhook', async () => {
    const { customer, subscription } = await subscribedCustomer('cancel');
    const scheduled = await stripe.subscriptions.update(subscription.id, { cancel_at_period_end: true });
    expect(scheduled.status).toBe('active');
    expect(scheduled.cancel_at_period_end).toBe(true);
    expect(scheduled.cancel_at).toBe(scheduled.items.data[0].current_period_end);
    const updated = await waitFor(() => deliveriesFor(customer.id).find((r) => r.event.type === 'customer.subscription.updated'), 'the update webhook');
    expect((updated.event.data.object as Stripe.Subscription).cancel_at_period_end).toBe(true);
    expect(updated.event.data.previous_attributes).toMatchObject({ cancel_at_period_end: false });

    const canceled = await stripe.subscriptions.cancel(subscription.id);
    expect(canceled.status).toBe('canceled');
    expect(canceled.canceled_at).toEqual(expect.any(Number));
    expect(canceled.ended_at).toEqual(expect.any(Number));
    const deleted = await waitFor(() => deliveriesFor(customer.id).find((r) => r.event.type === 'customer.subscription.deleted'), 'the deleted webhook');
    expect(stripe.webhooks.constructEvent(deleted.body, deleted.signature, SECRET).data.object).toMatchObject({ id: subscription.id, status: 'canceled' });

    // Like Stripe: canceled subscriptions are left out of the default list, included with status=all.
    expect((await stripe.subscriptions.list({ customer: customer.id })).data).toEqual([]);
    expect((await stripe.subscriptions.list({ customer: customer.id, status: 'all' })).data.map((s) => s.id)).toEqual([subscription.id]);
    await expect(stripe.subscriptions.cancel(subscription.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });

  it('creates a subscription server-side (active, first invoice paid)', async () => {
    const customer = await newCustomer('server-side');
    const prices = await priceIds();
    const subscription = await stripe.subscriptions.create({ customer: customer.id, items: [{ price: prices.tw_harbour_monthly, quantity: 1 }], metadata: { org_id: 'o9' } });
    expect(subscription).toMatchObject({ object: 'subscription', status: 'active', customer: customer.id, metadata: { org_id: 'o9' } });
    expect(typeof subscription.latest_invoice).toBe('string');
    await waitFor(() => typesFor(customer.id).length === 2, 'two webhooks');
    expect(typesFor(customer.id)).toEqual(['customer.subscription.created', 'invoice.paid']);
  });

  it('renews with a failed payment (past_due), then with a paid one (active)', async () => {
    const { customer, subscription } = await subscribedCustomer('renewal');
    const before = (await stripe.subscriptions.retrieve(subscription.id)).items.data[0];
    const failedAnswer = await control('advance', { subscription: subscription.id, outcome: 'failed' });
    expect(failedAnswer.status).toBe(200);

    await waitFor(() => typesFor(customer.id).length >= 5, 'the renewal webhooks');
    expect(typesFor(customer.id).slice(3)).toEqual(['invoice.payment_failed', 'customer.subscription.updated']);
    const [failedInvoiceEvent, pastDueEvent] = deliveriesFor(customer.id).slice(3).map((r) => r.event);
    expect(failedInvoiceEvent.data.object).toMatchObject({ status: 'open', amount_paid: 0, amount_due: 29000, subscription: subscription.id });
    expect(pastDueEvent.data.object).toMatchObject({ id: subscription.id, status: 'past_due' });
    expect(pastDueEvent.data.previous_attributes).toMatchObject({ status: 'active' });

    const pastDue = await stripe.subscriptions.retrieve(subscription.id);
    expect(pastDue.status).toBe('past_due');
    expect(pastDue.items.data[0].current_period_start).toBe(before.current_period_end); // the period moved on
    const invoices = await stripe.invoices.list({ customer: customer.id, limit: 10 });
    expect(invoices.data.map((i) => i.status)).toEqual(['open', 'paid']); // newest first
    expect(invoices.data[0].id).toBe(pastDue.latest_invoice);
    expect((await stripe.invoices.list({ customer: customer.id, limit: 1 })).has_more).toBe(true);

    await control('advance', { subscription: subscription.id, outcome: 'paid' });
    await waitFor(() => typesFor(customer.id).length >= 7, 'the second renewal webhooks');
    expect(typesFor(customer.id).slice(5)).toEqual(['invoice.paid', 'customer.subscription.updated']);
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('active');
  });

  it('ends a subscription set to cancel at period end when the period is advanced', async () => {
    const { customer, subscription } = await subscribedCustomer('period-end');
    await stripe.subscriptions.update(subscription.id, { cancel_at_period_end: true });
    const answer = (await (await control('advance', { subscription: subscription.id, outcome: 'paid' })).json()) as { ended: boolean; invoice: unknown };
    expect(answer).toMatchObject({ ended: true, invoice: null });
    await waitFor(() => typesFor(customer.id).includes('customer.subscription.deleted'), 'the deleted webhook');
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('canceled');
    expect((await stripe.invoices.list({ customer: customer.id })).data).toHaveLength(1);
  });

  it('resends an event with the same id and bytes, freshly signed', async () => {
    const customer = await newCustomer('resend');
    const original = await waitFor(() => customerDeliveries(customer.id).find((r) => r.event.type === 'customer.created'), 'customer.created');
    const answer = await control(`resend/${original.event.id}?wait=1`, {});
    expect(answer.status).toBe(202);

    const copies = customerDeliveries(customer.id).filter((r) => r.event.id === original.event.id);
    expect(copies).toHaveLength(2);
    expect(copies[1].body).toBe(copies[0].body);
    expect(stripe.webhooks.constructEvent(copies[1].body, copies[1].signature, SECRET).id).toBe(original.event.id);
    const listed = (await controlEvents()).find((e) => e.id === original.event.id)!;
    expect(listed.delivery.state).toBe('delivered');
    expect(listed.delivery.attempts.map((a) => a.status)).toEqual([200, 200]);
    expect((await control('resend/evt_doesnotexist', {})).status).toBe(404);
  });

  it('retries a delivery that the app answered with 500 on its back-off until it succeeds', async () => {
    const customer = await newCustomer('retry');
    await waitFor(() => customerDeliveries(customer.id).length === 1, 'customer.created');
    expect(await (await control('idle?timeout_ms=5000')).json()).toEqual({ idle: true }); // nothing else in flight
    failNextDeliveries = 2;
    await stripe.customers.update(customer.id, { name: 'Renamed' });
    await waitFor(() => customerDeliveries(customer.id).length === 2, 'the update delivered', 8000);
    expect(customerDeliveries(customer.id).map((r) => [r.event.type, (r.event.data.object as Stripe.Customer).name])).toEqual([
      ['customer.created', 'Test retry'],
      ['customer.updated', 'Renamed'],
    ]);
    expect(customerDeliveries(customer.id)[1].event.data.previous_attributes).toEqual({ name: 'Test retry' });
    const first = customerDeliveries(customer.id)[1].event.id;
    const listed = (await controlEvents()).find((e) => e.id === first)!;
    expect(listed.delivery.state).toBe('delivered');
    expect(listed.delivery.attempts.map((a) => a.status)).toEqual([500, 500, 200]);
    // The configured back-off (100 ms, then 200 ms) lies between the attempts.
    const [a, b, c] = (listed.delivery.attempts as unknown as { at: number }[]).map((x) => x.at);
    expect(b - a).toBeGreaterThanOrEqual(100);
    expect(c - b).toBeGreaterThanOrEqual(200);
  });

  it('runs the billing portal: change plan, schedule cancellation, back link', async () => {
    const { customer, subscription, prices } = await subscribedCustomer('portal');
    const portal = await stripe.billingPortal.sessions.create({ customer: customer.id, return_url: 'http://127.0.0.1:3999/o/acme/billing' });
    expect(portal.id).toMatch(/^bps_/);
    expect(portal).toMatchObject({ object: 'billing_portal.session', url: `${base}/portal/${portal.id}`, return_url: 'http://127.0.0.1:3999/o/acme/billing', customer: customer.id });

    const html = await (await fetch(portal.url)).text();
    expect(html).toContain('href="http://127.0.0.1:3999/o/acme/billing">Back to the app');
    expect(html).toContain('Switch to Harbour');
    expect(html).toContain('Switch to Armada');
    expect(html).toContain('Fleet (current plan)');
    expect(html).toContain('Cancel at period end');
    expect(html).toContain('Cancel now');

    const post = (action: string, fields: Record<string, string>) =>
      fetch(`${base}/portal/${portal.id}/${action}`, { method: 'POST', body: new URLSearchParams(fields), redirect: 'manual' });
    const changed = await post('change', { subscription: subscription.id, price: prices.tw_harbour_monthly });
    expect(changed.status).toBe(303);
    expect(changed.headers.get('location')).toBe(`/portal/${portal.id}?done=changed`);
    // Like checkout, the portal redirects after the webhook was attempted.
    expect(typesFor(customer.id).at(-1)).toBe('customer.subscription.updated');
    expect((await stripe.subscriptions.retrieve(subscription.id)).items.data[0].price.id).toBe(prices.tw_harbour_monthly);

    expect((await post('cancel', { subscription: subscription.id, when: 'period_end' })).status).toBe(303);
    expect((await stripe.subscriptions.retrieve(subscription.id)).cancel_at_period_end).toBe(true);
    expect(await (await fetch(`${portal.url}?done=period_end`)).text()).toContain('Keep subscription');

    // Another customer's subscription cannot be touched from this portal.
    const other = await subscribedCustomer('portal-other');
    const refused = await post('cancel', { subscription: other.subscription.id, when: 'now' });
    expect(refused.status).toBe(400);
    expect((await stripe.subscriptions.retrieve(other.subscription.id)).status).toBe('active');
  });

  it('answers errors in Stripe shape, surfaced as the SDK error classes', async () => {
    const missing = await stripe.customers.retrieve('cus_doesnotexist').then(
      () => null,
      (e: unknown) => e,
    );
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 404, code: 'resource_missing', type: 'StripeInvalidRequestError', param: 'id' });
    expect((missing as Error).message).toContain("No such customer: 'cus_doesnotexist'");

    const badPrice = await stripe.checkout.sessions
      .create({ mode: 'subscription', line_items: [{ price: 'price_nope', quantity: 1 }], success_url: 'http://127.0.0.1:3999/ok' })
      .then(() => null, (e: unknown) => e);
    expect(badPrice).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(badPrice).toMatchObject({ statusCode: 400, param: 'line_items[0][price]' });

    const badBoolean = await stripe.subscriptions.list({ customer: 'cus_x', limit: 500 }).then(() => null, (e: unknown) => e);
    expect(badBoolean).toMatchObject({ statusCode: 400, param: 'limit' });

    const live = sdkFor(base, 'sk_live_nope');
    await expect(live.customers.list()).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const anonymous = await fetch(`${base}/v1/customers`);
    expect(anonymous.status).toBe(401);
    expect(((await anonymous.json()) as { error: { type: string } }).error.type).toBe('invalid_request_error');

    const unknown = await fetch(`${base}/v1/charges`, { headers: { authorization: `Bearer ${API_KEY}` } });
    expect(unknown.status).toBe(404);
    expect(((await unknown.json()) as { error: { message: string } }).error.message).toMatch(/Unrecognized request URL/);
  });

  it('replays a POST with the same Idempotency-Key instead of creating twice', async () => {
    const key = `idem-${Date.now()}`;
    const first = await stripe.customers.create({ email: 'idem@example.test' }, { idempotencyKey: key });
    const second = await stripe.customers.create({ email: 'idem@example.test' }, { idempotencyKey: key });
    expect(second.id).toBe(first.id);
    expect((await stripe.customers.list({ email: 'idem@example.test' })).data).toHaveLength(1);
    await expect(stripe.customers.create({ email: 'other@example.test' }, { idempotencyKey: key })).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it('resets to the seeded plans only', async () => {
    const customer = await newCustomer('reset');
    expect((await control('reset', {})).status).toBe(200);
    await expect(stripe.customers.retrieve(customer.id)).rejects.toMatchObject({ statusCode: 404 });
    expect((await stripe.prices.list()).data.map((p) => p.lookup_key)).toEqual(['tw_harbour_monthly', 'tw_fleet_monthly', 'tw_armada_monthly']);
    expect(await controlEvents()).toEqual([]);
    const health = (await (await control('health')).json()) as { ok: boolean; counts: Record<string, number> };
    expect(health).toMatchObject({ ok: true, counts: { customers: 0, subscriptions: 0, prices: 3, events: 0 } });
  });
});

describe('FAKE_STRIPE_STATE_FILE', () => {
  it('keeps customers, subscriptions and events across a restart, and stops cleanly on SIGTERM', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'stripe-fake-state-'));
    const stateFile = path.join(dir, 'state.json');
    try {
      const first = spawnFake({ FAKE_STRIPE_STATE_FILE: stateFile });
      const firstSdk = sdkFor(await first.url);
      const customer = await firstSdk.customers.create({ email: 'kept@example.test' });
      const subscription = await firstSdk.subscriptions.create({ customer: customer.id, items: [{ price: 'price_TwFleetMonthly' }] });
      expect(await stopFake(first.process)).toBe(0);
      expect(fs.existsSync(stateFile)).toBe(true);

      const second = spawnFake({ FAKE_STRIPE_STATE_FILE: stateFile });
      try {
        const secondUrl = await second.url;
        const secondSdk = sdkFor(secondUrl);
        expect(((await secondSdk.customers.retrieve(customer.id)) as Stripe.Customer).email).toBe('kept@example.test');
        expect((await secondSdk.subscriptions.retrieve(subscription.id)).items.data[0].price.lookup_key).toBe('tw_fleet_monthly');
        const events = (await (await fetch(`${secondUrl}/__control/events`)).json()) as { data: { type: string; delivery: { state: string } }[] };
        expect(events.data.map((e) => [e.type, e.delivery.state])).toEqual([
          ['customer.created', 'not_configured'],
          ['customer.subscription.created', 'not_configured'],
          ['invoice.paid', 'not_configured'],
        ]);
      } finally {
        await stopFake(second.process);
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
