import type { EntityManager } from '@mikro-orm/postgresql';
import { DockingSchema, MembershipSchema } from '@/entities';
import { enqueueMailOnce } from '../../mail/outbox';
import { getEnv } from '../../env';
import { anodeListPdf } from '../planner/anode-list';
import { runAsSystem } from '../../unit-of-work';
import { formatDateOnly, parseDateOnly, toDateOnly } from '@/lib/dates/date-only';
import { forecastDateWords } from '@/lib/forecast/labels';
import type { AnodeList } from '@/lib/anode-list';
import { renewalRuleSentence } from '@/lib/words/renewal-rule';
import { renewalRuleOf } from '../planner/compute-plans';

/** Reminders go 90 and 30 days before a planned docking (the yard needs the anode list to order). */
export const REMINDER_DAYS = [90, 30] as const;

/** Lines listed in the e-mail itself; the attached list has them all. */
const MAX_LINES_IN_TEXT = 30;

/** The renewals still to fit at the docking, one line each with its renew-by date, for the e-mail text. */
function renewalLinesText(list: AnodeList): string {
  const lines = list.zones.flatMap((z) => z.lines.filter((l) => l.status !== 'fitted').map((l) => ({ zone: z.zone, l })));
  if (!lines.length) return 'No renewals are booked at this docking yet.';
  const text = lines
    .slice(0, MAX_LINES_IN_TEXT)
    .map(({ zone, l }) => `- ${zone ? `${zone}, ` : ''}${l.groupLabel}: ${l.quantity} × ${l.designation}, ${l.status}${l.renewBy ? `, ${forecastDateWords('renewBy')} ${formatDateOnly(l.renewBy)}` : ''}`);
  if (lines.length > MAX_LINES_IN_TEXT) text.push(`- and ${lines.length - MAX_LINES_IN_TEXT} more on the attached list`);
  return `Renewals at this docking:\n${text.join('\n')}`;
}

/**
 * Queues the docking reminders that are due: for each planned docking starting within 90 (or 30) days,
 * each planner and owner gets one e-mail with the anode list attached. The dedupe key (docking, its
 * date, the threshold, the person) makes each reminder exactly once, however often this runs.
 */
export async function queueDockingReminders(em: EntityManager, now = new Date()) {
  const horizon = toDateOnly(new Date(now.getTime() + 91 * 86_400_000));
  const today = toDateOnly(now);
  const dockings = await em.find(DockingSchema, { status: 'planned', plannedStart: { $gte: today, $lte: horizon }, asset: { archivedAt: null } }, { populate: ['asset', 'organisation'] });
  // Planners and owners of every organisation concerned, in one query rather than one per docking.
  const members = dockings.length
    ? await em.find(MembershipSchema, { organisation: { $in: [...new Set(dockings.map((d) => d.organisation.id))] }, role: { $in: ['planner', 'owner'] } }, { populate: ['user'] })
    : [];
  let queued = 0;
  for (const docking of dockings) {
    // Whole UTC days between two date-only values, whatever the server's time zone.
    const days = Math.round((parseDateOnly(docking.plannedStart).getTime() - parseDateOnly(today).getTime()) / 86_400_000);
    const threshold = REMINDER_DAYS.filter((t) => days <= t).at(-1);
    if (threshold === undefined) continue;
    const recipients = members.filter((m) => m.organisation.id === docking.organisation.id);
    if (!recipients.length) continue;
    const { pdf, filename, list } = await runAsSystem(docking.organisation.id, (ctx) => anodeListPdf(ctx, docking.id), { em: em.fork() });
    const renewals = `${renewalLinesText(list)}\n\n${renewalRuleSentence(renewalRuleOf({ organisation: docking.organisation }))}`;
    const url = `${getEnv().APP_URL}/o/${docking.organisation.slug}/dockings/${docking.id}`;
    const when = formatDateOnly(docking.plannedStart);
    for (const m of recipients) {
      const sent = await enqueueMailOnce(em, {
        to: m.user.email,
        organisationId: docking.organisation.id,
        dedupeKey: `docking-reminder:${docking.id}:${docking.plannedStart}:${threshold}:${m.user.id}`,
        subject: `${docking.asset.name} docks in ${days} days (${when}): anode list attached`,
        text: `${docking.asset.name} is planned to dock on ${when}${docking.yard ? ` at ${docking.yard}` : ''}, in ${days} days.\n\n${renewals}\n\nThe anode list for ordering and fitting is attached. Review and confirm the proposed renewals before ordering:\n${url}\n\nVerify the list against the latest survey and the governing standard before ordering.\n\n— Tidewarden`,
        attachments: [{ filename, contentType: 'application/pdf', content: pdf.toString('base64') }],
      });
      if (sent) queued++;
    }
  }
  return { queued };
}
