import { AnodeModelSchema, type AnodeModelRow } from '@/entities';
import { BUILTIN_ANODE_MODELS, type AnodeModel } from '@/lib/cp';
import { AppError } from '../../errors';
import { requirePermission, type OrgContext } from '../../org-context';
import { isUuid } from '../../ids';

/** Catalogue keys say where a model lives: `builtin:<designation>` or `org:<uuid>`. */
export const builtinKey = (id: string) => `builtin:${id}`;
export const orgKey = (id: string) => `org:${id}`;

export interface CatalogueModel extends AnodeModel {
  key: string;
  source: 'built-in' | 'organisation';
  archived: boolean;
}

export function toCpModel(row: AnodeModelRow): AnodeModel {
  return {
    id: row.id,
    designation: row.designation,
    alloy: row.alloy,
    mounting: row.mounting,
    shape: row.shape,
    dimensions: row.dimensions,
    netMassKg: row.netMassKg,
    grossMassKg: row.grossMassKg,
    ratedOutputA: row.ratedOutputA ?? undefined,
    ratedAtResistivityOhmM: row.ratedAtResistivityOhmM ?? undefined,
    unitPrice: row.unitPrice ?? undefined,
  };
}

/** The built-in generic models and the organisation's own, as one list. */
export async function listCatalogue(ctx: OrgContext, { includeArchived = false } = {}): Promise<CatalogueModel[]> {
  requirePermission(ctx, 'org:read');
  const rows = await ctx.em.find(AnodeModelSchema, { organisation: ctx.organisation, ...(includeArchived ? {} : { archivedAt: null }) }, { orderBy: { designation: 'asc' } });
  return [
    ...BUILTIN_ANODE_MODELS.map((m) => ({ ...m, key: builtinKey(m.id), source: 'built-in' as const, archived: false })),
    ...rows.map((r) => ({ ...toCpModel(r), key: orgKey(r.id), source: 'organisation' as const, archived: r.archivedAt != null })),
  ];
}

export async function resolveAnodeModel(ctx: OrgContext, key: string): Promise<CatalogueModel> {
  requirePermission(ctx, 'org:read');
  const [source, id] = [key.slice(0, key.indexOf(':')), key.slice(key.indexOf(':') + 1)];
  if (source === 'builtin') {
    const model = BUILTIN_ANODE_MODELS.find((m) => m.id === id);
    if (model) return { ...model, key, source: 'built-in', archived: false };
  } else if (source === 'org' && isUuid(id)) {
    const row = await ctx.em.findOne(AnodeModelSchema, { id, organisation: ctx.organisation });
    if (row) return { ...toCpModel(row), key, source: 'organisation', archived: row.archivedAt != null };
  }
  throw new AppError('invalid', 'That anode model is not in the catalogue.', { anodeModelKey: ['Choose an anode model from the catalogue.'] });
}
