'use server';
import { orgAction, formObject } from '@/lib/server/action';
import { createAnodeModel, setAnodeModelArchived } from '@/lib/server/services/catalogue/manage-anode-models';

export const createAnodeModelAction = orgAction('catalogue:write', async (ctx, formData) => {
  const model = await createAnodeModel(ctx, formObject(formData));
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/catalogue`);
  return { ok: true, message: `${model.designation} added to your catalogue.` };
});

export const archiveAnodeModelAction = orgAction('catalogue:write', async (ctx, formData) => {
  const archive = formData.get('archive') === '1';
  const model = await setAnodeModelArchived(ctx, String(formData.get('modelId') ?? ''), archive);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/catalogue`);
  return { ok: true, message: archive ? `${model.designation} archived.` : `${model.designation} restored.` };
});
