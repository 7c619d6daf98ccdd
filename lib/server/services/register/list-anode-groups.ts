import type { ListQuery } from '@/lib/schemas/register';
import type { AnodeGroupModelSnapshot } from '@/entities';
import { writeCsv } from '@/lib/csv/write-csv';
import { ALLOY_LABELS, ASSET_KIND_LABELS, HULL_END_LABELS, HULL_SIDE_LABELS, MOUNTING_LABELS, REGISTER_CSV_HEADERS, TIDAL_DATUM_LABELS, ZONE_KIND_LABELS } from '@/lib/labels';
import { positionOf } from '@/lib/drawings/position-of';
import type { AnodePosition, PileRef } from '@/lib/schemas/anode-position';

const pileWords = (r: PileRef) => [r.bent !== null ? `bent ${r.bent}` : null, r.row !== null ? `row ${r.row}` : null].filter(Boolean).join(' ');

/** The register CSV's position columns, in words (REGISTER_CSV_HEADERS, from "Frames" on). */
export function positionCells(p: AnodePosition): (string | number | null)[] {
  return [
    p.frameFrom === null ? null : p.frameTo !== null && p.frameTo !== p.frameFrom ? `${p.frameFrom}–${p.frameTo}` : `${p.frameFrom}`,
    p.side ? HULL_SIDE_LABELS[p.side] : null,
    p.heightAboveKeelM,
    p.place ? `${ZONE_KIND_LABELS[p.place] ?? p.place}${p.end ? `, ${HULL_END_LABELS[p.end]}` : ''}` : p.end ? HULL_END_LABELS[p.end] : null,
    p.pileFrom ? (p.pileTo ? `${pileWords(p.pileFrom)} to ${pileWords(p.pileTo)}` : pileWords(p.pileFrom)) : null,
    p.depthBelowDatumM,
    p.datum ? TIDAL_DATUM_LABELS[p.datum] : null,
    p.note,
  ];
}
import { requirePermission, type OrgContext } from '../../org-context';
import { ilikePattern, toPage, inSequence } from '../../sql';

// Sort keys the client may ask for, mapped to SQL; never interpolate anything else.
const SORTS: Record<string, string> = {
  asset: 'a.name',
  label: 'g.label',
  zone: 'z.name',
  model: "g.model->>'designation'",
  quantity: 'g.quantity',
  installedOn: 'g.installed_on',
  remaining: 'r.remaining_fraction',
  netMass: "g.quantity * (g.model->>'netMassKg')::float8",
};

export interface AnodeGroupRow {
  id: string;
  assetId: string;
  assetName: string;
  assetKind: string;
  zoneName: string | null;
  label: string;
  model: AnodeGroupModelSnapshot;
  quantity: number;
  positions: string | null;
  installedOn: string;
  removedOn: string | null;
  meanCurrentA: number | null;
  lastRemainingFraction: number | null;
  lastSurveyedOn: string | null;
}

function whereClause(ctx: OrgContext, query: ListQuery) {
  const clauses = ['g.organisation_id = ?', 'a.archived_at is null', query.archived === '1' ? 'g.removed_on is not null' : 'g.removed_on is null'];
  const params: unknown[] = [ctx.organisation.id];
  if (query.assetId) {
    clauses.push('g.asset_id = ?');
    params.push(query.assetId);
  }
  if (query.q) {
    clauses.push("(a.name ilike ? or g.label ilike ? or coalesce(z.name, '') ilike ? or g.model->>'designation' ilike ? or coalesce(g.positions, '') ilike ?)");
    const like = ilikePattern(query.q);
    params.push(like, like, like, like, like);
  }
  return { sql: clauses.join(' and '), params };
}

/**
 * One page of the anode register with the latest surveyed remaining fraction of each group.
 * Always two statements (a count and the page), whatever the size of the register.
 */
export async function listAnodeGroups(ctx: OrgContext, query: ListQuery) {
  requirePermission(ctx, 'org:read');
  const where = whereClause(ctx, query);
  const byRemaining = query.sort === 'remaining';
  const order = `${SORTS[query.sort ?? ''] ?? 'a.name'} ${query.dir === 'desc' ? 'desc' : 'asc'} nulls last, g.label asc, g.id asc`;
  const conn = ctx.em;
  const [countRows, rows] = await inSequence(
    () => conn.execute<{ total: string }[]>(`select count(*) as total from anode_group g join asset a on a.id = g.asset_id left join zone z on z.id = g.zone_id where ${where.sql}`, where.params),
    () => conn.execute<Record<string, unknown>[]>(
      // The page is chosen first and the latest survey looked up for its rows only, unless the
      // remaining fraction itself is the sort key; so the cost follows the page, not the register.
      `${byRemaining ? '' : `with page as (select g.id from anode_group g join asset a on a.id = g.asset_id left join zone z on z.id = g.zone_id where ${where.sql} order by ${order} limit ? offset ?)`}
       select g.id, g.asset_id, a.name as asset_name, a.kind as asset_kind, z.name as zone_name, g.label, g.model, g.quantity, g.positions,
              to_char(g.installed_on, 'YYYY-MM-DD') as installed_on, to_char(g.removed_on, 'YYYY-MM-DD') as removed_on, g.mean_current_a,
              r.remaining_fraction, to_char(r.surveyed_on, 'YYYY-MM-DD') as surveyed_on
         from ${byRemaining ? 'anode_group g' : 'page p join anode_group g on g.id = p.id'}
         join asset a on a.id = g.asset_id
         left join zone z on z.id = g.zone_id
         left join lateral (
           select sr.remaining_fraction, s.surveyed_on from survey_reading sr join survey s on s.id = sr.survey_id
            where sr.anode_group_id = g.id and sr.remaining_fraction is not null
            order by s.surveyed_on desc, sr.remaining_fraction asc limit 1) r on true
        ${byRemaining ? `where ${where.sql}` : ''}
        order by ${order}
        ${byRemaining ? 'limit ? offset ?' : ''}`,
      [...where.params, query.pageSize, (query.page - 1) * query.pageSize],
    ),
  );
  return toPage(countRows, query, rows, (r): AnodeGroupRow => ({
        id: r.id as string,
        assetId: r.asset_id as string,
        assetName: r.asset_name as string,
        assetKind: r.asset_kind as string,
        zoneName: (r.zone_name as string) ?? null,
        label: r.label as string,
        model: r.model as AnodeGroupModelSnapshot,
        quantity: Number(r.quantity),
        positions: (r.positions as string) ?? null,
        installedOn: r.installed_on as string,
        removedOn: (r.removed_on as string) ?? null,
        meanCurrentA: r.mean_current_a === null ? null : Number(r.mean_current_a),
        lastRemainingFraction: r.remaining_fraction === null ? null : Number(r.remaining_fraction),
        lastSurveyedOn: (r.surveyed_on as string) ?? null,
      }));
}

/**
 * The whole register (fitted groups) as CSV, for spreadsheets and the yard; formula-safe (lib/csv/write-csv).
 * Headers and the values a person reads (kind, alloy, mounting) are in the words of lib/labels; dates are
 * YYYY-MM-DD (the header says so) so a spreadsheet sorts them.
 */
// The position columns come from the text the row carries: the stored position is that text read on every write.
export async function exportAnodeRegisterCsv(ctx: OrgContext) {
  const { rows } = await listAnodeGroups(ctx, { page: 1, pageSize: 1_000_000, dir: 'asc', archived: '0' } as ListQuery);
  return writeCsv([
    [...REGISTER_CSV_HEADERS],
    ...rows.map((r) => [r.assetName, ASSET_KIND_LABELS[r.assetKind] ?? 'Asset', r.zoneName, r.label, r.model.designation, ALLOY_LABELS[r.model.alloy] ?? 'Other alloy', MOUNTING_LABELS[r.model.mounting] ?? 'Other mounting', r.quantity, r.model.netMassKg, r.model.grossMassKg, (r.quantity * r.model.netMassKg).toFixed(1), r.positions, r.installedOn, r.lastRemainingFraction === null ? null : Math.round(r.lastRemainingFraction * 1000) / 10, r.lastSurveyedOn, ...positionCells(positionOf({ positions: r.positions }, r.assetKind === 'structure' ? 'structure' : 'vessel'))]),
  ]);
}
