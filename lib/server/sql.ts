// A user's filter text as an ILIKE pattern that matches it literally (%, _ and \ escaped).
export const ilikePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of a list in the shape every list endpoint returns. */
export function toPage<R, T>(countRows: { total: string | number }[], query: { page: number; pageSize: number }, rows: R[], map: (row: R) => T) {
  return { total: Number(countRows[0]?.total ?? 0), page: query.page, pageSize: query.pageSize, rows: rows.map(map) };
}
