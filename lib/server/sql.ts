import type { EntityManager } from '@mikro-orm/postgresql';
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

/**
 * A read as a named prepared statement: PostgreSQL parses and plans it once per connection (then keeps its plan
 * when the plan does not depend on the values), instead of on every call; for a large statement read on every
 * request of a page (the asset page's). `text` uses `?` for the values, as em.execute does. Inside a transaction
 * it runs through em.execute, on the transaction's connection. The rows are PostgreSQL's, as em.execute gives them.
 */
export async function executePrepared<T>(em: EntityManager, name: string, text: string, values: readonly unknown[]): Promise<T[]> {
  if (!/^[a-z_]+$/.test(name)) throw new Error(`executePrepared: ${name} is not a statement name`);
  if (em.isInTransaction()) return em.execute<T[]>(text, [...values]);
  let n = 0;
  const numbered = text.replace(/\?/g, () => `$${++n}`);
  if (n !== values.length) throw new Error(`executePrepared ${name}: ${n} placeholders for ${values.length} values`);
  const client = em.getKnex().client;
  const started = performance.now();
  const connection = await client.acquireConnection();
  let rows: T[];
  try {
    try {
      rows = (await connection.query({ name, text: numbered, values })).rows as T[];
    } catch (error) {
      // A migration changed a table the statement reads (`*`) while this connection kept its plan: PostgreSQL then
      // refuses the kept plan ("cached plan must not change result type"). Drop it and prepare it again, once.
      if ((error as { code?: string }).code !== '0A000') throw error;
      await connection.query(`deallocate ${name}`);
      delete (connection as { connection?: { parsedStatements?: Record<string, unknown> } }).connection?.parsedStatements?.[name];
      rows = (await connection.query({ name, text: numbered, values })).rows as T[];
    }
  } finally {
    await client.releaseConnection(connection);
  }
  // Logged as the ORM logs its own statements (its debug output, and the tests' count of statements per request).
  em.config.getLogger().logQuery({ query: numbered, params: [...values], took: Math.round(performance.now() - started), results: rows.length, level: 'info', connection: { type: 'read' } });
  return rows;
}
