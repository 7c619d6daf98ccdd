import { afterAll, describe, expect, it } from 'vitest';
import { DesignSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { listDesigns } from '@/lib/server/services/designs/list-designs';
import { readDesignResults } from '@/lib/server/services/designs/read-design-record';
import { ctxFor, runAs } from '../fixtures/factories';
import { makeDesignOrg } from '../fixtures/design-org';

// The designs list reads its few figures out of the stored results in SQL; they must be the figures the
// validated record gives.
afterAll(async () => (await getOrm()).close(true));

describe('the designs list', () => {
  it("shows each revision's figures exactly as its validated stored results give them, and a broken value as absent", async () => {
    const org = await makeDesignOrg({ organisationName: 'List Figures Marine', checkerName: 'List Checker', vesselName: 'List Ferry' });
    const engineer = async () => ctxFor(await getEm(), org.organisation, org.users.engineer);
    const ids: string[] = [];
    for (const title of ['Hull, first look', 'Hull, second look']) ids.push((await runAs(engineer(), (c) => createDesign(c, { assetId: org.vesselId, title }))).id);
    const rows = await listDesigns(await engineer());
    expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
    for (const row of rows) {
      const results = readDesignResults(await (await getEm()).findOneOrFail(DesignSchema, { id: row.id }));
      expect(results).not.toBeNull();
      expect({ anodeCount: row.anodeCount, governing: row.governingCriterion, mass: row.installedNetMassKg, warnings: row.warningCount }).toEqual({
        anodeCount: results!.anodesToFit,
        governing: results!.governingCriterion,
        mass: results!.installedNetMassKg,
        warnings: results!.warnings?.length ?? 0,
      });
      expect(row.anodeCount).toBeGreaterThan(0);
      expect(row.preparedBy).toBe(org.users.engineer.name);
      expect(row.assetName).toBe('List Ferry');
    }
    // A stored value of the wrong type reads as absent in the list (the design's own page refuses the record).
    await (await getEm()).getConnection().execute(`update design set results = jsonb_set(results, '{anodesToFit}', '"many"') where id = ?`, [ids[0]]);
    expect((await listDesigns(await engineer())).find((r) => r.id === ids[0])!.anodeCount).toBeNull();
    // Filtered by asset: the same rows.
    expect((await listDesigns(await engineer(), { assetId: org.vesselId })).length).toBe(2);
  });
});
