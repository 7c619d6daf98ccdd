// Objects and their transitions: customers, products and prices, Checkout Sessions, subscriptions,
// invoices, billing-portal sessions and events.
//
// Records are kept in our own internal shape and rendered into API-shaped JSON on the way out, so that a
// subscription always shows the current price object and every event carries a snapshot taken when it
// happened. Mutations record events through `emit`; the server takes them with `takeEmitted()` and hands
// them to the webhook queue (see server.ts). Nothing in here does I/O.
import { randomBytes } from 'node:crypto';
import { Params } from './form';

/** The API version the installed SDK (stripe 23.1.0) pins; events are stamped with it. */
export const API_VERSION = '2026-10-28.endive';

export type Json = { [key: string]: unknown };

export type ErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

/** An error that the server renders as Stripe's `{ error: { type, message, code?, param? } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

const missing = (kind: string, id: string, param = 'id') =>
  new ApiError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);

/** A referenced object that does not exist: Stripe answers 400 (not 404) and names the param. */
const missingParam = (kind: string, id: string, param: string) =>
  new ApiError(400, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);

const badParam = (message: string, param: string) => new ApiError(400, 'invalid_request_error', message, 'parameter_invalid', param);

// ---------------------------------------------------------------------------------------------------------
// Ids, time, money

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

/** One calendar month later, clamped to the end of the month (31 Jan → 28/29 Feb), as Stripe bills. */
export function addMonth(unix: number): number {
  const d = new Date(unix * 1000);
  const target = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1, d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds()));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d.getUTCDate(), lastDay));
  return Math.floor(target.getTime() / 1000);
}

export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat('en-IE', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
}

const DAY = 86_400;

// ---------------------------------------------------------------------------------------------------------
// Internal records (JSON-serialisable, persisted as they are)

interface Base {
  id: string;
  created: number;
  /** Creation order, to sort objects created within the same second. */
  seq: number;
}

export interface CustomerRec extends Base {
  email: string | null;
  name: string | null;
  description: string | null;
  phone: string | null;
  metadata: Record<string, string>;
}

export interface ProductRec extends Base {
  name: string;
  description: string | null;
  active: boolean;
  metadata: Record<string, string>;
  default_price: string | null;
}

export interface PriceRec extends Base {
  product: string;
  unit_amount: number;
  currency: string;
  interval: 'month' | 'year';
  lookup_key: string | null;
  nickname: string | null;
  active: boolean;
  metadata: Record<string, string>;
}

export interface CheckoutSessionRec extends Base {
  customer: string | null;
  customer_email: string | null;
  mode: 'subscription';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid' | 'no_payment_required';
  line_items: { id: string; price: string; quantity: number }[];
  success_url: string;
  cancel_url: string | null;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  subscription_metadata: Record<string, string>;
  trial_period_days: number | null;
  subscription: string | null;
  invoice: string | null;
  expires_at: number;
}

export interface SubscriptionItemRec {
  id: string;
  created: number;
  price: string;
  quantity: number;
  metadata: Record<string, string>;
}

export type SubscriptionStatus = 'active' | 'trialing' | 'past_due' | 'canceled' | 'unpaid' | 'incomplete' | 'incomplete_expired' | 'paused';

export interface SubscriptionRec extends Base {
  customer: string;
  status: SubscriptionStatus;
  items: SubscriptionItemRec[];
  cancel_at_period_end: boolean;
  canceled_at: number | null;
  ended_at: number | null;
  cancellation_reason: 'cancellation_requested' | 'payment_failed' | null;
  current_period_start: number;
  current_period_end: number;
  trial_start: number | null;
  trial_end: number | null;
  start_date: number;
  metadata: Record<string, string>;
  latest_invoice: string | null;
}

export interface InvoiceLineRec {
  id: string;
  price: string;
  quantity: number;
  amount: number;
  description: string;
  period_start: number;
  period_end: number;
}

export interface InvoiceRec extends Base {
  number: string;
  customer: string;
  subscription: string | null;
  subscription_metadata: Record<string, string>;
  status: 'draft' | 'open' | 'paid' | 'void' | 'uncollectible';
  billing_reason: 'subscription_create' | 'subscription_cycle' | 'subscription_update' | 'manual';
  currency: string;
  lines: InvoiceLineRec[];
  amount_due: number;
  amount_paid: number;
  attempt_count: number;
  period_start: number;
  period_end: number;
  finalized_at: number;
  paid_at: number | null;
  next_payment_attempt: number | null;
}

export interface PortalSessionRec extends Base {
  customer: string;
  return_url: string | null;
}

export interface StateFile {
  version: 1;
  seq: number;
  invoiceNumber: number;
  customers: CustomerRec[];
  products: ProductRec[];
  prices: PriceRec[];
  checkoutSessions: CheckoutSessionRec[];
  subscriptions: SubscriptionRec[];
  invoices: InvoiceRec[];
  portalSessions: PortalSessionRec[];
  events: Json[];
}

// ---------------------------------------------------------------------------------------------------------
// The three plans Tidewarden sells. Fixed ids so that ids the app stored survive a reset of the fake.

const SEED_PLANS = [
  { key: 'tw_harbour_monthly', product: 'prod_TwHarbour', price: 'price_TwHarbourMonthly', name: 'Harbour', amount: 4900, maxAssets: '3' },
  { key: 'tw_fleet_monthly', product: 'prod_TwFleet', price: 'price_TwFleetMonthly', name: 'Fleet', amount: 29000, maxAssets: '25' },
  { key: 'tw_armada_monthly', product: 'prod_TwArmada', price: 'price_TwArmadaMonthly', name: 'Armada', amount: 89000, maxAssets: 'unlimited' },
] as const;

// ---------------------------------------------------------------------------------------------------------
// List helper

/** Stripe's list envelope with `limit`, `starting_after` and `ending_before` over newest-first items. */
function paginate<T extends Base>(items: T[], p: Params, url: string, render: (item: T) => Json): Json {
  const limit = p.integer('limit', { min: 1, max: 100 }) ?? 10;
  const sorted = [...items].sort((a, b) => b.created - a.created || b.seq - a.seq);
  const after = p.string('starting_after');
  const before = p.string('ending_before');
  let page: T[];
  let hasMore: boolean;
  if (after) {
    const i = sorted.findIndex((x) => x.id === after);
    if (i === -1) throw missingParam('object', after, 'starting_after');
    const rest = sorted.slice(i + 1);
    page = rest.slice(0, limit);
    hasMore = rest.length > limit;
  } else if (before) {
    const i = sorted.findIndex((x) => x.id === before);
    if (i === -1) throw missingParam('object', before, 'ending_before');
    const rest = sorted.slice(0, i);
    page = rest.slice(Math.max(0, rest.length - limit));
    hasMore = rest.length > limit;
  } else {
    page = sorted.slice(0, limit);
    hasMore = sorted.length > limit;
  }
  return { object: 'list', data: page.map(render), has_more: hasMore, url };
}

const clone = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

/** Applies a metadata update: `null` clears everything, an empty value removes one key. */
function mergeMetadata(current: Record<string, string>, update: Record<string, string> | null | undefined): Record<string, string> {
  if (update === undefined) return current;
  if (update === null) return {};
  const next = { ...current };
  for (const [k, v] of Object.entries(update)) {
    if (v === '') delete next[k];
    else next[k] = v;
  }
  return next;
}

const cleanMetadata = (m: Record<string, string> | null | undefined) => mergeMetadata({}, m);

// ---------------------------------------------------------------------------------------------------------

export interface StoreOptions {
  publicUrl: string;
}

export class Store {
  private seq = 0;
  private invoiceNumber = 0;
  private customers = new Map<string, CustomerRec>();
  private products = new Map<string, ProductRec>();
  private prices = new Map<string, PriceRec>();
  private checkoutSessions = new Map<string, CheckoutSessionRec>();
  private subscriptions = new Map<string, SubscriptionRec>();
  private invoices = new Map<string, InvoiceRec>();
  private portalSessions = new Map<string, PortalSessionRec>();
  /** Every event ever created, oldest first. */
  private events: Json[] = [];
  private eventIndex = new Map<string, Json>();
  /** Events created since the last takeEmitted(). */
  private emitted: string[] = [];

  private _publicUrl: string;

  constructor(options: StoreOptions) {
    this._publicUrl = options.publicUrl;
    this.seed();
  }

  get publicUrl(): string {
    return this._publicUrl;
  }

  /** Set once the port is known (FAKE_STRIPE_PORT=0); only affects URLs rendered afterwards. */
  setPublicUrl(url: string): void {
    this._publicUrl = url;
  }

  // ----- bookkeeping ------------------------------------------------------------------------------------

  private base(prefix: string, length?: number): Base {
    this.seq += 1;
    return { id: newId(prefix, length), created: nowSeconds(), seq: this.seq };
  }

  private seed(): void {
    const created = nowSeconds();
    // Seeded in reverse so that newest-first lists show Harbour, Fleet, Armada.
    for (const plan of [...SEED_PLANS].reverse()) {
      this.seq += 1;
      this.products.set(plan.product, {
        id: plan.product,
        created,
        seq: this.seq,
        name: plan.name,
        description: `Tidewarden ${plan.name}: ${plan.maxAssets === 'unlimited' ? 'unlimited assets' : `up to ${plan.maxAssets} assets`}.`,
        active: true,
        metadata: { max_assets: plan.maxAssets },
        default_price: plan.price,
      });
      this.seq += 1;
      this.prices.set(plan.price, {
        id: plan.price,
        created,
        seq: this.seq,
        product: plan.product,
        unit_amount: plan.amount,
        currency: 'eur',
        interval: 'month',
        lookup_key: plan.key,
        nickname: `${plan.name} monthly`,
        active: true,
        // Also on the price, so that code reading either place finds the plan's limit.
        metadata: { max_assets: plan.maxAssets },
      });
    }
  }

  /** Clears everything and seeds the plans again. */
  reset(): void {
    this.seq = 0;
    this.invoiceNumber = 0;
    for (const map of [this.customers, this.products, this.prices, this.checkoutSessions, this.subscriptions, this.invoices, this.portalSessions]) {
      map.clear();
    }
    this.events = [];
    this.eventIndex.clear();
    this.emitted = [];
    this.seed();
  }

  toJSON(): StateFile {
    return {
      version: 1,
      seq: this.seq,
      invoiceNumber: this.invoiceNumber,
      customers: [...this.customers.values()],
      products: [...this.products.values()],
      prices: [...this.prices.values()],
      checkoutSessions: [...this.checkoutSessions.values()],
      subscriptions: [...this.subscriptions.values()],
      invoices: [...this.invoices.values()],
      portalSessions: [...this.portalSessions.values()],
      events: this.events,
    };
  }

  load(file: StateFile): void {
    if (file.version !== 1) throw new Error(`Unsupported state file version ${String(file.version)}`);
    this.reset();
    const fill = <T extends { id: string }>(map: Map<string, T>, items: T[]) => items.forEach((x) => map.set(x.id, x));
    this.seq = file.seq;
    this.invoiceNumber = file.invoiceNumber;
    fill(this.customers, file.customers);
    fill(this.products, file.products);
    fill(this.prices, file.prices);
    fill(this.checkoutSessions, file.checkoutSessions);
    fill(this.subscriptions, file.subscriptions);
    fill(this.invoices, file.invoices);
    fill(this.portalSessions, file.portalSessions);
    this.events = file.events;
    this.events.forEach((e) => this.eventIndex.set(e.id as string, e));
  }

  // ----- events -----------------------------------------------------------------------------------------

  private emit(type: string, object: Json, previousAttributes?: Json): void {
    const data: Json = { object: clone(object) };
    if (previousAttributes) data.previous_attributes = clone(previousAttributes);
    const event: Json = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: nowSeconds(),
      data,
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    this.events.push(event);
    this.eventIndex.set(event.id as string, event);
    this.emitted.push(event.id as string);
  }

  /** Ids of the events created since the previous call, in creation order. */
  takeEmitted(): string[] {
    const ids = this.emitted;
    this.emitted = [];
    return ids;
  }

  allEvents(): Json[] {
    return this.events;
  }

  findEvent(id: string): Json | undefined {
    return this.eventIndex.get(id);
  }

  /** The exact bytes delivered for an event. Pretty-printed like Stripe's, so re-serialising breaks the signature. */
  eventPayload(id: string): string | null {
    const event = this.eventIndex.get(id);
    return event ? JSON.stringify(event, null, 2) : null;
  }

  getEvent(id: string): Json {
    const event = this.eventIndex.get(id);
    if (!event) throw missing('event', id);
    return event;
  }

  listEvents(p: Params): Json {
    const type = p.string('type');
    const typed = this.events
      .map((e, i) => ({ id: e.id as string, created: e.created as number, seq: i, event: e }))
      .filter((e) => !type || (type.endsWith('.*') ? (e.event.type as string).startsWith(type.slice(0, -1)) : e.event.type === type));
    return paginate(typed, p, '/v1/events', (e) => e.event);
  }

  // ----- lookups ----------------------------------------------------------------------------------------

  private customerRec(id: string, param?: string): CustomerRec {
    const rec = this.customers.get(id);
    if (!rec) throw param ? missingParam('customer', id, param) : missing('customer', id);
    return rec;
  }

  private priceRec(id: string, param?: string): PriceRec {
    const rec = this.prices.get(id);
    if (!rec) throw param ? missingParam('price', id, param) : missing('price', id);
    return rec;
  }

  private subscriptionRec(id: string): SubscriptionRec {
    const rec = this.subscriptions.get(id);
    if (!rec) throw missing('subscription', id);
    return rec;
  }

  /** Renders any object by id, for `expand[]`. */
  lookupAny(id: string): Json | null {
    const customer = this.customers.get(id);
    if (customer) return this.renderCustomer(customer);
    const product = this.products.get(id);
    if (product) return this.renderProduct(product);
    const price = this.prices.get(id);
    if (price) return this.renderPrice(price);
    const session = this.checkoutSessions.get(id);
    if (session) return this.renderCheckoutSession(session);
    const subscription = this.subscriptions.get(id);
    if (subscription) return this.renderSubscription(subscription);
    const invoice = this.invoices.get(id);
    if (invoice) return this.renderInvoice(invoice);
    const portal = this.portalSessions.get(id);
    if (portal) return this.renderPortalSession(portal);
    return this.eventIndex.get(id) ?? null;
  }

  // ----- rendering --------------------------------------------------------------------------------------

  renderCustomer(c: CustomerRec): Json {
    return {
      id: c.id,
      object: 'customer',
      address: null,
      balance: 0,
      created: c.created,
      currency: this.customerCurrency(c.id),
      default_source: null,
      delinquent: [...this.subscriptions.values()].some((s) => s.customer === c.id && s.status === 'past_due'),
      description: c.description,
      discount: null,
      email: c.email,
      invoice_prefix: c.id.slice(4, 12).toUpperCase(),
      invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
      livemode: false,
      metadata: { ...c.metadata },
      name: c.name,
      phone: c.phone,
      preferred_locales: [],
      shipping: null,
      tax_exempt: 'none',
      test_clock: null,
    };
  }

  private customerCurrency(customerId: string): string | null {
    for (const s of this.subscriptions.values()) if (s.customer === customerId) return 'eur';
    return null;
  }

  renderProduct(p: ProductRec): Json {
    return {
      id: p.id,
      object: 'product',
      active: p.active,
      created: p.created,
      default_price: p.default_price,
      description: p.description,
      images: [],
      livemode: false,
      marketing_features: [],
      metadata: { ...p.metadata },
      name: p.name,
      package_dimensions: null,
      shippable: null,
      statement_descriptor: null,
      tax_code: null,
      type: 'service',
      unit_label: null,
      updated: p.created,
      url: null,
    };
  }

  renderPrice(p: PriceRec): Json {
    return {
      id: p.id,
      object: 'price',
      active: p.active,
      billing_scheme: 'per_unit',
      created: p.created,
      currency: p.currency,
      custom_unit_amount: null,
      livemode: false,
      lookup_key: p.lookup_key,
      metadata: { ...p.metadata },
      nickname: p.nickname,
      product: p.product,
      recurring: { interval: p.interval, interval_count: 1, meter: null, trial_period_days: null, usage_type: 'licensed' },
      tax_behavior: 'unspecified',
      tiers_mode: null,
      transform_quantity: null,
      type: 'recurring',
      unit_amount: p.unit_amount,
      unit_amount_decimal: String(p.unit_amount),
    };
  }

  /** The legacy `plan` object that subscription items still carry next to `price`. */
  private renderPlan(p: PriceRec): Json {
    return {
      id: p.id,
      object: 'plan',
      active: p.active,
      amount: p.unit_amount,
      amount_decimal: String(p.unit_amount),
      billing_scheme: 'per_unit',
      created: p.created,
      currency: p.currency,
      interval: p.interval,
      interval_count: 1,
      livemode: false,
      metadata: { ...p.metadata },
      meter: null,
      nickname: p.nickname,
      product: p.product,
      tiers_mode: null,
      transform_usage: null,
      trial_period_days: null,
      usage_type: 'licensed',
    };
  }

  private sessionAmount(s: CheckoutSessionRec): number {
    if (s.trial_period_days) return 0;
    return s.line_items.reduce((sum, li) => sum + (this.prices.get(li.price)?.unit_amount ?? 0) * li.quantity, 0);
  }

  renderCheckoutSession(s: CheckoutSessionRec): Json {
    const amount = this.sessionAmount(s);
    const customer = s.customer ? this.customers.get(s.customer) : undefined;
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
      url: s.status === 'open' ? `${this.publicUrl}/checkout/${s.id}` : null,
    };
  }

  /** `line_items` is not included by default; it is only rendered when expanded. */
  private renderCheckoutLineItems(s: CheckoutSessionRec): Json {
    return {
      object: 'list',
      data: s.line_items.map((li) => {
        const price = this.priceRec(li.price);
        const product = this.products.get(price.product);
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
          price: this.renderPrice(price),
          quantity: li.quantity,
        };
      }),
      has_more: false,
      url: `/v1/checkout/sessions/${s.id}/line_items`,
    };
  }

  private renderSubscriptionItem(sub: SubscriptionRec, item: SubscriptionItemRec): Json {
    const price = this.priceRec(item.price);
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
      plan: this.renderPlan(price),
      price: this.renderPrice(price),
      quantity: item.quantity,
      subscription: sub.id,
      tax_rates: [],
    };
  }

  renderSubscription(s: SubscriptionRec): Json {
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
      currency: this.prices.get(s.items[0]?.price ?? '')?.currency ?? 'eur',
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
        data: s.items.map((item) => this.renderSubscriptionItem(s, item)),
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

  renderInvoice(i: InvoiceRec): Json {
    const customer = this.customers.get(i.customer);
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
      ending_balance: 0,
      footer: null,
      hosted_invoice_url: `${this.publicUrl}/invoice/${i.id}`,
      // We do not produce PDFs; the hosted page is the only document.
      invoice_pdf: null,
      lines: {
        object: 'list',
        data: i.lines.map((line) => this.renderInvoiceLine(i, line)),
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
      starting_balance: 0,
      statement_descriptor: null,
      status: i.status,
      status_transitions: {
        finalized_at: i.finalized_at,
        marked_uncollectible_at: i.status === 'uncollectible' ? i.finalized_at : null,
        paid_at: i.paid_at,
        voided_at: i.status === 'void' ? i.finalized_at : null,
      },
      subscription: i.subscription,
      subtotal: i.amount_due,
      subtotal_excluding_tax: i.amount_due,
      test_clock: null,
      total: i.amount_due,
      total_excluding_tax: i.amount_due,
      total_taxes: [],
      webhooks_delivered_at: i.finalized_at,
    };
  }

  private renderInvoiceLine(i: InvoiceRec, line: InvoiceLineRec): Json {
    const price = this.prices.get(line.price);
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
        ? { subscription_item_details: { subscription: i.subscription, proration: false }, type: 'subscription_item_details' }
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

  renderPortalSession(s: PortalSessionRec): Json {
    return {
      id: s.id,
      object: 'billing_portal.session',
      configuration: 'bpc_TwLocalStandIn',
      created: s.created,
      customer: s.customer,
      flow: null,
      livemode: false,
      locale: null,
      on_behalf_of: null,
      return_url: s.return_url,
      url: `${this.publicUrl}/portal/${s.id}`,
    };
  }

  // ----- customers --------------------------------------------------------------------------------------

  createCustomer(p: Params): Json {
    const rec: CustomerRec = {
      ...this.base('cus', 14),
      email: p.string('email', { maxLength: 512 }) || null,
      name: p.string('name', { maxLength: 256 }) || null,
      description: p.string('description', { maxLength: 350 }) || null,
      phone: p.string('phone', { maxLength: 20 }) || null,
      metadata: cleanMetadata(p.metadata()),
    };
    this.customers.set(rec.id, rec);
    const out = this.renderCustomer(rec);
    this.emit('customer.created', out);
    return out;
  }

  getCustomer(id: string): Json {
    return this.renderCustomer(this.customerRec(id));
  }

  updateCustomer(id: string, p: Params): Json {
    const rec = this.customerRec(id);
    const before = this.renderCustomer(rec);
    // An empty string unsets a field, as in Stripe's update calls.
    const text = (key: string, maxLength: number, current: string | null) => {
      const v = p.string(key, { maxLength });
      return v === undefined ? current : v || null;
    };
    rec.email = text('email', 512, rec.email);
    rec.name = text('name', 256, rec.name);
    rec.description = text('description', 350, rec.description);
    rec.phone = text('phone', 20, rec.phone);
    rec.metadata = mergeMetadata(rec.metadata, p.metadata());
    const out = this.renderCustomer(rec);
    this.emitUpdated('customer.updated', before, out);
    return out;
  }

  listCustomers(p: Params): Json {
    const email = p.string('email');
    const items = [...this.customers.values()].filter((c) => !email || c.email === email);
    return paginate(items, p, '/v1/customers', (c) => this.renderCustomer(c));
  }

  // ----- products and prices ----------------------------------------------------------------------------

  getProduct(id: string): Json {
    const rec = this.products.get(id);
    if (!rec) throw missing('product', id);
    return this.renderProduct(rec);
  }

  getPrice(id: string): Json {
    return this.renderPrice(this.priceRec(id));
  }

  listPrices(p: Params): Json {
    const lookupKeys = p.stringArray('lookup_keys');
    if (lookupKeys && lookupKeys.length > 10) throw badParam('You may pass at most 10 lookup_keys.', 'lookup_keys');
    const active = p.boolean('active');
    const product = p.string('product');
    const currency = p.string('currency')?.toLowerCase();
    const type = p.oneOf('type', ['one_time', 'recurring'] as const);
    const interval = p.object('recurring')?.oneOf('interval', ['day', 'week', 'month', 'year'] as const);
    const items = [...this.prices.values()].filter(
      (x) =>
        (!lookupKeys || (x.lookup_key !== null && lookupKeys.includes(x.lookup_key))) &&
        (active === undefined || x.active === active) &&
        (!product || x.product === product) &&
        (!currency || x.currency === currency) &&
        (!type || type === 'recurring') &&
        (!interval || x.interval === interval),
    );
    return paginate(items, p, '/v1/prices', (x) => this.renderPrice(x));
  }

  // ----- Checkout Sessions ------------------------------------------------------------------------------

  createCheckoutSession(p: Params): Json {
    const mode = p.oneOf('mode', ['payment', 'setup', 'subscription'] as const);
    if (!mode) throw badParam('Missing required param: mode.', 'mode');
    if (mode !== 'subscription') throw badParam(`This local stand-in only supports mode=subscription, not ${mode}.`, 'mode');
    const uiMode = p.string('ui_mode');
    if (uiMode && uiMode !== 'hosted') throw badParam(`This local stand-in only supports the hosted page (ui_mode=hosted).`, 'ui_mode');
    const successUrl = p.requiredString('success_url', { maxLength: 5000 });
    if (!/^https?:\/\//.test(successUrl)) throw badParam('Not a valid URL', 'success_url');
    const cancelUrl = p.string('cancel_url', { maxLength: 5000 }) || null;
    if (cancelUrl && !/^https?:\/\//.test(cancelUrl)) throw badParam('Not a valid URL', 'cancel_url');

    const customerId = p.string('customer') || null;
    const customerEmail = p.string('customer_email', { maxLength: 512 }) || null;
    if (customerId && customerEmail) {
      throw badParam('You may only specify one of these parameters: customer, customer_email.', 'customer_email');
    }
    if (customerId) this.customerRec(customerId, 'customer');

    const lineParams = p.objectArray('line_items');
    if (!lineParams || lineParams.length === 0) throw badParam('Missing required param: line_items.', 'line_items');
    const lineItems = lineParams.map((li) => {
      const priceId = li.requiredString('price');
      const price = this.priceRec(priceId, li.name('price'));
      if (!price.active) throw badParam(`The price specified is inactive: ${priceId}`, li.name('price'));
      return { id: newId('li'), price: priceId, quantity: li.integer('quantity', { min: 1, max: 999_999 }) ?? 1 };
    });

    const subscriptionData = p.object('subscription_data');
    const trialDays = subscriptionData?.integer('trial_period_days', { min: 1, max: 730 }) ?? null;

    const rec: CheckoutSessionRec = {
      ...this.base('cs_test', 58),
      customer: customerId,
      customer_email: customerEmail,
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
      expires_at: 0,
    };
    const expiresAt = p.integer('expires_at');
    rec.expires_at = expiresAt ?? rec.created + DAY;
    if (rec.expires_at < rec.created + 30 * 60 || rec.expires_at > rec.created + DAY) {
      throw badParam('expires_at must be between 30 minutes and 24 hours from now.', 'expires_at');
    }
    this.checkoutSessions.set(rec.id, rec);
    return this.renderCheckoutSession(rec);
  }

  private checkoutSessionRec(id: string): CheckoutSessionRec {
    const rec = this.checkoutSessions.get(id);
    if (!rec) throw missing('checkout.session', id);
    // Expire lazily: a session past its expiry cannot be paid.
    if (rec.status === 'open' && nowSeconds() >= rec.expires_at) {
      rec.status = 'expired';
      this.emit('checkout.session.expired', this.renderCheckoutSession(rec));
    }
    return rec;
  }

  getCheckoutSession(id: string, expandPaths: string[] = []): Json {
    const rec = this.checkoutSessionRec(id);
    const out = this.renderCheckoutSession(rec);
    // Not part of the object unless asked for (also for nested paths such as line_items.data.price.product).
    if (expandPaths.some((p) => p === 'line_items' || p.startsWith('line_items.'))) out.line_items = this.renderCheckoutLineItems(rec);
    return out;
  }

  listCheckoutLineItems(id: string, p: Params): Json {
    const list = this.renderCheckoutLineItems(this.checkoutSessionRec(id));
    const limit = p.integer('limit', { min: 1, max: 100 }) ?? 10;
    const data = list.data as Json[];
    return { ...list, data: data.slice(0, limit), has_more: data.length > limit };
  }

  expireCheckoutSession(id: string): Json {
    const rec = this.checkoutSessionRec(id);
    if (rec.status !== 'open') {
      throw new ApiError(400, 'invalid_request_error', `Only Checkout Sessions with a status of open can be expired; this one is ${rec.status}.`, 'checkout_session_not_open');
    }
    rec.status = 'expired';
    const out = this.renderCheckoutSession(rec);
    this.emit('checkout.session.expired', out);
    return out;
  }

  /** What the hosted checkout page shows. */
  checkoutView(id: string) {
    const rec = this.checkoutSessions.has(id) ? this.checkoutSessionRec(id) : undefined;
    if (!rec) return null;
    const lines = rec.line_items.map((li) => {
      const price = this.priceRec(li.price);
      return { name: this.products.get(price.product)?.name ?? price.id, unitAmount: price.unit_amount, currency: price.currency, interval: price.interval, quantity: li.quantity };
    });
    const customer = rec.customer ? this.customers.get(rec.customer) : undefined;
    return { session: rec, lines, email: customer?.email ?? rec.customer_email, total: lines.reduce((s, l) => s + l.unitAmount * l.quantity, 0) };
  }

  /**
   * The hosted page's payment: the succeeding test card creates the subscription and its first (paid)
   * invoice, completes the session and records checkout.session.completed, customer.subscription.created
   * and invoice.paid, in that order. The declining card changes nothing and records nothing.
   */
  payCheckout(id: string, card: string): { ok: true; redirect: string } | { ok: false; status: number; message: string } {
    const rec = this.checkoutSessionRec(id);
    if (rec.status !== 'open') return { ok: false, status: 409, message: `This checkout is ${rec.status} and can no longer be paid.` };
    const digits = card.replace(/\D/g, '');
    if (digits === '4000000000000002') return { ok: false, status: 402, message: 'Your card was declined.' };
    if (digits !== '4242424242424242') return { ok: false, status: 400, message: 'Unknown test card. Use one of the two buttons below.' };

    let customerId = rec.customer;
    if (!customerId) {
      // Stripe creates a customer for subscription-mode sessions that were not given one.
      const customer: CustomerRec = { ...this.base('cus', 14), email: rec.customer_email, name: null, description: null, phone: null, metadata: {} };
      this.customers.set(customer.id, customer);
      customerId = customer.id;
      rec.customer = customerId;
    }
    const { sub, invoice } = this.startSubscription({
      customer: customerId,
      items: rec.line_items.map((li) => ({ price: li.price, quantity: li.quantity })),
      trialDays: rec.trial_period_days,
      metadata: rec.subscription_metadata,
    });
    rec.status = 'complete';
    rec.payment_status = rec.trial_period_days ? 'no_payment_required' : 'paid';
    rec.subscription = sub.id;
    rec.invoice = invoice.id;

    this.emit('checkout.session.completed', this.renderCheckoutSession(rec));
    this.emit('customer.subscription.created', this.renderSubscription(sub));
    this.emit('invoice.paid', this.renderInvoice(invoice));
    return { ok: true, redirect: rec.success_url.replaceAll('{CHECKOUT_SESSION_ID}', rec.id) };
  }

  // ----- subscriptions ----------------------------------------------------------------------------------

  /** Creates an active (or trialing) subscription with its first, paid invoice. Records no events. */
  private startSubscription(input: {
    customer: string;
    items: { price: string; quantity: number; metadata?: Record<string, string> }[];
    trialDays: number | null;
    metadata: Record<string, string>;
  }): { sub: SubscriptionRec; invoice: InvoiceRec } {
    const base = this.base('sub', 24);
    const trialEnd = input.trialDays ? base.created + input.trialDays * DAY : null;
    const sub: SubscriptionRec = {
      ...base,
      customer: input.customer,
      status: trialEnd ? 'trialing' : 'active',
      items: input.items.map((item) => ({ id: newId('si', 14), created: base.created, price: item.price, quantity: item.quantity, metadata: item.metadata ?? {} })),
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
    this.subscriptions.set(sub.id, sub);
    const invoice = this.createInvoice(sub, 'subscription_create', true, Boolean(trialEnd));
    sub.latest_invoice = invoice.id;
    return { sub, invoice };
  }

  private createInvoice(sub: SubscriptionRec, reason: InvoiceRec['billing_reason'], paid: boolean, trial = false): InvoiceRec {
    const base = this.base('in', 24);
    this.invoiceNumber += 1;
    const lines: InvoiceLineRec[] = sub.items.map((item) => {
      const price = this.priceRec(item.price);
      const name = this.products.get(price.product)?.name ?? price.id;
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
    const total = lines.reduce((s, l) => s + l.amount, 0);
    const invoice: InvoiceRec = {
      ...base,
      number: `TWLOCAL-${String(this.invoiceNumber).padStart(4, '0')}`,
      customer: sub.customer,
      subscription: sub.id,
      subscription_metadata: { ...sub.metadata },
      status: paid ? 'paid' : 'open',
      billing_reason: reason,
      currency: this.prices.get(sub.items[0]?.price ?? '')?.currency ?? 'eur',
      lines,
      amount_due: total,
      amount_paid: paid ? total : 0,
      attempt_count: total > 0 ? 1 : 0,
      period_start: sub.current_period_start,
      period_end: sub.current_period_end,
      finalized_at: base.created,
      paid_at: paid ? base.created : null,
      next_payment_attempt: paid ? null : base.created + 3 * DAY,
    };
    this.invoices.set(invoice.id, invoice);
    return invoice;
  }

  /** Server-side creation. There are no payment methods here, so the first invoice is simply paid. */
  createSubscription(p: Params): Json {
    const customer = p.requiredString('customer');
    this.customerRec(customer, 'customer');
    const itemParams = p.objectArray('items');
    if (!itemParams || itemParams.length === 0) throw badParam('Missing required param: items.', 'items');
    const seen = new Set<string>();
    const items = itemParams.map((ip) => {
      const price = ip.requiredString('price');
      const rec = this.priceRec(price, ip.name('price'));
      if (!rec.active) throw badParam(`The price specified is inactive: ${price}`, ip.name('price'));
      if (seen.has(price)) throw badParam('Cannot add multiple subscription items with the same price.', ip.name('price'));
      seen.add(price);
      return { price, quantity: ip.integer('quantity', { min: 0 }) ?? 1, metadata: cleanMetadata(ip.metadata()) };
    });
    const trialDays = p.integer('trial_period_days', { min: 0, max: 730 }) || null;
    const { sub, invoice } = this.startSubscription({ customer, items, trialDays, metadata: cleanMetadata(p.metadata()) });
    if (p.boolean('cancel_at_period_end')) {
      sub.cancel_at_period_end = true;
      sub.canceled_at = sub.created;
      sub.cancellation_reason = 'cancellation_requested';
    }
    const out = this.renderSubscription(sub);
    this.emit('customer.subscription.created', out);
    this.emit('invoice.paid', this.renderInvoice(invoice));
    return out;
  }

  getSubscription(id: string): Json {
    return this.renderSubscription(this.subscriptionRec(id));
  }

  /** Like Stripe, the default list leaves out canceled subscriptions; `status=all` includes them. */
  listSubscriptions(p: Params): Json {
    const customer = p.string('customer');
    const price = p.string('price');
    const status = p.oneOf('status', ['active', 'all', 'canceled', 'ended', 'incomplete', 'incomplete_expired', 'past_due', 'paused', 'trialing', 'unpaid'] as const);
    const items = [...this.subscriptions.values()].filter((s) => {
      if (customer && s.customer !== customer) return false;
      if (price && !s.items.some((i) => i.price === price)) return false;
      if (status === 'all') return true;
      if (status === 'ended') return s.status === 'canceled' || s.status === 'incomplete_expired';
      if (status) return s.status === status;
      return s.status !== 'canceled' && s.status !== 'incomplete_expired';
    });
    return paginate(items, p, '/v1/subscriptions', (s) => this.renderSubscription(s));
  }

  /**
   * Plan change (`items[0][id]` + `items[0][price]`), quantity, `cancel_at_period_end`, `metadata`.
   * Prorations are not computed: `proration_behavior` is validated and otherwise ignored.
   */
  updateSubscription(id: string, p: Params): Json {
    const sub = this.subscriptionRec(id);
    const before = this.renderSubscription(sub);
    p.oneOf('proration_behavior', ['always_invoice', 'create_prorations', 'none'] as const);

    if (sub.status === 'canceled') {
      const allowed = new Set(['metadata', 'cancellation_details', 'expand', 'proration_behavior']);
      const other = Object.keys(p.raw).find((k) => !allowed.has(k));
      if (other) {
        throw new ApiError(400, 'invalid_request_error', 'A canceled subscription can only update its cancellation_details and metadata.', undefined, other);
      }
    }

    const itemParams = p.objectArray('items');
    const metadata = p.metadata();
    const cancelAtPeriodEnd = p.boolean('cancel_at_period_end');

    // Validate everything before changing anything.
    const nextItems = sub.items.map((i) => ({ ...i }));
    for (const ip of itemParams ?? []) {
      const itemId = ip.string('id');
      const priceId = ip.string('price');
      if (priceId) {
        const price = this.priceRec(priceId, ip.name('price'));
        if (!price.active) throw badParam(`The price specified is inactive: ${priceId}`, ip.name('price'));
      }
      const quantity = ip.integer('quantity', { min: 0 });
      const deleted = ip.boolean('deleted');
      if (itemId) {
        const idx = nextItems.findIndex((i) => i.id === itemId);
        if (idx === -1) throw missingParam('subscription item', itemId, ip.name('id'));
        if (deleted) {
          nextItems.splice(idx, 1);
          continue;
        }
        if (priceId) nextItems[idx].price = priceId;
        if (quantity !== undefined) nextItems[idx].quantity = quantity;
        nextItems[idx].metadata = mergeMetadata(nextItems[idx].metadata, ip.metadata());
      } else {
        // No id: Stripe adds a new item (it does not replace the existing one).
        if (!priceId) throw badParam('Missing required param: price (or id of an existing item).', ip.name('price'));
        if (deleted) throw badParam('deleted requires the id of an existing item.', ip.name('deleted'));
        nextItems.push({ id: newId('si', 14), created: nowSeconds(), price: priceId, quantity: quantity ?? 1, metadata: cleanMetadata(ip.metadata()) });
      }
    }
    if (nextItems.length === 0) throw badParam('A subscription must have at least one item.', 'items');
    const prices = nextItems.map((i) => i.price);
    if (new Set(prices).size !== prices.length) throw badParam('Cannot add multiple subscription items with the same price.', 'items');

    sub.items = nextItems;
    sub.metadata = mergeMetadata(sub.metadata, metadata);
    if (cancelAtPeriodEnd !== undefined && cancelAtPeriodEnd !== sub.cancel_at_period_end) {
      sub.cancel_at_period_end = cancelAtPeriodEnd;
      // Stripe stamps canceled_at when the cancellation is scheduled and clears it when it is withdrawn.
      sub.canceled_at = cancelAtPeriodEnd ? nowSeconds() : null;
      sub.cancellation_reason = cancelAtPeriodEnd ? 'cancellation_requested' : null;
    }
    const out = this.renderSubscription(sub);
    this.emitUpdated('customer.subscription.updated', before, out);
    return out;
  }

  /** DELETE /v1/subscriptions/:id: ends it now. */
  cancelSubscription(id: string): Json {
    const sub = this.subscriptionRec(id);
    if (sub.status === 'canceled') {
      throw new ApiError(400, 'invalid_request_error', `This subscription (${id}) has already been canceled.`);
    }
    this.endSubscription(sub, 'cancellation_requested');
    const out = this.renderSubscription(sub);
    this.emit('customer.subscription.deleted', out);
    return out;
  }

  private endSubscription(sub: SubscriptionRec, reason: SubscriptionRec['cancellation_reason']): void {
    const now = nowSeconds();
    sub.status = 'canceled';
    sub.canceled_at = sub.canceled_at ?? now;
    sub.ended_at = now;
    sub.cancellation_reason = reason;
    // The open invoices of a canceled subscription are not collected any more.
    for (const invoice of this.invoices.values()) {
      if (invoice.subscription === sub.id && invoice.status === 'open') invoice.next_payment_attempt = null;
    }
  }

  private emitUpdated(type: string, before: Json, after: Json): void {
    const previous: Json = {};
    for (const key of Object.keys(after)) {
      if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) previous[key] = before[key];
    }
    // Stripe sends an update event only when something changed.
    if (Object.keys(previous).length > 0) this.emit(type, after, previous);
  }

  // ----- billing portal ---------------------------------------------------------------------------------

  createPortalSession(p: Params): Json {
    const customer = p.requiredString('customer');
    this.customerRec(customer, 'customer');
    const returnUrl = p.string('return_url', { maxLength: 5000 }) || null;
    if (returnUrl && !/^https?:\/\//.test(returnUrl)) throw badParam('Not a valid URL', 'return_url');
    const rec: PortalSessionRec = { ...this.base('bps', 24), customer, return_url: returnUrl };
    this.portalSessions.set(rec.id, rec);
    return this.renderPortalSession(rec);
  }

  /** What the portal page shows, or null for an unknown session. */
  portalView(id: string) {
    const session = this.portalSessions.get(id);
    if (!session) return null;
    const customer = this.customers.get(session.customer);
    const subscriptions = [...this.subscriptions.values()]
      .filter((s) => s.customer === session.customer)
      .sort((a, b) => b.created - a.created || b.seq - a.seq)
      .map((s) => ({
        rec: s,
        items: s.items.map((i) => {
          const price = this.priceRec(i.price);
          return { id: i.id, priceId: price.id, name: this.products.get(price.product)?.name ?? price.id, unitAmount: price.unit_amount, currency: price.currency, quantity: i.quantity };
        }),
      }));
    const invoices = [...this.invoices.values()].filter((i) => i.customer === session.customer).sort((a, b) => b.created - a.created || b.seq - a.seq).slice(0, 12);
    const plans = SEED_PLANS.map((plan) => {
      const price = this.prices.get(plan.price);
      return { priceId: plan.price, name: plan.name, unitAmount: price?.unit_amount ?? plan.amount, currency: price?.currency ?? 'eur', maxAssets: plan.maxAssets };
    });
    return { session, customer, subscriptions, invoices, plans };
  }

  private portalSubscription(portalId: string, subscriptionId: string): SubscriptionRec {
    const session = this.portalSessions.get(portalId);
    if (!session) throw missing('billing_portal.session', portalId);
    const sub = this.subscriptions.get(subscriptionId);
    // Only the portal's own customer's subscriptions can be changed from it.
    if (!sub || sub.customer !== session.customer) throw missingParam('subscription', subscriptionId, 'subscription');
    return sub;
  }

  portalChangePlan(portalId: string, subscriptionId: string, priceId: string): Json {
    const sub = this.portalSubscription(portalId, subscriptionId);
    if (sub.status === 'canceled') throw badParam('This subscription has ended; start a new one from the app.', 'subscription');
    this.priceRec(priceId, 'price');
    return this.updateSubscription(sub.id, new Params({ items: [{ id: sub.items[0].id, price: priceId }], proration_behavior: 'create_prorations' }));
  }

  portalCancel(portalId: string, subscriptionId: string, when: 'period_end' | 'now' | 'resume'): Json {
    const sub = this.portalSubscription(portalId, subscriptionId);
    if (sub.status === 'canceled') throw badParam('This subscription has already ended.', 'subscription');
    if (when === 'now') return this.cancelSubscription(sub.id);
    return this.updateSubscription(sub.id, new Params({ cancel_at_period_end: when === 'period_end' ? 'true' : 'false' }));
  }

  // ----- invoices ---------------------------------------------------------------------------------------

  getInvoice(id: string): Json {
    const rec = this.invoices.get(id);
    if (!rec) throw missing('invoice', id);
    return this.renderInvoice(rec);
  }

  invoiceView(id: string) {
    const invoice = this.invoices.get(id);
    if (!invoice) return null;
    return { invoice, customer: this.customers.get(invoice.customer) };
  }

  listInvoices(p: Params): Json {
    const customer = p.string('customer');
    const subscription = p.string('subscription');
    const status = p.oneOf('status', ['draft', 'open', 'paid', 'uncollectible', 'void'] as const);
    const items = [...this.invoices.values()].filter(
      (i) => (!customer || i.customer === customer) && (!subscription || i.subscription === subscription) && (!status || i.status === status),
    );
    return paginate(items, p, '/v1/invoices', (i) => this.renderInvoice(i));
  }

  // ----- test controls ----------------------------------------------------------------------------------

  /**
   * Moves a subscription to its next billing period. A subscription set to cancel at period end ends
   * instead (customer.subscription.deleted, no invoice). Otherwise a renewal invoice is created:
   * paid → status active, events invoice.paid + customer.subscription.updated;
   * failed → invoice left open, status past_due, events invoice.payment_failed + customer.subscription.updated.
   */
  advance(subscriptionId: string, outcome: 'paid' | 'failed'): { subscription: Json; invoice: Json | null; ended: boolean } {
    const sub = this.subscriptions.get(subscriptionId);
    if (!sub) throw missing('subscription', subscriptionId, 'subscription');
    if (sub.status === 'canceled') throw badParam(`Subscription ${subscriptionId} is canceled; there is nothing to renew.`, 'subscription');
    const before = this.renderSubscription(sub);

    if (sub.cancel_at_period_end) {
      this.endSubscription(sub, 'cancellation_requested');
      const out = this.renderSubscription(sub);
      this.emit('customer.subscription.deleted', out);
      return { subscription: out, invoice: null, ended: true };
    }

    sub.current_period_start = sub.current_period_end;
    sub.current_period_end = addMonth(sub.current_period_start);
    const invoice = this.createInvoice(sub, 'subscription_cycle', outcome === 'paid');
    sub.latest_invoice = invoice.id;
    sub.status = outcome === 'paid' ? 'active' : 'past_due';
    const invoiceOut = this.renderInvoice(invoice);
    this.emit(outcome === 'paid' ? 'invoice.paid' : 'invoice.payment_failed', invoiceOut);
    const out = this.renderSubscription(sub);
    this.emitUpdated('customer.subscription.updated', before, out);
    return { subscription: out, invoice: invoiceOut, ended: false };
  }

  counts(): Record<string, number> {
    return {
      customers: this.customers.size,
      prices: this.prices.size,
      checkout_sessions: this.checkoutSessions.size,
      subscriptions: this.subscriptions.size,
      invoices: this.invoices.size,
      events: this.events.length,
    };
  }
}

// ---------------------------------------------------------------------------------------------------------
// expand[]

/**
 * Applies `expand[]` paths such as `subscription`, `data.product` or `items.data.price.product` to a
 * rendered object: the id found at the end of the path is replaced by the object it names. A `data`
 * segment of a list fans out over its elements. Unknown fields are a 400, as in Stripe.
 */
export function applyExpand(value: Json, paths: string[], lookup: (id: string) => Json | null): Json {
  for (const path of paths) {
    if (path.split('.').length > 4) throw badParam(`You cannot expand more than 4 levels of a property (${path}).`, 'expand');
    expandPath(value, path.split('.'), path, lookup);
  }
  return value;
}

function expandPath(target: unknown, segments: string[], fullPath: string, lookup: (id: string) => Json | null): void {
  if (target === null || target === undefined) return;
  if (Array.isArray(target)) {
    target.forEach((t) => expandPath(t, segments, fullPath, lookup));
    return;
  }
  if (typeof target !== 'object') throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
  const obj = target as Json;
  const [head, ...rest] = segments;
  if (!Object.hasOwn(obj, head)) throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
  let child = obj[head];
  if (typeof child === 'string') {
    const found = lookup(child);
    if (!found) throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
    obj[head] = found;
    child = found;
  }
  if (rest.length > 0) expandPath(child, rest, fullPath, lookup);
}
