import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AnodeGroupSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { toErrorBody } from '@/lib/server/errors';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { exportAnodeRegisterCsv } from '@/lib/server/services/register/list-anode-groups';
import { getAssetPage } from '@/lib/server/services/assets/get-asset-page';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { approveDesign } from '@/lib/server/services/designs/sign-design';
import { fitDesign, proposeDesignPositions } from '@/lib/server/services/designs/fit-design';
import { Migration20261216000000_position_parser_version } from '@/migrations/Migration20261216000000_position_parser_version';
import { PARSER_VERSION } from '@/lib/drawings/parse-position';
import { EMPTY_POSITION, anodePositionSchema } from '@/lib/schemas/anode-position';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';

let organisation: Organisation;
let users: Record<Role, User>;
let checker: User;
let vesselId: string;
const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const refusal = async (p: Promise<unknown>) => (await p.then(() => null, (e) => e)) as unknown;
const model = 'builtin:TW-AW-4020';
const group = (label: string, positions: string) => ({ label, anodeModelKey: model, quantity: 4, installedOn: '2024-05-01', meanCurrentA: 1, positions });
const fresh = async () => (await getEm()).fork();

beforeAll(async () => {
  // An invented ferry (Lpp 90 m, no frame spacing entered: estimated 0.66 m).
  ({ organisation, users, checker, vesselId } = await makeDesignOrg({ organisationName: 'Position Store Shipping', checkerName: 'Store Checker', vesselName: 'Store Test Ferry' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('a position that cannot be stored', () => {
  it('refuses a group write with 422 on the position field, and writes nothing', async () => {
    const before = await (await fresh()).count(AnodeGroupSchema, { asset: vesselId });
    for (const text of ['Fr 2500 P', '70 m above keel']) {
      const error = await refusal(runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, group('Too far', text))));
      const { status, body } = toErrorBody(error);
      expect(status).toBe(422);
      expect(body.error.fieldErrors?.positions?.[0]).toMatch(/cannot be right: use a (frame number from −50 to 2000|height above the keel from 0 to 60 m)/);
    }
    expect(await (await fresh()).count(AnodeGroupSchema, { asset: vesselId })).toBe(before);
    // An edit too: the stored text and position stay as they were.
    const ok = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, group('Edit me', 'Fr 22-30 P')));
    const edit = await refusal(runAs(ctx('engineer'), (c) => updateAnodeGroup(c, ok.id, group('Edit me', 'Fr 2200-2300 P'))));
    expect(toErrorBody(edit).status).toBe(422);
    const after = await (await fresh()).findOneOrFail(AnodeGroupSchema, { id: ok.id });
    expect([after.positions, after.position?.frameFrom, after.positionParserVersion]).toEqual(['Fr 22-30 P', 22, PARSER_VERSION]);
  });

  it('refuses a fit whole, with the message on that zone’s position field', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    const proposals = await proposeDesignPositions(await ctx('viewer'), design.id);
    const error = await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, design.id, { mode: 'installed', fittedOn: '2026-01-10', 'positionZone-0': proposals[0]!.zone, 'position-0': '400 m below CD' })));
    // On a vessel a level is read too; 400 m is past what the schema allows.
    const { status, body } = toErrorBody(error);
    expect(status).toBe(422);
    expect(Object.keys(body.error.fieldErrors ?? {})).toEqual(['position-0']);
    expect(await (await fresh()).count(AnodeGroupSchema, { design: design.id })).toBe(0);
  });
});

describe('positions from an older parser', () => {
  it('stores the parser version with each position, and reads a row from an older version again from its text', async () => {
    const g = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, group('Old parse', 'Fr 40 P, S')));
    const em = await fresh();
    expect((await em.findOneOrFail(AnodeGroupSchema, { id: g.id })).positionParserVersion).toBe(PARSER_VERSION);
    // What the first parser stored for this text (port, "S" in the note), without a version.
    await em.getConnection().execute(`update anode_group set position = ?::jsonb, position_parser_version = null where id = ?`, [JSON.stringify({ ...EMPTY_POSITION, frameFrom: 40, frameTo: 40, side: 'port', note: 'S' }), g.id]);
    const page = await getAssetPage(await ctx('viewer'), vesselId);
    const row = page.drawing.drawing!.rows.find((r) => r.label === 'Old parse')!;
    // Read again: two sides written, so the side is not known and the note keeps the text.
    expect(row.where).toBe('Frame 40');
    expect(row.note).toBe('Fr 40 P, S');
    // The register CSV says the same as the page.
    const csv = Papa.parse<string[]>((await exportAnodeRegisterCsv(await ctx('viewer'))).trimEnd(), { newline: '\r\n' }).data;
    const header = csv[0]!;
    const line = csv.find((r) => r.includes('Old parse'))!;
    const sideColumn = header.findIndex((h) => /^Side/.test(h));
    expect(sideColumn).toBeGreaterThan(0);
    expect(line[sideColumn]).toBe('');
  });
});

describe('the parser-version migration', () => {
  it('moves values outside the schema into the note, and changes nothing on a second run', async () => {
    const g = await runAs(ctx('engineer'), (c) => createAnodeGroup(c, vesselId, group('Far frame', 'Fr 25 P')));
    const orm = await getOrm();
    const migration = new Migration20261216000000_position_parser_version(orm.em.getDriver(), orm.config);
    await (await getEm())
      .transactional(async (tx) => {
        // What the first migration stored for "Fr 2500 P" before positions were checked.
        await tx.execute(`update anode_group set positions = 'Fr 2500 P', position = ?::jsonb, position_parser_version = null where id = ?`, [JSON.stringify({ ...EMPTY_POSITION, frameFrom: 2500, frameTo: 2500, side: 'port' }), g.id]);
        const run = async () => {
          migration.reset();
          migration.setTransactionContext(tx.getTransactionContext());
          await migration.up();
          for (const sql of migration.getQueries()) await tx.execute(sql as string);
        };
        const read = async () => (await tx.execute(`select position from anode_group where id = ?`, [g.id]))[0]!.position;
        await run();
        const first = await read();
        expect(first).toEqual({ ...EMPTY_POSITION, side: 'port', note: 'Fr 2500 P' });
        expect(anodePositionSchema.safeParse(first).success).toBe(true);
        await run();
        expect(await read()).toEqual(first);
        throw new Error('rollback');
      })
      .catch((e: Error) => {
        if (e.message !== 'rollback') throw e;
      });
  });
});
