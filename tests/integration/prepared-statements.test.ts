// The reads run on every request of a page (the session with its memberships, the asset page's statement) are named
// prepared statements: planned once per connection. Their answers must be those of the same statement run plainly,
// and a migration that changes a table they read with `*` must not break a connection that kept the old plan.
import { afterAll, describe, expect, it } from 'vitest';
import { getEm, getOrm, queryCounter } from '@/lib/server/db';
import { executePrepared } from '@/lib/server/sql';

afterAll(async () => {
  await (await getEm()).getConnection().execute('drop table if exists tw_prepared_probe');
  await (await getOrm()).close(true);
});

describe('executePrepared', () => {
  it('answers as em.execute does, value for value, and counts as one statement', async () => {
    const em = (await getEm()).fork();
    const sql = `select ?::int as n, ?::text as t, now() as at, json_build_object('a', ?::int) as j, null::date as d`;
    const before = queryCounter.count;
    const [prepared] = await executePrepared<Record<string, unknown>>(em, 'tw_probe_values', sql, [7, 'Sea chest', 3]);
    expect(queryCounter.count - before).toBe(1);
    const [plain] = await em.execute<Record<string, unknown>[]>(sql, [7, 'Sea chest', 3]);
    // The clock moves between the two reads; its value is read the same way (the types the ORM's driver sets).
    expect({ ...prepared, at: null }).toEqual({ ...plain, at: null });
    expect(typeof prepared!.at).toBe(typeof plain!.at);
    expect(Number.isNaN(new Date(prepared!.at as string).getTime())).toBe(false);
    expect(prepared!.j).toEqual({ a: 3 });
  });

  it('refuses a count of values that does not match the placeholders, and a name that is no statement name', async () => {
    const em = (await getEm()).fork();
    await expect(executePrepared(em, 'tw_probe_count', 'select ?::int', [])).rejects.toThrow('1 placeholders for 0 values');
    await expect(executePrepared(em, 'tw probe; drop', 'select 1', [])).rejects.toThrow('is not a statement name');
  });

  it('keeps answering when a migration adds a column to a table it reads with *', async () => {
    const em = (await getEm()).fork();
    await em.getConnection().execute('create table tw_prepared_probe (a int)');
    await em.getConnection().execute('insert into tw_prepared_probe values (1)');
    // Prepared on every connection of the pool (each keeps its own plan).
    const read = () => executePrepared<Record<string, unknown>>((em as typeof em).fork(), 'tw_probe_star', 'select * from tw_prepared_probe where a = ?', [1]);
    expect((await Promise.all(Array.from({ length: 12 }, read))).map((rows) => rows[0])).toEqual(Array.from({ length: 12 }, () => ({ a: 1 })));
    await em.getConnection().execute('alter table tw_prepared_probe add column b text default \'kept\'');
    expect((await Promise.all(Array.from({ length: 12 }, read))).map((rows) => rows[0])).toEqual(Array.from({ length: 12 }, () => ({ a: 1, b: 'kept' })));
  });
});
