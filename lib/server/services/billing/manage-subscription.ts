import { z } from 'zod';
import { LockMode } from '@mikro-orm/postgresql';
import { AssetSchema, OrganisationSchema, type Organisation } from '@/entities';
import { PLAN_IDS, PLANS, planFromLookupKey, type PlanId } from '@/lib/billing/plans';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { getEnv } from '../../env';
import { getStripe } from '../../billing/stripe';
import { requirePermission, type OrgContext } from '../../org-context';
import { applySubscription, syncSubscription } from './sync-subscription';
import { LIVE_SUBSCRIPTION_STATUSES } from './reconcile-subscription';

/** The organisation's customer at the payment service, created on first need. */
async function customerId(ctx: OrgContext) {
  if (ctx.organisation.stripeCustomerId) return ctx.organisation.stripeCustomerId;
  const customer = await getStripe().customers.create({ name: ctx.organisation.name, email: ctx.user.email, metadata: { organisationId: ctx.organisation.id } });
  ctx.organisation.stripeCustomerId = customer.id;
  return customer.id;
}

const planInput = z.object({ plan: z.enum(PLAN_IDS, { error: 'Choose a plan.' }) });

/** The organisation's row, locked for the rest of the unit of work and read again, so that two clicks run one after the other. */
async function lockOrganisation(ctx: OrgContext): Promise<Organisation> {
  return ctx.em.findOneOrFail(OrganisationSchema, { id: ctx.organisation.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
}

/** Whether the organisation holds a subscription that still bills: a plan change then updates it, never a second checkout. */
export const hasLiveSubscription = (org: Pick<Organisation, 'stripeSubscriptionId' | 'subscriptionStatus'>) =>
  Boolean(org.stripeSubscriptionId) && LIVE_SUBSCRIPTION_STATUSES.includes(org.subscriptionStatus);

async function priceFor(plan: PlanId) {
  const prices = await getStripe().prices.list({ lookup_keys: [PLANS[plan].lookupKey], active: true });
  const price = prices.data[0];
  if (!price) throw new AppError('conflict', 'That plan cannot be bought just now; try again later.');
  return price;
}

/**
 * A hosted checkout for a plan, offered only when the organisation has no live subscription (a plan
 * change goes through changePlan); the subscription is recorded when its signed webhook arrives.
 */
export async function startCheckout(ctx: OrgContext, input: unknown): Promise<string> {
  requirePermission(ctx, 'billing:manage');
  const { plan } = planInput.parse(input);
  const org = await lockOrganisation(ctx);
  if (hasLiveSubscription(org)) {
    throw new AppError('conflict', org.plan === plan ? `You are already on the ${PLANS[plan].name} plan.` : 'The organisation already has a subscription: change its plan instead of buying a second one.');
  }
  const stripe = getStripe();
  // The payment service may know of a subscription whose webhook has not arrived: never sell a second one.
  if (org.stripeCustomerId) {
    const existing = await stripe.subscriptions.list({ customer: org.stripeCustomerId, status: 'all', limit: 20 });
    const live = existing.data.find((s) => LIVE_SUBSCRIPTION_STATUSES.includes(s.status));
    // (The unit of work rolls back on this refusal; the billing page's reconciliation records that subscription.)
    if (live) throw new AppError('conflict', 'The organisation already has a subscription at the payment service: reload the page and change its plan instead.');
  }
  const price = await priceFor(plan);
  const customer = await customerId(ctx);
  // Only the newest checkout can be paid: one left open in another tab would buy a second subscription.
  const open = await stripe.checkout.sessions.list({ customer, status: 'open', limit: 100 });
  for (const session of open.data) await stripe.checkout.sessions.expire(session.id);
  const base = `${getEnv().APP_URL}/o/${ctx.organisation.slug}/billing`;
  const session = await stripe.checkout.sessions.create({
    mode: 'subscription',
    customer,
    client_reference_id: ctx.organisation.id,
    line_items: [{ price: price.id, quantity: 1 }],
    success_url: `${base}?checkout=success&session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${base}?checkout=cancelled`,
    metadata: { organisationId: ctx.organisation.id, plan },
    subscription_data: { metadata: { organisationId: ctx.organisation.id, plan } },
  });
  audit(ctx, { action: 'billing.checkout-started', details: { plan } });
  if (!session.url) throw new AppError('conflict', 'The payment service did not return a checkout page.');
  return session.url;
}

/**
 * Moves the live subscription to another plan: the one subscription is updated at the payment service
 * with proration (a credit for the unused time on the old plan, a charge for the rest of the period on the
 * new one, invoiced at once), never a second checkout. A plan too small for the active assets is refused.
 */
export async function changePlan(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'billing:manage');
  const { plan } = planInput.parse(input);
  const org = await lockOrganisation(ctx);
  if (!hasLiveSubscription(org)) throw new AppError('conflict', 'There is no subscription to change: choose a plan to start one.');
  const limit = PLANS[plan].maxAssets;
  if (limit !== null) {
    const active = await ctx.em.count(AssetSchema, { organisation: org, archivedAt: null });
    if (active > limit) throw new AppError('conflict', `The ${PLANS[plan].name} plan covers ${limit} active vessels and structures and ${active} are in use. Archive some first, then change the plan.`);
  }
  const stripe = getStripe();
  const current = await stripe.subscriptions.retrieve(org.stripeSubscriptionId!);
  if (!LIVE_SUBSCRIPTION_STATUSES.includes(current.status)) throw new AppError('conflict', 'The subscription has ended at the payment service: reload the page, then choose a plan to start a new one.');
  const item = current.items.data[0];
  const from = planFromLookupKey(item?.price.lookup_key);
  if (!item || from === plan) throw new AppError('conflict', `You are already on the ${PLANS[plan].name} plan.`);
  const price = await priceFor(plan);
  const updated = await stripe.subscriptions.update(current.id, {
    items: [{ id: item.id, price: price.id }],
    proration_behavior: 'always_invoice',
    metadata: { organisationId: org.id, plan },
  });
  applySubscription(org, updated);
  audit(ctx, { action: 'billing.plan-changed', targetType: 'organisation', targetId: org.id, details: { from, to: plan } });
  ctx.effects.revalidate(`/o/${org.slug}/billing`);
  return { from, to: plan };
}

/** The payment service's page where the owner changes plan or cancels. */
export async function openPortal(ctx: OrgContext): Promise<string> {
  requirePermission(ctx, 'billing:manage');
  if (!ctx.organisation.stripeCustomerId) throw new AppError('conflict', 'There is no subscription to manage yet: choose a plan first.');
  const session = await getStripe().billingPortal.sessions.create({ customer: ctx.organisation.stripeCustomerId, return_url: `${getEnv().APP_URL}/o/${ctx.organisation.slug}/billing` });
  return session.url;
}

/** Cancels at the end of the paid period (or takes the cancellation back). */
export async function setCancelAtPeriodEnd(ctx: OrgContext, cancel: boolean) {
  requirePermission(ctx, 'billing:manage');
  const id = ctx.organisation.stripeSubscriptionId;
  if (!id) throw new AppError('conflict', 'There is no subscription to cancel.');
  await getStripe().subscriptions.update(id, { cancel_at_period_end: cancel });
  await syncSubscription(ctx.organisation, id);
  audit(ctx, { action: cancel ? 'billing.cancel-requested' : 'billing.cancel-withdrawn' });
}

/** After the browser comes back from checkout: read the session and record it (webhooks do the same; both are idempotent). */
export async function confirmCheckout(ctx: OrgContext, sessionId: string) {
  requirePermission(ctx, 'billing:manage');
  if (!/^cs_[\w]+$/.test(sessionId)) return;
  const session = await getStripe().checkout.sessions.retrieve(sessionId);
  if (session.client_reference_id !== ctx.organisation.id || typeof session.subscription !== 'string') return;
  await syncSubscription(ctx.organisation, session.subscription);
}

export async function getBillingOverview(ctx: OrgContext) {
  requirePermission(ctx, 'billing:manage');
  const org = ctx.organisation;
  let invoices: { id: string; date: string; amount: number; currency: string; status: string; url: string | null }[] = [];
  let invoicesError: string | null = null;
  if (org.stripeCustomerId) {
    try {
      const list = await getStripe().invoices.list({ customer: org.stripeCustomerId, limit: 24 });
      invoices = list.data.map((i) => ({ id: i.id ?? '', date: new Date(i.created * 1000).toISOString(), amount: (i.amount_paid || i.amount_due) / 100, currency: i.currency.toUpperCase(), status: i.status ?? 'unknown', url: i.hosted_invoice_url ?? null }));
    } catch (error) {
      console.error('[tidewarden] invoices could not be listed', error instanceof Error ? error.message : error);
      invoicesError = 'The invoices cannot be shown just now; the payment service did not answer.';
    }
  }
  return { invoices, invoicesError };
}
