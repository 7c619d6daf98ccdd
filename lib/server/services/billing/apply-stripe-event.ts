import type Stripe from 'stripe';
import { LockMode, type EntityManager } from '@mikro-orm/postgresql';
import { OrganisationSchema, type Organisation } from '@/entities';
import { auditEvent } from '../../audit';
import { getStripe } from '../../billing/stripe';
import { isUuid } from '../../ids';
import { LIVE_SUBSCRIPTION_STATUSES } from './reconcile-subscription';
import { syncSubscription } from './sync-subscription';

export type EventOutcome = 'applied' | 'ignored' | 'duplicate';

const customerOf = (object: { customer?: string | Stripe.Customer | Stripe.DeletedCustomer | null }) =>
  typeof object.customer === 'string' ? object.customer : (object.customer?.id ?? null);

/**
 * Applies one verified webhook event exactly once. The event id is stored in the same transaction as
 * the change, so a replay is recognised; the subscription's state is read back from the payment
 * service, so events that arrive out of order still leave the current state.
 */
export async function applyStripeEvent(em: EntityManager, event: Stripe.Event): Promise<{ outcome: EventOutcome; organisationId: string | null }> {
  return em.transactional(async (tx) => {
    const inserted = await tx.execute<{ id: string }[]>(
      `insert into stripe_event (id, type, outcome, received_at) values (?, ?, 'processing', now()) on conflict (id) do nothing returning id`,
      [event.id, event.type],
    );
    if (!inserted.length) return { outcome: 'duplicate' as const, organisationId: null };

    const object = event.data.object as unknown as Record<string, unknown> & { customer?: string | null };
    let org: Organisation | null = null;
    // The organisation's row is locked before the subscription is read back, so that a reconciliation
    // pass running at the same moment cannot write an older reading over this one (or this over its).
    const locked = { lockMode: LockMode.PESSIMISTIC_WRITE } as const;
    if (event.type === 'checkout.session.completed') {
      const session = event.data.object as Stripe.Checkout.Session;
      org = session.client_reference_id && isUuid(session.client_reference_id) ? await tx.findOne(OrganisationSchema, { id: session.client_reference_id }, locked) : null;
      if (org && !org.stripeCustomerId) org.stripeCustomerId = customerOf(session);
    }
    org ??= customerOf(object) ? await tx.findOne(OrganisationSchema, { stripeCustomerId: customerOf(object)! }, locked) : null;

    let outcome: EventOutcome = 'ignored';
    let detail: string | null = null;
    if (!org) {
      detail = `no organisation for customer ${customerOf(object) ?? '(none)'}`;
    } else if (event.type === 'checkout.session.completed') {
      const session = event.data.object as Stripe.Checkout.Session;
      const newId = typeof session.subscription === 'string' ? session.subscription : session.subscription?.id;
      if (newId) {
        const previous = org.stripeSubscriptionId;
        const previousLive = Boolean(previous) && LIVE_SUBSCRIPTION_STATUSES.includes(org.subscriptionStatus);
        await syncSubscription(org, newId);
        // Checkout is offered only without a live subscription, and only the newest checkout can be paid; should
        // one still complete beside a live subscription, the older one is ended so that one subscription bills.
        if (previous && previousLive && previous !== newId) {
          await getStripe().subscriptions.cancel(previous).catch((error: unknown) => console.error('[tidewarden] could not end the replaced subscription', previous, error instanceof Error ? error.message : error));
        }
        outcome = 'applied';
      }
    } else if (event.type.startsWith('customer.subscription.')) {
      const sub = event.data.object as Stripe.Subscription;
      // Only the organisation's current subscription decides its state (an old one may end after a plan change).
      if (!org.stripeSubscriptionId || org.stripeSubscriptionId === sub.id) {
        await syncSubscription(org, sub.id);
        outcome = 'applied';
      } else detail = `subscription ${sub.id} is not the current one`;
    } else if (event.type === 'invoice.paid' || event.type === 'invoice.payment_failed') {
      if (org.stripeSubscriptionId) {
        await syncSubscription(org, org.stripeSubscriptionId);
        outcome = 'applied';
      }
    } else {
      detail = 'event type not used';
    }
    if (org && outcome === 'applied') {
      auditEvent(tx, { organisationId: org.id, action: 'billing.event-applied', details: { type: event.type, status: org.subscriptionStatus, plan: org.plan } });
    }
    await tx.flush();
    await tx.execute(`update stripe_event set outcome = ?, organisation_id = ?, detail = ? where id = ?`, [outcome, org?.id ?? null, detail, event.id]);
    return { outcome, organisationId: org?.id ?? null };
  });
}

