import type { EntityManager } from '@mikro-orm/postgresql';
import { SurveyReadingSchema, SurveySchema } from '@/entities';
import { surveyEditSchema } from '@/lib/schemas/surveys';
import { AppError, notFound } from '../../errors';
import { audit } from '../../audit';
import { uuidOrNotFound } from '../../ids';
import { requirePermission, type OrgContext } from '../../org-context';
import { getSurveyOrThrow } from './survey-access';
import { describeReading, lockSurvey, mailCorrections } from './reading-alerts';
import { deleteObjectsNow } from '../storage/delete-objects';

/** How long a deleted survey can be restored. */
export const SURVEY_RESTORE_DAYS = 30;

const surveyRecord = (s: { surveyedOn: string; method: string; surveyor?: string | null; defaultElectrode?: string | null; notes?: string | null }) => ({
  surveyedOn: s.surveyedOn,
  method: s.method,
  surveyor: s.surveyor ?? null,
  defaultElectrode: s.defaultElectrode ?? null,
  notes: s.notes ?? null,
});

/**
 * Corrects a survey's own fields (date, method, surveyor, electrode, notes). Its readings keep the electrode
 * each was recorded against; the survey's electrode is the default of the readings still to come.
 */
export async function updateSurvey(ctx: OrgContext, surveyId: string, input: unknown) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  const data = surveyEditSchema.parse(input);
  const before = surveyRecord(survey);
  survey.surveyedOn = data.surveyedOn;
  survey.method = data.method;
  survey.surveyor = data.surveyor;
  survey.defaultElectrode = data.defaultElectrode;
  survey.notes = data.notes;
  const after = surveyRecord(survey);
  audit(ctx, { action: 'survey.updated', targetType: 'survey', targetId: survey.id, details: { before, after } });
  // The survey's date places its remaining-mass readings on the depletion curve.
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  return survey;
}

/**
 * Deletes a survey with its readings and attachments. It is kept whole in the bin (`survey_bin`) for
 * SURVEY_RESTORE_DAYS days, where an engineer can restore it; live tables hold only live surveys, so no
 * forecast, list or count can pick up a deleted one. A message that named its readings is followed by a correction.
 */
export async function deleteSurvey(ctx: OrgContext, surveyId: string) {
  requirePermission(ctx, 'survey:write');
  const survey = await getSurveyOrThrow(ctx, surveyId);
  await lockSurvey(ctx, survey);
  const alerted = await ctx.em.find(SurveyReadingSchema, { survey, alertedAt: { $ne: null } });
  await ctx.em.execute(
    `insert into survey_bin (id, organisation_id, asset_id, surveyed_on, method, readings, attachments, deleted_at, deleted_by_email, payload)
     select s.id, s.organisation_id, s.asset_id, s.surveyed_on, s.method,
            (select count(*) from survey_reading r where r.survey_id = s.id),
            (select count(*) from survey_attachment a where a.survey_id = s.id),
            now(), ?,
            jsonb_build_object(
              'survey', to_jsonb(s),
              'readings', coalesce((select jsonb_agg(to_jsonb(r)) from survey_reading r where r.survey_id = s.id), '[]'::jsonb),
              'attachments', coalesce((select jsonb_agg(to_jsonb(a)) from survey_attachment a where a.survey_id = s.id), '[]'::jsonb))
       from survey s where s.id = ?`,
    [ctx.user.email, survey.id],
  );
  const [counts] = await ctx.em.execute<{ readings: number; attachments: number }[]>('select readings, attachments from survey_bin where id = ?', [survey.id]);
  if (alerted.length) await mailCorrections(ctx, survey, alerted.map((r) => ({ location: r.location, before: describeReading(survey, r), after: null })), { surveyDeleted: true });
  ctx.em.remove(survey);
  audit(ctx, {
    action: 'survey.deleted',
    targetType: 'survey',
    targetId: survey.id,
    details: { before: { asset: survey.asset.name, ...surveyRecord(survey), readings: counts.readings, attachments: counts.attachments }, after: null },
  });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys`);
  return { assetId: survey.asset.id, assetName: survey.asset.name, surveyedOn: survey.surveyedOn, readings: counts.readings };
}

export interface DeletedSurveyRow {
  id: string;
  assetId: string;
  assetName: string;
  surveyedOn: string;
  method: string;
  readings: number;
  attachments: number;
  deletedAt: string;
  deletedBy: string | null;
  /** The last day it can be restored (UTC). */
  restorableUntil: string;
}

/** Surveys deleted in the last SURVEY_RESTORE_DAYS days, newest first (what an engineer can restore). */
export async function listDeletedSurveys(ctx: OrgContext): Promise<DeletedSurveyRow[]> {
  requirePermission(ctx, 'survey:restore');
  const rows = await ctx.em.execute<Record<string, unknown>[]>(
    `select b.id, b.asset_id, a.name as asset_name, to_char(b.surveyed_on, 'YYYY-MM-DD') as surveyed_on, b.method, b.readings, b.attachments,
            b.deleted_at, b.deleted_by_email, to_char((b.deleted_at + ? * interval '1 day') at time zone 'UTC', 'YYYY-MM-DD') as restorable_until
       from survey_bin b join asset a on a.id = b.asset_id
      where b.organisation_id = ? and b.deleted_at > now() - ? * interval '1 day'
      order by b.deleted_at desc limit 200`,
    [SURVEY_RESTORE_DAYS, ctx.organisation.id, SURVEY_RESTORE_DAYS],
  );
  return rows.map((r) => ({
    id: r.id as string,
    assetId: r.asset_id as string,
    assetName: r.asset_name as string,
    surveyedOn: r.surveyed_on as string,
    method: r.method as string,
    readings: Number(r.readings),
    attachments: Number(r.attachments),
    deletedAt: new Date(r.deleted_at as string).toISOString(),
    deletedBy: (r.deleted_by_email as string) ?? null,
    restorableUntil: r.restorable_until as string,
  }));
}

/**
 * Puts a deleted survey back as it was (same id, readings, attachments), within SURVEY_RESTORE_DAYS days.
 * A reading's anode group that has since gone is left blank; a recorder who has left is replaced by the restorer.
 */
export async function restoreSurvey(ctx: OrgContext, surveyId: string) {
  requirePermission(ctx, 'survey:restore');
  uuidOrNotFound(surveyId, 'Deleted survey');
  const [bin] = await ctx.em.execute<{ id: string; asset_id: string; readings: number; fresh: boolean }[]>(
    `select id, asset_id, readings, deleted_at > now() - ? * interval '1 day' as fresh from survey_bin where id = ? and organisation_id = ? for update`,
    [SURVEY_RESTORE_DAYS, surveyId, ctx.organisation.id],
  );
  if (!bin) throw notFound('Deleted survey');
  if (!bin.fresh) throw new AppError('invalid', `The survey was deleted more than ${SURVEY_RESTORE_DAYS} days ago and can no longer be restored.`);
  return putBack(ctx, surveyId, bin, false);
}

/** How long after a delete whoever may delete a survey may also undo it (the screen offers it for a few seconds). */
export const SURVEY_UNDO_MINUTES = 10;

/**
 * Undo of "Delete the survey", a moment ago, by anyone who may delete one (an inspector too; restoring from
 * the bin later stays an engineer's). A repeat finds the survey back and changes nothing.
 */
export async function undoDeleteSurvey(ctx: OrgContext, surveyId: string) {
  requirePermission(ctx, 'survey:write');
  uuidOrNotFound(surveyId, 'Deleted survey');
  const [bin] = await ctx.em.execute<{ id: string; asset_id: string; readings: number; recent: boolean }[]>(
    `select id, asset_id, readings, deleted_at > now() - ? * interval '1 minute' as recent from survey_bin where id = ? and organisation_id = ? for update`,
    [SURVEY_UNDO_MINUTES, surveyId, ctx.organisation.id],
  );
  if (!bin) {
    const live = await ctx.em.findOne(SurveySchema, { id: surveyId, organisation: ctx.organisation });
    if (live) return { survey: await getSurveyOrThrow(ctx, surveyId), restored: false };
    throw notFound('Deleted survey');
  }
  if (!bin.recent) throw new AppError('conflict', `The survey was deleted more than ${SURVEY_UNDO_MINUTES} minutes ago; an engineer can restore it from the deleted surveys within ${SURVEY_RESTORE_DAYS} days.`);
  return { survey: await putBack(ctx, surveyId, bin, true), restored: true };
}

async function putBack(ctx: OrgContext, surveyId: string, bin: { asset_id: string; readings: number }, undo: boolean) {
  await ctx.em.execute(
    `insert into survey
     select (jsonb_populate_record(null::survey,
               case when exists (select 1 from app_user u where u.id = (b.payload->'survey'->>'created_by_id')::uuid) then b.payload->'survey'
                    else jsonb_set(b.payload->'survey', '{created_by_id}', to_jsonb(?::text)) end)).*
       from survey_bin b where b.id = ?`,
    [ctx.user.id, surveyId],
  );
  await ctx.em.execute(
    `insert into survey_reading
     select (jsonb_populate_record(null::survey_reading,
               case when exists (select 1 from anode_group g where g.id = (e->>'anode_group_id')::uuid) then e
                    else jsonb_set(e, '{anode_group_id}', 'null'::jsonb) end)).*
       from survey_bin b cross join lateral jsonb_array_elements(b.payload->'readings') e where b.id = ?`,
    [surveyId],
  );
  await ctx.em.execute(
    `insert into survey_attachment select (jsonb_populate_record(null::survey_attachment, e)).*
       from survey_bin b cross join lateral jsonb_array_elements(b.payload->'attachments') e where b.id = ?`,
    [surveyId],
  );
  await ctx.em.execute('delete from survey_bin where id = ?', [surveyId]);
  const survey = await getSurveyOrThrow(ctx, surveyId);
  audit(ctx, { action: 'survey.restored', targetType: 'survey', targetId: surveyId, details: { before: null, after: { asset: survey.asset.name, ...surveyRecord(survey), readings: Number(bin.readings) }, ...(undo ? { undo: true } : {}) } });
  ctx.effects.assetChanged(bin.asset_id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys`);
  return survey;
}

/**
 * Empties the bin of surveys deleted more than SURVEY_RESTORE_DAYS days ago (the worker runs it), then deletes
 * their photos and reports from the storage: the delete of the rows commits first (no transaction here), and a
 * file whose delete fails has no row left, so the storage clean-up job removes it later.
 */
export async function purgeDeletedSurveys(em: EntityManager, now = new Date()) {
  const rows = await em.execute<{ id: string; object_keys: string[] | null }[]>(
    `delete from survey_bin where deleted_at <= ?::timestamptz - ? * interval '1 day'
     returning id, array(select e->>'object_key' from jsonb_array_elements(coalesce(payload->'attachments', '[]'::jsonb)) e) as object_keys`,
    [now.toISOString(), SURVEY_RESTORE_DAYS],
  );
  await deleteObjectsNow(rows.flatMap((r) => r.object_keys ?? []));
  return rows.length;
}
