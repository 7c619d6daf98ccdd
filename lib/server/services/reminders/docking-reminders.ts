import type { EntityManager } from '@mikro-orm/postgresql';
import { DockingSchema, MembershipSchema, OutboxMessageSchema } from '@/entities';
import { enqueueMailOnce } from '../../mail/outbox';
import { getEnv } from '../../env';
import { anodeListFor, anodeListPdf } from '../planner/anode-list';
import { recomputeRenewals } from '../planner/recompute-renewals';
import { runAsSystem } from '../../unit-of-work';
import { formatDateOnly, parseDateOnly, toDateOnly } from '@/lib/dates/date-only';
import { eventWords, forecastDateWords, statusWords, type EventWords } from '@/lib/labels';
import type { AnodeList } from '@/lib/anode-list';
import type { GroupWithForecast } from '../forecast/group-forecasts';
import { renewalRuleSentence } from '@/lib/labels';
import { renewalRuleOf } from '../planner/compute-plans';

/** Reminders go 90 and 30 days before a planned docking (the yard needs the anode list to order). */
export const REMINDER_DAYS = [90, 30] as const;

/** Lines listed in the e-mail itself; the attached list has them all. */
const MAX_LINES_IN_TEXT = 30;

/** The renewals still to fit at the docking (cancelled ones are not on the list). */
const openLines = (list: AnodeList) => list.zones.flatMap((z) => z.lines.filter((l) => l.status !== 'fitted').map((l) => ({ zone: z.zone, l })));

/** The renewals still to fit at the docking, one line each with its renew-by date, for the e-mail text. */
function renewalLinesText(list: AnodeList, words: EventWords): string {
  const lines = openLines(list);
  const text = lines
    .slice(0, MAX_LINES_IN_TEXT)
    .map(({ zone, l }) => `- ${zone ? `${zone}, ` : ''}${l.groupLabel}: ${l.quantity} × ${l.designation} (${statusWords(l.status)})${l.renewBy ? `, ${forecastDateWords('renewBy')} ${formatDateOnly(l.renewBy)}` : ''}`);
  if (lines.length > MAX_LINES_IN_TEXT) text.push(`- and ${lines.length - MAX_LINES_IN_TEXT} more on the attached list`);
  return `Renewals at this ${words.event}:\n${text.join('\n')}`;
}

/** What is missing for a docking with nothing to fit, in one or two sentences. */
function missingWords(assetName: string, groups: readonly Pick<GroupWithForecast, 'forecast'>[], words: EventWords): string {
  if (!groups.length) return `No anodes are recorded for ${assetName}: record its fitted anode groups on the asset page so their renewals can be forecast and proposed.`;
  const unforecast = groups.filter((g) => !g.forecast).length;
  const noBasis = unforecast
    ? ` ${unforecast} of its ${groups.length} anode group${groups.length === 1 ? '' : 's'} cannot be forecast (no current basis or no usable survey): link ${unforecast === 1 ? 'it' : 'them'} to a design, enter a mean current or survey ${unforecast === 1 ? 'it' : 'them'}.`
    : '';
  return `By the forecast, none of the ${groups.length} anode group${groups.length === 1 ? '' : 's'} of ${assetName} is due for renewal at this ${words.event}.${noBasis}`;
}

/**
 * Queues the docking reminders that are due: for each planned docking starting within 90 (or 30) days,
 * each planner and owner gets one e-mail with the anode list attached, or, when nothing is to be fitted
 * there yet, one that says so and what is missing (never an empty list). The dedupe key (docking, its
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
  let failed = 0;
  for (const docking of dockings) {
    // Whole UTC days between two date-only values, whatever the server's time zone.
    const days = Math.round((parseDateOnly(docking.plannedStart).getTime() - parseDateOnly(today).getTime()) / 86_400_000);
    const threshold = REMINDER_DAYS.filter((t) => days <= t).at(-1);
    if (threshold === undefined) continue;
    const recipients = members.filter((m) => m.organisation.id === docking.organisation.id);
    if (!recipients.length) continue;
    const keyOf = (userId: string) => `docking-reminder:${docking.id}:${docking.plannedStart}:${threshold}:${userId}`;
    // Everyone already has this reminder: nothing to recompute or render (the job runs far more often than reminders fall due).
    if ((await em.count(OutboxMessageSchema, { dedupeKey: { $in: recipients.map((m) => keyOf(m.user.id)) } })) === recipients.length) continue;
    const words = eventWords(docking.asset.kind);
    // The proposals as of today (a group may have become overdue since the last change), then the list; the PDF
    // only when the list has something to fit: an empty list is never attached, the e-mail says what is missing.
    const prepare = () => runAsSystem(
      docking.organisation.id,
      async (ctx) => {
        // recomputeRenewals locks the asset first: of two workers' passes at once (a start-up pass and a cron slot),
        // the second waits and then finds the proposal the first made, instead of making a second one.
        const { plans } = await recomputeRenewals(ctx, [docking.asset.id], now);
        const { list } = await anodeListFor(ctx, docking.id);
        if (openLines(list).length) return await anodeListPdf(ctx, docking.id);
        return { missing: missingWords(docking.asset.name, plans[0]?.groups ?? [], words) };
      },
      { em: em.fork() },
    );
    let prepared: Awaited<ReturnType<typeof prepare>>;
    try {
      prepared = await prepare();
    } catch (error) {
      // One docking's bad data must not hold back every other organisation's reminders; this one is tried again at
      // the next pass (nothing was queued for it).
      failed++;
      console.error(`[tidewarden] the reminder for docking ${docking.id} could not be prepared; it is tried again at the next pass:`, error instanceof Error ? error.message : error);
      continue;
    }
    const rule = renewalRuleSentence(renewalRuleOf({ organisation: docking.organisation }), docking.asset.kind);
    const base = `${getEnv().APP_URL}/o/${docking.organisation.slug}`;
    const url = `${base}/dockings/${docking.id}`;
    const when = formatDateOnly(docking.plannedStart);
    // A vessel docks at a yard; a structure has a diving campaign by a contractor.
    const opening =
      docking.asset.kind === 'structure'
        ? `A diving campaign on ${docking.asset.name} is planned for ${when}${docking.yard ? ` by ${docking.yard}` : ''}, in ${days} days.`
        : `${docking.asset.name} is planned to dock on ${when}${docking.yard ? ` at ${docking.yard}` : ''}, in ${days} days.`;
    const heading = docking.asset.kind === 'structure' ? `${docking.asset.name}: diving campaign in ${days} days (${when})` : `${docking.asset.name} docks in ${days} days (${when})`;
    const mail =
      'pdf' in prepared
        ? {
            subject: `${heading}: anode list attached`,
            text: `${opening}\n\n${renewalLinesText(prepared.list, words)}\n\n${rule}\n\nThe anode list for ordering and fitting is attached. Review and confirm the proposed renewals before ordering:\n${url}\n\nVerify the list against the latest survey and the governing standard before ordering.\n\n— Tidewarden`,
            attachments: [{ filename: prepared.filename, contentType: 'application/pdf', content: prepared.pdf.toString('base64') }],
          }
        : {
            subject: `${heading}: no anode renewals booked yet`,
            text: `${opening}\n\nNo renewals are proposed or confirmed for this ${words.event} yet, so no anode list is attached. ${prepared.missing}\n\nOpen the planner to book the renewals this ${words.event} should carry:\n${url}\n\n${rule}\n\n— Tidewarden`,
          };
    for (const m of recipients) {
      const sent = await enqueueMailOnce(em, {
        to: m.user.email,
        organisationId: docking.organisation.id,
        dedupeKey: keyOf(m.user.id),
        ...mail,
      });
      if (sent) queued++;
    }
  }
  return { queued, failed };
}
