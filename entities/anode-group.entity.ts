import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';
import { OrganisationSchema } from './organisation.entity';
import { AssetSchema } from './asset.entity';
import { ZoneSchema } from './zone.entity';
import { DesignSchema } from './design.entity';
import type { AnodePosition } from '@/lib/schemas/anode-position';

/** What the register keeps of a catalogue model when the group is fitted (the catalogue may change later). */
export interface AnodeGroupModelSnapshot {
  key: string;
  designation: string;
  alloy: string;
  mounting: string;
  netMassKg: number;
  grossMassKg: number;
  capacityAhPerKg: number;
  utilisationFactor: number;
  potentialV: number;
}

// Installed anodes of one model on one zone, fitted together. Never deleted: a removal closes the
// group (removedOn) and a renewal fitted in its place points back to it (replacesGroupId).
export const AnodeGroupSchema = defineEntity({
  name: 'AnodeGroup',
  tableName: 'anode_group',
  indexes: [{ properties: ['organisation', 'removedOn'] }, { properties: ['asset', 'removedOn'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    asset: p.manyToOne(AssetSchema).deleteRule('cascade'),
    zone: p.manyToOne(ZoneSchema).nullable().deleteRule('set null'),
    label: p.string().length(60),
    model: p.json<AnodeGroupModelSnapshot>(),
    quantity: p.integer(),
    positions: p.text().nullable(),
    // The position as data, parsed from `positions` on every write (lib/drawings/parse-position.ts); read with
    // positionOf (lib/drawings/position-of.ts), which checks it against anodePositionSchema.
    position: p.json<AnodePosition>().nullable(),
    // The parser version that wrote `position` (PARSER_VERSION); positionOf reads the text again when it is older.
    positionParserVersion: p.integer().nullable(),
    installedOn: p.date(),
    design: p.manyToOne(DesignSchema).nullable().deleteRule('set null'),
    // The group's share of its design's mean current, A (or a measured output); drives the forecast.
    meanCurrentA: double().nullable(),
    removedOn: p.date().nullable(),
    removalReason: p.string().length(200).nullable(),
    replacesGroupId: p.uuid().nullable(),
    notes: p.text().nullable(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type AnodeGroup = InferEntity<typeof AnodeGroupSchema>;

// The history of a group: every edit with who made it and what changed.
export const AnodeGroupChangeSchema = defineEntity({
  name: 'AnodeGroupChange',
  tableName: 'anode_group_change',
  properties: {
    id: uuidPk(),
    group: p.manyToOne(AnodeGroupSchema).deleteRule('cascade').index(),
    changedByEmail: p.string().length(254).nullable(),
    changes: p.json<Record<string, [unknown, unknown]>>(),
    createdAt: createdAt(),
  },
});
export type AnodeGroupChange = InferEntity<typeof AnodeGroupChangeSchema>;
