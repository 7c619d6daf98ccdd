import { writeCsv, type CsvCell } from '@/lib/csv/write-csv';
import type { AnodeList, AnodeListLine } from './build-anode-list';
import { alloyWords, ANODE_LIST_LINE_COLUMNS, dimensionsWords, mountingWords, statusWords, ZONE_COLUMN, zoneWords } from '@/lib/labels/anode-list';

/**
 * The anode list as CSV for the yard's or contractor's spreadsheet: ONE table, the columns and
 * words of the PDF's line table (words.ts), with the zone (the PDF's heading over each zone's
 * lines) as the first column. Zones and lines in the PDF's order; no totals rows, so the sheet
 * can be sorted and summed as it is. Written by lib/csv/write-csv (RFC 4180, CRLF, texts a
 * spreadsheet would run as a formula prefixed with an apostrophe: labels and positions are typed
 * by users). Masses are plain kg numbers (at most 3 decimals, no grouping) and renew-by dates
 * YYYY-MM-DD, so spreadsheets read them as numbers and dates.
 */

export const ANODE_LIST_CSV_HEADER = [ZONE_COLUMN, ...ANODE_LIST_LINE_COLUMNS] as const;

/** kg as a plain number with at most 3 decimals ("92.4", not "92.39999999999999"). */
const kg = (x: number): string => String(Math.round(x * 1000) / 1000);

function lineRow(l: AnodeListLine): CsvCell[] {
  return [
    zoneWords(l.zone),
    l.groupLabel,
    l.designation,
    l.dimensions ? dimensionsWords(l.dimensions) : '',
    alloyWords(l.alloy),
    mountingWords(l.mounting),
    l.quantity,
    kg(l.netMassEachKg),
    kg(l.grossMassEachKg),
    kg(l.netMassTotalKg),
    kg(l.grossMassTotalKg),
    l.positions ?? '',
    l.renewBy ?? '',
    statusWords(l.status),
  ];
}

export function anodeListCsv(list: AnodeList): string {
  return writeCsv([[...ANODE_LIST_CSV_HEADER], ...list.zones.flatMap((zone) => zone.lines.map(lineRow))]);
}
