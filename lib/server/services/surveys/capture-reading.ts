import { ZodError } from 'zod';
import { AnodeGroupSchema, SurveySchema } from '@/entities';
import { InputError } from '@/lib/errors/input-error';
import { CAPTURE_CONFLICT_MESSAGES } from '@/lib/labels';
import { captureReadingSchema, type CaptureItemResult } from '@/lib/schemas/surveys';
import { AppError, fieldErrorsFromZod } from '../../errors';
import { isUuid } from '../../ids';
import { requirePermission, type OrgContext } from '../../org-context';
import { audit } from '../../audit';
import { addReadings, surveyElectrodeOf } from './record-readings';
import { describeReading, lockSurvey, underProtectionWords } from './reading-alerts';

/**
 * One item of a phone's capture queue, in its own unit of work (the caller's): recorded once per survey
 * whatever the retries. An item already recorded is answered at once; otherwise the permission is checked and
 * the survey locked, so two sends of the same item at the same moment take turns and the second finds the
 * first's reading (`duplicate`, with its id); the unique index on
 * (survey_id, device_id) holds the same rule in the database, and `used_device_id` keeps the id after the reading is
 * deleted, so a late resend does not bring a deleted reading back. The reading goes through `addReadings`
 * (conversion to Ag/AgCl/seawater, classification, the under-protection alert once per survey).
 *
 * An item already recorded is answered `duplicate` before anything else is checked, so a phone that lost
 * the answer learns its reading is safe even if the survey's asset was archived or the member's role
 * changed since. What the member must resolve (the survey deleted, the asset archived, the group closed or
 * not on the asset, no permission to write, a read-only organisation) throws an AppError of code
 * `conflict`, `forbidden` or `read-only`; bad fields throw a ZodError or an `invalid` AppError.
 */
export async function captureReading(ctx: OrgContext, surveyId: string, item: Record<string, unknown>): Promise<CaptureItemResult> {
  requirePermission(ctx, 'org:read');
  const deviceId = String(item.deviceId ?? '');
  if (!isUuid(surveyId)) throw new AppError('conflict', CAPTURE_CONFLICT_MESSAGES.surveyGone);
  const survey = await ctx.em.findOne(SurveySchema, { id: surveyId, organisation: ctx.organisation }, { populate: ['asset'] });
  if (!survey) throw new AppError('conflict', CAPTURE_CONFLICT_MESSAGES.surveyGone);
  const answerFor = (prior: PriorCapture): CaptureItemResult | null =>
    prior === null ? null : prior === 'deleted' ? deletedSince(deviceId) : { deviceId, status: 'duplicate', readingId: prior.id, message: `Already recorded at ${prior.location}.` };
  // Already recorded (or recorded and deleted since): answered without a lock or a permission check (a reading
  // is safe whatever changed since).
  const earlier = answerFor(await priorCapture(ctx, survey.id, deviceId));
  if (earlier) return earlier;

  // Only a member who may write takes the survey's lock (a viewer's queue never holds up the writers).
  requirePermission(ctx, 'survey:write');
  await lockSurvey(ctx, survey);
  // A send of the same item that held the lock first has recorded it meanwhile.
  const meanwhile = answerFor(await priorCapture(ctx, survey.id, deviceId));
  if (meanwhile) return meanwhile;
  if (survey.asset.archivedAt) throw new AppError('conflict', CAPTURE_CONFLICT_MESSAGES.assetArchived);
  const reading = captureReadingSchema(surveyElectrodeOf(survey)).parse(item);
  let groupLabel: string | null = null;
  if (reading.anodeGroupId) {
    const group = await ctx.em.findOne(AnodeGroupSchema, { id: reading.anodeGroupId, organisation: ctx.organisation });
    if (!group || group.asset.id !== survey.asset.id) throw new AppError('conflict', CAPTURE_CONFLICT_MESSAGES.groupNotOnAsset);
    if (group.removedOn) throw new AppError('conflict', CAPTURE_CONFLICT_MESSAGES.groupGone);
    groupLabel = group.label;
  }
  const { under, mailed, readings } = await addReadings(ctx, survey, [{ ...reading, anodeGroupLabel: groupLabel, line: null }]);
  const [created] = readings;
  created.deviceId = reading.deviceId;
  // Kept for good, as for photos: a reading deleted on the desk is never recorded again by a late resend.
  await ctx.em.execute('insert into used_device_id (organisation_id, device_id, used_at) values (?, ?, now()) on conflict do nothing', [ctx.organisation.id, reading.deviceId]);
  audit(ctx, { action: 'survey.reading-added', targetType: 'survey', targetId: survey.id, details: { readingId: created.id, location: created.location, deviceId: reading.deviceId } });
  ctx.effects.assetChanged(survey.asset.id);
  ctx.effects.revalidate(`/o/${ctx.organisation.slug}/surveys/${survey.id}`);
  const saved = `Recorded at ${created.location}: ${describeReading(survey, created)}.`;
  return { deviceId, status: 'recorded', readingId: created.id, message: under ? `${saved} It is under-protected; ${underProtectionWords({ under, mailed })}.` : saved };
}

/** What became of an item sent before: its reading, `deleted` (recorded, deleted on the desk since), or null (never recorded). */
type PriorCapture = { id: string; location: string } | 'deleted' | null;

/**
 * The reading recorded under this device id in this survey, and whether the organisation ever used the id, in one
 * statement, so one snapshot: a send that commits the reading and its id together cannot look deleted to a
 * racing send reading the two at different moments.
 */
async function priorCapture(ctx: OrgContext, surveyId: string, deviceId: string): Promise<PriorCapture> {
  if (!isUuid(deviceId)) return null;
  const [row] = await ctx.em.execute<{ id: string | null; location: string | null; used: boolean }[]>(
    `select r.id, r.location, exists (select 1 from used_device_id u where u.organisation_id = ? and u.device_id = ?) as used
       from (select 1) as one left join survey_reading r on r.survey_id = ? and r.device_id = ?::uuid`,
    [ctx.organisation.id, deviceId, surveyId, deviceId],
  );
  if (row?.id) return { id: row.id, location: row.location ?? '' };
  return row?.used ? 'deleted' : null;
}

/**
 * A resend of a reading that was recorded and has been deleted on the desk since: answered as a duplicate (the phone
 * drops it, its work was received) and not recorded again, so a deletion is never undone by a phone that lost an answer.
 */
function deletedSince(deviceId: string): CaptureItemResult {
  return { deviceId, status: 'duplicate', message: CAPTURE_CONFLICT_MESSAGES.deletedSince };
}

/**
 * The survey a batch is sent to, checked once before its items: a survey that does not exist (deleted since the
 * phone opened it, or never this organisation's) answers 404 for the whole batch, with the sentence the phone
 * shows beside each of its items. Only reads.
 */
export async function getCaptureSurveyOrThrow(ctx: OrgContext, surveyId: string) {
  requirePermission(ctx, 'org:read');
  const survey = isUuid(surveyId) ? await ctx.em.findOne(SurveySchema, { id: surveyId, organisation: ctx.organisation }, { fields: ['id'] }) : null;
  if (!survey) throw new AppError('not-found', CAPTURE_CONFLICT_MESSAGES.surveyGone);
  return survey;
}

/** How a refused item is answered: its fields (`invalid`) or something the member must resolve (`conflict`); null for anything else. */
export function captureRefusal(deviceId: string, error: unknown): CaptureItemResult | null {
  if (error instanceof ZodError) {
    const fieldErrors = fieldErrorsFromZod(error);
    return { deviceId, status: 'invalid', message: Object.values(fieldErrors)[0]?.[0] ?? 'Some fields need attention.', fieldErrors };
  }
  if (error instanceof InputError) return { deviceId, status: 'invalid', message: error.message, fieldErrors: { [error.field]: [error.message] } };
  if (error instanceof AppError) {
    if (error.code === 'invalid') return { deviceId, status: 'invalid', message: error.message, fieldErrors: Object.keys(error.fieldErrors).length ? error.fieldErrors : undefined };
    if (error.code === 'forbidden') return { deviceId, status: 'conflict', message: CAPTURE_CONFLICT_MESSAGES.notAllowed };
    if (error.code === 'conflict' || error.code === 'read-only' || error.code === 'not-found') return { deviceId, status: 'conflict', message: error.message };
  }
  return null;
}
