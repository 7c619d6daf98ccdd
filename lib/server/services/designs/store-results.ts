import type { Asset, Design } from '@/entities';
import { DESIGN_SCHEMA_VERSION, parseDesignRecord } from '@/lib/schemas/design-record';
import { AppError } from '../../errors';
import type { OrgContext } from '../../org-context';
import { APP_VERSION } from '../../app-version';
import { computeDesk } from './compute-design';
import { designLabel } from './read-design-record';

/**
 * Sizes the inputs and returns the record to store, checked against the stored-record schema on the way
 * in (a record the app could not read back is never written). Inputs that cannot be sized give a record
 * without results and with the reason, so a draft is never lost.
 */
export async function computeRecord(ctx: OrgContext, asset: Pick<Asset, 'hasImpressedCurrent'>, inputs: unknown, label: string) {
  const desk = await computeDesk(ctx, inputs, { hasImpressedCurrent: Boolean(asset.hasImpressedCurrent) });
  const record = parseDesignRecord(
    {
      schemaVersion: DESIGN_SCHEMA_VERSION,
      inputs: desk.inputs,
      anodeModel: desk.model,
      results: desk.result ? { ...desk.result, notices: desk.notices, impressedCurrent: desk.impressedCurrent, options: desk.options } : null,
      resultError: desk.error ? `${desk.error.field}: ${desk.error.message}` : null,
      basis: desk.result?.basis ?? null,
    },
    label,
  );
  return { desk, record };
}

/** Recomputes and stores a revision's record from the inputs. */
export async function storeResults(ctx: OrgContext, design: Design, inputs: unknown) {
  const { desk, record } = await computeRecord(ctx, design.asset, inputs, designLabel(design));
  Object.assign(design, record, { appVersion: APP_VERSION });
  // Groups linked to this design follow its demand profile: their forecasts, proposals and outlook move with it.
  ctx.effects.assetChanged(design.asset.id);
  return desk;
}

export function assertEditable(design: Design) {
  if (design.status === 'approved') {
    throw new AppError('conflict', `Revision ${design.revision} is approved and cannot change. Make a new revision to change it.`);
  }
}
