import { dayNumberUTC } from './dates';
import { ForecastInputError } from './errors';
import type { RenewalProposal } from './propose-renewals';
import { date, finite, list, record, text } from './validate';

/**
 * An asset's protection outlook for the fleet overview, by precedence
 *   under-protected > over-protected > no-anodes > overdue > renew-at-next-docking > sound:
 * - 'under-protected': the latest survey found potentials outside the protection criteria
 *   (the caller decides that from the readings);
 * - 'over-protected': the latest survey found a potential more negative than the asset's
 *   over-protection limit (coating disbondment, hydrogen embrittlement of high-strength steel,
 *   alkaline corrosion of aluminium); under-protection found in the same survey comes first;
 * - 'no-anodes': the asset has no anode group recorded (`anodesRecorded: false`): nothing is
 *   known to protect it, so it is never called sound;
 * - 'overdue': a group is flagged overdue, or its `needsDockingBy` is before today (the
 *   stored proposals may be older than today);
 * - 'renew-at-next-docking': a group is proposed or kept at the next docking (at any
 *   docking when `nextDockingId` is not given), or needs a docking that is not planned
 *   yet ('no-docking' not yet overdue: the next docking must renew it);
 * - 'sound': otherwise (renewals only at later dockings, or none).
 */

export type AssetOutlook = 'sound' | 'no-anodes' | 'renew-at-next-docking' | 'overdue' | 'over-protected' | 'under-protected';

export type GroupStatusSummary = Pick<RenewalProposal, 'status' | 'overdue' | 'needsDockingBy' | 'dockingId'>;

export interface AssetOutlookInput {
  groupStatuses: readonly GroupStatusSummary[];
  underProtectedBySurvey: boolean;
  /** The latest survey has a reading beyond the over-protection limit; omitted = false. */
  overProtectedBySurvey?: boolean;
  today: Date;
  /** The asset has at least one anode group recorded; omitted = true. */
  anodesRecorded?: boolean;
  /** The asset's next docking; when given, only renewals at it make 'renew-at-next-docking'. */
  nextDockingId?: string | null;
}

export function assetOutlook(input: AssetOutlookInput): AssetOutlook {
  const inp = record(input, 'input');
  const statuses = list(inp.groupStatuses, 'groupStatuses');
  if (typeof inp.underProtectedBySurvey !== 'boolean') {
    throw new ForecastInputError('underProtectedBySurvey', 'underProtectedBySurvey must be true or false.');
  }
  if (inp.overProtectedBySurvey !== undefined && typeof inp.overProtectedBySurvey !== 'boolean') {
    throw new ForecastInputError('overProtectedBySurvey', 'overProtectedBySurvey must be true or false.');
  }
  if (inp.anodesRecorded !== undefined && typeof inp.anodesRecorded !== 'boolean') {
    throw new ForecastInputError('anodesRecorded', 'anodesRecorded must be true or false.');
  }
  const todayDay = dayNumberUTC(date(inp.today, 'today'));
  const nextDockingId = inp.nextDockingId === undefined || inp.nextDockingId === null ? null : text(inp.nextDockingId, 'nextDockingId');

  let overdue = false;
  let renewNext = false;
  statuses.forEach((s, i) => {
    const r = record(s, `groupStatuses[${i}]`);
    const needsBy = r.needsDockingBy === undefined ? null : date(r.needsDockingBy, `groupStatuses[${i}].needsDockingBy`);
    if (r.overdue === true || (needsBy !== null && dayNumberUTC(needsBy) < todayDay)) overdue = true;
    else if (r.status === 'no-docking') renewNext = true;
    else if ((r.status === 'proposed' || r.status === 'kept') && (nextDockingId === null || r.dockingId === nextDockingId)) renewNext = true;
  });

  if (inp.underProtectedBySurvey) return 'under-protected';
  if (inp.overProtectedBySurvey) return 'over-protected';
  if (inp.anodesRecorded === false) return 'no-anodes';
  if (overdue) return 'overdue';
  if (renewNext) return 'renew-at-next-docking';
  return 'sound';
}

export interface MassDue {
  dockingId: string;
  /** Net anode mass to fit, kg: the sum of the installed net mass of each group renewed. */
  massKg: number;
  groupIds: string[];
}

/**
 * Net anode mass due at each docking from the proposals ('proposed' and 'kept'), in the
 * order the dockings first appear. `netMassKgByGroup` gives each group's net mass
 * (quantity x net mass per anode); a renewed group missing from it is an error.
 */
export function massDueKg(
  proposals: readonly Pick<RenewalProposal, 'groupId' | 'status' | 'dockingId'>[],
  netMassKgByGroup: ReadonlyMap<string, number> | Readonly<Record<string, number>>,
): MassDue[] {
  const rows = list(proposals, 'proposals');
  const lookup = (id: string): unknown =>
    netMassKgByGroup instanceof Map ? netMassKgByGroup.get(id) : Object.prototype.hasOwnProperty.call(netMassKgByGroup, id) ? (netMassKgByGroup as Record<string, number>)[id] : undefined;
  const byDocking = new Map<string, MassDue>();
  rows.forEach((p, i) => {
    const r = record(p, `proposals[${i}]`);
    if (r.status !== 'proposed' && r.status !== 'kept') return;
    const groupId = text(r.groupId, `proposals[${i}].groupId`);
    const dockingId = text(r.dockingId, `proposals[${i}].dockingId`);
    const mass = finite(lookup(groupId), `netMassKgByGroup.${groupId}`, 'kg');
    if (mass < 0) throw new ForecastInputError(`netMassKgByGroup.${groupId}`, `netMassKgByGroup.${groupId} must not be negative.`);
    const row = byDocking.get(dockingId) ?? { dockingId, massKg: 0, groupIds: [] };
    row.massKg += mass;
    row.groupIds.push(groupId);
    byDocking.set(dockingId, row);
  });
  return [...byDocking.values()];
}
