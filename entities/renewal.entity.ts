import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt } from './common';
import { OrganisationSchema } from './organisation.entity';
import { DockingSchema } from './docking.entity';
import { AnodeGroupSchema } from './anode-group.entity';

export const RENEWAL_STATUSES = ['proposed', 'confirmed', 'ordered', 'fitted', 'cancelled'] as const;
export type RenewalStatus = (typeof RENEWAL_STATUSES)[number];
export const RENEWAL_REASONS = ['forecast-depletion', 'survey-finding', 'damage', 'other'] as const;
export type RenewalReason = (typeof RENEWAL_REASONS)[number];

// Anodes of a group booked for renewal at a docking. 'proposed' rows are the scheduler's and are
// recomputed; everything a planner has touched (confirmed, ordered, fitted, cancelled) is left alone.
export const RenewalSchema = defineEntity({
  name: 'Renewal',
  tableName: 'renewal',
  indexes: [{ properties: ['docking', 'status'] }, { properties: ['group', 'status'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    docking: p.manyToOne(DockingSchema).deleteRule('cascade'),
    group: p.manyToOne(AnodeGroupSchema).deleteRule('cascade'),
    status: p.string().length(12).$type<RenewalStatus>().default('proposed'),
    reason: p.string().length(24).$type<RenewalReason>(),
    quantity: p.integer(),
    notes: p.text().nullable(),
    // The scheduler's one-sentence explanation of why this docking was chosen.
    rationale: p.text().nullable(),
    confirmedByEmail: p.string().length(254).nullable(),
    confirmedAt: p.datetime().nullable(),
    fittedOn: p.date().nullable(),
    newGroupId: p.uuid().nullable(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type Renewal = InferEntity<typeof RenewalSchema>;
