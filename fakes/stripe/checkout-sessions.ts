// Checkout Sessions (mode `subscription` only): created by the app, paid or declined on the hosted page
// (pages.ts), read back by the app when the browser returns.
import type { Params } from './form';
import { badParam, cleanMetadata, DAY, missing, newId, nowSeconds, paginate, type Json } from './api';
import { customerRec, insertCustomer } from './customers';
import { emit } from './events';
import { renderInvoice } from './invoices';
import { activePriceRec, priceRec, productName, renderPrice } from './prices';
import { renderSubscription, startSubscription } from './subscriptions';
import type { CheckoutView } from './pages';
import type { CheckoutSessionRec, Store } from './store';

function sessionAmount(store: Store, s: CheckoutSessionRec): number {
  if (s.trial_period_days) return 0;
  return s.line_items.reduce((sum, li) => sum + (store.prices.get(li.price)?.unit_amount ?? 0) * li.quantity, 0);
}

function renderCheckoutSession(store: Store, s: CheckoutSessionRec): Json {
  const amount = sessionAmount(store, s);
  const customer = s.customer ? store.customers.get(s.customer) : undefined;
  return {
    id: s.id,
    object: 'checkout.session',
    after_expiration: null,
    allow_promotion_codes: null,
    amount_subtotal: amount,
    amount_total: amount,
    automatic_tax: { enabled: false, liability: null, provider: null, status: null },
    billing_address_collection: null,
    cancel_url: s.cancel_url,
    client_reference_id: s.client_reference_id,
    client_secret: null,
    created: s.created,
    currency: 'eur',
    custom_fields: [],
    custom_text: { after_submit: null, shipping_address: null, submit: null, terms_of_service_acceptance: null },
    customer: s.customer,
    customer_creation: s.customer ? null : 'always',
    customer_details:
      s.status === 'complete' && customer
        ? { address: null, email: customer.email, name: customer.name, phone: customer.phone, tax_exempt: 'none', tax_ids: [] }
        : null,
    customer_email: s.customer_email,
    discounts: [],
    expires_at: s.expires_at,
    invoice: s.invoice,
    invoice_creation: null,
    livemode: false,
    locale: null,
    metadata: { ...s.metadata },
    mode: s.mode,
    payment_intent: null,
    payment_link: null,
    payment_method_collection: 'always',
    payment_method_types: ['card'],
    payment_status: s.payment_status,
    recovered_from: null,
    setup_intent: null,
    shipping_address_collection: null,
    shipping_cost: null,
    shipping_options: [],
    status: s.status,
    submit_type: null,
    subscription: s.subscription,
    success_url: s.success_url,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    // Like Stripe: the hosted URL is only given while the session can still be paid.
    url: s.status === 'open' ? `${store.publicUrl}/checkout/${s.id}` : null,
  };
}

/** `line_items` is not included by default; it is only rendered when expanded. */
function renderCheckoutLineItems(store: Store, s: CheckoutSessionRec): Json {
  return {
    object: 'list',
    data: s.line_items.map((li) => {
      const price = priceRec(store, li.price);
      const product = store.products.get(price.product);
      const amount = s.trial_period_days ? 0 : price.unit_amount * li.quantity;
      return {
        id: li.id,
        object: 'item',
        amount_discount: 0,
        amount_subtotal: amount,
        amount_tax: 0,
        amount_total: amount,
        currency: price.currency,
        description: product?.name ?? price.nickname,
        price: renderPrice(price),
        quantity: li.quantity,
      };
    }),
    has_more: false,
    url: `/v1/checkout/sessions/${s.id}/line_items`,
  };
}

export function createCheckoutSession(store: Store, p: Params): Json {
  const mode = p.oneOf('mode', ['payment', 'setup', 'subscription'] as const);
  if (!mode) throw badParam('Missing required param: mode.', 'mode');
  if (mode !== 'subscription') throw badParam(`This local stand-in only supports mode=subscription, not ${mode}.`, 'mode');
  const successUrl = p.requiredString('success_url', { maxLength: 5000 });
  if (!/^https?:\/\//.test(successUrl)) throw badParam('Not a valid URL', 'success_url');
  const cancelUrl = p.string('cancel_url', { maxLength: 5000 }) || null;
  if (cancelUrl && !/^https?:\/\//.test(cancelUrl)) throw badParam('Not a valid URL', 'cancel_url');

  const customerId = p.string('customer') || null;
  if (customerId) customerRec(store, customerId, 'customer');

  const lineParams = p.objectArray('line_items');
  if (!lineParams || lineParams.length === 0) throw badParam('Missing required param: line_items.', 'line_items');
  const lineItems = lineParams.map((li) => {
    const priceId = li.requiredString('price');
    activePriceRec(store, priceId, li.name('price'));
    return { id: newId('li'), price: priceId, quantity: li.integer('quantity', { min: 1, max: 999_999 }) ?? 1 };
  });

  const subscriptionData = p.object('subscription_data');
  const trialDays = subscriptionData?.integer('trial_period_days', { min: 1, max: 730 }) ?? null;

  const base = store.base('cs_test', 58);
  const rec: CheckoutSessionRec = {
    ...base,
    customer: customerId,
    customer_email: null,
    mode: 'subscription',
    status: 'open',
    payment_status: 'unpaid',
    line_items: lineItems,
    success_url: successUrl,
    cancel_url: cancelUrl,
    client_reference_id: p.string('client_reference_id', { maxLength: 200 }) || null,
    metadata: cleanMetadata(p.metadata()),
    subscription_metadata: cleanMetadata(subscriptionData?.metadata()),
    trial_period_days: trialDays,
    subscription: null,
    invoice: null,
    expires_at: base.created + DAY,
  };
  store.checkoutSessions.set(rec.id, rec);
  return renderCheckoutSession(store, rec);
}

function checkoutSessionRec(store: Store, id: string): CheckoutSessionRec {
  const rec = store.checkoutSessions.get(id);
  if (!rec) throw missing('checkout.session', id);
  // Expire lazily: a session past its expiry cannot be paid.
  if (rec.status === 'open' && nowSeconds() >= rec.expires_at) {
    rec.status = 'expired';
    emit(store, 'checkout.session.expired', renderCheckoutSession(store, rec));
  }
  return rec;
}

export function getCheckoutSession(store: Store, id: string, expandPaths: string[]): Json {
  const rec = checkoutSessionRec(store, id);
  const out = renderCheckoutSession(store, rec);
  // Not part of the object unless asked for (also for nested paths such as line_items.data.price.product).
  if (expandPaths.some((p) => p === 'line_items' || p.startsWith('line_items.'))) out.line_items = renderCheckoutLineItems(store, rec);
  return out;
}

/** GET /v1/checkout/sessions (`customer`, `status`), newest first; expired sessions are expired first. */
export function listCheckoutSessions(store: Store, p: Params): Json {
  const customer = p.string('customer');
  const status = p.oneOf('status', ['open', 'complete', 'expired'] as const);
  const items = [...store.checkoutSessions.keys()]
    .map((id) => checkoutSessionRec(store, id))
    .filter((s) => (!customer || s.customer === customer) && (!status || s.status === status));
  return paginate(items, p, '/v1/checkout/sessions', (s) => renderCheckoutSession(store, s));
}

/** POST /v1/checkout/sessions/:id/expire: an open session can no longer be paid (checkout.session.expired). */
export function expireCheckoutSession(store: Store, id: string): Json {
  const rec = checkoutSessionRec(store, id);
  if (rec.status !== 'open') throw badParam(`Only Checkout Sessions with a status of open can be expired; this one is ${rec.status}.`, 'session');
  rec.status = 'expired';
  const out = renderCheckoutSession(store, rec);
  emit(store, 'checkout.session.expired', out);
  return out;
}

/** What the hosted checkout page shows, or null for an unknown session. */
export function checkoutView(store: Store, id: string): CheckoutView | null {
  if (!store.checkoutSessions.has(id)) return null;
  const rec = checkoutSessionRec(store, id);
  const lines = rec.line_items.map((li) => {
    const price = priceRec(store, li.price);
    return { name: productName(store, price), unitAmount: price.unit_amount, currency: price.currency, interval: price.interval, quantity: li.quantity };
  });
  const customer = rec.customer ? store.customers.get(rec.customer) : undefined;
  return { session: rec, lines, email: customer?.email ?? rec.customer_email, total: lines.reduce((s, l) => s + l.unitAmount * l.quantity, 0) };
}

/**
 * The hosted page's payment: the succeeding test card creates the subscription and its first (paid)
 * invoice, completes the session and records checkout.session.completed, customer.subscription.created
 * and invoice.paid, in that order. The declining card changes nothing and records nothing.
 */
export function payCheckout(store: Store, id: string, card: string): { ok: true; redirect: string } | { ok: false; status: number; message: string } {
  const rec = checkoutSessionRec(store, id);
  if (rec.status !== 'open') return { ok: false, status: 409, message: `This checkout is ${rec.status} and can no longer be paid.` };
  const digits = card.replace(/\D/g, '');
  if (digits === '4000000000000002') return { ok: false, status: 402, message: 'Your card was declined.' };
  if (digits !== '4242424242424242') return { ok: false, status: 400, message: 'Unknown test card. Use one of the two buttons below.' };

  // Stripe creates a customer for subscription-mode sessions that were not given one.
  rec.customer ??= insertCustomer(store, { email: rec.customer_email, name: null, metadata: {} }).id;
  const { sub, invoice } = startSubscription(store, {
    customer: rec.customer,
    items: rec.line_items.map((li) => ({ price: li.price, quantity: li.quantity })),
    trialDays: rec.trial_period_days,
    metadata: rec.subscription_metadata,
  });
  rec.status = 'complete';
  rec.payment_status = rec.trial_period_days ? 'no_payment_required' : 'paid';
  rec.subscription = sub.id;
  rec.invoice = invoice.id;

  emit(store, 'checkout.session.completed', renderCheckoutSession(store, rec));
  emit(store, 'customer.subscription.created', renderSubscription(store, sub));
  emit(store, 'invoice.paid', renderInvoice(store, invoice));
  return { ok: true, redirect: rec.success_url.replaceAll('{CHECKOUT_SESSION_ID}', rec.id) };
}
