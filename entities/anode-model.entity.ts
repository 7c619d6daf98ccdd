import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';
import { OrganisationSchema } from './organisation.entity';
import type { AnodeShape, AnodeAlloy } from '@/lib/cp';
import type { AnodeDimensions, AnodeMounting } from '@/lib/cp/anode-model';

// An organisation's own catalogue entry; the built-in generic models live in lib/cp.
export const AnodeModelSchema = defineEntity({
  name: 'AnodeModel',
  tableName: 'anode_model',
  uniques: [{ properties: ['organisation', 'designation'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    designation: p.string().length(60),
    alloy: p.string().length(32).$type<AnodeAlloy>(),
    mounting: p.string().length(16).$type<AnodeMounting>(),
    shape: p.json<AnodeShape>(),
    dimensions: p.json<AnodeDimensions>(),
    netMassKg: double(),
    grossMassKg: double(),
    ratedOutputA: double().nullable(),
    /** Resistivity, ohm m, the data-sheet output was stated at; the design scales the output to the job's. */
    ratedAtResistivityOhmM: double().nullable(),
    unitPrice: double().nullable(),
    notes: p.text().nullable(),
    archivedAt: p.datetime().nullable(),
    createdAt: createdAt(),
  },
});
export type AnodeModelRow = InferEntity<typeof AnodeModelSchema>;
