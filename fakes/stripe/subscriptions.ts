// Subscriptions: started by a paid checkout (or server-side by the demo seed), changed by the app and the
// portal (plan, quantity, cancel at period end), ended now or at period end, and renewed by the
// /__control/advance test control.
import type { Params } from './form';
import { addMonth, ApiError, badParam, cleanMetadata, DAY, mergeMetadata, missing, missingParam, newId, nowSeconds, paginate, type Json } from './api';
import { emit, emitUpdated } from './events';
import { createInvoice, issueInvoice, renderInvoice } from './invoices';
import { activePriceRec, priceRec, productName, renderPlan, renderPrice } from './prices';
import { customerRec } from './customers';
import type { InvoiceLineRec, InvoiceRec, Store, SubscriptionItemRec, SubscriptionRec } from './store';

function subscriptionRec(store: Store, id: string): SubscriptionRec {
  const rec = store.subscriptions.get(id);
  if (!rec) throw missing('subscription', id);
  return rec;
}

function renderSubscriptionItem(store: Store, sub: SubscriptionRec, item: SubscriptionItemRec): Json {
  const price = priceRec(store, item.price);
  return {
    id: item.id,
    object: 'subscription_item',
    billing_thresholds: null,
    created: item.created,
    // Newer API versions keep the billing period on the item; the subscription repeats it for older code.
    current_period_end: sub.current_period_end,
    current_period_start: sub.current_period_start,
    discounts: [],
    metadata: { ...item.metadata },
    plan: renderPlan(price),
    price: renderPrice(price),
    quantity: item.quantity,
    subscription: sub.id,
    tax_rates: [],
  };
}

export function renderSubscription(store: Store, s: SubscriptionRec): Json {
  return {
    id: s.id,
    object: 'subscription',
    application: null,
    application_fee_percent: null,
    automatic_tax: { disabled_reason: null, enabled: false, liability: null },
    billing_cycle_anchor: s.start_date,
    billing_cycle_anchor_config: null,
    billing_thresholds: null,
    cancel_at: s.cancel_at_period_end ? s.current_period_end : null,
    cancel_at_period_end: s.cancel_at_period_end,
    canceled_at: s.canceled_at,
    cancellation_details: { comment: null, feedback: null, reason: s.cancellation_reason },
    collection_method: 'charge_automatically',
    created: s.created,
    currency: store.prices.get(s.items[0]?.price ?? '')?.currency ?? 'eur',
    current_period_end: s.current_period_end,
    current_period_start: s.current_period_start,
    customer: s.customer,
    days_until_due: null,
    default_payment_method: null,
    default_source: null,
    description: null,
    discounts: [],
    ended_at: s.ended_at,
    invoice_settings: { account_tax_ids: null, issuer: { type: 'self' } },
    items: {
      object: 'list',
      data: s.items.map((item) => renderSubscriptionItem(store, s, item)),
      has_more: false,
      total_count: s.items.length,
      url: `/v1/subscription_items?subscription=${s.id}`,
    },
    latest_invoice: s.latest_invoice,
    livemode: false,
    metadata: { ...s.metadata },
    next_pending_invoice_item_invoice: null,
    on_behalf_of: null,
    pause_collection: null,
    payment_settings: { payment_method_options: null, payment_method_types: null, save_default_payment_method: 'off' },
    pending_invoice_item_interval: null,
    pending_setup_intent: null,
    pending_update: null,
    schedule: null,
    start_date: s.start_date,
    status: s.status,
    test_clock: null,
    transfer_data: null,
    trial_end: s.trial_end,
    trial_settings: { end_behavior: { missing_payment_method: 'create_invoice' } },
    trial_start: s.trial_start,
  };
}

/** Creates an active (or trialing) subscription with its first, paid invoice. Records no events. */
export function startSubscription(
  store: Store,
  input: { customer: string; items: { price: string; quantity: number }[]; trialDays: number | null; metadata: Record<string, string> },
): { sub: SubscriptionRec; invoice: InvoiceRec } {
  const base = store.base('sub', 24);
  const trialEnd = input.trialDays ? base.created + input.trialDays * DAY : null;
  const sub: SubscriptionRec = {
    ...base,
    customer: input.customer,
    status: trialEnd ? 'trialing' : 'active',
    items: input.items.map((item) => ({ id: newId('si', 14), created: base.created, price: item.price, quantity: item.quantity, metadata: {} })),
    cancel_at_period_end: false,
    canceled_at: null,
    ended_at: null,
    cancellation_reason: null,
    current_period_start: base.created,
    // During a trial the first period is the trial itself, as in Stripe.
    current_period_end: trialEnd ?? addMonth(base.created),
    trial_start: trialEnd ? base.created : null,
    trial_end: trialEnd,
    start_date: base.created,
    metadata: { ...input.metadata },
    latest_invoice: null,
  };
  store.subscriptions.set(sub.id, sub);
  const invoice = createInvoice(store, sub, 'subscription_create', true, Boolean(trialEnd));
  sub.latest_invoice = invoice.id;
  return { sub, invoice };
}

/** Server-side creation (the demo seed). There are no payment methods here, so the first invoice is simply paid. */
export function createSubscription(store: Store, p: Params): Json {
  const customer = p.requiredString('customer');
  customerRec(store, customer, 'customer');
  const itemParams = p.objectArray('items');
  if (!itemParams || itemParams.length === 0) throw badParam('Missing required param: items.', 'items');
  const seen = new Set<string>();
  const items = itemParams.map((ip) => {
    const price = ip.requiredString('price');
    activePriceRec(store, price, ip.name('price'));
    if (seen.has(price)) throw badParam('Cannot add multiple subscription items with the same price.', ip.name('price'));
    seen.add(price);
    return { price, quantity: ip.integer('quantity', { min: 0 }) ?? 1 };
  });
  const { sub, invoice } = startSubscription(store, { customer, items, trialDays: null, metadata: cleanMetadata(p.metadata()) });
  const out = renderSubscription(store, sub);
  emit(store, 'customer.subscription.created', out);
  emit(store, 'invoice.paid', renderInvoice(store, invoice));
  return out;
}

export function getSubscription(store: Store, id: string): Json {
  return renderSubscription(store, subscriptionRec(store, id));
}

/** Like Stripe, the default list leaves out canceled subscriptions; `status=all` includes them. */
export function listSubscriptions(store: Store, p: Params): Json {
  const customer = p.string('customer');
  const status = p.oneOf('status', ['active', 'all', 'canceled', 'ended', 'incomplete', 'incomplete_expired', 'past_due', 'paused', 'trialing', 'unpaid'] as const);
  const items = [...store.subscriptions.values()].filter((s) => {
    if (customer && s.customer !== customer) return false;
    if (status === 'all') return true;
    if (status === 'ended') return s.status === 'canceled' || s.status === 'incomplete_expired';
    if (status) return s.status === status;
    return s.status !== 'canceled' && s.status !== 'incomplete_expired';
  });
  return paginate(items, p, '/v1/subscriptions', (s) => renderSubscription(store, s));
}

/**
 * The proration lines of a change from `oldItems` to `newItems` at `at`, as Stripe computes them: for each
 * item whose price or quantity changed, a credit for the unused time on the old price and a charge for the
 * remaining time on the new one, each the full period's amount times the remaining fraction of the period
 * (in seconds), rounded to the minor unit.
 */
export function prorationLines(store: Store, sub: SubscriptionRec, oldItems: SubscriptionItemRec[], newItems: SubscriptionItemRec[], at: number): InvoiceLineRec[] {
  const start = sub.current_period_start;
  const end = sub.current_period_end;
  if (end <= start || at >= end) return [];
  const fraction = (end - Math.max(at, start)) / (end - start);
  const day = new Date(at * 1000).toISOString().slice(0, 10);
  const lines: InvoiceLineRec[] = [];
  for (const item of newItems) {
    const old = oldItems.find((i) => i.id === item.id);
    if (!old || (old.price === item.price && old.quantity === item.quantity)) continue;
    const oldPrice = priceRec(store, old.price);
    const newPrice = priceRec(store, item.price);
    lines.push({
      id: newId('il', 24),
      price: oldPrice.id,
      quantity: old.quantity,
      amount: -Math.round(oldPrice.unit_amount * old.quantity * fraction),
      description: `Unused time on ${old.quantity} × ${productName(store, oldPrice)} after ${day}`,
      period_start: at,
      period_end: end,
      proration: true,
    });
    lines.push({
      id: newId('il', 24),
      price: newPrice.id,
      quantity: item.quantity,
      amount: Math.round(newPrice.unit_amount * item.quantity * fraction),
      description: `Remaining time on ${item.quantity} × ${productName(store, newPrice)} after ${day}`,
      period_start: at,
      period_end: end,
      proration: true,
    });
  }
  return lines;
}

/**
 * Plan or quantity change of an existing item (`items[0][id]` with `items[0][price]` and/or
 * `items[0][quantity]`) and `cancel_at_period_end`. A change of price or quantity on a paying subscription
 * is prorated like Stripe's: `create_prorations` (the default) adds the credit and charge lines to the next
 * renewal invoice, `always_invoice` bills them at once in an invoice of their own (paid; a total below zero
 * becomes a credit on the customer's balance), `none` bills nothing for the rest of the period.
 */
export function updateSubscription(store: Store, id: string, p: Params): Json {
  const sub = subscriptionRec(store, id);
  const before = renderSubscription(store, sub);
  const prorationBehavior = p.oneOf('proration_behavior', ['always_invoice', 'create_prorations', 'none'] as const) ?? 'create_prorations';
  const prorationDate = p.integer('proration_date', { min: 0 });

  if (sub.status === 'canceled') {
    const allowed = new Set(['metadata', 'cancellation_details', 'expand', 'proration_behavior']);
    const other = Object.keys(p.raw).find((k) => !allowed.has(k));
    if (other) {
      throw new ApiError(400, 'invalid_request_error', 'A canceled subscription can only update its cancellation_details and metadata.', undefined, other);
    }
  }

  const itemParams = p.objectArray('items');
  const cancelAtPeriodEnd = p.boolean('cancel_at_period_end');
  const metadata = p.metadata();

  // Validate everything before changing anything.
  const nextItems = sub.items.map((i) => ({ ...i }));
  for (const ip of itemParams ?? []) {
    const itemId = ip.requiredString('id');
    const priceId = ip.string('price');
    if (priceId) activePriceRec(store, priceId, ip.name('price'));
    const quantity = ip.integer('quantity', { min: 0 });
    const item = nextItems.find((i) => i.id === itemId);
    if (!item) throw missingParam('subscription item', itemId, ip.name('id'));
    if (priceId) item.price = priceId;
    if (quantity !== undefined) item.quantity = quantity;
  }
  const prices = nextItems.map((i) => i.price);
  if (new Set(prices).size !== prices.length) throw badParam('Cannot add multiple subscription items with the same price.', 'items');

  const at = prorationDate ?? nowSeconds();
  // A trial is not billed, so a change during it is not prorated either.
  const prorations = prorationBehavior !== 'none' && (sub.status === 'active' || sub.status === 'past_due') ? prorationLines(store, sub, sub.items, nextItems, at) : [];
  sub.items = nextItems;
  sub.metadata = mergeMetadata(sub.metadata, metadata);
  let prorationInvoice: InvoiceRec | null = null;
  if (prorations.length && prorationBehavior === 'always_invoice') {
    prorationInvoice = issueInvoice(store, sub, 'subscription_update', [...(sub.pending_prorations ?? []), ...prorations], true);
    sub.pending_prorations = [];
    sub.latest_invoice = prorationInvoice.id;
  } else if (prorations.length) {
    sub.pending_prorations = [...(sub.pending_prorations ?? []), ...prorations];
  }
  if (cancelAtPeriodEnd !== undefined && cancelAtPeriodEnd !== sub.cancel_at_period_end) {
    sub.cancel_at_period_end = cancelAtPeriodEnd;
    // Stripe stamps canceled_at when the cancellation is scheduled and clears it when it is withdrawn.
    sub.canceled_at = cancelAtPeriodEnd ? nowSeconds() : null;
    sub.cancellation_reason = cancelAtPeriodEnd ? 'cancellation_requested' : null;
  }
  const out = renderSubscription(store, sub);
  emitUpdated(store, 'customer.subscription.updated', before, out);
  if (prorationInvoice) emit(store, 'invoice.paid', renderInvoice(store, prorationInvoice));
  return out;
}

function endSubscription(store: Store, sub: SubscriptionRec): Json {
  const now = nowSeconds();
  sub.status = 'canceled';
  sub.canceled_at = sub.canceled_at ?? now;
  sub.ended_at = now;
  sub.cancellation_reason = 'cancellation_requested';
  // The open invoices of a canceled subscription are not collected any more.
  for (const invoice of store.invoices.values()) {
    if (invoice.subscription === sub.id && invoice.status === 'open') invoice.next_payment_attempt = null;
  }
  const out = renderSubscription(store, sub);
  emit(store, 'customer.subscription.deleted', out);
  return out;
}

/** DELETE /v1/subscriptions/:id: ends it now. */
export function cancelSubscription(store: Store, id: string): Json {
  const sub = subscriptionRec(store, id);
  if (sub.status === 'canceled') {
    throw new ApiError(400, 'invalid_request_error', `This subscription (${id}) has already been canceled.`);
  }
  return endSubscription(store, sub);
}

/**
 * Moves a subscription to its next billing period. A subscription set to cancel at period end ends
 * instead (customer.subscription.deleted, no invoice). Otherwise a renewal invoice is created:
 * paid → status active, events invoice.paid + customer.subscription.updated;
 * failed → invoice left open, status past_due, events invoice.payment_failed + customer.subscription.updated.
 */
export function advance(store: Store, subscriptionId: string, outcome: 'paid' | 'failed'): { subscription: Json; invoice: Json | null; ended: boolean } {
  const sub = store.subscriptions.get(subscriptionId);
  if (!sub) throw missing('subscription', subscriptionId, 'subscription');
  if (sub.status === 'canceled') throw badParam(`Subscription ${subscriptionId} is canceled; there is nothing to renew.`, 'subscription');
  if (sub.cancel_at_period_end) return { subscription: endSubscription(store, sub), invoice: null, ended: true };

  const before = renderSubscription(store, sub);
  sub.current_period_start = sub.current_period_end;
  sub.current_period_end = addMonth(sub.current_period_start);
  const invoice = createInvoice(store, sub, 'subscription_cycle', outcome === 'paid');
  sub.latest_invoice = invoice.id;
  sub.status = outcome === 'paid' ? 'active' : 'past_due';
  const invoiceOut = renderInvoice(store, invoice);
  emit(store, outcome === 'paid' ? 'invoice.paid' : 'invoice.payment_failed', invoiceOut);
  const out = renderSubscription(store, sub);
  emitUpdated(store, 'customer.subscription.updated', before, out);
  return { subscription: out, invoice: invoiceOut, ended: false };
}
