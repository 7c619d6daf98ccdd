import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';
import { AssetSchema } from './asset.entity';
import type { ZONE_KIND_VALUES } from '@/lib/schemas/design';

export type ZoneKind = (typeof ZONE_KIND_VALUES)[number];

// A surface of an asset protected together, with what the calculation needs to know about it.
export const ZoneSchema = defineEntity({
  name: 'Zone',
  tableName: 'zone',
  properties: {
    id: uuidPk(),
    asset: p.manyToOne(AssetSchema).deleteRule('cascade').index(),
    name: p.string().length(80),
    kind: p.string().length(24).$type<ZoneKind>(),
    areaM2: double(),
    // 'entered', or the estimate used (e.g. 'denny-mumford'), named on the calculation note.
    areaSource: p.string().length(32).default('entered'),
    // 'I' | 'II' | 'III' (DNV coating categories) or 'bare'
    coatingCategory: p.string().length(8),
    coatingAgeYears: double().default(0),
    waterType: p.string().length(16).$type<'seawater' | 'brackish' | 'fresh' | 'sediment'>(),
    climate: p.string().length(16),
    depthBand: p.string().length(16),
    temperatureC: double().nullable(),
    drainsCurrent: p.string().length(16).nullable().$type<'copper-alloy' | 'stainless'>(),
    // Design current density entered by the engineer instead of the table, A/m2 {initial, mean, final}
    currentDensityOverride: p.json<{ initial: number; mean: number; final: number }>().nullable(),
    sortOrder: p.integer().default(0),
    archivedAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type Zone = InferEntity<typeof ZoneSchema>;
