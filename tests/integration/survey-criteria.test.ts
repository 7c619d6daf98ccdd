import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AssetSchema, AuditEventSchema, OutboxMessageSchema, SurveyReadingSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { nernstSlopeV } from '@/lib/cp';
import { getEm, getOrm } from '@/lib/server/db';
import { toErrorBody } from '@/lib/server/errors';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { updateAsset } from '@/lib/server/services/assets/update-asset';
import { listFleet } from '@/lib/server/services/assets/list-fleet';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { getSurveyDetails, listSurveys } from '@/lib/server/services/surveys/survey-details';
import { listQuerySchema } from '@/lib/schemas/register';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

let org: { organisation: Organisation; users: Record<Role, User> };
const ctx = async (role: Role) => ctxFor(await getEm(), org.organisation, org.users[role]);
const errorOf = async (p: Promise<unknown>) => (await p.then(() => null, (e) => e)) as { code?: string; fieldErrors?: Record<string, string[]> } | null;

async function surveyOf(assetId: string, surveyedOn = '2025-06-01') {
  return runAs(ctx('inspector'), (c) => createSurvey(c, { assetId, surveyedOn, method: 'diver', defaultElectrode: 'ag-agcl-seawater' }));
}
const read = (surveyId: string, location: string, potentialV: string, electrode = 'ag-agcl-seawater') =>
  runAs(ctx('inspector'), (c) => addReading(c, surveyId, { location, potentialV, electrode }));
const fleetRow = async (assetId: string) => (await listFleet(await ctx('viewer'), listQuerySchema.parse({ pageSize: 200 }))).rows.find((r) => r.id === assetId)!;
const storedOutlook = async (assetId: string) => (await (await getEm()).findOneOrFail(AssetSchema, { id: assetId })).outlook;

beforeAll(async () => {
  org = await makeOrgWithRoles(await getEm(), 'Survey Criteria Harbour');
});
afterAll(async () => (await getOrm()).close(true));

describe('survey classification with the asset’s criteria', () => {
  it('steel without flags keeps the single -0.80 V criterion', async () => {
    // -0.80 V Ag/AgCl/seawater aerobic steel, DNV-RP-B401 / MIL-HDBK-1004/10 via design-basis.md (published)
    const jetty = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Plain Jetty', structureType: 'jetty', waterType: 'seawater' }));
    expect(jetty).toMatchObject({ anaerobic: false, highStrengthSteel: false, waterSalinityPsu: null });
    const survey = await surveyOf(jetty.id);
    expect((await read(survey.id, 'P1', '-0.80')).under).toBe(0);
    expect((await read(survey.id, 'P2', '-0.79')).under).toBe(1);
  });

  it('a reading of -0.85 V on an anaerobic steel asset is under-protected (criterion -0.90 V) and the engineers are told', async () => {
    // -0.90 V where sulphate-reducing bacteria are active, design-basis.md "Environment" (published)
    const pier = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Mud Pier', structureType: 'jetty', waterType: 'seawater', anaerobic: 'on' }));
    expect(pier.anaerobic).toBe(true);
    const survey = await surveyOf(pier.id);
    const { under } = await read(survey.id, 'Bent 3 mudline', '-0.85');
    expect(under).toBe(1);
    const details = await getSurveyDetails(await ctx('viewer'), survey.id);
    expect(details.survey.criteriaFor).toBe('anaerobic steel');
    expect(details.readings[0]).toMatchObject({ potentialAgAgClV: -0.85, potentialStatus: 'under-protected', potentialCriterion: 'less negative than -0.90 V (anaerobic steel)' });
    const mails = await (await getEm()).find(OutboxMessageSchema, { subject: { $like: '%Under-protection found on Mud Pier%' } });
    expect(mails.map((m) => m.toAddress).sort()).toEqual([org.users.engineer.email, org.users.owner.email].sort());
    // The survey list counts it with the anaerobic criterion too.
    const listed = (await listSurveys(await ctx('viewer'), listQuerySchema.parse({ assetId: pier.id }))).rows;
    expect(listed.map((r) => r.underProtected)).toEqual([1]);
    expect(await storedOutlook(pier.id)).toBe('under-protected');
  });

  it('-1.10 V on a high-strength-steel asset is over-protected, and the fleet outlook says so in words of its own', async () => {
    // high-strength steel (yield > 550 MPa) no more negative than about -0.83 V: DNV, FROM MEMORY (design-basis.md)
    const rig = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Jack-up Leg Test', hullMaterial: 'steel', highStrengthSteel: 'on' }));
    const survey = await surveyOf(rig.id);
    expect((await read(survey.id, 'Leg A chord', '-1.10')).under).toBe(0);
    const details = await getSurveyDetails(await ctx('viewer'), survey.id);
    expect(details.readings[0]).toMatchObject({ potentialStatus: 'over-protected', potentialCriterion: 'more negative than -0.83 V (high-strength steel)' });
    expect(details.counts['over-protected']).toBe(1);
    const row = await fleetRow(rig.id);
    expect(row).toMatchObject({ outlook: 'over-protected', outlookWords: 'Over-protected by survey', highStrengthSteel: true });
    expect(await storedOutlook(rig.id)).toBe('over-protected');
    // -0.95 V protects ordinary steel (-0.80 to -1.05 V, published range) but over-protects the high-strength asset.
    const ordinary = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Ordinary Hull Test', hullMaterial: 'steel' }));
    await read((await surveyOf(ordinary.id)).id, 'Bottom', '-0.95');
    // Protected, but no anodes are recorded on it: the outlook says so rather than 'sound'.
    expect((await fleetRow(ordinary.id)).outlook).toBe('no-anodes');
    await read((await surveyOf(rig.id, '2025-07-01')).id, 'Leg B chord', '-0.95');
    expect((await fleetRow(rig.id)).outlook).toBe('over-protected');
  });

  it('under-protection keeps precedence when the same survey also finds over-protection', async () => {
    const barge = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Mixed Barge', hullMaterial: 'steel', highStrengthSteel: 'on' }));
    const survey = await surveyOf(barge.id);
    await read(survey.id, 'Stern', '-1.10');
    expect((await fleetRow(barge.id)).outlook).toBe('over-protected');
    await read(survey.id, 'Bow', '-0.70');
    expect((await fleetRow(barge.id)).outlookWords).toBe('Under-protected by survey');
    expect(await storedOutlook(barge.id)).toBe('under-protected');
  });

  it('a brackish asset (5 PSU): -0.80 V against Ag/AgCl/seawater is corrected by about +0.05 V before classification', async () => {
    // Nernst: 0.05916 V x log10(35 / 5) = +0.0500 V at 25 C, chloride in proportion to salinity (lib/cp/potentials.ts)
    const expectedShift = nernstSlopeV(25) * Math.log10(35 / 5);
    expect(expectedShift).toBeCloseTo(0.05, 3);
    const quay = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'River Quay', structureType: 'wharf', waterType: 'brackish', waterSalinityPsu: '5' }));
    expect(quay.waterSalinityPsu).toBe(5);
    const survey = await surveyOf(quay.id);
    const { under } = await read(survey.id, 'Pile 7', '-0.80');
    expect(under).toBe(1); // -0.75 V on the seawater scale: less negative than -0.80 V
    // A CSE reading does not depend on chloride: -0.85 V CSE is -0.80 V Ag/AgCl/seawater (50 mV, European practice) whatever the salinity.
    expect((await read(survey.id, 'Pile 8', '-0.85', 'cse')).under).toBe(0);
    const readings = await (await getEm()).find(SurveyReadingSchema, { survey: survey.id }, { orderBy: { location: 'asc' } });
    expect(readings[0].potentialV).toBe(-0.8);
    expect(readings[0].potentialAgAgClV! - -0.8).toBeCloseTo(expectedShift, 5);
    expect(readings[1].potentialAgAgClV).toBeCloseTo(-0.8, 6);
    expect((await fleetRow(quay.id)).outlook).toBe('under-protected');
  });

  it('refuses Ag/AgCl/seawater readings where the salinity is unknown or too low to correct, and writes nothing', async () => {
    const canal = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Canal Wall', structureType: 'sheet-pile-wall', waterType: 'brackish' }));
    const survey = await surveyOf(canal.id);
    const error = await errorOf(read(survey.id, 'Panel 1', '-0.85'));
    expect(error?.code).toBe('invalid');
    expect(error?.fieldErrors?.electrode?.[0]).toMatch(/salinity is not recorded/);
    expect(await (await getEm()).count(SurveyReadingSchema, { survey: survey.id })).toBe(0);
    // CSE readings need no chloride correction.
    expect((await read(survey.id, 'Panel 1', '-0.90', 'cse')).under).toBe(0);
    const lake = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Lake Jetty', structureType: 'jetty', waterType: 'fresh', waterSalinityPsu: '0.2' }));
    const s2 = await surveyOf(lake.id);
    expect((await errorOf(read(s2.id, 'Pile 1', '-0.85')))?.fieldErrors?.electrode?.[0]).toMatch(/cannot be corrected/);
  });
});

describe('the asset’s criteria', () => {
  it('are recorded, checked and edited; a change of criteria recomputes the outlook in the same unit of work', async () => {
    // Refusals as the client sees them: 422 with the field named.
    const refusal = async (input: Record<string, unknown>) => toErrorBody(await errorOf(runAs(ctx('engineer'), (c) => createAsset(c, input))));
    const alu = await refusal({ kind: 'vessel', name: 'Alu Ferry', hullMaterial: 'aluminium', highStrengthSteel: 'on' });
    expect(alu.status).toBe(422);
    expect(alu.body.error.fieldErrors?.highStrengthSteel?.[0]).toMatch(/steel hull/);
    const salty = await refusal({ kind: 'vessel', name: 'Salty', hullMaterial: 'steel', waterSalinityPsu: '50' });
    expect(salty.status).toBe(422);
    expect(salty.body.error.fieldErrors?.waterSalinityPsu?.[0]).toMatch(/at most 42 PSU/);

    const dolphin = await runAs(ctx('engineer'), (c) => createAsset(c, { kind: 'structure', name: 'Berth Dolphin', structureType: 'dolphin', waterType: 'seawater' }));
    const survey = await surveyOf(dolphin.id);
    await read(survey.id, 'Pile 1', '-0.86');
    // -0.86 V protects aerobic steel; no anodes are recorded on the dolphin, so the outlook says that rather than 'sound'.
    expect(await storedOutlook(dolphin.id)).toBe('no-anodes');
    await runAs(ctx('engineer'), (c) => updateAsset(c, dolphin.id, { kind: 'structure', name: 'Berth Dolphin', structureType: 'dolphin', waterType: 'seawater', anaerobic: 'on' }));
    expect(await storedOutlook(dolphin.id)).toBe('under-protected'); // but not anaerobic steel (-0.90 V)
    const audited = await (await getEm()).find(AuditEventSchema, { action: 'asset.updated', targetId: dolphin.id });
    expect(audited.map((a) => a.details?.surveyCriteria)).toEqual([{ protectedMetal: 'steel', anaerobic: true, highStrengthSteel: false }]);
    expect((await fleetRow(dolphin.id)).anaerobic).toBe(true);
    await runAs(ctx('engineer'), (c) => updateAsset(c, dolphin.id, { kind: 'structure', name: 'Berth Dolphin', structureType: 'dolphin', waterType: 'seawater' }));
    expect(await storedOutlook(dolphin.id)).toBe('no-anodes');
  });
});
