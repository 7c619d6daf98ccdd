'use server';
import { redirect } from 'next/navigation';
import { z } from 'zod';
import { orgAction, orgJsonAction, formId, formObject } from '@/lib/server/action';
import { computeDesk, toDeskComputed } from '@/lib/server/services/designs/compute-design';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { approveDesign, checkDesign } from '@/lib/server/services/designs/sign-design';
import { newRevision } from '@/lib/server/services/designs/new-revision';
import { getDesignOrThrow } from '@/lib/server/services/designs/get-design';
import { startDesign } from '@/lib/server/services/designs/start-design';
import { fitDesign } from '@/lib/server/services/designs/fit-design';

export const createDesignAction = orgAction('design:write', async (ctx, formData) => {
  const design = await startDesign(ctx, formObject(formData));
  redirect(`/o/${ctx.organisation.slug}/designs/${design.id}`);
});

/** Recomputes the desk's results as the inputs change; writes nothing. */
export const computeDeskAction = orgJsonAction('org:read', async (ctx, input) => {
  const { designId, inputs } = z.object({ designId: z.uuid(), inputs: z.unknown() }).parse(input);
  const design = await getDesignOrThrow(ctx, designId);
  return toDeskComputed(await computeDesk(ctx, inputs, { hasImpressedCurrent: Boolean(design.asset.hasImpressedCurrent) }));
});

export const saveDesignAction = orgJsonAction('design:write', async (ctx, input) => {
  const { designId, title, inputs } = z.object({ designId: z.uuid(), title: z.unknown(), inputs: z.unknown() }).parse(input);
  const { design } = await saveDesign(ctx, designId, { title, inputs });
  return { status: design.status, updatedAt: design.updatedAt.toISOString(), resultError: design.resultError };
});


export const checkDesignAction = orgAction('design:write', async (ctx, formData) => {
  const design = await checkDesign(ctx, formId(formData, 'designId'));
  return { ok: true, message: `Saved: revision ${design.revision} of “${design.title}” signed by you as checker. It now waits for approval.` };
});

export const approveDesignAction = orgAction('design:approve', async (ctx, formData) => {
  const design = await approveDesign(ctx, formId(formData, 'designId'));
  return { ok: true, message: `Saved: revision ${design.revision} of “${design.title}” approved by you. It can no longer change.` };
});

export const newRevisionAction = orgAction('design:write', async (ctx, formData) => {
  const design = await newRevision(ctx, formId(formData, 'designId'));
  redirect(`/o/${ctx.organisation.slug}/designs/${design.id}`);
});

/** "Fit this design": the approved revision's anodes recorded as installed groups on the day entered. */
export const fitDesignAction = orgAction('asset:write', async (ctx, formData) => {
  const result = await fitDesign(ctx, formId(formData, 'designId'), { ...formObject(formData), mode: 'installed' });
  return { ok: true, message: result.message };
});

/** "Fit this design" at a docking: the approved revision's anodes booked as renewals at a planned docking or campaign. */
export const bookDesignRenewalsAction = orgAction('renewal:write', async (ctx, formData) => {
  const result = await fitDesign(ctx, formId(formData, 'designId'), { ...formObject(formData), mode: 'renewal' });
  return { ok: true, message: result.message };
});
