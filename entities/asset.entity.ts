import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';
import { OrganisationSchema } from './organisation.entity';

export const ASSET_KINDS = ['vessel', 'structure'] as const;
export type AssetKind = (typeof ASSET_KINDS)[number];

// A vessel or a harbour structure. One table: the particulars that do not apply to a kind stay null.
// Assets are archived, never deleted, so designs, surveys and history keep their subject.
export const AssetSchema = defineEntity({
  name: 'Asset',
  tableName: 'asset',
  indexes: [{ properties: ['organisation', 'archivedAt', 'name'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    kind: p.string().length(16).$type<AssetKind>(),
    name: p.string().length(120),
    notes: p.text().nullable(),
    // Vessel particulars (SI)
    imoNumber: p.string().length(7).nullable(),
    vesselType: p.string().length(60).nullable(),
    lengthBppM: double().nullable(),
    beamM: double().nullable(),
    draughtM: double().nullable(),
    blockCoefficient: double().nullable(),
    // Frame spacing, m, for the hull drawing; its source 'entered' or 'estimate' (null with no value).
    frameSpacingM: double().nullable(),
    frameSpacingSource: p.string().length(16).nullable().$type<'entered' | 'estimate'>(),
    hullMaterial: p.string().length(16).nullable().$type<'steel' | 'aluminium'>(),
    hasImpressedCurrent: p.boolean().default(false),
    tradingWaters: p.string().length(120).nullable(),
    // Structure particulars
    structureType: p.string().length(32).nullable(),
    location: p.string().length(120).nullable(),
    waterType: p.string().length(16).nullable().$type<'seawater' | 'brackish' | 'fresh'>(),
    designLifeYears: double().nullable(),
    pileCount: p.integer().nullable(),
    pileDiameterM: double().nullable(),
    // The pile grid for the plan: rows (lettered) by bents (numbered); its source 'entered' or 'estimate'.
    pileRows: p.integer().nullable(),
    pileBents: p.integer().nullable(),
    pileGridSource: p.string().length(16).nullable().$type<'entered' | 'estimate'>(),
    // What the survey criteria need (lib/surveys/criteria.ts), for either kind: the salinity of the water the
    // readings are taken in, PSU, for the chloride correction of an Ag/AgCl/seawater electrode (null: 35 PSU
    // in seawater, unknown otherwise); anaerobic conditions with sulphate-reducing bacteria (steel -0.90 V);
    // high-strength steel, yield above 550 MPa (no more negative than about -0.83 V).
    waterSalinityPsu: double().nullable(),
    anaerobic: p.boolean().default(false),
    highStrengthSteel: p.boolean().default(false),
    // The protection outlook last computed (sound, renew at next docking, overdue, under- or over-protected),
    // kept so the weekly digest can tell what changed.
    outlook: p.string().length(32).nullable(),
    outlookChangedAt: p.datetime().nullable(),
    archivedAt: p.datetime().nullable(),
    createdAt: createdAt(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type Asset = InferEntity<typeof AssetSchema>;
