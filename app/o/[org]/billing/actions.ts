'use server';
import { redirect } from 'next/navigation';
import { orgAction, formObject } from '@/lib/server/action';
import { changePlan, hasLiveSubscription, openPortal, setCancelAtPeriodEnd, startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { PLANS } from '@/lib/billing/plans';

// A plan chosen while a subscription is live changes that subscription (prorated); otherwise it opens a checkout.
export const checkoutAction = orgAction('billing:manage', async (ctx, formData) => {
  if (hasLiveSubscription(ctx.organisation)) {
    const { to } = await changePlan(ctx, formObject(formData));
    return { ok: true, message: `The plan is now ${PLANS[to].name}. The difference for the rest of this period is invoiced now.` };
  }
  redirect(await startCheckout(ctx, formObject(formData)));
});

export const portalAction = orgAction('billing:manage', async (ctx) => {
  redirect(await openPortal(ctx));
});

export const cancelAction = orgAction('billing:manage', async (ctx, formData) => {
  const cancel = formData.get('cancel') === '1';
  await setCancelAtPeriodEnd(ctx, cancel);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/billing`);
  return { ok: true, message: cancel ? 'The subscription ends at the end of the paid period. Nothing is deleted.' : 'The cancellation is withdrawn.' };
});
