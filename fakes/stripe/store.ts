// The fake's whole state: every record in our own internal shape, the event log and the counters.
//
// Records are kept apart from their API rendering (done by the resource modules next to this file) so
// that a subscription always shows the current price object and every event carries a snapshot taken
// when it happened. The record shapes below are also the state file's format (FAKE_STRIPE_STATE_FILE):
// they are persisted exactly as they are, so changing one means migrating files written by older runs.
// Nothing in here does I/O; server.ts reads and writes the file.
import { newId, nowSeconds, type Json } from './api';
import { seedPlans } from './prices';

export interface Base {
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
  /** Credit (negative) or debt (positive) carried to the next invoice, in minor units; absent = 0. */
  balance?: number;
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

type SubscriptionStatus = 'active' | 'trialing' | 'past_due' | 'canceled' | 'unpaid' | 'incomplete' | 'incomplete_expired' | 'paused';

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
  /** Proration lines of `create_prorations` changes, billed with the next renewal invoice; absent = none. */
  pending_prorations?: InvoiceLineRec[];
}

export interface InvoiceLineRec {
  id: string;
  price: string;
  quantity: number;
  amount: number;
  description: string;
  period_start: number;
  period_end: number;
  /** A credit or charge for part of a period after a plan change; absent = false. */
  proration?: boolean;
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
  /** The customer's balance applied to this invoice (negative = credit) and left after it; absent = 0. */
  starting_balance?: number;
  ending_balance?: number;
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

export class Store {
  seq = 0;
  invoiceNumber = 0;
  readonly customers = new Map<string, CustomerRec>();
  readonly products = new Map<string, ProductRec>();
  readonly prices = new Map<string, PriceRec>();
  readonly checkoutSessions = new Map<string, CheckoutSessionRec>();
  readonly subscriptions = new Map<string, SubscriptionRec>();
  readonly invoices = new Map<string, InvoiceRec>();
  readonly portalSessions = new Map<string, PortalSessionRec>();
  /** Every event ever created, oldest first. */
  events: Json[] = [];
  readonly eventIndex = new Map<string, Json>();
  /** Events created since the last takeEmitted(). */
  emitted: string[] = [];

  /**
   * Base of the `url` / `hosted_invoice_url` values handed to browsers. Reassigned once the port is known
   * (FAKE_STRIPE_PORT=0); only URLs rendered afterwards change.
   */
  constructor(public publicUrl: string) {
    seedPlans(this);
  }

  /** Id, creation time and creation order for a new record. */
  base(prefix: string, length?: number): Base {
    this.seq += 1;
    return { id: newId(prefix, length), created: nowSeconds(), seq: this.seq };
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
    seedPlans(this);
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
