import { MS_PER_DAY, addMonthsMs, dayNumberUTC } from './dates';
import { formatDateOnly } from '../dates/date-only';
import { ForecastInputError } from './errors';
import { forecastDateWords } from '@/lib/labels/forecast';
import { eventWords } from '@/lib/labels/planner';
import { date, isRecord, isText, isValidDate, list, record, text, whole } from './validate';

/**
 * Renewal scheduling: which docking (or diving campaign) renews each anode group.
 *
 * The due date of a group is its renewBy (GroupForecast.renewBy: the remaining fraction reaches
 * the higher of 1 - u and the renewal threshold, 25 % by default), and its early date the
 * early end of the renewBy band (renewByEarly). A caller that gives no renewBy (older callers)
 * is scheduled on endOfLife and `early` instead, as before.
 *
 * Rules, applied to each group in this order:
 * 1. A group with a confirmed renewal is returned as 'kept' with that docking, never
 *    re-proposed or overwritten by a recompute. It only gets a `warning` when the
 *    confirmed docking is unknown, cancelled, or after the group's deadline.
 * 2. A group whose due date is null (never depletes) is 'sound'.
 * 3. deadline = due date - margin (calendar months, default 6, practice).
 * 4. Candidate dockings are those not cancelled, not done (a finished docking cannot
 *    take a new renewal) and dated today or later.
 * 5. A deadline before today (by UTC calendar day) is overdue (`overdue: true`): the group
 *    is proposed at the very next candidate, whatever its date, so it is on that docking's
 *    list. When that docking falls after the due date itself (the anodes reach the renewal
 *    point before it), or there is no candidate at all ('no-docking', `needsDockingBy =
 *    deadline`), `earlierDocking` asks for an unplanned docking or campaign as soon as
 *    possible (dated today).
 * 6. Otherwise let the horizon be the last candidate's date (today when there is none)
 *    plus the typical docking interval (30 months, practice; class allows at most 36).
 *    A deadline after the horizon means the next docking, not yet planned, is expected
 *    before the deadline: the group is 'sound', nothing to book yet, with `nextReviewBy =
 *    deadline`. (The margin is applied here too, so a group whose deadline falls between
 *    the last planned docking and the next expected one is renewed at the last planned
 *    docking: "hull anodes that will not last to the next docking", design-basis.md,
 *    Inspection.)
 * 7. Otherwise the proposal is the LAST candidate dated on or before the deadline: renew
 *    at the last opportunity before the anodes run out so their life is used; a docking
 *    after the deadline is too late. A group that outlives several dockings is proposed
 *    at the last of them before its deadline. When the group's early date (the early end
 *    of its due date's band) less the margin is before that docking, `atRisk` is true.
 * 8. No candidate on or before the deadline, but one after it and on or before the due
 *    date: the group can still reach that docking, inside the margin. It is proposed at
 *    the first such docking with `withinMargin: true` (the sentence says so).
 * 9. No candidate on or before the due date either: 'no-docking', `needsDockingBy =
 *    deadline`, `overdue: false`, and `earlierDocking` asks for an unplanned docking or
 *    campaign by the deadline.
 *
 * Cost: the dockings of an asset are validated, filtered and sorted once
 * (O(D log D)); each group is then O(log D) by binary search, so a fleet is
 * O(groups x log dockings) plus the sorting.
 */

export type DockingStatus = 'planned' | 'done' | 'cancelled';

export interface DockingInput {
  id: string;
  /** Planned or actual start. */
  date: Date;
  /** Missing means planned. */
  status?: DockingStatus;
}

export interface RenewalGroupInput {
  id: string;
  /**
   * Renew by (GroupForecast.renewBy): the date the group is scheduled on. When given (a date
   * or null), `endOfLife` and `early` are not used for scheduling.
   */
  renewBy?: Date | null;
  /** Early end of the renewBy band (GroupForecast.renewByEarly), for the `atRisk` flag. */
  renewByEarly?: Date | null;
  /**
   * End of life (GroupForecast.endOfLife): scheduled on only when `renewBy` is not given
   * (callers written before renewBy); required then.
   */
  endOfLife?: Date | null;
  /** Early end of the endOfLife band (GroupForecast.early), with `endOfLife` only. */
  early?: Date | null;
  confirmedRenewal?: { dockingId: string } | null;
}

export interface RenewalOptions {
  today: Date;
  /** Whole months between the deadline and the due date (renewBy); default 6 (practice). */
  marginMonths?: number;
  /** Expected interval after the last planned docking; default 30 months (practice). */
  typicalIntervalMonths?: number;
}

export interface ProposeRenewalsInput extends RenewalOptions {
  groups: readonly RenewalGroupInput[];
  dockings: readonly DockingInput[];
  /** The sentences say "docking" for a vessel and "campaign" for a structure; unknown says "docking or campaign". */
  assetKind?: 'vessel' | 'structure';
}

export type RenewalStatus = 'proposed' | 'kept' | 'no-docking' | 'sound';

export interface RenewalProposal {
  groupId: string;
  status: RenewalStatus;
  /** 'proposed': the docking chosen; 'kept': the confirmed one. */
  dockingId?: string;
  dockingDate?: Date;
  /** The due date (renewBy, else endOfLife) less the margin, for every group that depletes. */
  deadline?: Date;
  /** 'no-docking': the date by which a docking is needed (the deadline). */
  needsDockingBy?: Date;
  /** 'no-docking': whether that date has already passed. */
  overdue?: boolean;
  /** 'sound' with a finite end of life: review (book a docking) by this date. */
  nextReviewBy?: Date;
  /** 'proposed': the early end of the band would need renewal before this docking. */
  atRisk?: boolean;
  /** 'proposed' at a docking after the deadline but on or before the due date (rules 5 and 8): inside the margin. */
  withinMargin?: boolean;
  /**
   * No planned docking renews the group before its due date: an unplanned docking (a campaign for a
   * structure) is needed by this date (today when overdue), with the sentence that says why.
   */
  earlierDocking?: { by: Date; reason: string };
  /** One English sentence. */
  reason: string;
  /** 'kept' only: the confirmed booking looks wrong (one sentence). */
  warning?: string;
}

export const DEFAULT_MARGIN_MONTHS = 6;
export const DEFAULT_TYPICAL_INTERVAL_MONTHS = 30;

export interface FleetAssetInput {
  assetId: string;
  assetKind?: 'vessel' | 'structure';
  groups: readonly RenewalGroupInput[];
  dockings: readonly DockingInput[];
}

export interface FleetAssetProposals {
  assetId: string;
  proposals: RenewalProposal[];
}

const DOCKING_STATUSES: readonly DockingStatus[] = ['planned', 'done', 'cancelled'];

interface Settings {
  today: Date;
  todayDay: number;
  marginMonths: number;
  intervalMonths: number;
  /** formatDateOnly of an instant (ms), remembered per UTC day for the length of one call. */
  dayText: (ms: number) => string;
  /** '6 months' */
  marginText: string;
  /**
   * '3 Nov 2028 (renew by 3 May 2029 less 6 months)': the deadline and why it is there, remembered per
   * due day for one call (the deadline's day follows from the due date's day).
   */
  deadlineWords: (onRenewBy: boolean, dueMs: number, deadlineMs: number) => DeadlineWords;
  /** Rule 7's at-risk ending, ', although the early end ... by 3 Feb 2028.', remembered per UTC day for one call. */
  atRiskEnding: (earlyDeadlineMs: number) => string;
}

interface DeadlineWords {
  words: string;
  /** The words ending a sentence ('... less 6 months).'), made once rather than for every group. */
  ended: string;
}

interface PreparedDockings {
  byId: Map<string, { date: Date; status: DockingStatus }>;
  /** Candidates sorted by date (ties by id). */
  ids: string[];
  dates: Date[];
  times: Float64Array;
}

/** Renewal proposals for the groups of one asset (vessel or structure). */
export function proposeRenewals(input: ProposeRenewalsInput): RenewalProposal[] {
  const inp = record(input, 'input');
  const settings = readSettings(inp, '');
  return proposeForAsset(inp.groups, inp.dockings, settings, '', inp.assetKind);
}

/** The same for many assets; options are read once, dockings sorted once per asset. */
export function proposeRenewalsForFleet(assets: readonly FleetAssetInput[], opts: RenewalOptions): FleetAssetProposals[] {
  const settings = readSettings(record(opts, 'opts'), 'opts.');
  return list(assets, 'assets').map((a, i) => {
    const asset = record(a, `assets[${i}]`);
    const assetId = text(asset.assetId, `assets[${i}].assetId`);
    return { assetId, proposals: proposeForAsset(asset.groups, asset.dockings, settings, `assets[${i}].`, asset.assetKind) };
  });
}

function readSettings(inp: Record<string, unknown>, prefix: string): Settings {
  const today = date(inp.today, `${prefix}today`);
  const marginMonths = inp.marginMonths === undefined ? DEFAULT_MARGIN_MONTHS : whole(inp.marginMonths, `${prefix}marginMonths`, 0, 120);
  const intervalMonths =
    inp.typicalIntervalMonths === undefined
      ? DEFAULT_TYPICAL_INTERVAL_MONTHS
      : whole(inp.typicalIntervalMonths, `${prefix}typicalIntervalMonths`, 1, 120);
  const dayText = dayTextCache();
  const marginText = `${marginMonths} month${marginMonths === 1 ? '' : 's'}`;
  return {
    today,
    todayDay: dayNumberUTC(today),
    marginMonths,
    intervalMonths,
    dayText,
    marginText,
    deadlineWords: deadlineWordsCache(dayText, marginText),
    atRiskEnding: perDay((ms) => `, although the early end of the forecast would need renewal by ${dayText(ms)}.`),
  };
}

/** Settings.deadlineWords: by due date kind and UTC day, each built once per call (most groups share their due day with others). */
function deadlineWordsCache(dayText: (ms: number) => string, marginText: string): Settings['deadlineWords'] {
  const onRenewBy = new Map<number, DeadlineWords>();
  const onEndOfLife = new Map<number, DeadlineWords>();
  return (renewBy, dueMs, deadlineMs) => {
    const byDay = renewBy ? onRenewBy : onEndOfLife;
    const dayNumber = Math.floor(dueMs / MS_PER_DAY);
    let entry = byDay.get(dayNumber);
    if (entry === undefined) {
      const words = `${dayText(deadlineMs)} (${DUE_WORDS[renewBy ? 'renewBy' : 'endOfLife']} ${dayText(dueMs)} less ${marginText})`;
      entry = { words, ended: `${words}.` };
      byDay.set(dayNumber, entry);
    }
    return entry;
  };
}

/**
 * formatDateOnly by UTC day number, each day formatted once: a fleet's sentences name the same
 * days again and again (15,000 groups of the bench fleet fall due on about 2,500 days, their
 * dockings on 70). One cache per call, so it is bounded by the call's input.
 */
function dayTextCache(): (ms: number) => string {
  return perDay((ms) => formatDateOnly(new Date(ms)));
}

/** Words that depend only on the UTC day of an instant, made once per day for the length of one call. */
function perDay(make: (ms: number) => string): (ms: number) => string {
  const byDay = new Map<number, string>();
  return (ms) => {
    const dayNumber = Math.floor(ms / MS_PER_DAY);
    let words = byDay.get(dayNumber);
    if (words === undefined) {
      words = make(ms);
      byDay.set(dayNumber, words);
    }
    return words;
  };
}

function prepareDockings(value: unknown, todayDay: number, prefix: string): PreparedDockings {
  const raw = list(value, `${prefix}dockings`);
  const byId = new Map<string, { date: Date; status: DockingStatus }>();
  const candidates: { id: string; date: Date }[] = [];
  /** The error path of the i-th docking, built only to refuse a value. */
  const field = (i: number) => `${prefix}dockings[${i}]`;
  for (let i = 0; i < raw.length; i++) {
    const r = isRecord(raw[i]) ? (raw[i] as Record<string, unknown>) : record(raw[i], field(i));
    const id = isText(r.id) ? r.id : text(r.id, `${field(i)}.id`);
    const when = isValidDate(r.date) ? r.date : date(r.date, `${field(i)}.date`);
    let status: DockingStatus = 'planned';
    if (r.status !== undefined) {
      if (typeof r.status !== 'string' || !(DOCKING_STATUSES as readonly string[]).includes(r.status)) {
        throw new ForecastInputError(`${field(i)}.status`, `${field(i)}.status must be one of 'planned', 'done', 'cancelled'.`);
      }
      status = r.status as DockingStatus;
    }
    if (byId.has(id)) throw new ForecastInputError(`${field(i)}.id`, `${field(i)}.id ${JSON.stringify(id)} appears twice.`);
    byId.set(id, { date: when, status });
    if (status === 'planned' && dayNumberUTC(when) >= todayDay) candidates.push({ id, date: when });
  }
  candidates.sort((a, b) => a.date.getTime() - b.date.getTime() || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const n = candidates.length;
  const ids: string[] = new Array(n);
  const dates: Date[] = new Array(n);
  const times = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    ids[k] = candidates[k].id;
    dates[k] = candidates[k].date;
    times[k] = candidates[k].date.getTime();
  }
  return { byId, ids, dates, times };
}

/** Index of the last time <= t, or -1. */
function lastAtOrBefore(times: Float64Array, t: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (times[mid] <= t) lo = mid + 1;
    else hi = mid;
  }
  return lo - 1;
}

/** The words of the sentences: a vessel docks, a structure's anodes are renewed in a (diving) campaign. */
function sentenceWords(kind: unknown) {
  if (kind === 'vessel' || kind === 'structure') {
    const w = eventWords(kind);
    return { ev: w.event, evs: w.events, unplanned: kind === 'structure' ? 'a diving campaign' : 'an unplanned docking' };
  }
  return { ev: 'docking', evs: 'dockings', unplanned: 'an unplanned docking or campaign' };
}

/** The words of a due date inside a sentence ('renew by', 'end of life'), looked up once. */
const DUE_WORDS = { renewBy: forecastDateWords('renewBy'), endOfLife: forecastDateWords('endOfLife') } as const;

/** The error path of a group's field ('assets[3].groups[7]'), built only when a value is refused. */
const groupField = (prefix: string, i: number) => `${prefix}groups[${i}]`;

/** What every group of one asset is scheduled against: its candidate dockings and the words of its sentences. */
interface AssetPlan {
  s: Settings;
  docks: PreparedDockings;
  /** The number of candidate dockings. */
  n: number;
  assetKind: unknown;
  ev: string;
  evs: string;
  unplanned: string;
  /** Rule 6's horizon, ms. */
  horizon: number;
  /** Rule 7's sentence up to the deadline, per candidate docking: 'Renew at the docking of 4 Jun 2029, the last docking before the deadline '. */
  renewAtText: string[];
  /** Rule 6's sentence after the deadline and its parenthesis. */
  soundText: string;
}

/** A group's validated inputs. */
interface GroupDue {
  groupId: string;
  onRenewBy: boolean;
  due: Date | null;
  early: Date | null;
  confirmedId: string | null;
}

function proposeForAsset(groupsValue: unknown, dockingsValue: unknown, s: Settings, prefix: string, assetKind?: unknown): RenewalProposal[] {
  const { ev, evs, unplanned } = sentenceWords(assetKind);
  const groups = list(groupsValue, `${prefix}groups`);
  const docks = prepareDockings(dockingsValue, s.todayDay, prefix);
  const n = docks.times.length;
  const horizonBase = n > 0 ? docks.dates[n - 1] : s.today;
  const horizonText = n > 0 ? `the last planned ${ev} (${s.dayText(docks.times[n - 1])})` : `today, with no ${ev} planned`;
  const plan: AssetPlan = {
    s,
    docks,
    n,
    assetKind,
    ev,
    evs,
    unplanned,
    horizon: addMonthsMs(horizonBase.getTime(), s.intervalMonths),
    renewAtText: docks.ids.map((_, k) => `Renew at the ${ev} of ${s.dayText(docks.times[k])}, the last ${ev} before the deadline `),
    soundText: ` is more than ${s.intervalMonths} months after ${horizonText}, so nothing needs booking yet.`,
  };
  const proposals: RenewalProposal[] = new Array(groups.length);
  // One record of a group's inputs for the asset, filled in for each group in turn.
  const group: GroupDue = { groupId: '', onRenewBy: false, due: null, early: null, confirmedId: null };
  for (let i = 0; i < groups.length; i++) {
    readGroup(groups[i], prefix, i, group);
    proposals[i] = proposeForGroup(plan, group);
  }
  return proposals;
}

/** A group's inputs into `into`, validated in the order the errors are reported (id, due date, early date, confirmed renewal). */
function readGroup(g: unknown, prefix: string, i: number, into: GroupDue): void {
  const r = isRecord(g) ? g : record(g, groupField(prefix, i));
  const groupId = isText(r.id) ? r.id : text(r.id, `${groupField(prefix, i)}.id`);
  // The due date: renewBy when the caller gives it, else endOfLife (see the module comment).
  const onRenewBy = r.renewBy !== undefined;
  const dueValue = onRenewBy ? r.renewBy : r.endOfLife;
  const earlyValue = onRenewBy ? r.renewByEarly : r.early;
  const due = dueValue === null ? null : isValidDate(dueValue) ? dueValue : date(dueValue, `${groupField(prefix, i)}.${onRenewBy ? 'renewBy' : 'endOfLife'}`);
  const early =
    earlyValue === undefined || earlyValue === null
      ? null
      : isValidDate(earlyValue)
        ? earlyValue
        : date(earlyValue, `${groupField(prefix, i)}.${onRenewBy ? 'renewByEarly' : 'early'}`);
  let confirmedId: string | null = null;
  if (r.confirmedRenewal !== undefined && r.confirmedRenewal !== null) {
    const field = `${groupField(prefix, i)}.confirmedRenewal`;
    confirmedId = text(record(r.confirmedRenewal, field).dockingId, `${field}.dockingId`);
  }
  into.groupId = groupId;
  into.onRenewBy = onRenewBy;
  into.due = due;
  into.early = early;
  into.confirmedId = confirmedId;
}

/** Rules 1-9 for one group (dates as epoch ms, each day's words formatted once per call). */
function proposeForGroup(a: AssetPlan, group: GroupDue): RenewalProposal {
  const { groupId, onRenewBy, due, early, confirmedId } = group;
  const { s, docks, n, ev, unplanned } = a;
  const marginText = s.marginText;
  const day = s.dayText;
  const dueWords = DUE_WORDS[onRenewBy ? 'renewBy' : 'endOfLife'];
  const dueMs = due === null ? NaN : due.getTime();
  const deadlineMs = due === null ? NaN : addMonthsMs(dueMs, -s.marginMonths);
  const deadline = due === null ? null : new Date(deadlineMs);

  // Rule 1: a confirmed renewal is kept as it is.
  if (confirmedId !== null) {
    const booked = docks.byId.get(confirmedId);
    const bookedText = booked ? day(booked.date.getTime()) : '';
    const out: RenewalProposal = {
      groupId,
      status: 'kept',
      dockingId: confirmedId,
      ...(booked ? { dockingDate: booked.date } : {}),
      ...(deadline ? { deadline } : {}),
      reason: booked ? `The renewal confirmed at the ${ev} of ${bookedText} is kept as booked.` : 'The confirmed renewal is kept as booked.',
    };
    if (!booked) out.warning = `The confirmed renewal's ${ev} is not among this asset's ${a.evs}.`;
    else if (booked.status === 'cancelled') out.warning = `The ${ev} of ${bookedText} has been cancelled; the renewal needs another ${ev}.`;
    else if (deadline && booked.date.getTime() > deadlineMs) {
      out.warning = `The ${ev} of ${bookedText} is after the deadline ${s.deadlineWords(onRenewBy, dueMs, deadlineMs).ended}`;
    }
    return out;
  }

  // Rule 2: never depletes.
  if (deadline === null) {
    const point = onRenewBy ? 'renewal threshold' : 'end of life';
    return { groupId, status: 'sound', reason: `At its forecast rate the group never reaches its ${point}, so it needs no renewal.` };
  }

  const deadlineEntry = s.deadlineWords(onRenewBy, dueMs, deadlineMs);
  const deadlineWords = deadlineEntry.words;
  const needs = unplanned === 'a diving campaign' ? 'a campaign' : 'a docking';

  // Rule 5: the deadline has passed: the very next docking, and an earlier one when that is too late.
  if (Math.floor(deadlineMs / MS_PER_DAY) < s.todayDay) {
    const overdueWords = `The renewal deadline ${deadlineWords} has passed`;
    const dueText = `${dueWords} ${day(dueMs)}`;
    const asap = (why: string) => ({ by: s.today, reason: `${why}: plan ${unplanned} as soon as possible (from ${day(s.today.getTime())}).` });
    if (n > 0) {
      const dockingText = day(docks.times[0]);
      // Object literals written out rather than spread from a common part: a spread copies
      // property by property, the slowest way to make a proposal.
      if (docks.times[0] > dueMs) {
        return {
          groupId,
          status: 'proposed',
          dockingId: docks.ids[0],
          dockingDate: docks.dates[0],
          deadline,
          overdue: true,
          earlierDocking: asap(`The next ${ev} (${dockingText}) is after the ${dueText}`),
          reason: `${overdueWords}, so the group is renewed at the next ${ev}, ${dockingText}, which is after the ${dueText}.`,
        };
      }
      return {
        groupId,
        status: 'proposed',
        dockingId: docks.ids[0],
        dockingDate: docks.dates[0],
        deadline,
        overdue: true,
        withinMargin: true,
        reason: `${overdueWords}, so the group is renewed at the next ${ev}, ${dockingText}.`,
      };
    }
    return {
      groupId,
      status: 'no-docking',
      deadline,
      needsDockingBy: deadline,
      overdue: true,
      earlierDocking: asap(a.assetKind === 'vessel' || a.assetKind === 'structure' ? `No ${ev} is planned` : 'No docking or campaign is planned'),
      reason: `${overdueWords} and no ${ev} is planned, so the group needs ${needs} as soon as possible.`,
    };
  }

  // Rule 6: outlives the planned dockings and the next expected one.
  if (deadlineMs > a.horizon) {
    return {
      groupId,
      status: 'sound',
      deadline,
      nextReviewBy: deadline,
      reason: `The deadline ${deadlineWords}${a.soundText}`,
    };
  }

  // Rule 7: the last candidate on or before the deadline.
  const k = lastAtOrBefore(docks.times, deadlineMs);
  if (k >= 0) {
    const earlyDeadlineMs = early === null ? NaN : addMonthsMs(early.getTime(), -s.marginMonths);
    if (early !== null && docks.times[k] > earlyDeadlineMs) {
      return {
        groupId,
        status: 'proposed',
        dockingId: docks.ids[k],
        dockingDate: docks.dates[k],
        deadline,
        atRisk: true,
        reason: `${a.renewAtText[k]}${deadlineWords}${s.atRiskEnding(earlyDeadlineMs)}`,
      };
    }
    return { groupId, status: 'proposed', dockingId: docks.ids[k], dockingDate: docks.dates[k], deadline, reason: `${a.renewAtText[k]}${deadlineEntry.ended}` };
  }

  const dueText = `${dueWords} ${day(dueMs)}`;

  // Rule 8: the first candidate after the deadline that is still on or before the due date (inside the margin).
  if (n > 0 && docks.times[0] <= dueMs) {
    return {
      groupId,
      status: 'proposed',
      dockingId: docks.ids[0],
      dockingDate: docks.dates[0],
      deadline,
      withinMargin: true,
      reason: `Renew at the ${ev} of ${day(docks.times[0])}: no ${ev} falls before the deadline ${deadlineWords}, and this one is still before the ${dueText}, inside the ${marginText} margin.`,
    };
  }

  // Rule 9: no docking reaches the group before its due date.
  const next = n > 0 ? `the next ${ev} (${day(docks.times[0])}) is after the ${dueText}` : a.assetKind === 'vessel' || a.assetKind === 'structure' ? `no ${ev} is planned` : 'no docking or campaign is planned';
  return {
    groupId,
    status: 'no-docking',
    deadline,
    needsDockingBy: deadline,
    overdue: false,
    earlierDocking: { by: deadline, reason: `${next.charAt(0).toUpperCase()}${next.slice(1)}: plan ${unplanned} by ${day(deadlineMs)} (the ${dueText} less ${marginText}).` },
    reason: `No planned ${ev} falls on or before the deadline ${deadlineWords}, and ${next}, so the group needs ${needs} by the deadline.`,
  };
}
