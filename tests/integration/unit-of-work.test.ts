import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { MembershipSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { getLucia } from '@/lib/server/auth/lucia';
import { toErrorBody } from '@/lib/server/errors';
import { outboxSettled } from '@/lib/server/mail/outbox';
import { Effects, type Work } from '@/lib/server/unit-of-work';
import type { OrgContext } from '@/lib/server/org-context';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { setAssetArchived, updateAsset } from '@/lib/server/services/assets/update-asset';
import { archiveZone, createZone, updateZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup, removeAnodeGroup, updateAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { captureReading } from '@/lib/server/services/surveys/capture-reading';
import { importSurveyCsv } from '@/lib/server/services/surveys/import-survey-csv';
import { requestAttachmentUpload } from '@/lib/server/services/surveys/request-attachment-upload';
import { completeAttachmentUpload } from '@/lib/server/services/surveys/complete-attachment-upload';
import { putToLink, requestUpload } from '../fixtures/direct-upload';
import { addSurveyAttachment, deleteSurveyAttachment, restoreSurveyAttachment, updateSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { deleteReading, restoreReading, updateReading } from '@/lib/server/services/surveys/correct-readings';
import { deleteSurvey, restoreSurvey, undoDeleteSurvey, updateSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { createDocking, updateDocking } from '@/lib/server/services/planner/dockings';
import { addRenewal, cancelRenewal, confirmRenewal, markRenewalFitted, markRenewalOrdered, updateRenewal } from '@/lib/server/services/planner/renewals';
import { anodeListPdf } from '@/lib/server/services/planner/anode-list';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { startDesign } from '@/lib/server/services/designs/start-design';
import { saveDesign } from '@/lib/server/services/designs/save-design';
import { approveDesign, checkDesign } from '@/lib/server/services/designs/sign-design';
import { fitDesign } from '@/lib/server/services/designs/fit-design';
import { newRevision } from '@/lib/server/services/designs/new-revision';
import { renderCalculationNote } from '@/lib/server/services/designs/calculation-note';
import { createAnodeModel, setAnodeModelArchived } from '@/lib/server/services/catalogue/manage-anode-models';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { changeMemberRole } from '@/lib/server/services/team/change-member-role';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { restoreMember } from '@/lib/server/services/team/restore-member';
import { restoreZone } from '@/lib/server/services/register/restore-zone';
import { restoreAnodeGroup } from '@/lib/server/services/register/restore-anode-group';
import { revokeInvitation } from '@/lib/server/services/team/revoke-invitation';
import { acceptInvitationAsNewUser, acceptInvitationAsUser } from '@/lib/server/services/team/accept-invitation';
import { updateOrganisationSettings } from '@/lib/server/services/accounts/update-organisation-settings';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { signIn } from '@/lib/server/services/accounts/sign-in';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { changePassword } from '@/lib/server/services/accounts/change-password';
import { createOrganisation } from '@/lib/server/services/accounts/create-organisation';
import { resendVerification } from '@/lib/server/services/accounts/resend-verification';
import { ctxFor, inUnitOfWork, makeOrgWithRoles, makeUser, runAs, TEST_PASSWORD, uniqueEmail } from '../fixtures/factories';
import { cookieJar, nextHeadersMock } from '../fixtures/next-headers-mock';

vi.mock('next/headers', () => nextHeadersMock);

// Every write service is run twice from the same state: once with its unit of work made to fail at the
// last step (after the service and the renewal recompute have written everything, just before commit),
// once normally. The failed run must leave every table exactly as it was, and the normal run must change
// something, so the comparison can fail.

const NOTHING_CHANGED = /nothing was changed/;

let home: { organisation: Organisation; users: Record<Role, User> };
const member = (role: Role) => ctxFor(getEmSync(), home.organisation, home.users[role]);
let emForCtx: Awaited<ReturnType<typeof getEm>>;
const getEmSync = () => emForCtx;

/**
 * A fingerprint of every application table: rows and their content. The rate limits' counters are left out:
 * they are counted outside the unit of work on purpose, so a refused request still counts.
 */
async function databaseFingerprint() {
  await outboxSettled(); // a delivery kicked by an earlier commit must not move the fingerprint
  const em = await getEm();
  const tables: { table_name: string }[] = await em.execute(
    `select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' and table_name not like 'mikro_orm%' and table_name <> 'rate_limit' order by table_name`,
  );
  const parts: string[] = [];
  for (const { table_name } of tables) {
    const [row]: { n: string; h: string | null }[] = await em.execute(`select count(*)::text as n, md5(string_agg(t::text, '|' order by t::text)) as h from "${table_name}" t`);
    parts.push(`${table_name}:${row.n}:${row.h ?? ''}`);
  }
  return parts;
}

/** Makes the next unit of work throw after everything was written and recomputed, just before commit. */
function failLastStep() {
  const original = Effects.prototype.settle;
  return vi.spyOn(Effects.prototype, 'settle').mockImplementationOnce(async function (this: Effects, em) {
    await original.call(this, em);
    throw new Error('injected failure after the last write');
  });
}

afterEach(() => vi.restoreAllMocks());
// The injected failures are unexpected errors by design; their log lines are not news.
beforeEach(() => {
  vi.spyOn(console, 'error').mockImplementation(() => undefined);
});

async function expectAllOrNothing(run: () => Promise<unknown>) {
  const before = await databaseFingerprint();
  failLastStep();
  const error = await run().then(
    () => null,
    (e) => e,
  );
  expect(error, 'the injected failure reaches the caller').toBeInstanceOf(Error);
  // What the entry points show the user for it.
  expect(toErrorBody(error).body.error.message).toMatch(NOTHING_CHANGED);
  expect(await databaseFingerprint()).toEqual(before);
  // The same call without the failure does write: the comparison above can fail.
  await run();
  expect(await databaseFingerprint()).not.toEqual(before);
}

let vesselId: string;
let zoneId: string;
let groupId: string;
let surveyId: string;
let dockingId: string;
let designId: string;

beforeAll(async () => {
  emForCtx = await getEm();
  home = await makeOrgWithRoles(await getEm(), 'All Or Nothing Marine');
  const engineer = () => member('engineer');
  const vessel = await runAs(engineer(), (c) => createAsset(c, { kind: 'vessel', name: 'Rollback Tug', hullMaterial: 'steel', lengthBppM: 30, beamM: 9, draughtM: 3.5, blockCoefficient: 0.6 }));
  vesselId = vessel.id;
  zoneId = (await runAs(engineer(), (c) => createZone(c, vesselId, { name: 'Hull bottom', kind: 'hull-bottom', areaM2: 300, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }))).id;
  // Installed 900 days ago: due for renewal within the planning window, so the scheduler proposes it.
  const installedOn = new Date(Date.now() - 900 * 86_400_000).toISOString().slice(0, 10);
  groupId = (await runAs(engineer(), (c) => createAnodeGroup(c, vesselId, { zoneId, label: 'Bottom', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 10, installedOn, meanCurrentA: 2.5 }))).id;
  surveyId = (await runAs(member('inspector'), (c) => createSurvey(c, { assetId: vesselId, surveyedOn: '2026-01-10', method: 'diver', defaultElectrode: 'ag-agcl-seawater' }))).id;
  dockingId = (await runAs(member('planner'), (c) => createDocking(c, { assetId: vesselId, kind: 'intermediate', plannedStart: new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10), yard: 'Test Yard' }))).id;
  designId = (await runAs(engineer(), (c) => createDesign(c, { assetId: vesselId }))).id;
});
afterAll(async () => (await getOrm()).close(true));

const as = (role: Role) => <T,>(work: (c: OrgContext) => Promise<T>) => () => runAs(member(role), work);
const proposedRenewalId = async () => {
  const rows: { id: string }[] = await (await getEm()).execute(`select id from renewal where group_id = ? and status = 'proposed'`, [groupId]);
  return rows[0]?.id;
};

describe('every write commits as one transaction or not at all', () => {
  it('assets: create, update, archive', async () => {
    await expectAllOrNothing(as('engineer')((c) => createAsset(c, { kind: 'structure', name: `Pontoon ${uniqueEmail('p')}`, structureType: 'pontoon', waterType: 'seawater' })));
    await expectAllOrNothing(as('engineer')((c) => updateAsset(c, vesselId, { kind: 'vessel', name: `Rollback Tug ${uniqueEmail('n')}`, hullMaterial: 'steel' })));
    const spare = await runAs(member('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Spare Launch', hullMaterial: 'steel' }));
    await expectAllOrNothing(as('engineer')((c) => setAssetArchived(c, spare.id, true)));
  });

  it('zones: create, update, archive', async () => {
    await expectAllOrNothing(as('engineer')((c) => createZone(c, vesselId, { name: `Sides ${uniqueEmail('z')}`, kind: 'boot-top-sides', areaM2: 120, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' })));
    await expectAllOrNothing(as('engineer')((c) => updateZone(c, zoneId, { name: 'Hull bottom', kind: 'hull-bottom', areaM2: 310 + Math.random(), coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' })));
    const spare = await runAs(member('engineer'), (c) => createZone(c, vesselId, { name: 'Spare zone', kind: 'boot-top-sides', areaM2: 10, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }));
    await expectAllOrNothing(as('engineer')((c) => archiveZone(c, spare.id)));
    await expectAllOrNothing(as('engineer')((c) => restoreZone(c, spare.id)));
  });

  it('anode groups: fit, edit, remove (the renewal recompute rolls back with them)', async () => {
    await expectAllOrNothing(as('engineer')((c) => createAnodeGroup(c, vesselId, { zoneId, label: `Sides ${uniqueEmail('g')}`, anodeModelKey: 'builtin:TW-ZW-3015', quantity: 4, installedOn: '2025-01-01', meanCurrentA: 1 })));
    await expectAllOrNothing(as('engineer')((c) => updateAnodeGroup(c, groupId, { zoneId, label: 'Bottom', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 10, installedOn: new Date(Date.now() - 900 * 86_400_000).toISOString().slice(0, 10), meanCurrentA: 2.5 + Math.random() })));
    const spare = await runAs(member('engineer'), (c) => createAnodeGroup(c, vesselId, { label: 'Spare group', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 2, installedOn: '2025-01-01', meanCurrentA: 0.5 }));
    await expectAllOrNothing(as('engineer')((c) => removeAnodeGroup(c, spare.id, { removedOn: '2026-01-01', reason: 'Lost' })));
    await expectAllOrNothing(as('engineer')((c) => restoreAnodeGroup(c, spare.id)));
  });

  it('surveys: record, add a reading (with its alert mail), import a CSV, attach a photo', async () => {
    await expectAllOrNothing(as('inspector')((c) => createSurvey(c, { assetId: vesselId, surveyedOn: '2026-02-01', method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater', readings: [{ location: 'Fr 10 P', potentialV: -0.95, electrode: 'ag-agcl-seawater' }] })));
    // Under-protected: the outbox message must roll back with the reading.
    await expectAllOrNothing(as('inspector')((c) => addReading(c, surveyId, { location: `Fr 12 S ${uniqueEmail('r')}`, potentialV: '-0.62', electrode: 'ag-agcl-seawater' })));
    // A reading captured on a phone, under-protected: its device id, its alert mail and the recompute roll back together.
    await expectAllOrNothing(as('inspector')((c) => captureReading(c, surveyId, { deviceId: randomUUID(), kind: 'reading', location: `Fr 14 S ${uniqueEmail('d')}`, potentialV: -0.6, anodeGroupId: groupId })));
    const csv = new TextEncoder().encode(`location,potential_v,electrode,anode_group,remaining\nFr 20 P,-0.93,ag-agcl-seawater,Bottom,70%\n`);
    await expectAllOrNothing(as('inspector')((c) => importSurveyCsv(c, surveyId, csv)));
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
    await expectAllOrNothing(as('inspector')((c) => addSurveyAttachment(c, surveyId, { name: 'bottom.png', bytes: png }, 'Bottom anode')));
  });

  it('survey corrections: edit and delete a reading (with its correction mail) and undo the delete, edit and delete a survey, restore it, edit and delete an attachment', async () => {
    const survey = await runAs(member('inspector'), (c) => createSurvey(c, { assetId: vesselId, surveyedOn: '2026-03-01', method: 'diver', defaultElectrode: 'ag-agcl-seawater' }));
    await runAs(member('inspector'), (c) => addReading(c, survey.id, { location: 'Fr 30 P', potentialV: '-0.62', electrode: 'ag-agcl-seawater' }));
    await runAs(member('inspector'), (c) => addReading(c, survey.id, { location: 'Fr 31 P', potentialV: '-0.64', electrode: 'ag-agcl-seawater' }));
    const ids: { id: string; location: string }[] = await (await getEm()).execute('select id, location from survey_reading where survey_id = ? order by location', [survey.id]);
    // Fr 30 P was named by the under-protection message: its correction queues a mail in the same unit.
    await expectAllOrNothing(as('inspector')((c) => updateReading(c, survey.id, ids[0].id, { location: 'Fr 30 P', potentialV: String(-0.95 - Math.random() / 100), electrode: 'ag-agcl-seawater' })));
    await expectAllOrNothing(as('inspector')((c) => deleteReading(c, survey.id, ids[1].id)));
    // Its undo: the row back from the delete's audit record, and (under-protected) the alert mail, in one unit.
    await expectAllOrNothing(as('inspector')((c) => restoreReading(c, survey.id, ids[1].id)));
    await expectAllOrNothing(as('inspector')((c) => updateSurvey(c, survey.id, { surveyedOn: '2026-03-02', method: 'rov', surveyor: `ROV ${uniqueEmail('s')}`, defaultElectrode: 'cse' })));
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    const attachment = await runAs(member('inspector'), (c) => addSurveyAttachment(c, survey.id, { name: 'fr30.png', bytes: png }, null));
    await expectAllOrNothing(as('inspector')((c) => updateSurveyAttachment(c, survey.id, attachment.id, { caption: `Fr 30 ${uniqueEmail('c')}` })));
    await expectAllOrNothing(as('inspector')((c) => deleteSurveyAttachment(c, survey.id, attachment.id)));
    await expectAllOrNothing(as('inspector')((c) => restoreSurveyAttachment(c, survey.id, attachment.id)));
    // A direct upload: the link (its pending row), then the check in the storage and the attachment row with its audit.
    const deviceId = `uow-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
    const uploadInput = { deviceId, filename: 'fr31.png', contentType: 'image/png', sizeBytes: png.length };
    await expectAllOrNothing(as('inspector')((c) => requestAttachmentUpload(c, survey.id, uploadInput)));
    expect((await putToLink(await requestUpload(await member('inspector'), survey.id, uploadInput), png)).status).toBe(200);
    await expectAllOrNothing(as('inspector')((c) => completeAttachmentUpload(c, survey.id, deviceId)));
    await expectAllOrNothing(as('inspector')((c) => deleteSurvey(c, survey.id)));
    await expectAllOrNothing(as('engineer')((c) => restoreSurvey(c, survey.id)));
    // The inspector's Undo right after a delete (survey:write, within minutes) is one unit of work too.
    await runAs(member('inspector'), (c) => deleteSurvey(c, survey.id));
    await expectAllOrNothing(as('inspector')((c) => undoDeleteSurvey(c, survey.id)));
  });

  it('dockings and renewals: plan, move, book, confirm, order, fit, cancel', async () => {
    await expectAllOrNothing(as('planner')((c) => createDocking(c, { assetId: vesselId, kind: 'intermediate', plannedStart: '2029-05-01', yard: 'Later Yard' })));
    await expectAllOrNothing(as('planner')((c) => updateDocking(c, dockingId, { kind: 'intermediate', status: 'planned', plannedStart: new Date(Date.now() + (61 + Math.floor(Math.random() * 20)) * 86_400_000).toISOString().slice(0, 10), yard: 'Test Yard' })));
    const renewalId = await proposedRenewalId();
    expect(renewalId, 'the scheduler proposed the overdue group at the docking').toBeTruthy();
    await expectAllOrNothing(as('planner')((c) => confirmRenewal(c, renewalId!)));
    await expectAllOrNothing(as('planner')((c) => updateRenewal(c, renewalId!, { dockingId, quantity: 9, notes: 'Check the sea chest too' })));
    await expectAllOrNothing(as('planner')((c) => markRenewalOrdered(c, renewalId!)));
    await expectAllOrNothing(as('planner')((c) => markRenewalFitted(c, renewalId!, { fittedOn: new Date().toISOString().slice(0, 10) })));
    // A fresh group to book by hand and then cancel.
    const spare = await runAs(member('engineer'), (c) => createAnodeGroup(c, vesselId, { label: `Rudder ${uniqueEmail('r')}`, anodeModelKey: 'builtin:TW-ZW-3015', quantity: 2, installedOn: '2025-06-01', meanCurrentA: 0.3 }));
    await expectAllOrNothing(as('planner')((c) => addRenewal(c, dockingId, { groupId: spare.id, reason: 'damage', notes: 'Bent by a fender' })));
    const booked: { id: string }[] = await (await getEm()).execute(`select id from renewal where group_id = ? and status = 'confirmed'`, [spare.id]);
    await expectAllOrNothing(as('planner')((c) => cancelRenewal(c, booked[0].id)));
  });

  it('printing is audited in the same unit: the anode list and the calculation note', async () => {
    await expectAllOrNothing(as('planner')((c) => anodeListPdf(c, dockingId)));
    await expectAllOrNothing(as('engineer')((c) => renderCalculationNote(c, designId)));
  });

  it('designs: create (with a new asset), save, check, approve, fit, revise', async () => {
    await expectAllOrNothing(as('engineer')((c) => createDesign(c, { assetId: vesselId })));
    await expectAllOrNothing(as('engineer')((c) => startDesign(c, { assetId: 'new', title: 'Launch design', 'asset.kind': 'vessel', 'asset.name': `New Launch ${uniqueEmail('l')}`, 'asset.hullMaterial': 'steel' })));
    const draft = await runAs(member('engineer'), (c) => createDesign(c, { assetId: vesselId }));
    await expectAllOrNothing(as('engineer')((c) => saveDesign(c, draft.id, { title: `Renamed ${uniqueEmail('t')}`, inputs: draft.inputs })));
    await expectAllOrNothing(as('owner')((c) => checkDesign(c, draft.id)));
    await expectAllOrNothing(as('owner')((c) => approveDesign(c, draft.id)));
    await expectAllOrNothing(as('engineer')((c) => fitDesign(c, draft.id, { mode: 'installed', fittedOn: '2025-06-01' })));
    await expectAllOrNothing(as('engineer')((c) => newRevision(c, draft.id)));
  });

  it('catalogue: add a model, archive it', async () => {
    const model = { designation: `TW-T-${Math.floor(Math.random() * 1e6)}`, alloy: 'zinc', mounting: 'flush-weld', shapeKind: 'short-flush', lengthM: '0.3', widthM: '0.15', thicknessM: '0.03', exposedAreaM2: '0.05', netMassKg: '8', grossMassKg: '9' };
    await expectAllOrNothing(as('engineer')((c) => createAnodeModel(c, model)));
    const created = await runAs(member('engineer'), (c) => createAnodeModel(c, { ...model, designation: `${model.designation}-B` }));
    await expectAllOrNothing(as('engineer')((c) => setAnodeModelArchived(c, created.id, true)));
  });

  it('team and settings: invite (with its mail), change a role, remove, withdraw, settings (with the recompute)', async () => {
    await expectAllOrNothing(as('owner')((c) => inviteMember(c, { email: uniqueEmail('invitee'), role: 'viewer' })));
    const viewerMembership = (await member('viewer')).membership.id;
    await expectAllOrNothing(as('owner')((c) => changeMemberRole(c, { membershipId: viewerMembership, role: 'inspector' })));
    const leaver = await makeUser(await getEm());
    await runAs(member('owner'), async (c) => {
      c.em.create(MembershipSchema, { organisation: c.organisation, user: leaver.id, role: 'viewer' });
    });
    const leaverMembership: { id: string }[] = await (await getEm()).execute(`select id from membership where user_id = ?`, [leaver.id]);
    await expectAllOrNothing(as('owner')((c) => removeMember(c, { membershipId: leaverMembership[0].id })));
    await expectAllOrNothing(as('owner')((c) => restoreMember(c, { membershipId: leaverMembership[0].id })));
    const { invitation } = await runAs(member('owner'), (c) => inviteMember(c, { email: uniqueEmail('withdrawn'), role: 'viewer' }));
    await expectAllOrNothing(as('owner')((c) => revokeInvitation(c, { invitationId: invitation.id })));
    await expectAllOrNothing(as('owner')((c) => updateOrganisationSettings(c, { name: 'All Or Nothing Marine', renewalMarginMonths: 6 + Math.floor(Math.random() * 6), renewalThresholdPercent: 25, fittingRatePerKg: '12', currency: 'EUR' })));
  });
});

describe('outside an organisation: accounts and invitations are all or nothing too', () => {
  const publicWork = <T,>(work: (w: Work) => Promise<T>) => () => inUnitOfWork(work);

  it('sign-up, sign-in, reset request, password change, new organisation, confirmation mail', async () => {
    await expectAllOrNothing(publicWork((w) => signUp({ ...w, input: { name: 'Rollback Person', email: uniqueEmail('signup'), password: 'brass-rudder-stock-7' } })));
    const user = await makeUser(await getEm());
    await expectAllOrNothing(publicWork((w) => signIn({ ...w, input: { email: user.email, password: TEST_PASSWORD }, ip: '198.51.100.40' })));
    // The rolled-back request leaves no token behind, so the second one is not throttled.
    const resetter = await makeUser(await getEm());
    await expectAllOrNothing(publicWork((w) => requestPasswordReset({ ...w, input: { email: resetter.email } })));
    const changer = await makeUser(await getEm());
    await expectAllOrNothing(publicWork((w) => changePassword({ ...w, userId: changer.id, input: { currentPassword: TEST_PASSWORD, password: 'new-keel-plate-42' } })));
    const current = { id: user.id, email: user.email, name: user.name, emailVerified: true };
    await expectAllOrNothing(publicWork((w) => createOrganisation({ ...w, user: current, input: { name: `Rollback Harbour ${uniqueEmail('o')}` } })));
    const unverified = await makeUser(await getEm(), { verified: false });
    await expectAllOrNothing(publicWork((w) => resendVerification({ ...w, userId: unverified.id })));
  });

  it('accepting an invitation, as a new person and as an existing user', async () => {
    const inviteToken = async (email: string) => (await runAs(member('owner'), (c) => inviteMember(c, { email, role: 'viewer' }))).token;
    const newcomerToken = await inviteToken(uniqueEmail('newcomer'));
    await expectAllOrNothing(publicWork((w) => acceptInvitationAsNewUser({ ...w, input: { token: newcomerToken, name: 'New Comer', password: 'jetty-pile-bent-12' } })));
    const existing = await makeUser(await getEm());
    const existingToken = await inviteToken(existing.email);
    const current = { id: existing.id, email: existing.email, name: existing.name, emailVerified: true };
    await expectAllOrNothing(publicWork((w) => acceptInvitationAsUser({ ...w, user: current, input: { token: existingToken } })));
  });
});

describe('through the entry points', () => {
  it('a form action whose last step fails answers that nothing was changed, and nothing was', async () => {
    const lucia = getLucia();
    cookieJar.clear();
    cookieJar.set(lucia.sessionCookieName, (await lucia.createSession(home.users.engineer.id, {})).id);
    const { createAnodeGroupAction } = await import('@/app/o/[org]/assets/actions');
    const form = new FormData();
    for (const [k, v] of Object.entries({ assetId: vesselId, zoneId, label: 'Through the form', anodeModelKey: 'builtin:TW-ZW-3015', quantity: '3', installedOn: '2025-03-01', meanCurrentA: '0.8' })) form.set(k, v);
    const before = await databaseFingerprint();
    failLastStep();
    const state = await createAnodeGroupAction(home.organisation.slug, { ok: false }, form);
    expect(state.ok).toBe(false);
    expect(state.message).toMatch(NOTHING_CHANGED);
    expect(state.values?.label).toBe('Through the form'); // what was typed is kept
    expect(await databaseFingerprint()).toEqual(before);
    const ok = await createAnodeGroupAction(home.organisation.slug, { ok: false }, form);
    expect(ok.ok).toBe(true);
  });

  it('a refused action writes nothing: archiving a zone is one unit with its audit row', async () => {
    const { archiveZoneAction } = await import('@/app/o/[org]/assets/actions');
    const spare = await runAs(member('engineer'), (c) => createZone(c, vesselId, { name: 'Zone via form', kind: 'boot-top-sides', areaM2: 5, coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' }));
    const lucia = getLucia();
    cookieJar.clear();
    cookieJar.set(lucia.sessionCookieName, (await lucia.createSession(home.users.viewer.id, {})).id);
    const form = new FormData();
    form.set('zoneId', spare.id);
    const before = await databaseFingerprint();
    const refused = await archiveZoneAction(home.organisation.slug, { ok: false }, form);
    expect(refused.message).toBe('Your role in this organisation does not allow that.');
    expect(await databaseFingerprint()).toEqual(before);
    // Without the asset id (an old form) the engineer's archive still works: the zone names its asset.
    cookieJar.set(lucia.sessionCookieName, (await lucia.createSession(home.users.engineer.id, {})).id);
    expect((await archiveZoneAction(home.organisation.slug, { ok: false }, form)).ok).toBe(true);
  });
});
