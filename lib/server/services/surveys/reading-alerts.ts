import { MembershipSchema, SurveyReadingSchema, type Survey, type SurveyReading } from '@/entities';
import { classifyPotential, type PotentialStatus } from '@/lib/surveys/criteria';
import { surveyCriteriaOf } from '@/lib/register/protected-metal';
import { formatDateOnly } from '@/lib/dates/date-only';
import { enqueueMail } from '../../mail/outbox';
import { readingCorrectionMail, underProtectionMail, type MailedReading } from '../../mail/templates';
import { getEnv } from '../../env';
import type { OrgContext } from '../../org-context';

import { electrodeWords, POTENTIAL_STATUS_LABELS, surveyInSentence } from '@/lib/labels';

const volts = (v: number) => `${v > 0 ? '+' : v < 0 ? '-' : ''}${Math.abs(v).toFixed(3)} V`;

/** The reading's potential judged against the asset's criteria; null when it has none. */
export function potentialStatusOf(survey: Survey, reading: Pick<SurveyReading, 'potentialAgAgClV'>): PotentialStatus | null {
  if (reading.potentialAgAgClV === null || reading.potentialAgAgClV === undefined) return null;
  return classifyPotential({ potentialAgAgClV: reading.potentialAgAgClV, ...surveyCriteriaOf(survey.asset) }).status;
}


/** "+0.200 V against zinc (-0.850 V Ag/AgCl/seawater): protected", or the remaining mass when there is no potential. */
export function describeReading(survey: Survey, reading: Pick<SurveyReading, 'potentialV' | 'electrode' | 'potentialAgAgClV' | 'remainingFraction'>): string {
  const parts: string[] = [];
  if (reading.potentialV !== null && reading.potentialV !== undefined) {
    const electrode = electrodeWords(reading.electrode ?? '');
    const converted = reading.electrode !== 'ag-agcl-seawater' && reading.potentialAgAgClV !== null && reading.potentialAgAgClV !== undefined ? ` (${volts(reading.potentialAgAgClV)} Ag/AgCl/seawater)` : '';
    const status = potentialStatusOf(survey, reading);
    parts.push(`${volts(reading.potentialV)} against ${electrode}${converted}${status ? `: ${POTENTIAL_STATUS_LABELS[status].toLowerCase()}` : ''}`);
  }
  if (reading.remainingFraction !== null && reading.remainingFraction !== undefined) parts.push(`${Math.round(reading.remainingFraction * 1000) / 10} % of the anode remaining`);
  return parts.join('; ') || 'no value';
}

export const surveyLabelOf = (survey: Survey) => `${surveyInSentence(survey.method)} of ${formatDateOnly(survey.surveyedOn)}`;
const surveyUrl = (ctx: OrgContext, survey: Survey) => `${getEnv().APP_URL}/o/${ctx.organisation.slug}/surveys/${survey.id}`;

/** The people told about protection: the organisation's engineers and owners. */
async function recipientsOf(ctx: OrgContext) {
  const memberships = await ctx.em.find(MembershipSchema, { organisation: ctx.organisation, role: { $in: ['engineer', 'owner'] } }, { populate: ['user'] });
  return memberships.map((m) => m.user);
}

/**
 * Writes to one survey's readings run one after another (a row lock on the survey for the rest of the
 * transaction), so two requests cannot both decide that nobody has been told yet.
 */
export async function lockSurvey(ctx: OrgContext, survey: Survey) {
  await ctx.em.execute('select id from survey where id = ? for update', [survey.id]);
}

/**
 * Tells the engineers and owners about under-protected readings, once per survey and condition: the
 * first under-protected readings of a survey are mailed and remembered (`alertedAt`); later ones join
 * that open alert and are shown on the survey's page, not mailed one by one. When every reading an
 * alert named has been corrected or deleted (each correction is mailed), the condition is over, and the
 * next under-protected reading starts a new alert.
 */
export async function alertUnderProtection(ctx: OrgContext, survey: Survey, readings: SurveyReading[]): Promise<{ under: number; mailed: boolean }> {
  const under = readings.filter((r) => potentialStatusOf(survey, r) === 'under-protected');
  if (!under.length) return { under: 0, mailed: false };
  const ids = new Set(under.map((r) => r.id));
  const open = await ctx.em.count(SurveyReadingSchema, { survey, alertedAt: { $ne: null }, id: { $nin: [...ids] } });
  if (open > 0) return { under: under.length, mailed: false };
  const now = new Date();
  for (const r of under) r.alertedAt = now;
  const mailed: MailedReading[] = under.map((r) => ({ location: r.location, value: describeReading(survey, r) }));
  const mail = underProtectionMail(survey.asset.name, surveyLabelOf(survey), mailed, surveyUrl(ctx, survey));
  for (const user of await recipientsOf(ctx)) {
    enqueueMail(ctx, { to: user.email, organisationId: ctx.organisation.id, subject: mail.subject, text: mail.text, html: mail.html });
  }
  return { under: under.length, mailed: true };
}

/** The words an action shows about under-protected readings it recorded. */
export const underProtectionWords = ({ under, mailed }: { under: number; mailed: boolean }) =>
  !under ? '' : mailed ? 'the engineers have been told' : 'the engineers were already told about this survey; it is on its page';

export interface Correction {
  location: string;
  before: string;
  /** null: the reading was deleted. */
  after: string | null;
}

/** Follows an earlier under-protection message with the corrections of the readings it named. */
export async function mailCorrections(ctx: OrgContext, survey: Survey, corrections: Correction[], { surveyDeleted = false } = {}) {
  if (!corrections.length) return;
  const readings = surveyDeleted ? [] : await ctx.em.find(SurveyReadingSchema, { survey }, { fields: ['potentialAgAgClV'] });
  const stillUnder = surveyDeleted ? ('survey deleted' as const) : readings.filter((r) => potentialStatusOf(survey, r) === 'under-protected').length;
  const mail = readingCorrectionMail(survey.asset.name, surveyLabelOf(survey), ctx.user.name, corrections, stillUnder, surveyUrl(ctx, survey));
  for (const user of await recipientsOf(ctx)) {
    enqueueMail(ctx, { to: user.email, organisationId: ctx.organisation.id, subject: mail.subject, text: mail.text, html: mail.html });
  }
}
