import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { OrganisationSchema } from './organisation.entity';
import { AssetSchema } from './asset.entity';

export const DOCKING_KINDS = ['intermediate', 'renewal-survey', 'unplanned', 'campaign'] as const;
export type DockingKind = (typeof DOCKING_KINDS)[number];
export const DOCKING_STATUSES = ['planned', 'done', 'cancelled'] as const;
export type DockingStatus = (typeof DOCKING_STATUSES)[number];

// A dry-docking of a vessel, or a diving/works campaign on a structure: when renewals can be fitted.
export const DockingSchema = defineEntity({
  name: 'Docking',
  tableName: 'docking',
  indexes: [{ properties: ['organisation', 'plannedStart'] }, { properties: ['asset', 'plannedStart'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    asset: p.manyToOne(AssetSchema).deleteRule('cascade'),
    kind: p.string().length(16).$type<DockingKind>(),
    status: p.string().length(12).$type<DockingStatus>().default('planned'),
    plannedStart: p.date(),
    plannedEnd: p.date().nullable(),
    actualStart: p.date().nullable(),
    actualEnd: p.date().nullable(),
    yard: p.string().length(120).nullable(),
    reference: p.string().length(60).nullable(),
    notes: p.text().nullable(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type Docking = InferEntity<typeof DockingSchema>;
