// On a paid plan, choosing a bigger plan opened a new checkout for the full price, charged the same day
// as the current plan's invoice, leaving two subscriptions. A plan change must update the one
// subscription with proration; the invoices' amounts are computed here from the prices and the dates.
import { afterAll, describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { PLANS, type PlanId } from '@/lib/billing/plans';
import { getOrm } from '@/lib/server/db';
import { getStripe } from '@/lib/server/billing/stripe';
import { changePlan, startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { runAs } from '../fixtures/factories';
import { fakeUrl, memberCtx, reloadOrg, subscribedOrg } from './billing-fixtures';

afterAll(async () => (await getOrm()).close(true));

const monthly = (plan: PlanId) => PLANS[plan].monthlyPriceEur * 100; // minor units

/** Credit and charge of a change at `at` (unix s) within [start, end): each whole-period amount times the unused fraction, rounded to the cent. */
function expectedProration(from: PlanId, to: PlanId, start: number, end: number, at: number) {
  const fraction = (end - at) / (end - start);
  return { credit: -Math.round(monthly(from) * fraction), charge: Math.round(monthly(to) * fraction) };
}

/** Runs `change` and the proration expected for any second it may have happened in. */
async function timed<T>(change: () => Promise<T>) {
  const t0 = Math.floor(Date.now() / 1000);
  const result = await change();
  const t1 = Math.floor(Date.now() / 1000);
  return { result, seconds: Array.from({ length: t1 - t0 + 1 }, (_, i) => t0 + i) };
}

const invoicesOf = async (customer: string) => (await getStripe().invoices.list({ customer, limit: 20 })).data; // newest first
const lineAmounts = (invoice: Stripe.Invoice) => invoice.lines.data.map((l) => l.amount).sort((a, b) => a - b);
const checkoutSessionCount = async () => ((await (await fetch(`${fakeUrl()}/__control/health`)).json()) as { counts: { checkout_sessions: number } }).counts.checkout_sessions;

describe('plan changes on a paid plan', () => {
  it('a bigger plan does not open a second checkout while a subscription is live', async () => {
    const org = await subscribedOrg('Plan Change No Second Checkout', 'harbour');
    const sessions = await checkoutSessionCount();
    const refused = await runAs(memberCtx(org), (c) => startCheckout(c, { plan: 'fleet' })).catch((e) => e);
    expect(refused.code).toBe('conflict');
    expect(refused.message).toMatch(/already has a subscription/);
    expect(await checkoutSessionCount()).toBe(sessions);
  });

  it('upgrades and downgrades the one subscription with prorated invoices; the credit goes to the next renewal', async () => {
    const org = await subscribedOrg('Plan Change Proration Marine', 'harbour');
    const stripe = getStripe();
    const o = await reloadOrg(org);
    const customer = o.stripeCustomerId!;
    const subscriptionId = o.stripeSubscriptionId!;
    const item = (await stripe.subscriptions.retrieve(subscriptionId)).items.data[0];
    const [start, end] = [item.current_period_start, item.current_period_end];
    expect(item.price.unit_amount).toBe(monthly('harbour'));

    // Upgrade: Harbour → Fleet, the difference for the rest of the period invoiced and paid at once.
    const up = await timed(() => runAs(memberCtx(org), (c) => changePlan(c, { plan: 'fleet' })));
    expect(up.result).toEqual({ from: 'harbour', to: 'fleet' });
    let invoices = await invoicesOf(customer);
    expect(invoices).toHaveLength(2);
    const upgrade = invoices[0];
    expect(upgrade.billing_reason).toBe('subscription_update');
    expect(upgrade.status).toBe('paid');
    const upExpected = up.seconds.map((t) => expectedProration('harbour', 'fleet', start, end, t));
    expect(upExpected.map((e) => [e.credit, e.charge])).toContainEqual(lineAmounts(upgrade));
    const [credit, charge] = lineAmounts(upgrade);
    expect(credit).toBeLessThan(0);
    expect(upgrade.amount_due).toBe(credit + charge);
    expect(upgrade.amount_paid).toBe(credit + charge);
    expect(upgrade.amount_due).toBeLessThan(monthly('fleet')); // never the full price again

    let after = await reloadOrg(org);
    expect([after.plan, after.subscriptionStatus, after.stripeSubscriptionId]).toEqual(['fleet', 'active', subscriptionId]);
    // One subscription, ever: nothing was bought a second time.
    const all = (await stripe.subscriptions.list({ customer, status: 'all' })).data;
    expect(all.map((s) => s.id)).toEqual([subscriptionId]);
    expect(all[0].items.data[0].price.lookup_key).toBe('tw_fleet_monthly');

    // Downgrade: Fleet → Harbour, a credit for the unused Fleet time larger than the Harbour charge.
    const down = await timed(() => runAs(memberCtx(org), (c) => changePlan(c, { plan: 'harbour' })));
    expect(down.result).toEqual({ from: 'fleet', to: 'harbour' });
    invoices = await invoicesOf(customer);
    expect(invoices).toHaveLength(3);
    const downgrade = invoices[0];
    expect(downgrade.billing_reason).toBe('subscription_update');
    const downExpected = down.seconds.map((t) => expectedProration('fleet', 'harbour', start, end, t));
    expect(downExpected.map((e) => [e.credit, e.charge])).toContainEqual(lineAmounts(downgrade));
    const net = lineAmounts(downgrade).reduce((s, a) => s + a, 0);
    expect(net).toBeLessThan(0);
    expect(downgrade.amount_due).toBe(0);
    expect(downgrade.ending_balance).toBe(net);
    expect(((await stripe.customers.retrieve(customer)) as Stripe.Customer).balance).toBe(net);
    after = await reloadOrg(org);
    expect(after.plan).toBe('harbour');

    // The next renewal bills Harbour less the credit.
    const renewal = await fetch(`${fakeUrl()}/__control/advance`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ subscription: subscriptionId, outcome: 'paid' }) });
    expect(renewal.ok).toBe(true);
    const [renewed] = await invoicesOf(customer);
    expect(renewed.billing_reason).toBe('subscription_cycle');
    expect(renewed.starting_balance).toBe(net);
    expect(renewed.amount_due).toBe(Math.max(0, monthly('harbour') + net));
  });

  it('two identical plan changes at once make one change and one invoice', async () => {
    const org = await subscribedOrg('Plan Change Double Click Marine', 'harbour');
    const customer = (await reloadOrg(org)).stripeCustomerId!;
    let release!: () => void;
    const barrier = new Promise<void>((resolve) => (release = resolve));
    const attempts = [0, 1].map(() =>
      runAs(memberCtx(org), async (c) => {
        await barrier;
        return changePlan(c, { plan: 'armada' });
      }).then(
        () => 'changed',
        (e: { code?: string }) => e.code ?? 'error',
      ),
    );
    release();
    expect((await Promise.all(attempts)).sort()).toEqual(['changed', 'conflict']);
    const invoices = await invoicesOf(customer);
    expect(invoices.filter((i) => i.billing_reason === 'subscription_update')).toHaveLength(1);
    expect((await reloadOrg(org)).plan).toBe('armada');
  });

  it('a plan too small for the active assets is refused and nothing is billed', async () => {
    const org = await subscribedOrg('Plan Change Too Small Marine', 'fleet');
    const { createAsset } = await import('@/lib/server/services/assets/create-asset');
    for (let i = 1; i <= 4; i++) await runAs(memberCtx(org, 'engineer'), (c) => createAsset(c, { kind: 'vessel', name: `Boat ${i}`, hullMaterial: 'steel' }));
    const customer = (await reloadOrg(org)).stripeCustomerId!;
    const refused = await runAs(memberCtx(org), (c) => changePlan(c, { plan: 'harbour' })).catch((e) => e);
    expect(refused.code).toBe('conflict');
    expect(refused.message).toMatch(/Harbour plan covers 3 .* 4 are in use/);
    expect(await invoicesOf(customer)).toHaveLength(1);
    expect((await reloadOrg(org)).plan).toBe('fleet');
  });
});
