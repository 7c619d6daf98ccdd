import { z } from 'zod';
import { PLAN_IDS, PLANS } from '@/lib/billing/plans';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { getEnv } from '../../env';
import { getStripe } from '../../billing/stripe';
import { requirePermission, type OrgContext } from '../../org-context';
import { syncSubscription } from './sync-subscription';

/** The organisation's customer at the payment service, created on first need. */
async function customerId(ctx: OrgContext) {
  if (ctx.organisation.stripeCustomerId) return ctx.organisation.stripeCustomerId;
  const customer = await getStripe().customers.create({ name: ctx.organisation.name, email: ctx.user.email, metadata: { organisationId: ctx.organisation.id } });
  ctx.organisation.stripeCustomerId = customer.id;
  return customer.id;
}

/** A hosted checkout for a plan; the subscription is recorded when its signed webhook arrives. */
export async function startCheckout(ctx: OrgContext, input: unknown): Promise<string> {
  requirePermission(ctx, 'billing:manage');
  const { plan } = z.object({ plan: z.enum(PLAN_IDS, { error: 'Choose a plan.' }) }).parse(input);
  if (ctx.organisation.plan === plan && ['active', 'trialing'].includes(ctx.organisation.subscriptionStatus) && ctx.organisation.stripeSubscriptionId) {
    throw new AppError('conflict', `You are already on the ${PLANS[plan].name} plan.`);
  }
  const stripe = getStripe();
  const prices = await stripe.prices.list({ lookup_keys: [PLANS[plan].lookupKey], active: true });
  const price = prices.data[0];
  if (!price) throw new AppError('conflict', 'That plan cannot be bought just now; try again later.');
  const base = `${getEnv().APP_URL}/o/${ctx.organisation.slug}/billing`;
  const session = await stripe.checkout.sessions.create({
    mode: 'subscription',
    customer: await customerId(ctx),
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
