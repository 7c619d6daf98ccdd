'use server';
import { redirect } from 'next/navigation';
import { orgAction, formObject } from '@/lib/server/action';
import { openPortal, setCancelAtPeriodEnd, startCheckout } from '@/lib/server/services/billing/manage-subscription';

export const checkoutAction = orgAction('billing:manage', async (ctx, formData) => {
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
