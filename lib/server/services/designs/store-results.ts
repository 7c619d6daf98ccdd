import type { Design } from '@/entities';
import { AppError } from '../../errors';
import type { OrgContext } from '../../org-context';
import { APP_VERSION } from '../../app-version';
import { computeDesk } from './compute-design';

/** Recomputes and stores results with the inputs; inputs that cannot be sized keep the draft with the reason. */
export async function storeResults(ctx: OrgContext, design: Design, inputs: unknown) {
  const desk = await computeDesk(ctx, inputs, { hasImpressedCurrent: Boolean(design.asset.hasImpressedCurrent) });
  design.inputs = { ...desk.inputs, anodeModelSnapshot: desk.model };
  design.results = desk.result ? { ...desk.result, notices: desk.notices, impressedCurrent: desk.impressedCurrent, options: desk.options } : null;
  design.resultError = desk.error ? `${desk.error.field}: ${desk.error.message}` : null;
  design.basis = desk.result?.basis ?? null;
  design.appVersion = APP_VERSION;
  return desk;
}

export function assertEditable(design: Design) {
  if (design.status === 'approved') {
    throw new AppError('conflict', `Revision ${design.revision} is approved and cannot change. Make a new revision to change it.`);
  }
}
