import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type Stripe from 'stripe';
import { OrganisationSchema, StripeEventSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { getEnv } from '@/lib/server/env';
import { getStripe } from '@/lib/server/billing/stripe';
import { setCancelAtPeriodEnd, startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { exportAnodeRegisterCsv } from '@/lib/server/services/register/list-anode-groups';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

// These tests drive the local Stripe fake (started by `npm test`) through the official SDK, then hand the
// events it recorded to our webhook endpoint, signed the way the payment service signs them.
const fakeUrl = () => `http://127.0.0.1:${getEnv().STRIPE_API_PORT}`;

let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role = 'owner') => ctxFor(await getEm(), org.organisation, org.users[role]);
const reload = async () => (await getEm()).findOneOrFail(OrganisationSchema, { id: org.organisation.id });

async function postWebhook(payload: string, signature?: string) {
  const { POST } = await import('@/app/api/webhooks/stripe/route');
  const header = signature ?? getStripe().webhooks.generateTestHeaderString({ payload, secret: getEnv().STRIPE_WEBHOOK_SECRET });
  const res = await POST(new Request('http://127.0.0.1/api/webhooks/stripe', { method: 'POST', body: payload, headers: { 'stripe-signature': header, 'content-type': 'application/json' } }));
  return { status: res.status, body: await res.json() };
}

/** Every event the fake recorded for a customer since `since` (unix s), oldest first. */
async function eventsFor(customer: string, since: number): Promise<Stripe.Event[]> {
  const all = await getStripe().events.list({ limit: 100 }).autoPagingToArray({ limit: 5000 });
  return all
    .filter((e) => e.created >= since && (e.data.object as { customer?: string }).customer === customer)
    .sort((a, b) => a.created - b.created || a.id.localeCompare(b.id));
}

async function deliverAll(customer: string, since: number) {
  const outcomes: string[] = [];
  for (const event of await eventsFor(customer, since)) outcomes.push((await postWebhook(JSON.stringify(event))).body.outcome);
  return outcomes;
}

async function pay(checkoutUrl: string, card: string) {
  const id = new URL(checkoutUrl).pathname.split('/').pop();
  return fetch(`${fakeUrl()}/checkout/${id}/pay`, { method: 'POST', body: new URLSearchParams({ card }), redirect: 'manual' });
}

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Billing Test Marine');
});
afterAll(async () => (await getOrm()).close(true));

describe('subscriptions through the Stripe SDK and the local fake', () => {
  let since = 0;

  it('checkout with a card that succeeds, then the signed webhook, makes the plan active', async () => {
    since = Math.floor(Date.now() / 1000) - 1;
    const url = await runAs(ctx(), (c) => startCheckout(c, { plan: 'harbour' }));
    expect(url).toMatch(/\/checkout\/cs_/);
    const paid = await pay(url, '4242424242424242');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toContain('checkout=success');
    const customer = (await reload()).stripeCustomerId!;
    const outcomes = await deliverAll(customer, since);
    expect(outcomes).toContain('applied');
    const o = await reload();
    expect(o.subscriptionStatus).toBe('active');
    expect(o.plan).toBe('harbour');
    expect(o.stripeSubscriptionId).toMatch(/^sub_/);
    expect(o.currentPeriodEnd).toBeInstanceOf(Date);
  });

  it('a replayed event is recognised and applied once', async () => {
    const customer = (await reload()).stripeCustomerId!;
    const [first] = await eventsFor(customer, since);
    const again = await postWebhook(JSON.stringify(first));
    expect(again.status).toBe(200);
    expect(again.body.outcome).toBe('duplicate');
    expect(await (await getEm()).count(StripeEventSchema, { id: first.id })).toBe(1);
  });

  it('a forged signature is refused with 400 and changes nothing', async () => {
    const before = await reload();
    const forged = JSON.stringify({ id: 'evt_forged', object: 'event', type: 'customer.subscription.deleted', created: Math.floor(Date.now() / 1000), data: { object: { id: before.stripeSubscriptionId, object: 'subscription', customer: before.stripeCustomerId, status: 'canceled' } } });
    const wrongSecret = getStripe().webhooks.generateTestHeaderString({ payload: forged, secret: 'whsec_not_ours' });
    const res = await postWebhook(forged, wrongSecret);
    expect(res.status).toBe(400);
    expect((await reload()).subscriptionStatus).toBe('active');
    expect(await (await getEm()).count(StripeEventSchema, { id: 'evt_forged' })).toBe(0);
  });

  it('an event for an unknown customer is acknowledged and ignored', async () => {
    const payload = JSON.stringify({ id: `evt_unknown_${Date.now()}`, object: 'event', type: 'invoice.paid', created: Math.floor(Date.now() / 1000), data: { object: { id: 'in_x', object: 'invoice', customer: 'cus_nobody_here' } } });
    const res = await postWebhook(payload);
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('ignored');
  });

  it('enforces the plan limit on active assets (Harbour: 3)', async () => {
    for (let i = 1; i <= 3; i++) await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: `Limit boat ${i}`, hullMaterial: 'steel' }));
    const refused = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Limit boat 4', hullMaterial: 'steel' })).catch((e) => e);
    expect(refused.code).toBe('conflict');
    expect(refused.message).toMatch(/Harbour plan covers 3/);
  });

  it('a declined card leaves the organisation as it was', async () => {
    const fresh = await makeOrgWithRoles(await getEm(), 'Declined Card Marine');
    const owner = await ctxFor(await getEm(), fresh.organisation, fresh.users.owner);
    const t = Math.floor(Date.now() / 1000) - 1;
    const url = await runAs(owner, (c) => startCheckout(c, { plan: 'armada' }));
    const declined = await pay(url, '4000000000000002');
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined.');
    const customer = (await (await getEm()).findOneOrFail(OrganisationSchema, { id: fresh.organisation.id })).stripeCustomerId!;
    await deliverAll(customer, t);
    const after = await (await getEm()).findOneOrFail(OrganisationSchema, { id: fresh.organisation.id });
    expect([after.plan, after.stripeSubscriptionId, after.subscriptionStatus]).toEqual([null, null, 'trialing']);
  });

  it('with a live subscription another plan is not sold through a second checkout', async () => {
    const refused = await runAs(ctx(), (c) => startCheckout(c, { plan: 'armada' })).catch((e) => e);
    expect(refused.code).toBe('conflict');
    expect((await reload()).plan).toBe('harbour');
  });

  it('cancelling at period end keeps it active until then; events out of order still leave the current state', async () => {
    await runAs(ctx(), (c) => setCancelAtPeriodEnd(c, true));
    expect((await reload()).cancelAtPeriodEnd).toBe(true);
    const o = await reload();
    // The period ends: the subscription is deleted at the payment service.
    const t = Math.floor(Date.now() / 1000);
    await getStripe().subscriptions.cancel(o.stripeSubscriptionId!);
    const events = await eventsFor(o.stripeCustomerId!, t);
    const deleted = events.find((e) => e.type === 'customer.subscription.deleted')!;
    expect(deleted).toBeTruthy();
    await postWebhook(JSON.stringify(deleted));
    expect((await reload()).subscriptionStatus).toBe('canceled');
    // An older "updated" event arriving late must not bring the subscription back.
    const stale = { ...deleted, id: `evt_stale_${Date.now()}`, type: 'customer.subscription.updated', created: deleted.created - 100, data: { object: { ...(deleted.data.object as object), status: 'active' } } };
    await postWebhook(JSON.stringify(stale));
    expect((await reload()).subscriptionStatus).toBe('canceled');
  });

  it('a lapsed subscription makes the organisation read-only; reading and exports still work, nothing is deleted', async () => {
    const refused = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'After lapse', hullMaterial: 'steel' })).catch((e) => e);
    expect(refused.code).toBe('read-only');
    expect(refused.message).toMatch(/read-only/);
    const csv = await runAs(ctx('viewer'), (c) => exportAnodeRegisterCsv(c));
    expect(csv.split('\r\n')[0]).toMatch(/^Asset,Asset kind,/);
    // The owner can still reach billing to renew.
    const url = await runAs(ctx(), (c) => startCheckout(c, { plan: 'fleet' }));
    expect(url).toMatch(/\/checkout\/cs_/);
  });

  it('a failed renewal payment makes it past due, still writable within the grace period', async () => {
    const fresh = await makeOrgWithRoles(await getEm(), 'Past Due Marine');
    const owner = await ctxFor(await getEm(), fresh.organisation, fresh.users.owner);
    const t = Math.floor(Date.now() / 1000) - 1;
    const url = await runAs(owner, (c) => startCheckout(c, { plan: 'fleet' }));
    await pay(url, '4242424242424242');
    const customer = (await (await getEm()).findOneOrFail(OrganisationSchema, { id: fresh.organisation.id })).stripeCustomerId!;
    await deliverAll(customer, t);
    const subId = (await (await getEm()).findOneOrFail(OrganisationSchema, { id: fresh.organisation.id })).stripeSubscriptionId!;
    const res = await fetch(`${fakeUrl()}/__control/advance`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ subscription: subId, outcome: 'failed' }) });
    expect(res.ok).toBe(true);
    await deliverAll(customer, t);
    const o = await (await getEm()).findOneOrFail(OrganisationSchema, { id: fresh.organisation.id });
    expect(o.subscriptionStatus).toBe('past_due');
    expect(o.pastDueSince).toBeInstanceOf(Date);
    const engineer = await ctxFor(await getEm(), o, fresh.users.engineer);
    await expect(runAs(engineer, (c) => createAsset(c, { kind: 'vessel', name: 'Within grace', hullMaterial: 'steel' }))).resolves.toBeTruthy();
  });
});
