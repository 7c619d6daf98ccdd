// Invoices: one per subscription period, created by subscriptions.ts (first period and renewals), listed by
// the app and shown on the hosted invoice page.
import type { Params } from './form';
import { DAY, formatMoney, newId, paginate, type Json } from './api';
import { priceRec, productName } from './prices';
import type { InvoiceLineRec, InvoiceRec, Store, SubscriptionRec } from './store';

/**
 * An invoice for the subscription's current period, paid at once or left open (a failed payment). Proration
 * lines waiting from plan changes are billed with it, and the customer's balance (a credit left by a
 * downgrade) is applied, as Stripe does.
 */
export function createInvoice(store: Store, sub: SubscriptionRec, reason: InvoiceRec['billing_reason'], paid: boolean, trial = false): InvoiceRec {
  const periodLines: InvoiceLineRec[] = sub.items.map((item) => {
    const price = priceRec(store, item.price);
    const name = productName(store, price);
    return {
      id: newId('il', 24),
      price: price.id,
      quantity: item.quantity,
      amount: trial ? 0 : price.unit_amount * item.quantity,
      description: trial ? `Trial period for ${name}` : `${item.quantity} × ${name} (at ${formatMoney(price.unit_amount, price.currency)} / ${price.interval})`,
      period_start: sub.current_period_start,
      period_end: sub.current_period_end,
    };
  });
  const lines = [...(sub.pending_prorations ?? []), ...periodLines];
  sub.pending_prorations = [];
  return issueInvoice(store, sub, reason, lines, paid);
}

/**
 * Finalises an invoice over the given lines. The customer's balance is applied first: a credit lowers
 * what is due, and a total below zero (a downgrade) becomes a credit for the next invoice.
 */
export function issueInvoice(store: Store, sub: SubscriptionRec, reason: InvoiceRec['billing_reason'], lines: InvoiceLineRec[], paid: boolean): InvoiceRec {
  const base = store.base('in', 24);
  store.invoiceNumber += 1;
  const subtotal = lines.reduce((s, l) => s + l.amount, 0);
  const customer = store.customers.get(sub.customer);
  const startingBalance = customer?.balance ?? 0;
  const total = Math.max(0, subtotal + startingBalance);
  const endingBalance = Math.min(0, subtotal + startingBalance);
  if (customer) customer.balance = endingBalance;
  const invoice: InvoiceRec = {
    ...base,
    number: `TWLOCAL-${String(store.invoiceNumber).padStart(4, '0')}`,
    customer: sub.customer,
    subscription: sub.id,
    subscription_metadata: { ...sub.metadata },
    status: paid ? 'paid' : 'open',
    billing_reason: reason,
    currency: store.prices.get(sub.items[0]?.price ?? '')?.currency ?? 'eur',
    lines,
    amount_due: total,
    amount_paid: paid ? total : 0,
    attempt_count: total > 0 ? 1 : 0,
    period_start: sub.current_period_start,
    period_end: sub.current_period_end,
    finalized_at: base.created,
    paid_at: paid ? base.created : null,
    next_payment_attempt: paid ? null : base.created + 3 * DAY,
    starting_balance: startingBalance,
    ending_balance: endingBalance,
  };
  store.invoices.set(invoice.id, invoice);
  return invoice;
}

/** The sum of the lines, before the customer's balance (negative for a downgrade's credit). */
const subtotalOf = (i: InvoiceRec) => i.lines.reduce((s, l) => s + l.amount, 0);

export function renderInvoice(store: Store, i: InvoiceRec): Json {
  const customer = store.customers.get(i.customer);
  const open = i.status === 'open';
  return {
    id: i.id,
    object: 'invoice',
    account_country: 'IE',
    account_name: 'Tidewarden (local stand-in)',
    amount_due: i.amount_due,
    amount_overpaid: 0,
    amount_paid: i.amount_paid,
    amount_remaining: i.amount_due - i.amount_paid,
    amount_shipping: 0,
    application: null,
    attempt_count: i.attempt_count,
    attempted: i.attempt_count > 0,
    auto_advance: open,
    billing_reason: i.billing_reason,
    collection_method: 'charge_automatically',
    created: i.created,
    currency: i.currency,
    customer: i.customer,
    customer_email: customer?.email ?? null,
    customer_name: customer?.name ?? null,
    default_payment_method: null,
    description: null,
    discounts: [],
    due_date: null,
    effective_at: i.finalized_at,
    ending_balance: i.ending_balance ?? 0,
    footer: null,
    hosted_invoice_url: `${store.publicUrl}/invoice/${i.id}`,
    // We do not produce PDFs; the hosted page is the only document.
    invoice_pdf: null,
    lines: {
      object: 'list',
      data: i.lines.map((line) => renderInvoiceLine(store, i, line)),
      has_more: false,
      total_count: i.lines.length,
      url: `/v1/invoices/${i.id}/lines`,
    },
    livemode: false,
    metadata: {},
    next_payment_attempt: i.next_payment_attempt,
    number: i.number,
    on_behalf_of: null,
    // Newer API versions name the subscription here; `subscription` below is kept for older code.
    parent: i.subscription
      ? {
          quote_details: null,
          subscription_details: { metadata: { ...i.subscription_metadata }, subscription: i.subscription },
          type: 'subscription_details',
        }
      : null,
    period_end: i.period_end,
    period_start: i.period_start,
    receipt_number: null,
    starting_balance: i.starting_balance ?? 0,
    statement_descriptor: null,
    status: i.status,
    status_transitions: {
      finalized_at: i.finalized_at,
      marked_uncollectible_at: i.status === 'uncollectible' ? i.finalized_at : null,
      paid_at: i.paid_at,
      voided_at: i.status === 'void' ? i.finalized_at : null,
    },
    subscription: i.subscription,
    subtotal: subtotalOf(i),
    subtotal_excluding_tax: subtotalOf(i),
    test_clock: null,
    total: subtotalOf(i),
    total_excluding_tax: subtotalOf(i),
    total_taxes: [],
    webhooks_delivered_at: i.finalized_at,
  };
}

function renderInvoiceLine(store: Store, i: InvoiceRec, line: InvoiceLineRec): Json {
  const price = store.prices.get(line.price);
  return {
    id: line.id,
    object: 'line_item',
    amount: line.amount,
    currency: i.currency,
    description: line.description,
    discount_amounts: [],
    discountable: true,
    discounts: [],
    invoice: i.id,
    livemode: false,
    metadata: {},
    parent: i.subscription
      ? { subscription_item_details: { subscription: i.subscription, proration: Boolean(line.proration) }, type: 'subscription_item_details' }
      : null,
    period: { end: line.period_end, start: line.period_start },
    pricing: {
      price_details: { price: line.price, product: price?.product ?? null },
      type: 'price_details',
      unit_amount_decimal: price ? String(price.unit_amount) : null,
    },
    quantity: line.quantity,
    subscription: i.subscription,
    subtotal: line.amount,
    taxes: [],
  };
}

export function listInvoices(store: Store, p: Params): Json {
  const customer = p.string('customer');
  const items = [...store.invoices.values()].filter((i) => !customer || i.customer === customer);
  return paginate(items, p, '/v1/invoices', (i) => renderInvoice(store, i));
}

/** What the hosted invoice page shows, or null for an unknown invoice. */
export function invoiceView(store: Store, id: string) {
  const invoice = store.invoices.get(id);
  if (!invoice) return null;
  return { invoice, customer: store.customers.get(invoice.customer) };
}
