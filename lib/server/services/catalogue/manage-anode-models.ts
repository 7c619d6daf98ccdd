import { AnodeModelSchema } from '@/entities';
import { anodeResistanceOhm, type AnodeShape } from '@/lib/cp';
import { CpInputError } from '@/lib/cp/errors';
import { anodeModelSchema } from '@/lib/schemas/register';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { z } from 'zod';
import { isUuid } from '../../ids';

type ModelInput = z.infer<typeof anodeModelSchema>;

/** The resistance-formula shape from the catalogue form, with the field to blame when something is missing. */
export function shapeFromForm(d: ModelInput): AnodeShape {
  const need = (value: number | null, field: string, what: string) => {
    if (value === null) throw new AppError('invalid', `Enter the ${what} for this formula.`, { [field]: [`Enter the ${what} for this formula.`] });
    return value;
  };
  switch (d.shapeKind) {
    case 'slender-standoff':
      return { kind: 'slender-standoff', lengthM: d.lengthM, radiusM: need(d.radiusM, 'radiusM', 'equivalent radius'), ...(d.standoffM !== null ? { standoffM: d.standoffM } : {}) };
    case 'long-flush':
      return { kind: 'long-flush', lengthM: d.lengthM, widthM: need(d.widthM, 'widthM', 'width'), ...(d.thicknessM !== null ? { thicknessM: d.thicknessM } : {}) };
    default:
      return { kind: d.shapeKind, exposedAreaM2: need(d.exposedAreaM2, 'exposedAreaM2', 'exposed area'), lengthM: d.lengthM, ...(d.widthM ? { widthM: d.widthM } : {}), ...(d.thicknessM ? { thicknessM: d.thicknessM } : {}) };
  }
}

export async function createAnodeModel(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'catalogue:write');
  const d = anodeModelSchema.parse(input);
  if (d.grossMassKg < d.netMassKg) throw new AppError('invalid', 'The gross mass includes the core and cannot be less than the net mass.', { grossMassKg: ['The gross mass cannot be less than the net mass.'] });
  const shape = shapeFromForm(d);
  // Reject shapes the resistance formulas cannot take, with lib/cp's own message, named by the form's field.
  try {
    anodeResistanceOhm({ shape, resistivityOhmM: 0.25 });
  } catch (error) {
    if (error instanceof CpInputError) throw new CpInputError(error.field.replace(/^shape\./, ''), error.message);
    throw error;
  }
  if (await ctx.em.count(AnodeModelSchema, { organisation: ctx.organisation, designation: d.designation })) {
    throw new AppError('conflict', 'A model with that designation exists.', { designation: ['Your catalogue already has a model with that designation.'] });
  }
  const model = ctx.em.create(AnodeModelSchema, {
    organisation: ctx.organisation,
    designation: d.designation,
    alloy: d.alloy,
    mounting: d.mounting,
    shape,
    dimensions: { lengthM: d.lengthM, ...(d.widthM ? { widthM: d.widthM } : {}), ...(d.thicknessM ? { thicknessM: d.thicknessM } : {}), ...(d.radiusM ? { radiusM: d.radiusM } : {}) },
    netMassKg: d.netMassKg,
    grossMassKg: d.grossMassKg,
    ratedOutputA: d.ratedOutputA,
    ratedAtResistivityOhmM: d.ratedAtResistivityOhmM,
    unitPrice: d.unitPrice,
    notes: d.notes,
    archivedAt: null,
  });
  audit(ctx, { action: 'catalogue.model-added', targetType: 'anode-model', targetId: model.id, details: { designation: model.designation } });
  return model;
}

/** Models already used stay readable in designs and the register (they keep a snapshot); archiving hides them from new choices. */
export async function setAnodeModelArchived(ctx: OrgContext, modelId: string, archived: boolean) {
  requirePermission(ctx, 'catalogue:write');
  const model = isUuid(modelId) ? await ctx.em.findOne(AnodeModelSchema, { id: modelId, organisation: ctx.organisation }) : null;
  if (!model) throw notFound('Anode model');
  // A repeat (a double click, the Undo sent twice) changes nothing and is not audited again.
  if (Boolean(model.archivedAt) === archived) return model;
  model.archivedAt = archived ? new Date() : null;
  audit(ctx, { action: archived ? 'catalogue.model-archived' : 'catalogue.model-restored', targetType: 'anode-model', targetId: model.id, details: { designation: model.designation } });
  return model;
}
