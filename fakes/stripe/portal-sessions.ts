// Billing-portal sessions: created by the app, then the portal page (pages.ts) lets the customer switch plan
// or cancel through the same subscription changes as the API, so the same events are recorded.
import { Params } from './form';
import { badParam, missing, missingParam, newestFirst, type Json } from './api';
import { customerRec } from './customers';
import { priceRec, productName, SEED_PLANS } from './prices';
import { cancelSubscription, updateSubscription } from './subscriptions';
import type { PortalView } from './pages';
import type { PortalSessionRec, Store, SubscriptionRec } from './store';

function renderPortalSession(store: Store, s: PortalSessionRec): Json {
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
    url: `${store.publicUrl}/portal/${s.id}`,
  };
}

export function createPortalSession(store: Store, p: Params): Json {
  const customer = p.requiredString('customer');
  customerRec(store, customer, 'customer');
  const returnUrl = p.string('return_url', { maxLength: 5000 }) || null;
  if (returnUrl && !/^https?:\/\//.test(returnUrl)) throw badParam('Not a valid URL', 'return_url');
  const rec: PortalSessionRec = { ...store.base('bps', 24), customer, return_url: returnUrl };
  store.portalSessions.set(rec.id, rec);
  return renderPortalSession(store, rec);
}

/** What the portal page shows, or null for an unknown session. */
export function portalView(store: Store, id: string): PortalView | null {
  const session = store.portalSessions.get(id);
  if (!session) return null;
  const customer = store.customers.get(session.customer);
  const subscriptions = newestFirst([...store.subscriptions.values()].filter((s) => s.customer === session.customer)).map((s) => ({
    rec: s,
    items: s.items.map((i) => {
      const price = priceRec(store, i.price);
      return { id: i.id, priceId: price.id, name: productName(store, price), unitAmount: price.unit_amount, currency: price.currency, quantity: i.quantity };
    }),
  }));
  const invoices = newestFirst([...store.invoices.values()].filter((i) => i.customer === session.customer)).slice(0, 12);
  const plans = SEED_PLANS.map((plan) => {
    const price = store.prices.get(plan.price);
    return { priceId: plan.price, name: plan.name, unitAmount: price?.unit_amount ?? plan.amount, currency: price?.currency ?? 'eur', maxAssets: plan.maxAssets };
  });
  return { session, customer, subscriptions, invoices, plans };
}

/** Only the portal's own customer's subscriptions can be changed from it. */
function portalSubscription(store: Store, portalId: string, subscriptionId: string): SubscriptionRec {
  const session = store.portalSessions.get(portalId);
  if (!session) throw missing('billing_portal.session', portalId);
  const sub = store.subscriptions.get(subscriptionId);
  if (!sub || sub.customer !== session.customer) throw missingParam('subscription', subscriptionId, 'subscription');
  return sub;
}

export function portalChangePlan(store: Store, portalId: string, subscriptionId: string, priceId: string): Json {
  const sub = portalSubscription(store, portalId, subscriptionId);
  if (sub.status === 'canceled') throw badParam('This subscription has ended; start a new one from the app.', 'subscription');
  priceRec(store, priceId, 'price');
  return updateSubscription(store, sub.id, new Params({ items: [{ id: sub.items[0].id, price: priceId }], proration_behavior: 'create_prorations' }));
}

export function portalCancel(store: Store, portalId: string, subscriptionId: string, when: 'period_end' | 'now' | 'resume'): Json {
  const sub = portalSubscription(store, portalId, subscriptionId);
  if (sub.status === 'canceled') throw badParam('This subscription has already ended.', 'subscription');
  if (when === 'now') return cancelSubscription(store, sub.id);
  return updateSubscription(store, sub.id, new Params({ cancel_at_period_end: when === 'period_end' ? 'true' : 'false' }));
}
