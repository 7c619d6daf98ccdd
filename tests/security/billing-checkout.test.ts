// Two checkouts opened at once (a double click, a second tab) could both be paid, leaving two live
// subscriptions for one organisation. Only the newest checkout may be payable, and a subscription id
// belongs to one organisation only.
import { afterAll, describe, expect, it } from 'vitest';
import { OrganisationSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { getStripe } from '@/lib/server/billing/stripe';
import { startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { makeOrgWithRoles, runAs } from '../fixtures/factories';
import { memberCtx, payCheckout, reloadOrg, subscribedOrg } from './billing-fixtures';

afterAll(async () => (await getOrm()).close(true));

describe('one live subscription per organisation', () => {
  it('two checkouts started at once: only one can be paid, and the payment service holds one subscription', async () => {
    const org = await makeOrgWithRoles(await getEm(), 'Two Tabs Marine');
    let release!: () => void;
    const barrier = new Promise<void>((resolve) => (release = resolve));
    const started = [0, 1].map(() =>
      runAs(memberCtx(org), async (c) => {
        await barrier;
        return startCheckout(c, { plan: 'fleet' });
      }),
    );
    release();
    const urls = await Promise.all(started);
    expect(new Set(urls).size).toBe(2);

    const paid = await Promise.all(urls.map((url) => payCheckout(url)));
    expect(paid.map((r) => r.status).sort()).toEqual([303, 409]);
    const customer = (await reloadOrg(org)).stripeCustomerId!;
    const subscriptions = (await getStripe().subscriptions.list({ customer, status: 'all' })).data;
    expect(subscriptions).toHaveLength(1);
  });

  it('the database refuses one subscription recorded for two organisations', async () => {
    const first = await subscribedOrg('Subscription Owner Marine', 'harbour');
    const second = await makeOrgWithRoles(await getEm(), 'Subscription Copy Marine');
    const subscriptionId = (await reloadOrg(first)).stripeSubscriptionId!;
    const em = (await getEm()).fork();
    const copy = await em.findOneOrFail(OrganisationSchema, { id: second.organisation.id });
    copy.stripeSubscriptionId = subscriptionId;
    await expect(em.flush()).rejects.toThrow(/unique|duplicate/i);
  });
});
