'use server';
import { redirect } from 'next/navigation';
import { orgAction, formId, formObject } from '@/lib/server/action';
import { AppError } from '@/lib/server/errors';
import { createDocking, updateDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal, cancelRenewal, confirmRenewal, markRenewalFitted, markRenewalOrdered, updateRenewal } from '@/lib/server/services/planner/renewals';


export const createDockingAction = orgAction('docking:write', async (ctx, formData) => {
  const docking = await createDocking(ctx, formObject(formData));
  redirect(`/o/${ctx.organisation.slug}/dockings/${docking.id}`);
});

export const updateDockingAction = orgAction('docking:write', async (ctx, formData) => {
  const docking = await updateDocking(ctx, formId(formData, 'dockingId'), formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/dockings/${docking.id}`);
  return { ok: true, message: 'Docking saved; renewal proposals were recomputed.' };
});

/** One action for the renewal row buttons, so the table stays a single form per row. */
export const renewalStepAction = orgAction('renewal:write', async (ctx, formData) => {
  const renewalId = formId(formData, 'renewalId');
  const step = formData.get('step');
  if (step === 'confirm') await confirmRenewal(ctx, renewalId);
  else if (step === 'ordered') await markRenewalOrdered(ctx, renewalId);
  else if (step === 'fitted') await markRenewalFitted(ctx, renewalId, formObject(formData));
  else if (step === 'cancel') await cancelRenewal(ctx, renewalId);
  else if (step === 'update') await updateRenewal(ctx, renewalId, formObject(formData));
  else throw new AppError('invalid', 'Unknown step.');
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/dockings`);
  return { ok: true, message: step === 'fitted' ? 'Recorded as fitted: the new anodes are in the register and the old group is closed.' : 'Saved.' };
});

export const addRenewalAction = orgAction('renewal:write', async (ctx, formData) => {
  const renewal = await addRenewal(ctx, formId(formData, 'dockingId'), formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/dockings/${renewal.docking.id}`);
  return { ok: true, message: 'Renewal booked.' };
});
