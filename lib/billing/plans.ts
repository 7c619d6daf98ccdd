// Plans of our own, priced by the number of active assets. Prices live in the payment service
// (looked up by these keys); the limits are enforced here, on the server.
export const PLAN_IDS = ['harbour', 'fleet', 'armada'] as const;
export type PlanId = (typeof PLAN_IDS)[number];

export interface Plan {
  id: PlanId;
  name: string;
  lookupKey: string;
  /** Active (not archived) assets allowed; null = unlimited. */
  maxAssets: number | null;
  monthlyPriceEur: number;
  summary: string;
}

export const PLANS: Record<PlanId, Plan> = {
  harbour: { id: 'harbour', name: 'Harbour', lookupKey: 'tw_harbour_monthly', maxAssets: 3, monthlyPriceEur: 49, summary: 'Up to 3 vessels or structures' },
  fleet: { id: 'fleet', name: 'Fleet', lookupKey: 'tw_fleet_monthly', maxAssets: 25, monthlyPriceEur: 290, summary: 'Up to 25 vessels or structures' },
  armada: { id: 'armada', name: 'Armada', lookupKey: 'tw_armada_monthly', maxAssets: null, monthlyPriceEur: 890, summary: 'Any number of vessels and structures' },
};

export const TRIAL_DAYS = 30;
/** The plan whose limits apply during the trial. */
export const TRIAL_PLAN: PlanId = 'fleet';
/** Days a failed payment may stay unpaid before the organisation becomes read-only. */
export const PAST_DUE_GRACE_DAYS = 14;

export const planFromLookupKey = (key: string | null | undefined): PlanId | null => PLAN_IDS.find((id) => PLANS[id].lookupKey === key) ?? null;

export interface BillingState {
  plan: PlanId | null;
  subscriptionStatus: string;
  trialEndsAt: Date | null;
  stripeSubscriptionId: string | null;
  pastDueSince: Date | null;
}

/** The asset limit in force: the plan's, or the trial plan's while trialing without a subscription. */
export function assetLimitOf(state: BillingState): number | null {
  const plan = state.plan ?? (state.subscriptionStatus === 'trialing' ? TRIAL_PLAN : null);
  return plan ? PLANS[plan].maxAssets : 0;
}

/**
 * Why the organisation is read-only, or null when it is not: a cancelled or unpaid subscription,
 * a payment failed more than the grace period ago, or a trial that ended without a subscription.
 * Nothing is deleted in any case; reading, printing and exports go on.
 */
export function readOnlyReason(state: BillingState, now = new Date()): string | null {
  const s = state.subscriptionStatus;
  if (s === 'canceled' || s === 'unpaid' || s === 'incomplete_expired') return 'The subscription has ended.';
  if (s === 'past_due' && state.pastDueSince && now.getTime() - state.pastDueSince.getTime() > PAST_DUE_GRACE_DAYS * 86_400_000) {
    return `A payment has been overdue for more than ${PAST_DUE_GRACE_DAYS} days.`;
  }
  if (s === 'trialing' && !state.stripeSubscriptionId && state.trialEndsAt && state.trialEndsAt.getTime() < now.getTime()) return 'The free trial has ended.';
  return null;
}

