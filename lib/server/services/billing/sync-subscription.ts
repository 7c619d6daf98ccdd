import type Stripe from 'stripe';
import type { Organisation } from '@/entities';
import { planFromLookupKey } from '@/lib/billing/plans';
import { getStripe } from '../../billing/stripe';

/**
 * Copies a subscription's current state onto the organisation. It is always read back from the
 * payment service, never taken from an event's payload, so events that arrive late or twice
 * cannot leave an old state behind.
 */
export async function syncSubscription(org: Organisation, subscriptionId: string, now = new Date()) {
  const sub = await getStripe().subscriptions.retrieve(subscriptionId);
  applySubscription(org, sub, now);
  return sub;
}

export function applySubscription(org: Organisation, sub: Stripe.Subscription, now = new Date()) {
  const item = sub.items.data[0];
  const periodEnd = (item as unknown as { current_period_end?: number })?.current_period_end ?? (sub as unknown as { current_period_end?: number }).current_period_end;
  org.stripeSubscriptionId = sub.id;
  org.subscriptionStatus = sub.status;
  org.plan = planFromLookupKey(item?.price.lookup_key) ?? org.plan ?? null;
  org.currentPeriodEnd = periodEnd ? new Date(periodEnd * 1000) : null;
  org.cancelAtPeriodEnd = Boolean(sub.cancel_at_period_end);
  org.pastDueSince = sub.status === 'past_due' ? (org.pastDueSince ?? now) : null;
  if (sub.status === 'active') org.trialEndsAt = null;
}
