'use server';
import { revalidatePath } from 'next/cache';
import { orgAction, formObject } from '@/lib/server/action';
import { createAnodeModel, setAnodeModelArchived } from '@/lib/server/services/catalogue/manage-anode-models';

export const createAnodeModelAction = orgAction('catalogue:write', async (ctx, formData) => {
  const model = await createAnodeModel(ctx, formObject(formData));
  revalidatePath(`/o/${ctx.organisation.slug}/catalogue`);
  return { ok: true, message: `${model.designation} added to your catalogue.` };
});

export const archiveAnodeModelAction = orgAction('catalogue:write', async (ctx, formData) => {
  const archive = formData.get('archive') === '1';
  const model = await setAnodeModelArchived(ctx, String(formData.get('modelId') ?? ''), archive);
  revalidatePath(`/o/${ctx.organisation.slug}/catalogue`);
  return { ok: true, message: archive ? `${model.designation} archived.` : `${model.designation} restored.` };
});
