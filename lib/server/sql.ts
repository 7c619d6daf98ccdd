// A user's filter text as an ILIKE pattern that matches it literally (%, _ and \ escaped).
export const ilikePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of a list in the shape every list endpoint returns. */
export function toPage<R, T>(countRows: { total: string | number }[], query: { page: number; pageSize: number }, rows: R[], map: (row: R) => T) {
  return { total: Number(countRows[0]?.total ?? 0), page: query.page, pageSize: query.pageSize, rows: rows.map(map) };
}

/**
 * Runs queries one after another and returns their results as a tuple. Inside a unit of work every
 * query goes through the transaction's one connection, which takes one query at a time: Promise.all
 * would only queue them (and pg deprecates that).
 */
export async function inSequence<T extends readonly (() => Promise<unknown>)[]>(...steps: T): Promise<{ -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> }> {
  const results: unknown[] = [];
  for (const step of steps) results.push(await step());
  return results as { -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> };
}

const LOCKABLE = new Set(['organisation', 'asset', 'anode_group', 'renewal']);

/**
 * Locks one row until the transaction ends, so a check and the write that relies on it happen one request
 * at a time: a second request waits here, then reads what the first committed. `for no key update` conflicts
 * with itself but not with the key-share locks that inserts referring to the row take, so other writes of
 * the organisation go on. Runs through em.execute, in the caller's transaction. Returns whether the row exists.
 */
export async function lockRow(em: { execute: (sql: string, params: unknown[]) => Promise<unknown> }, table: 'organisation' | 'asset' | 'anode_group' | 'renewal', id: string): Promise<boolean> {
  if (!LOCKABLE.has(table)) throw new Error(`lockRow: ${table} is not a lockable table`);
  const rows = (await em.execute(`select id from "${table}" where id = ? for no key update`, [id])) as unknown[];
  return rows.length > 0;
}

/**
 * A PostgreSQL array literal for one `?::type[]` parameter (knex would spread a JS array into several
 * parameters): every element quoted and escaped, null as NULL.
 */
export function pgArray(values: readonly (string | number | null)[]): string {
  return `{${values.map((v) => (v === null ? 'NULL' : `"${String(v).replace(/[\\"]/g, (c) => `\\${c}`)}"`)).join(',')}}`;
}
