// For the HTTP stage of `npm run bench` (scripts/bench-http.mjs): opens a session for the demo owner the way
// a sign-in does (Lucia's createSession through our MikroORM adapter: a real auth_session row, the real
// cookie name), without going through the sign-in form and its rate limit, finds the demo records whose
// pages the bench requests, and gives the calculations POST its body (the 50-surface hull that the
// in-process designAnodeSystem benchmark sizes). Prints one JSON line on stdout.
import demo from './demo-sign-ins.json';
import { getLucia } from '../lib/server/auth/lucia';
import { getOrm } from '../lib/server/db';
import { benchHullDesign } from '../tests/fixtures/bench-data';

async function firstId(sql: string, params: unknown[], what: string): Promise<string> {
  const orm = await getOrm();
  const rows = await orm.em.getConnection().execute<{ id: string }[]>(sql, params);
  if (!rows[0]) throw new Error(`The demo scenario has no ${what}; was the database seeded?`);
  return rows[0].id;
}

async function main() {
  const owner = demo.users.find((u) => u.role === 'owner');
  if (!owner) throw new Error('scripts/demo-sign-ins.json names no owner.');
  const slug = demo.organisation.slug;
  const userId = await firstId('select id from app_user where email = ?', [owner.email], `user ${owner.email}`);
  const organisationId = await firstId('select id from organisation where slug = ?', [slug], `organisation ${slug}`);
  const inOrg = (table: string, what: string, order = 'created_at') =>
    firstId(`select id from "${table}" where organisation_id = ? order by ${order}, id limit 1`, [organisationId], what);
  // The demo vessel with the most fitted groups: its asset page is the fullest one a user opens.
  const assetId = await firstId(
    `select a.id from asset a left join anode_group g on g.asset_id = a.id
      where a.organisation_id = ? and a.kind = 'vessel' group by a.id, a.name order by count(g.id) desc, a.name limit 1`,
    [organisationId],
    'vessel',
  );
  const designId = await inOrg('design', 'design');
  // The docking with the most renewals booked or proposed: its renewals list is the longest.
  const dockingId = await firstId(
    `select d.id from docking d left join renewal r on r.docking_id = d.id
      where d.organisation_id = ? group by d.id, d.planned_start order by count(r.id) desc, d.planned_start limit 1`,
    [organisationId],
    'docking',
  );
  const surveyId = await inOrg('survey', 'survey', 'surveyed_on');

  const lucia = getLucia();
  const session = await lucia.createSession(userId, {});
  const cookie = lucia.createSessionCookie(session.id);
  process.stdout.write(
    `${JSON.stringify({ cookie: `${cookie.name}=${cookie.value}`, owner: owner.email, slug, ids: { assetId, designId, dockingId, surveyId }, calculationBody: benchHullDesign() })}\n`,
  );
  await (await getOrm()).close(true);
}

main().catch((error) => {
  process.stderr.write(`The bench could not open a session: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exit(1);
});
