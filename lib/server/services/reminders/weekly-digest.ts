import type { EntityManager } from '@mikro-orm/postgresql';
import { getISOWeek, getISOWeekYear, subDays } from 'date-fns';
import { MembershipSchema, OrganisationSchema } from '@/entities';
import { enqueueMailOnce } from '../../mail/outbox';
import { getEnv } from '../../env';
import { recomputeRenewals } from '../planner/recompute-renewals';
import { runAsSystem } from '../../unit-of-work';
import { OUTLOOK_WORDS, type AssetPlan } from '../planner/compute-plans';
import { formatDateOnly, toDateOnly } from '@/lib/dates/date-only';
import { eventWords, forecastDateWords } from '@/lib/labels';

/** The earliest renew-by date of the asset's groups with a renewal to book or booked, or null. */
function firstRenewBy(plan: AssetPlan): Date | null {
  const dates = plan.groups
    .filter((g) => g.proposal && g.proposal.status !== 'sound')
    .map((g) => g.forecast?.renewBy)
    .filter((d): d is Date => Boolean(d));
  return dates.length ? new Date(Math.min(...dates.map((d) => d.getTime()))) : null;
}

/** One asset's line: its outlook, the first renew-by date and the next docking. */
function digestLine(plan: AssetPlan, base: string): string {
  const renewBy = firstRenewBy(plan);
  const notes = [
    ...(renewBy ? [`${forecastDateWords('renewBy')} ${formatDateOnly(renewBy)}`] : []),
    ...(plan.nextDocking ? [`next ${eventWords(plan.asset.kind).event} ${formatDateOnly(plan.nextDocking.plannedStart)}`] : []),
  ];
  return `- ${plan.asset.name}: ${OUTLOOK_WORDS[plan.outlook]}${notes.length ? ` (${notes.join('; ')})` : ''}\n  ${base}/assets/${plan.asset.id}`;
}

/**
 * Once a week: recompute every organisation's outlooks and tell its planners and owners which assets
 * changed since the last digest. Nothing is sent when nothing changed. Exactly once per ISO week and person.
 */
export async function queueWeeklyDigests(em: EntityManager, now = new Date()) {
  const organisations = await em.find(OrganisationSchema, {});
  let queued = 0;
  const week = `${getISOWeekYear(now)}-W${String(getISOWeek(now)).padStart(2, '0')}`;
  for (const organisation of organisations) {
    const since = organisation.lastDigestAt ?? subDays(now, 7);
    // Each organisation's recompute commits on its own: one organisation's failure does not undo another's.
    const { plans } = await runAsSystem(organisation.id, (ctx) => recomputeRenewals(ctx, undefined, now), { em: em.fork() });
    const changed = plans.filter((p) => p.asset.outlookChangedAt && p.asset.outlookChangedAt.getTime() > since.getTime());
    if (changed.length) {
      const recipients = await em.find(MembershipSchema, { organisation: organisation.id, role: { $in: ['planner', 'owner'] } }, { populate: ['user'] });
      const base = `${getEnv().APP_URL}/o/${organisation.slug}`;
      const lines = changed.map((p) => digestLine(p, base));
      for (const m of recipients) {
        if (
          await enqueueMailOnce(em, {
            to: m.user.email,
            organisationId: organisation.id,
            dedupeKey: `weekly-digest:${organisation.id}:${week}:${m.user.id}`,
            subject: `Tidewarden weekly: ${changed.length} asset${changed.length === 1 ? '' : 's'} changed outlook (${organisation.name})`,
            text: `Since ${formatDateOnly(toDateOnly(since))}, the protection outlook changed for:\n\n${lines.join('\n')}\n\nThe docking planner: ${base}/dockings\n\n— Tidewarden`,
          })
        )
          queued++;
      }
    }
    await em.nativeUpdate(OrganisationSchema, { id: organisation.id }, { lastDigestAt: now });
  }
  return { queued };
}
