import { writeCsv, type CsvCell } from '@/lib/csv/write-csv';
import type { AnodeList } from './build-anode-list';

/**
 * The dry-dock anode list as CSV for the yard's spreadsheet, written by lib/csv/write-csv
 * (RFC 4180: CRLF line ends, fields quoted when they hold a quote, comma, semicolon or line
 * break; texts a spreadsheet would run as a formula prefixed with an apostrophe, as positions
 * and group labels are typed by users).
 *
 * Layout
 *   1. header, then one row per line of the list (zone by zone, in the list's order), its
 *      renew_by date YYYY-MM-DD (empty when the group has none);
 *   2. a blank line, a row "ordering totals", a header and one row per model;
 *   3. a totals row (quantity, net and gross mass of the whole list).
 * Masses are plain kg numbers (at most 3 decimals, no grouping) so spreadsheets read them as numbers.
 */

export const ANODE_LIST_CSV_HEADER = [
  'zone',
  'group',
  'model',
  'alloy',
  'mounting',
  'quantity',
  'net_mass_each_kg',
  'gross_mass_each_kg',
  'net_mass_total_kg',
  'gross_mass_total_kg',
  'positions',
  'reason',
  'status',
  'renew_by',
] as const;

export const ANODE_LIST_CSV_ORDER_HEADER = [
  'model',
  'alloy',
  'mounting',
  'quantity',
  'net_mass_each_kg',
  'gross_mass_each_kg',
  'net_mass_total_kg',
  'gross_mass_total_kg',
] as const;

/** kg as a plain number with at most 3 decimals ("92.4", not "92.39999999999999"). */
const kg = (x: number): string => String(Math.round(x * 1000) / 1000);

export function anodeListCsv(list: AnodeList): string {
  const out: CsvCell[][] = [[...ANODE_LIST_CSV_HEADER]];
  for (const zone of list.zones) {
    for (const l of zone.lines) {
      out.push([
        l.zone,
        l.groupLabel,
        l.designation,
        l.alloy,
        l.mounting,
        l.quantity,
        kg(l.netMassEachKg),
        kg(l.grossMassEachKg),
        kg(l.netMassTotalKg),
        kg(l.grossMassTotalKg),
        l.positions,
        l.reason,
        l.status,
        l.renewBy,
      ]);
    }
  }
  out.push([]);
  out.push(['ordering totals']);
  out.push([...ANODE_LIST_CSV_ORDER_HEADER]);
  for (const o of list.orderTotals) {
    out.push([o.designation, o.alloy, o.mounting, o.quantity, kg(o.netMassEachKg), kg(o.grossMassEachKg), kg(o.netMassTotalKg), kg(o.grossMassTotalKg)]);
  }
  out.push(['total', '', '', list.totals.quantity, '', '', kg(list.totals.netMassKg), kg(list.totals.grossMassKg)]);
  return writeCsv(out);
}
