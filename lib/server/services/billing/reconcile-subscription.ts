import type Stripe from 'stripe';
import { LockMode, type EntityManager } from '@mikro-orm/postgresql';
import { OrganisationSchema, type Organisation } from '@/entities';
import { audit } from '../../audit';
import { getStripe } from '../../billing/stripe';
import type { OrgContext } from '../../org-context';
import { runAsSystem } from '../../unit-of-work';
import { applySubscription } from './sync-subscription';

/** Statuses in which a subscription still bills (or is about to): an organisation holds at most one of these. */
export const LIVE_SUBSCRIPTION_STATUSES: readonly string[] = ['active', 'trialing', 'past_due', 'unpaid', 'incomplete'];

/** The fields mirrored from the payment service, as plain values for comparison and the audit row. */
function billingSnapshot(org: Organisation) {
  return {
    subscription: org.stripeSubscriptionId ?? null,
    status: org.subscriptionStatus,
    plan: org.plan ?? null,
    currentPeriodEnd: org.currentPeriodEnd ? org.currentPeriodEnd.toISOString() : null,
    cancelAtPeriodEnd: Boolean(org.cancelAtPeriodEnd),
    pastDueSince: org.pastDueSince ? org.pastDueSince.toISOString() : null,
    trialEndsAt: org.trialEndsAt ? org.trialEndsAt.toISOString() : null,
  };
}

/**
 * The subscription that decides the organisation's state: a live one of its customer (the one on record
 * first), else the one on record whatever its status. A checkout whose webhook never arrived is found
 * this way too.
 */
async function currentSubscription(org: Organisation, options: Stripe.RequestOptions): Promise<Stripe.Subscription | null> {
  const stripe = getStripe();
  if (org.stripeCustomerId) {
    const list = await stripe.subscriptions.list({ customer: org.stripeCustomerId, status: 'all', limit: 20 }, options);
    const live = list.data.filter((s) => LIVE_SUBSCRIPTION_STATUSES.includes(s.status));
    const found = live.find((s) => s.id === org.stripeSubscriptionId) ?? live[0] ?? list.data.find((s) => s.id === org.stripeSubscriptionId);
    if (found) return found;
  }
  return org.stripeSubscriptionId ? stripe.subscriptions.retrieve(org.stripeSubscriptionId, {}, options) : null;
}

export interface ReconcileOutcome {
  changed: boolean;
  before: ReturnType<typeof billingSnapshot>;
  after: ReturnType<typeof billingSnapshot>;
}

/**
 * Reads the organisation's subscription back from the payment service and repairs the local copy
 * (status, plan, period end, cancellation; read-only follows from the status). Idempotent: a second run
 * changes nothing. Audited only when something changed. Webhooks lost while the app was down are
 * made good here. Runs in the caller's unit of work (the worker and the billing page use runAsSystem).
 */
export async function reconcileSubscription(ctx: OrgContext, options: { timeoutMs?: number; now?: Date } = {}): Promise<ReconcileOutcome> {
  // The organisation's row is locked (and read again) so that a webhook or another pass applied at the
  // same moment waits for this one instead of writing over it.
  const org = await ctx.em.findOneOrFail(OrganisationSchema, { id: ctx.organisation.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
  const before = billingSnapshot(org);
  if (!org.stripeCustomerId && !org.stripeSubscriptionId) return { changed: false, before, after: before };
  const sub = await currentSubscription(org, options.timeoutMs ? { timeout: options.timeoutMs, maxNetworkRetries: 0 } : {});
  if (sub) applySubscription(org, sub, options.now);
  const after = billingSnapshot(org);
  const changed = JSON.stringify(before) !== JSON.stringify(after);
  if (changed) {
    audit(ctx, { action: 'billing.reconciled', targetType: 'organisation', targetId: org.id, details: { before, after } });
    ctx.effects.revalidate(`/o/${org.slug}/billing`);
  }
  return { changed, before, after };
}

/**
 * The scheduled pass: every organisation that has a customer at the payment service, each in a unit of
 * work of its own, so one failure (the service not answering) leaves the others reconciled.
 */
export async function reconcileAllSubscriptions(em: EntityManager) {
  const orgs = await em.find(OrganisationSchema, { $or: [{ stripeCustomerId: { $ne: null } }, { stripeSubscriptionId: { $ne: null } }] }, { fields: ['id'] });
  let changed = 0;
  let failed = 0;
  for (const { id } of orgs) {
    try {
      const outcome = await runAsSystem(id, (ctx) => reconcileSubscription(ctx), { em: em.fork() });
      if (outcome.changed) changed += 1;
    } catch (error) {
      failed += 1;
      console.error('[tidewarden] subscription could not be reconciled', id, error instanceof Error ? error.message : error);
    }
  }
  return { checked: orgs.length, changed, failed };
}

/**
 * For the billing page: reconcile now, with a short time-out, and refresh the page's copy. Never throws:
 * when the payment service does not answer, the page shows the last known state and says so.
 */
export async function checkSubscriptionNow(ctx: OrgContext, timeoutMs = 3000): Promise<{ checked: boolean }> {
  if (!ctx.organisation.stripeCustomerId && !ctx.organisation.stripeSubscriptionId) return { checked: true };
  try {
    await runAsSystem(ctx.organisation.id, (c) => reconcileSubscription(c, { timeoutMs }));
    await ctx.em.refresh(ctx.organisation);
    return { checked: true };
  } catch (error) {
    console.error('[tidewarden] the billing page could not check the subscription', error instanceof Error ? error.message : error);
    return { checked: false };
  }
}
