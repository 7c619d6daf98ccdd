import { CpInputError, compareOptions, designAnodeSystem, impressedCurrentSummary, type DesignResult, type OptionRow, type ImpressedCurrentSummary } from '@/lib/cp';
import { buildDesignInput, buildDesignJob, deskNotices, resolveEnvironment, type DeskNotice } from '@/lib/design/build-design-input';
import type { DeskComputed } from '@/lib/design/desk-computed';
import { deskInputsSchema, type DeskInputs } from '@/lib/schemas/design';
import { listCatalogue, resolveAnodeModel, type CatalogueModel } from '../catalogue/anode-models';
import { requirePermission, type OrgContext } from '../../org-context';

export interface DeskResult {
  inputs: DeskInputs;
  model: CatalogueModel;
  result: DesignResult | null;
  /** Why the inputs cannot be sized (lib/cp's field and sentence); the draft is still kept. */
  error: { field: string; message: string } | null;
  notices: DeskNotice[];
  options: OptionRow[];
  impressedCurrent: ImpressedCurrentSummary | null;
}

/**
 * Sizes the desk's inputs with lib/cp: the design with the chosen model, the same job with every
 * catalogue model side by side, and, for a vessel with an impressed-current system, its output.
 */
export async function computeDesk(ctx: OrgContext, rawInputs: unknown, { hasImpressedCurrent = false } = {}): Promise<DeskResult> {
  requirePermission(ctx, 'org:read');
  const parsed = deskInputsSchema.parse(rawInputs);
  const model = await resolveAnodeModel(ctx, parsed.anodeModelKey);
  let result: DesignResult | null = null;
  let error: DeskResult['error'] = null;
  // What the tool fills in (resistivity from the water, potential from the criterion) is stored with
  // the inputs as the value used, and the notices say where it came from.
  let inputs = parsed;
  const sources: DeskNotice[] = [];
  try {
    const env = resolveEnvironment(parsed);
    inputs = { ...parsed, resistivityOhmM: env.resistivityOhmM, protectivePotentialV: env.protectivePotentialV };
    sources.push({ code: 'resistivity-source', message: `Resistivity ${env.resistivityOhmM} Ω·m: ${env.resistivitySource}.` });
    sources.push({ code: 'potential-source', message: `Protective potential ${env.protectivePotentialV} V vs Ag/AgCl/seawater: ${env.potentialSource}.` });
  } catch (e) {
    if (!(e instanceof CpInputError)) throw e;
    error = { field: e.field, message: e.message };
  }
  const notices = [...deskNotices(inputs), ...sources];
  try {
    if (!error) result = designAnodeSystem(buildDesignInput(inputs, model));
  } catch (e) {
    if (!(e instanceof CpInputError)) throw e;
    error = { field: e.field, message: e.message };
  }
  let options: OptionRow[] = [];
  let impressedCurrent: ImpressedCurrentSummary | null = null;
  try {
    const job = buildDesignJob(inputs);
    const catalogue = (await listCatalogue(ctx)).filter((m) => suitsWater(m, inputs.water));
    options = compareOptions({ job, models: catalogue.map((m) => ({ ...m, id: m.key })), fittingRatePerKg: ctx.organisation.fittingRatePerKg ?? undefined });
    if (hasImpressedCurrent) impressedCurrent = impressedCurrentSummary({ designLifeYears: job.designLifeYears, surfaces: job.surfaces });
  } catch (e) {
    if (!(e instanceof CpInputError)) throw e;
  }
  return { inputs, model, result, error, notices, options, impressedCurrent };
}

/** What the desk shows of a calculation (the inputs stay with the desk). */
export function toDeskComputed({ result, error, notices, options, impressedCurrent, model }: DeskResult): DeskComputed {
  return { result, error, notices, options, impressedCurrent, model };
}

/** Magnesium is for fresh and brackish water; zinc and aluminium for sea and brackish water (practice). */
function suitsWater(model: CatalogueModel, water: DeskInputs['water']) {
  const magnesium = model.alloy === 'magnesium' || model.alloy === 'magnesium-high-potential';
  if (water === 'seawater') return !magnesium;
  if (water === 'fresh') return magnesium;
  return true;
}
