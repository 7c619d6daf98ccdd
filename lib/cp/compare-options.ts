import type { AnodeModel } from './anode-model';
import { anodeFromModel } from './anode-from-model';
import { assertCompatible } from './design-checks';
import { computeDesign, type GoverningCriterion } from './design-anode-system';
import { validateAnode, validateJob, type DesignJob } from './design-input';
import { CpInputError } from './errors';
import { list, nonNegative, optional, record } from './validate';

export interface CompareOptionsInput {
  job: DesignJob;
  /** Catalogue models to try (built-in or the organisation's). */
  models: readonly AnodeModel[];
  /** Fitting cost per kg of installed gross mass; with a model's unitPrice it gives a cost. */
  fittingRatePerKg?: number;
}

export interface OptionCost {
  supply: number;
  fitting: number;
  total: number;
}

export type OptionRow =
  | {
      id: string;
      designation: string;
      alloy: AnodeModel['alloy'];
      suitable: true;
      anodeCount: number;
      governingCriterion: GoverningCriterion;
      requiredNetMassKg: number;
      installedNetMassKg: number;
      installedGrossMassKg: number;
      achievedLifeYears: number;
      warningsCount: number;
      warningCodes: string[];
      /** Null unless the model has a unit price and a fitting rate is given. */
      cost: OptionCost | null;
    }
  | { id: string; designation: string; alloy: AnodeModel['alloy']; suitable: false; reason: string; field: string };

/**
 * The same job sized with each model, side by side. A model the job rejects (for
 * example magnesium on an aluminium hull) is listed as unsuitable with the reason; an
 * invalid job throws, since no option could then be sized.
 */
export function compareOptions(input: CompareOptionsInput): OptionRow[] {
  const r = record(input, 'input');
  const job = validateJob(r.job);
  const rate = optional(r.fittingRatePerKg, (v) => nonNegative(v, 'fittingRatePerKg', 'per kg'));
  return list(r.models, 'models').map((m, i) => optionRow(job, m as AnodeModel, i, rate));
}

function optionRow(job: ReturnType<typeof validateJob>, model: AnodeModel, index: number, rate: number | undefined): OptionRow {
  const head = { id: String(model?.id ?? index), designation: String(model?.designation ?? ''), alloy: model?.alloy };
  try {
    const field = `models[${index}]`;
    const anode = validateAnode(anodeFromModel(model, job.environment?.water, field), field);
    assertCompatible(job, anode, field);
    const d = computeDesign(job, anode);
    const gross = d.anodeCount * (anode.grossMassKg ?? anode.netMassKg);
    const unitPrice = optional(model.unitPrice, (v) => nonNegative(v, `models[${index}].unitPrice`));
    return {
      ...head,
      suitable: true,
      anodeCount: d.anodeCount,
      governingCriterion: d.governingCriterion,
      requiredNetMassKg: d.requiredNetMassKg,
      installedNetMassKg: d.installedNetMassKg,
      installedGrossMassKg: gross,
      achievedLifeYears: d.achievedLifeYears,
      warningsCount: d.warnings.length,
      warningCodes: d.warnings.map((w) => w.code),
      cost: unitPrice !== undefined && rate !== undefined ? costOf(d.anodeCount, unitPrice, rate, gross) : null,
    };
  } catch (e) {
    if (!(e instanceof CpInputError)) throw e;
    return { ...head, suitable: false, reason: e.message, field: e.field };
  }
}

/** Supply = count x unit price; fitting = rate x installed gross mass (what is handled and welded). */
function costOf(count: number, unitPrice: number, rate: number, grossKg: number): OptionCost {
  const supply = count * unitPrice;
  const fitting = rate * grossKg;
  return { supply, fitting, total: supply + fitting };
}
