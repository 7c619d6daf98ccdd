// Webhooks sent while the app is down were never reconciled: a subscription cancelled at the payment
// service stayed active and writable. The fake's webhooks go to a port where no app listens (the app is
// "down" for them); one reconciliation pass must read the subscription back and repair the organisation.
import { afterAll, describe, expect, it, vi } from 'vitest';
import { AuditEventSchema, StripeEventSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { getStripe } from '@/lib/server/billing/stripe';
import { organisationReadOnlyReason } from '@/lib/server/org-context';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { checkSubscriptionNow, reconcileAllSubscriptions } from '@/lib/server/services/billing/reconcile-subscription';
import { makeOrgWithRoles, runAs } from '../fixtures/factories';
import { deliveriesOf, memberCtx, payCheckout, reloadOrg, subscribedOrg } from './billing-fixtures';

afterAll(async () => (await getOrm()).close(true));

const reconciledRows = async (organisationId: string) => (await getEm()).count(AuditEventSchema, { organisationId, action: 'billing.reconciled' });

describe('billing reconciliation with the app down', () => {
  it('a subscription cancelled at the payment service while no webhook can arrive makes the organisation read-only after one pass', async () => {
    const org = await subscribedOrg('Reconcile Cancelled Marine', 'harbour');
    const before = await reloadOrg(org);
    expect([before.subscriptionStatus, before.plan]).toEqual(['active', 'harbour']);

    // Cancelled at the payment service; its webhook never reaches this database (the fake posts to a port
    // where nothing listens, or under `npm test` to the end-to-end app, which has a database of its own).
    await getStripe().subscriptions.cancel(before.stripeSubscriptionId!);
    const { events } = await deliveriesOf(before.stripeSubscriptionId!);
    const deleted = events.find((e) => e.type === 'customer.subscription.deleted')!;
    expect(deleted).toBeTruthy();
    expect(await (await getEm()).count(StripeEventSchema, { id: deleted.id })).toBe(0);
    // Without reconciliation the organisation is still active and writable: the finding.
    expect((await reloadOrg(org)).subscriptionStatus).toBe('active');

    const pass = await reconcileAllSubscriptions(await getEm());
    expect(pass.failed).toBe(0);
    expect(pass.changed).toBeGreaterThanOrEqual(1);

    const after = await reloadOrg(org);
    expect(after.subscriptionStatus).toBe('canceled');
    expect(organisationReadOnlyReason(after)).toMatch(/ended/);
    const refused = await runAs(memberCtx(org, 'engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'After the cancellation', hullMaterial: 'steel' })).catch((e) => e);
    expect(refused.code).toBe('read-only');
    expect(await reconciledRows(org.organisation.id)).toBe(1);

    // Idempotent: a second pass changes nothing and audits nothing.
    await reconcileAllSubscriptions(await getEm());
    expect(await reconciledRows(org.organisation.id)).toBe(1);
    expect((await reloadOrg(org)).subscriptionStatus).toBe('canceled');
  });

  it('a checkout paid while the app was down is found and recorded by the pass', async () => {
    const org = await makeOrgWithRoles(await getEm(), 'Reconcile Lost Checkout Marine');
    const url = await runAs(memberCtx(org), (c) => startCheckout(c, { plan: 'fleet' }));
    expect((await payCheckout(url)).status).toBe(303);
    // Neither the webhook nor the browser's return reached the app.
    expect((await reloadOrg(org)).stripeSubscriptionId).toBeNull();

    await reconcileAllSubscriptions(await getEm());
    const after = await reloadOrg(org);
    expect(after.stripeSubscriptionId).toMatch(/^sub_/);
    expect([after.subscriptionStatus, after.plan]).toEqual(['active', 'fleet']);
    expect(after.currentPeriodEnd).toBeInstanceOf(Date);
  });

  it('a plan changed and a cancellation scheduled at the payment service (its portal) are copied by the pass', async () => {
    const org = await subscribedOrg('Reconcile Portal Marine', 'harbour');
    const o = await reloadOrg(org);
    const stripe = getStripe();
    const sub = await stripe.subscriptions.retrieve(o.stripeSubscriptionId!);
    const fleet = (await stripe.prices.list({ lookup_keys: ['tw_fleet_monthly'] })).data[0];
    await stripe.subscriptions.update(sub.id, { items: [{ id: sub.items.data[0].id, price: fleet.id }], cancel_at_period_end: true });

    await reconcileAllSubscriptions(await getEm());
    const after = await reloadOrg(org);
    expect(after.plan).toBe('fleet');
    expect(after.cancelAtPeriodEnd).toBe(true);
    expect(after.subscriptionStatus).toBe('active');
  });

  it('the billing page check repairs the state, and when the payment service does not answer it reports so and keeps the last known state', async () => {
    const org = await subscribedOrg('Reconcile Page Marine', 'harbour');
    const o = await reloadOrg(org);
    await getStripe().subscriptions.cancel(o.stripeSubscriptionId!);
    const ctx = await memberCtx(org);
    expect(await checkSubscriptionNow(ctx)).toEqual({ checked: true });
    expect(ctx.organisation.subscriptionStatus).toBe('canceled');

    const other = await subscribedOrg('Reconcile Page Down Marine', 'harbour');
    const down = vi.spyOn(getStripe().subscriptions, 'list').mockRejectedValue(new Error('connect ECONNREFUSED 127.0.0.1'));
    try {
      const otherCtx = await memberCtx(other);
      expect(await checkSubscriptionNow(otherCtx)).toEqual({ checked: false });
      expect(otherCtx.organisation.subscriptionStatus).toBe('active');
    } finally {
      down.mockRestore();
    }
    expect(await reconciledRows(other.organisation.id)).toBe(0);
  });
});
