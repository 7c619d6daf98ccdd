import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { OrganisationSchema } from './organisation.entity';
import { AssetSchema } from './asset.entity';
import { UserSchema } from './user.entity';

export const DESIGN_STATUSES = ['draft', 'checked', 'approved'] as const;
export type DesignStatus = (typeof DESIGN_STATUSES)[number];

// One revision of an asset's anode design: inputs, anode model snapshot, results, basis and app version
// stored together. An approved revision is immutable; a change makes a new revision.
// The record columns are typed unknown on purpose: they are read through readDesignRecord (a zod parse,
// lib/schemas/design-record.ts) so that a row written under another version fails loudly.
export const DesignSchema = defineEntity({
  name: 'Design',
  tableName: 'design',
  uniques: [{ properties: ['asset', 'revision'] }],
  indexes: [{ properties: ['organisation', 'updatedAt'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    asset: p.manyToOne(AssetSchema).deleteRule('cascade'),
    revision: p.integer(),
    title: p.string().length(160),
    status: p.string().length(12).$type<DesignStatus>().default('draft'),
    // Which version of lib/schemas/design-record.ts the record columns follow.
    schemaVersion: p.integer(),
    inputs: p.json<unknown>(),
    anodeModel: p.json<unknown>().nullable(),
    results: p.json<unknown>().nullable(),
    // Set when the inputs cannot be computed (kept so a draft is never lost).
    resultError: p.text().nullable(),
    basis: p.json<unknown>().nullable(),
    appVersion: p.string().length(32),
    preparedBy: p.manyToOne(UserSchema).deleteRule('restrict'),
    checkedBy: p.manyToOne(UserSchema).nullable().deleteRule('restrict'),
    checkedAt: p.datetime().nullable(),
    approvedBy: p.manyToOne(UserSchema).nullable().deleteRule('restrict'),
    approvedAt: p.datetime().nullable(),
    basedOnRevision: p.integer().nullable(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type Design = InferEntity<typeof DesignSchema>;
