import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { p, uuidPk, createdAt, double } from './common';
import { OrganisationSchema } from './organisation.entity';
import { AssetSchema } from './asset.entity';
import { UserSchema } from './user.entity';
import { AnodeGroupSchema } from './anode-group.entity';

export const SURVEY_METHODS = ['diver', 'drop-cell', 'rov', 'dry-dock', 'other'] as const;
export type SurveyMethod = (typeof SURVEY_METHODS)[number];

export const SurveySchema = defineEntity({
  name: 'Survey',
  tableName: 'survey',
  indexes: [{ properties: ['organisation', 'surveyedOn'] }, { properties: ['asset', 'surveyedOn'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    asset: p.manyToOne(AssetSchema).deleteRule('cascade'),
    surveyedOn: p.date(),
    method: p.string().length(16).$type<SurveyMethod>(),
    surveyor: p.string().length(120).nullable(),
    /** The electrode every reading of the survey defaults to (the form's default, the CSV's blank cells). */
    defaultElectrode: p.string().length(24).default('ag-agcl-seawater'),
    notes: p.text().nullable(),
    createdBy: p.manyToOne(UserSchema).deleteRule('restrict'),
    createdAt: createdAt(),
  },
});
export type Survey = InferEntity<typeof SurveySchema>;

// One reading: a potential (as measured, with its electrode, and converted to Ag/AgCl/seawater)
// and/or an estimate of an anode group's remaining fraction.
export const SurveyReadingSchema = defineEntity({
  name: 'SurveyReading',
  tableName: 'survey_reading',
  properties: {
    id: uuidPk(),
    survey: p.manyToOne(SurveySchema).deleteRule('cascade').index(),
    line: p.integer().nullable(),
    location: p.string().length(80),
    potentialV: double().nullable(),
    electrode: p.string().length(24).nullable(),
    potentialAgAgClV: double().nullable(),
    anodeGroup: p.manyToOne(AnodeGroupSchema).nullable().deleteRule('set null').index(),
    remainingFraction: double().nullable(),
    comment: p.text().nullable(),
    /** When an under-protection alert named this reading; a correction of it is mailed to the same people. */
    alertedAt: p.datetime().nullable(),
    /** The UUID a phone gave the reading when it was captured (offline capture); unique per survey. */
    deviceId: p.uuid().nullable(),
  },
});
export type SurveyReading = InferEntity<typeof SurveyReadingSchema>;

// Photos and reports: the row says what the file is; its bytes are an object in the object storage under
// `objectKey` (org/<organisation>/survey/<survey>/<uuid>). A file sent from a device carries the device's id
// for the item (`deviceId`), unique per organisation, so the same item is accepted once whatever the retries.
export const SurveyAttachmentSchema = defineEntity({
  name: 'SurveyAttachment',
  tableName: 'survey_attachment',
  uniques: [{ properties: ['organisation', 'deviceId'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    survey: p.manyToOne(SurveySchema).deleteRule('cascade').index(),
    filename: p.string().length(200),
    contentType: p.string().length(60),
    sizeBytes: p.integer(),
    // NULL only for a file kept in PostgreSQL before the move to the object storage and not moved yet (its
    // bytes are still in the unmapped column `data`; see move-stored-files.ts). Every new file has its key.
    objectKey: p.string().length(300).unique().nullable(),
    deviceId: p.string().length(64).nullable(),
    caption: p.string().length(200).nullable(),
    uploadedByEmail: p.string().length(254).nullable(),
    createdAt: createdAt(),
  },
});
export type SurveyAttachment = InferEntity<typeof SurveyAttachmentSchema>;

// An upload the browser was given a presigned URL for and has not completed yet. `objectKey` is the staging key
// of the latest link (a repeat of the request for the same device item gets a new one); completing it copies the
// object to a fresh key and turns it into a survey_attachment row.
// Rows older than a day are removed by the storage clean-up job, and their objects with them.
export const SurveyAttachmentUploadSchema = defineEntity({
  name: 'SurveyAttachmentUpload',
  tableName: 'survey_attachment_upload',
  uniques: [{ properties: ['organisation', 'deviceId'] }],
  properties: {
    id: uuidPk(),
    organisation: p.manyToOne(OrganisationSchema).deleteRule('cascade'),
    survey: p.manyToOne(SurveySchema).deleteRule('cascade').index(),
    deviceId: p.string().length(64),
    objectKey: p.string().length(300).unique(),
    filename: p.string().length(200),
    contentType: p.string().length(60),
    sizeBytes: p.integer(),
    caption: p.string().length(200).nullable(),
    uploadedByEmail: p.string().length(254).nullable(),
    createdAt: createdAt().index(),
  },
});
export type SurveyAttachmentUpload = InferEntity<typeof SurveyAttachmentUploadSchema>;
