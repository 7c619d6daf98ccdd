import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AnodeGroupSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { approveDesign } from '@/lib/server/services/designs/sign-design';
import { fitDesign, proposeDesignPositions } from '@/lib/server/services/designs/fit-design';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';

let organisation: Organisation;
let users: Record<Role, User>;
let checker: User;
let vesselId: string;
const ctx = async (who: Role | User) => ctxFor(await getEm(), organisation, typeof who === 'string' ? users[who] : who);
const refusal = async (p: Promise<unknown>) => (await p.then(() => null, (e) => e)) as { code?: string } | null;

beforeAll(async () => {
  ({ organisation, users, checker, vesselId } = await makeDesignOrg({ organisationName: 'Fit Positions Shipping', checkerName: 'Second Engineer', vesselName: 'Position Test Ferry' }));
});
afterAll(async () => (await getOrm()).close(true));

describe('fitting a design at proposed or edited positions', () => {
  it('proposes a position for each zone with anodes, and fits the edited ones with the rest as proposed', async () => {
    const design = await runAs(ctx('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    expect(await proposeDesignPositions(await ctx('engineer'), design.id)).toEqual([]); // a draft has none
    await runAs(ctx(checker), (c) => approveDesign(c, design.id));
    const proposals = await proposeDesignPositions(await ctx('viewer'), design.id);
    expect(proposals.length).toBeGreaterThan(1);
    const bottom = proposals.find((p) => p.position.place === 'hull-bottom')!;
    expect(bottom.text).toMatch(/^Fr \d+-\d+ P\/S, bottom/);
    const rudderIndex = proposals.findIndex((p) => p.position.place === 'rudder');
    expect(rudderIndex).toBeGreaterThanOrEqual(0);

    // A position that cannot be stored refuses the whole fit: nothing written.
    const bad = { mode: 'installed', fittedOn: '2026-01-10', 'positionZone-0': proposals[rudderIndex]!.zone, 'position-0': 'x'.repeat(2001) };
    expect((await refusal(runAs(ctx('engineer'), (c) => fitDesign(c, design.id, bad))))).not.toBeNull();
    expect(await (await getEm()).fork().count(AnodeGroupSchema, { design: design.id })).toBe(0);

    await runAs(ctx('engineer'), (c) => fitDesign(c, design.id, { mode: 'installed', fittedOn: '2026-01-10', 'positionZone-0': proposals[rudderIndex]!.zone, 'position-0': 'Rudder S only, lower pintle' }));
    const groups = await (await getEm()).fork().find(AnodeGroupSchema, { design: design.id }, { populate: ['zone'] });
    expect(groups).toHaveLength(proposals.length);
    const byZone = new Map(groups.map((g) => [g.zone!.name, g]));
    expect(byZone.get(proposals[rudderIndex]!.zone)!.positions).toBe('Rudder S only, lower pintle');
    expect(byZone.get(proposals[rudderIndex]!.zone)!.position).toMatchObject({ place: 'rudder', side: 'starboard', note: 'only, lower pintle' });
    expect(byZone.get(bottom.zone)!.positions).toBe(bottom.text);
    expect(byZone.get(bottom.zone)!.position).toEqual(bottom.position);
  });
});
