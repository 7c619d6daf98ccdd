import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { addDays } from 'date-fns';
import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { getURLFromRedirectError } from 'next/dist/client/components/redirect';
import {
  DesignSchema,
  MembershipSchema,
  OrganisationSchema,
  OutboxMessageSchema,
  RenewalSchema,
  SessionSchema,
  UserSchema,
  type Organisation,
  type User,
} from '@/entities';
import { ROLES, type Role } from '@/lib/roles';
import { can, type Permission } from '@/lib/server/permissions';
import type { OrgContext } from '@/lib/server/org-context';
import { getEm, getOrm } from '@/lib/server/db';
import { getLucia } from '@/lib/server/auth/lucia';
import { verifyPassword } from '@/lib/server/auth/password';
import { getStripe } from '@/lib/server/billing/stripe';
import { PLANS } from '@/lib/billing/plans';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { archiveZone, createZone } from '@/lib/server/services/register/zones';
import { createAnodeGroup, removeAnodeGroup } from '@/lib/server/services/register/anode-groups';
import { createDesign } from '@/lib/server/services/designs/create-design';
import { createAnodeModel } from '@/lib/server/services/catalogue/manage-anode-models';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { addReading } from '@/lib/server/services/surveys/record-readings';
import { deleteReading } from '@/lib/server/services/surveys/correct-readings';
import { deleteSurvey } from '@/lib/server/services/surveys/manage-surveys';
import { addSurveyAttachment, deleteSurveyAttachment } from '@/lib/server/services/surveys/attachments';
import { createDocking } from '@/lib/server/services/planner/dockings';
import { fitDesign } from '@/lib/server/services/designs/fit-design';
import { approveDesign } from '@/lib/server/services/designs/sign-design';
import { inviteMember } from '@/lib/server/services/team/invite-member';
import { removeMember } from '@/lib/server/services/team/remove-member';
import { signUp } from '@/lib/server/services/accounts/sign-up';
import { requestPasswordReset } from '@/lib/server/services/accounts/request-password-reset';
import { ctxFor, inUnitOfWork, makeOrgWithRoles, makeUser, runAs, TEST_PASSWORD, uniqueEmail } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { ROOT, databaseFingerprint, filesNamed, importFile, rowCount, sessionCookie, signInAs, tableFingerprint, type WatchedTable } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

// Every server action of the app, called the way the browser calls it: an orgAction with the slug the page
// binds, the previous state and the FormData; an orgJsonAction with the slug and its input; a publicAction with
// the previous state and the FormData. A test below fails when an actions.ts exports an action these tables miss.

const ROLE_REFUSED = 'Your role in this organisation does not allow that.';
const ORG_NOT_FOUND = 'Organisation was not found.';
const STRONG_PASSWORD = 'brass-rudder-stock-7';

const MODULES = {
  'app/o/[org]/assets/actions.ts': () => import('@/app/o/[org]/assets/actions'),
  'app/o/[org]/designs/actions.ts': () => import('@/app/o/[org]/designs/actions'),
  'app/o/[org]/catalogue/actions.ts': () => import('@/app/o/[org]/catalogue/actions'),
  'app/o/[org]/surveys/actions.ts': () => import('@/app/o/[org]/surveys/actions'),
  'app/o/[org]/dockings/actions.ts': () => import('@/app/o/[org]/dockings/actions'),
  'app/o/[org]/team/actions.ts': () => import('@/app/o/[org]/team/actions'),
  'app/o/[org]/billing/actions.ts': () => import('@/app/o/[org]/billing/actions'),
  'app/o/[org]/account/actions.ts': () => import('@/app/o/[org]/account/actions'),
  'app/orgs/actions.ts': () => import('@/app/orgs/actions'),
  'app/(auth)/sign-up/actions.ts': () => import('@/app/(auth)/sign-up/actions'),
  'app/(auth)/sign-in/actions.ts': () => import('@/app/(auth)/sign-in/actions'),
  'app/(auth)/verify/[token]/actions.ts': () => import('@/app/(auth)/verify/[token]/actions'),
  'app/(auth)/reset/actions.ts': () => import('@/app/(auth)/reset/actions'),
  'app/(auth)/invite/[token]/actions.ts': () => import('@/app/(auth)/invite/[token]/actions'),
} as const;
type ModulePath = keyof typeof MODULES;

type Input = Record<string, unknown>;
type Data = any;
interface ActionState {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  values?: Record<string, string>;
  data?: Data;
}
/** What the browser sees: the action's state, or the address a redirect sends it to. */
type Outcome = { state: ActionState; redirect?: undefined } | { redirect: string; state?: undefined };

interface OrgActionCase {
  module: ModulePath;
  name: string;
  /** 'form': (slug, previousState, formData); 'json': (slug, input). */
  kind: 'form' | 'json';
  /** The permission the action's orgAction/orgJsonAction names. */
  permission: Permission;
  /** The table the action writes. */
  table: WatchedTable;
  /** false for actions that only read or hand over to another site. */
  writes?: false;
  /** The organisation it runs in (home unless stated). */
  org?: 'billing';
  /** A valid input for `role` to send; makes fresh records where the action uses them up. */
  input: (role: Role) => Promise<Input>;
  /** How success shows: a redirect to a matching address, an ok state with a matching message, or JSON data. */
  success: { redirect: RegExp } | { message: RegExp } | { data: (data: Data) => void };
}

interface PublicActionCase {
  module: ModulePath;
  name: string;
  scenarios: { title: string; run: () => Promise<void> }[];
}

type OrgFixture = { organisation: Organisation; users: Record<Role, User> };
let home: OrgFixture;
let other: OrgFixture;
let billing: OrgFixture;
const fixtures: Record<string, string> = {};
let serial = 0;
const unique = (label: string) => `${label} ${++serial}`;
const day = (offset: number) => addDays(new Date(), offset).toISOString().slice(0, 10);
const UUID = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';

/** Runs service calls as a member of the home organisation (fixtures are made the way the app makes them). */
const as = async <T,>(role: Role, work: (c: OrgContext) => Promise<T>, org: OrgFixture = home) => runAs(ctxFor(await getEm(), org.organisation, org.users[role]), work);

/** A reading of the fixture survey, for the correction actions to change or delete. */
async function surveyReading() {
  const location = unique('Reading');
  await as('inspector', (c) => addReading(c, fixtures.survey, { location, potentialV: '-0.95', electrode: 'ag-agcl-seawater' }));
  const [row] = await (await getEm()).execute<{ id: string }[]>('select id from survey_reading where survey_id = ? and location = ?', [fixtures.survey, location]);
  return row.id;
}
const spareSurvey = async () => (await as('inspector', (c) => createSurvey(c, { assetId: fixtures.vessel, surveyedOn: day(-8), method: 'diver', defaultElectrode: 'cse' }))).id;
const PNG_BYTES = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
const surveyAttachment = async () => (await as('inspector', (c) => addSurveyAttachment(c, fixtures.survey, { name: `photo-${++serial}.png`, bytes: PNG_BYTES }, null))).id;

async function addMember(role: Role) {
  const em = await getEm();
  const user = await makeUser(em, { name: `Extra ${role}` });
  const membership = em.create(MembershipSchema, { organisation: em.getReference(OrganisationSchema, home.organisation.id), user, role });
  await em.flush();
  return membership.id;
}

async function designBy(role: Role) {
  return (await as(role, (c) => createDesign(c, { assetId: fixtures.designVessel, title: unique('Signable design') }))).id;
}

/** An approved revision (prepared by the engineer, approved by the owner), of the design vessel unless stated. */
async function approvedDesign(assetId = fixtures.designVessel) {
  const design = await as('engineer', (c) => createDesign(c, { assetId, title: unique('Fittable design') }));
  await as('owner', (c) => approveDesign(c, design.id));
  return design.id;
}

/** A group on the renewal vessel; the scheduler proposes its renewal at the vessel's docking. */
async function proposedRenewal() {
  // 10 x TW-AW-4020 at 5 A installed a year ago: renew by (25 % left) in about 597 days, deadline about 414 days
  // ahead, so the docking 200 days ahead is where the renewal is proposed (same hand check as planner.test.ts).
  const group = await as('engineer', (c) => createAnodeGroup(c, fixtures.renewalVessel, { label: unique('Renewal group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 10, installedOn: day(-365), meanCurrentA: 5 }));
  const renewal = await (await getEm()).findOneOrFail(RenewalSchema, { group: group.id, status: 'proposed' });
  return { groupId: group.id, renewalId: renewal.id };
}

async function billingCustomer() {
  const em = await getEm();
  const org = await em.findOneOrFail(OrganisationSchema, { id: billing.organisation.id });
  if (!org.stripeCustomerId) {
    org.stripeCustomerId = (await getStripe().customers.create({ name: org.name, email: billing.users.owner.email, metadata: { organisationId: org.id } })).id;
    await em.flush();
  }
  return org;
}

const vesselParticulars = { kind: 'vessel', hullMaterial: 'steel', lengthBppM: '60', beamM: '12', draughtM: '3.5', blockCoefficient: '0.6' };
const zoneFields = { kind: 'hull-bottom', areaM2: '120', coatingCategory: 'II', waterType: 'seawater', climate: 'temperate', depthBand: '0-30' };
const modelFields = { alloy: 'zinc', mounting: 'flush-bolt', shapeKind: 'short-flush', lengthM: '0.3', widthM: '0.15', thicknessM: '0.03', exposedAreaM2: '0.06', netMassKg: '8', grossMassKg: '8.5' };

const ORG_ACTIONS: OrgActionCase[] = [
  // Assets, zones and anode groups
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'createAssetAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'asset',
    input: async () => ({ ...vesselParticulars, name: unique('Action boat'), hasImpressedCurrent: 'on' }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/assets/${UUID}$`) },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'updateAssetAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'asset',
    input: async () => ({ ...vesselParticulars, assetId: fixtures.vessel, name: 'Action Vessel', vesselType: unique('Tug') }),
    success: { message: /^Particulars saved\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'archiveAssetAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'asset',
    input: async () => ({ assetId: (await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: unique('Archivable boat'), hullMaterial: 'steel' }))).id, archive: '1' }),
    success: { message: /^Archivable boat \d+ is archived; restore it at any time\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'createZoneAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'zone',
    input: async () => ({ ...zoneFields, assetId: fixtures.vessel, name: unique('Bottom zone') }),
    success: { message: /^Zone "Bottom zone \d+" added\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'updateZoneAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'zone',
    input: async () => ({ ...zoneFields, zoneId: fixtures.zone, name: unique('Renamed zone') }),
    success: { message: /^Zone "Renamed zone \d+" saved\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'archiveZoneAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'zone',
    input: async () => ({ zoneId: (await as('engineer', (c) => createZone(c, fixtures.vessel, { ...zoneFields, name: unique('Short-lived zone') }))).id }),
    success: { message: /^Zone "Short-lived zone \d+" archived\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'restoreZoneAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'zone',
    // A zone archived a moment ago, as the Undo button beside the archive's confirmation sends it.
    input: async () => {
      const zone = await as('engineer', (c) => createZone(c, fixtures.vessel, { ...zoneFields, name: unique('Archived zone') }));
      await as('engineer', (c) => archiveZone(c, zone.id));
      return { zoneId: zone.id };
    },
    success: { message: /^Zone "Archived zone \d+" restored\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'createAnodeGroupAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'anode_group',
    input: async () => ({ assetId: fixtures.vessel, label: unique('Hull group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: '4', installedOn: day(-100) }),
    success: { message: /^4 × TW-AW-4020 recorded as "Hull group \d+"\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'updateAnodeGroupAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'anode_group',
    input: async () => ({ groupId: fixtures.group, label: 'Action group', anodeModelKey: 'builtin:TW-AW-4020', quantity: String(6 + ++serial), installedOn: day(-200) }),
    success: { message: /^Group "Action group" saved; the change is in its history\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'removeAnodeGroupAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'anode_group',
    input: async () => ({
      groupId: (await as('engineer', (c) => createAnodeGroup(c, fixtures.vessel, { label: unique('Lost group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: day(-50) }))).id,
      removedOn: day(0),
      reason: 'Lost in a collision',
    }),
    success: { message: /^Group "Lost group \d+" closed as removed on \d{4}-\d{2}-\d{2}\.$/ },
  },
  {
    module: 'app/o/[org]/assets/actions.ts',
    name: 'restoreAnodeGroupAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'anode_group',
    // A group closed a moment ago, as the Undo in the close's notice sends it.
    input: async () => {
      const group = await as('engineer', (c) => createAnodeGroup(c, fixtures.vessel, { label: unique('Reopened group'), anodeModelKey: 'builtin:TW-AW-4020', quantity: 2, installedOn: day(-50) }));
      await as('engineer', (c) => removeAnodeGroup(c, group.id, { removedOn: day(0), reason: 'Closed by mistake' }));
      return { groupId: group.id };
    },
    success: { message: /^Group "Reopened group \d+" is fitted again\.$/ },
  },
  // Designs
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'createDesignAction',
    kind: 'form',
    permission: 'design:write',
    table: 'design',
    input: async () => ({ assetId: fixtures.designVessel, title: unique('Desk design') }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/designs/${UUID}$`) },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'computeDeskAction',
    kind: 'json',
    permission: 'org:read',
    table: 'design',
    writes: false,
    input: async () => ({ designId: fixtures.design, inputs: (await (await getEm()).findOneOrFail(DesignSchema, { id: fixtures.design })).inputs }),
    success: { data: (d) => expect(d.result.anodeCount).toBeGreaterThan(0) },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'saveDesignAction',
    kind: 'json',
    permission: 'design:write',
    table: 'design',
    input: async () => ({ designId: fixtures.design, title: unique('Saved design'), inputs: (await (await getEm()).findOneOrFail(DesignSchema, { id: fixtures.design })).inputs }),
    success: { data: (d) => expect(d).toMatchObject({ status: 'draft', resultError: null }) },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'checkDesignAction',
    kind: 'form',
    permission: 'design:write',
    table: 'design',
    // The preparer never signs: the design is prepared by someone else than the member who checks it.
    input: async (role) => ({ designId: await designBy(role === 'engineer' ? 'owner' : 'engineer') }),
    success: { message: /^Saved: revision \d+ of “.+” signed by you as checker\. It now waits for approval\.$/ },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'approveDesignAction',
    kind: 'form',
    permission: 'design:approve',
    table: 'design',
    input: async (role) => ({ designId: await designBy(role === 'engineer' ? 'owner' : 'engineer') }),
    success: { message: /^Saved: revision \d+ of “.+” approved by you\. It can no longer change\.$/ },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'newRevisionAction',
    kind: 'form',
    permission: 'design:write',
    table: 'design',
    input: async () => ({ designId: fixtures.design }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/designs/${UUID}$`) },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'fitDesignAction',
    kind: 'form',
    permission: 'asset:write',
    table: 'anode_group',
    input: async () => ({ designId: await approvedDesign(), fittedOn: day(-10) }),
    success: { message: /^\d+ × [\w-]+ recorded as fitted on .* in \d+ zones? of Design Vessel\.$/ },
  },
  {
    module: 'app/o/[org]/designs/actions.ts',
    name: 'bookDesignRenewalsAction',
    kind: 'form',
    permission: 'renewal:write',
    table: 'renewal',
    // A fresh vessel fitted to a fresh approved revision, with a planned docking: the revision's groups are booked there.
    input: async () => {
      const vessel = await as('engineer', (c) => createAsset(c, { kind: 'vessel', name: unique('Refit Vessel'), lengthBppM: 40, beamM: 10, draughtM: 3, blockCoefficient: 0.6, hullMaterial: 'steel' }));
      const designId = await approvedDesign(vessel.id);
      await as('engineer', (c) => fitDesign(c, designId, { mode: 'installed', fittedOn: day(-400) }));
      const docking = await as('planner', (c) => createDocking(c, { assetId: vessel.id, kind: 'intermediate', plannedStart: day(150) }));
      return { designId, dockingId: docking.id };
    },
    success: { message: /^\d+ × [\w-]+ booked as renewals in \d+ zones? at the docking from .*\.$/ },
  },
  // Catalogue
  {
    module: 'app/o/[org]/catalogue/actions.ts',
    name: 'createAnodeModelAction',
    kind: 'form',
    permission: 'catalogue:write',
    table: 'anode_model',
    input: async () => ({ ...modelFields, designation: unique('OWN-PLATE') }),
    success: { message: /^OWN-PLATE \d+ added to your catalogue\.$/ },
  },
  {
    module: 'app/o/[org]/catalogue/actions.ts',
    name: 'archiveAnodeModelAction',
    kind: 'form',
    permission: 'catalogue:write',
    table: 'anode_model',
    input: async () => ({ modelId: (await as('engineer', (c) => createAnodeModel(c, { ...modelFields, designation: unique('OLD-PLATE') }))).id, archive: '1' }),
    success: { message: /^OLD-PLATE \d+ archived\.$/ },
  },
  // Surveys
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'createSurveyAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey',
    input: async () => ({ assetId: fixtures.vessel, surveyedOn: day(-3), method: 'diver', surveyor: 'Harbour Divers', defaultElectrode: 'ag-agcl-seawater' }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/surveys/${UUID}$`) },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'addReadingAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_reading',
    input: async () => ({ surveyId: fixtures.survey, location: unique('Frame'), potentialV: '-0.95', electrode: 'ag-agcl-seawater', remainingPercent: '80' }),
    success: { message: /^Reading added at .+: .+ against .+\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'updateReadingAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_reading',
    input: async () => ({ surveyId: fixtures.survey, readingId: await surveyReading(), location: unique('Frame'), potentialV: '-0.97', electrode: 'ag-agcl-seawater', remainingPercent: '75' }),
    success: { message: /^Reading at Frame \d+ corrected\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'deleteReadingAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_reading',
    input: async () => ({ surveyId: fixtures.survey, readingId: await surveyReading() }),
    success: { message: /^Reading at Reading \d+ deleted\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'restoreReadingAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_reading',
    // A reading deleted a moment ago, as the Undo button in the delete's notice sends it.
    input: async () => {
      const readingId = await surveyReading();
      await as('inspector', (c) => deleteReading(c, fixtures.survey, readingId));
      return { surveyId: fixtures.survey, readingId };
    },
    success: { message: /^Reading at Reading \d+ put back: .+\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'updateSurveyAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey',
    input: async () => ({ surveyId: fixtures.survey, surveyedOn: day(-5), method: 'drop-cell', surveyor: unique('Quay Divers'), defaultElectrode: 'ag-agcl-seawater' }),
    success: { message: /^Survey saved\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'deleteSurveyAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey',
    input: async () => ({ surveyId: await spareSurvey() }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/surveys\\?deleted=${UUID}$`) },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'undoDeleteSurveyAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey',
    // A survey deleted a moment ago, as the Undo in the list's notice sends it.
    input: async () => {
      const surveyId = await spareSurvey();
      await as('inspector', (c) => deleteSurvey(c, surveyId));
      return { surveyId };
    },
    success: { message: /^Survey of Action Vessel on \d{1,2} \w{3} \d{4} put back\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'restoreSurveyAction',
    kind: 'form',
    permission: 'survey:restore',
    table: 'survey',
    input: async () => {
      const surveyId = await spareSurvey();
      await as('inspector', (c) => deleteSurvey(c, surveyId));
      return { surveyId };
    },
    success: { message: /^Survey of Action Vessel on \d{1,2} \w{3} \d{4} restored\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'updateAttachmentAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_attachment',
    input: async () => ({ surveyId: fixtures.survey, attachmentId: await surveyAttachment(), caption: unique('Pile') }),
    success: { message: /^Caption of photo-\d+\.png saved\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'deleteAttachmentAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_attachment',
    input: async () => ({ surveyId: fixtures.survey, attachmentId: await surveyAttachment() }),
    success: { message: /^photo-\d+\.png deleted\.$/ },
  },
  {
    module: 'app/o/[org]/surveys/actions.ts',
    name: 'restoreAttachmentAction',
    kind: 'form',
    permission: 'survey:write',
    table: 'survey_attachment',
    // An attachment deleted a moment ago, as the Undo in the delete's notice sends it.
    input: async () => {
      const attachmentId = await surveyAttachment();
      await as('inspector', (c) => deleteSurveyAttachment(c, fixtures.survey, attachmentId));
      return { surveyId: fixtures.survey, attachmentId };
    },
    success: { message: /^photo-\d+\.png put back\.$/ },
  },
  // Dockings and renewals
  {
    module: 'app/o/[org]/dockings/actions.ts',
    name: 'createDockingAction',
    kind: 'form',
    permission: 'docking:write',
    table: 'docking',
    input: async () => ({ assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(400), yard: 'North Yard' }),
    success: { redirect: new RegExp(`^/o/[\\w-]+/dockings/${UUID}$`) },
  },
  {
    module: 'app/o/[org]/dockings/actions.ts',
    name: 'updateDockingAction',
    kind: 'form',
    permission: 'docking:write',
    table: 'docking',
    input: async () => ({ dockingId: fixtures.docking, kind: 'intermediate', status: 'planned', plannedStart: day(300), yard: unique('South Yard') }),
    success: { message: /^Docking saved; renewal proposals were recomputed\.$/ },
  },
  {
    module: 'app/o/[org]/dockings/actions.ts',
    name: 'renewalStepAction',
    kind: 'form',
    permission: 'renewal:write',
    table: 'renewal',
    input: async () => ({ renewalId: (await proposedRenewal()).renewalId, step: 'confirm' }),
    success: { message: /^Saved\.$/ },
  },
  {
    module: 'app/o/[org]/dockings/actions.ts',
    name: 'addRenewalAction',
    kind: 'form',
    permission: 'renewal:write',
    table: 'renewal',
    input: async () => ({ dockingId: fixtures.renewalDocking, groupId: (await proposedRenewal()).groupId, reason: 'damage', quantity: '3', notes: 'Two anodes lost' }),
    success: { message: /^Renewal booked\.$/ },
  },
  // Team and settings
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'inviteMemberAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'invitation',
    input: async () => ({ email: uniqueEmail('invitee'), role: 'planner' }),
    success: { message: /^Invitation to invitee-\w+@test\.example queued for sending\. The link expires in 7 days\.$/ },
  },
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'changeMemberRoleAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'membership',
    input: async () => ({ membershipId: await addMember('viewer'), role: 'inspector' }),
    success: { message: /^Saved: .+ is now inspector\.$/ },
  },
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'removeMemberAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'membership',
    input: async () => ({ membershipId: await addMember('viewer') }),
    success: { message: /^Removed Extra viewer \(user-\w+@test\.example\)\.$/ },
  },
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'restoreMemberAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'membership',
    // A member removed a moment ago, as the Undo button beside the removal's confirmation sends it.
    input: async () => {
      const membershipId = await addMember('viewer');
      await as('owner', (c) => removeMember(c, { membershipId }));
      return { membershipId };
    },
    success: { message: /^Restored: Extra viewer is a member again, as viewer\.$/ },
  },
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'revokeInvitationAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'invitation',
    input: async () => ({ invitationId: (await as('owner', (c) => inviteMember(c, { email: uniqueEmail('revoked'), role: 'viewer' }))).invitation.id }),
    success: { message: /^Invitation withdrawn\.$/ },
  },
  {
    module: 'app/o/[org]/team/actions.ts',
    name: 'updateSettingsAction',
    kind: 'form',
    permission: 'team:manage',
    table: 'organisation',
    // The margin and the threshold stay at 6 months and 25 %, so the scheduler's proposals stay where the renewal fixtures expect them.
    input: async () => ({ name: 'Action Harbour', renewalMarginMonths: '6', renewalThresholdPercent: '25', fittingRatePerKg: String(10 + ++serial), currency: 'EUR' }),
    success: { message: /^Settings saved\.$/ },
  },
  // Billing (an organisation of its own, so a subscription does not change the others' limits)
  {
    module: 'app/o/[org]/billing/actions.ts',
    name: 'checkoutAction',
    kind: 'form',
    permission: 'billing:manage',
    table: 'organisation',
    org: 'billing',
    input: async () => ({ plan: 'armada' }),
    success: { redirect: /^http:\/\/127\.0\.0\.1:\d+\/checkout\/cs_\w+$/ },
  },
  {
    module: 'app/o/[org]/billing/actions.ts',
    name: 'portalAction',
    kind: 'form',
    permission: 'billing:manage',
    table: 'organisation',
    writes: false,
    org: 'billing',
    input: async () => (await billingCustomer(), {}),
    success: { redirect: /^http:\/\/127\.0\.0\.1:\d+\/portal\/\w+$/ },
  },
  {
    module: 'app/o/[org]/billing/actions.ts',
    name: 'cancelAction',
    kind: 'form',
    permission: 'billing:manage',
    table: 'organisation',
    org: 'billing',
    input: async () => {
      const org = await billingCustomer();
      if (!org.stripeSubscriptionId) {
        const stripe = getStripe();
        const [price] = (await stripe.prices.list({ lookup_keys: [PLANS.armada.lookupKey], active: true })).data;
        const subscription = await stripe.subscriptions.create({ customer: org.stripeCustomerId!, items: [{ price: price.id }], metadata: { organisationId: org.id, plan: 'armada' } });
        await (await getEm()).nativeUpdate(OrganisationSchema, { id: org.id }, { stripeSubscriptionId: subscription.id, subscriptionStatus: 'active', plan: 'armada' });
      }
      return { cancel: '1' };
    },
    success: { message: /^The subscription ends at the end of the paid period\. Nothing is deleted\.$/ },
  },
];

const orgOf = (c: OrgActionCase) => (c.org === 'billing' ? billing : home);

function formDataOf(input: Input) {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) form.set(key, String(value));
  return form;
}

/** Calls an action as the browser does and reports what the browser would see. */
async function invoke(call: () => Promise<unknown>): Promise<Outcome> {
  try {
    return { state: (await call()) as ActionState };
  } catch (error) {
    if (isRedirectError(error)) return { redirect: getURLFromRedirectError(error) };
    throw error;
  }
}

async function callOrgAction(c: OrgActionCase, slug: string, input: Input): Promise<Outcome> {
  const action = (await MODULES[c.module]())[c.name as never] as (...args: unknown[]) => Promise<unknown>;
  return invoke(() => (c.kind === 'form' ? action(slug, { ok: false }, formDataOf(input)) : action(slug, input)));
}

/** Runs a request that must be refused and checks that nothing at all was written (the table it names first). */
async function refusedWithoutWrites(table: WatchedTable, request: () => Promise<Outcome>) {
  const before = await databaseFingerprint();
  const outcome = await request();
  expect(outcome.redirect, 'a refused action does not navigate').toBeUndefined();
  const after = await databaseFingerprint();
  expect(after[table], `${table}: row count and rows unchanged`).toBe(before[table]);
  expect(after).toEqual(before);
  return outcome.state!;
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Action Harbour');
  other = await makeOrgWithRoles(await getEm(), 'Other Action Harbour');
  billing = await makeOrgWithRoles(await getEm(), 'Action Billing Marine');
  const particulars = { kind: 'vessel', hullMaterial: 'steel', lengthBppM: 60, beamM: 12, draughtM: 3.5, blockCoefficient: 0.6 } as const;
  fixtures.vessel = (await as('engineer', (c) => createAsset(c, { ...particulars, name: 'Action Vessel' }))).id;
  fixtures.designVessel = (await as('engineer', (c) => createAsset(c, { ...particulars, name: 'Design Vessel' }))).id;
  fixtures.renewalVessel = (await as('engineer', (c) => createAsset(c, { ...particulars, name: 'Renewal Vessel' }))).id;
  fixtures.zone = (await as('engineer', (c) => createZone(c, fixtures.vessel, { ...zoneFields, name: 'Action zone' }))).id;
  fixtures.group = (await as('engineer', (c) => createAnodeGroup(c, fixtures.vessel, { label: 'Action group', anodeModelKey: 'builtin:TW-AW-4020', quantity: 6, installedOn: day(-200) }))).id;
  fixtures.design = (await as('engineer', (c) => createDesign(c, { assetId: fixtures.designVessel, title: 'Action design' }))).id;
  fixtures.survey = (await as('inspector', (c) => createSurvey(c, { assetId: fixtures.vessel, surveyedOn: day(-5), method: 'drop-cell', defaultElectrode: 'ag-agcl-seawater' }))).id;
  fixtures.docking = (await as('planner', (c) => createDocking(c, { assetId: fixtures.vessel, kind: 'intermediate', plannedStart: day(300) }))).id;
  fixtures.renewalDocking = (await as('planner', (c) => createDocking(c, { assetId: fixtures.renewalVessel, kind: 'intermediate', plannedStart: day(200), yard: 'Renewal Yard' }))).id;
});
afterAll(async () => (await getOrm()).close(true));

describe('organisation server actions, as the browser calls them', () => {
  for (const c of ORG_ACTIONS) {
    describe(`${c.name} (${c.permission})`, () => {
      // One valid input for every refusal: refused calls write nothing, so it stays valid for all of them.
      let valid: Input;
      const permitted = ROLES.filter((r) => can(r, c.permission));
      beforeAll(async () => {
        valid = await c.input(permitted[0]);
      });

      it('without a session: asked to sign in, nothing written', async () => {
        await signInAs(null);
        const state = await refusedWithoutWrites(c.table, () => callOrgAction(c, orgOf(c).organisation.slug, valid));
        expect(state.ok).toBe(false);
        expect(state.message).toMatch(/sign in/i);
      });

      for (const role of ROLES) {
        it(`${role} of another organisation: "${ORG_NOT_FOUND}", nothing written`, async () => {
          await signInAs(other.users[role]);
          const state = await refusedWithoutWrites(c.table, () => callOrgAction(c, orgOf(c).organisation.slug, valid));
          expect(state).toMatchObject({ ok: false, message: ORG_NOT_FOUND });
        });
      }

      for (const role of ROLES.filter((r) => !can(r, c.permission))) {
        it(`${role}: refused by role, nothing written`, async () => {
          await signInAs(orgOf(c).users[role]);
          const state = await refusedWithoutWrites(c.table, () => callOrgAction(c, orgOf(c).organisation.slug, valid));
          expect(state).toMatchObject({ ok: false, message: ROLE_REFUSED });
        });
      }

      for (const role of permitted) {
        it(`${role}: succeeds${c.writes === false ? '' : ` and writes ${c.table}`}`, async () => {
          const input = role === permitted[0] ? valid : await c.input(role);
          await signInAs(orgOf(c).users[role]);
          const before = await tableFingerprint(c.table);
          const outcome = await callOrgAction(c, orgOf(c).organisation.slug, input);
          if ('redirect' in c.success) {
            expect(outcome.state, 'a redirect, not a state').toBeUndefined();
            expect(outcome.redirect).toMatch(c.success.redirect);
          } else {
            expect(outcome.state, JSON.stringify(outcome.state)).toMatchObject({ ok: true });
            if ('message' in c.success) expect(outcome.state!.message).toMatch(c.success.message);
            else c.success.data(outcome.state!.data);
          }
          const after = await tableFingerprint(c.table);
          if (c.writes === false) expect(after).toBe(before);
          else expect(after).not.toBe(before);
        });
      }

      if (c.writes !== false) {
        it('sent twice with one idempotency key (a double submit): the repeat gets the first result and writes nothing', async () => {
          const role = permitted[0];
          const input = { ...(await c.input(role)), idempotencyKey: randomUUID() };
          await signInAs(orgOf(c).users[role]);
          const first = await callOrgAction(c, orgOf(c).organisation.slug, input);
          expect(first.redirect ?? first.state?.ok, JSON.stringify(first)).toBeTruthy();
          const before = await databaseFingerprint();
          const repeat = await callOrgAction(c, orgOf(c).organisation.slug, input);
          expect(repeat).toEqual(first);
          expect(await databaseFingerprint()).toEqual(before);
        });
      }
    });
  }
});

describe('renewal steps through the row action', () => {
  it('a planner confirms, edits, orders and records a renewal as fitted; another is cancelled', async () => {
    const { renewalStepAction } = await MODULES['app/o/[org]/dockings/actions.ts']();
    const step = (renewalId: string, name: string, extra: Input = {}) => invoke(() => renewalStepAction(home.organisation.slug, { ok: false }, formDataOf({ renewalId, step: name, ...extra })));
    await signInAs(home.users.planner);
    const { renewalId, groupId } = await proposedRenewal();
    const status = async (id = renewalId) => (await (await getEm()).findOneOrFail(RenewalSchema, { id })).status;
    expect((await step(renewalId, 'confirm')).state).toMatchObject({ ok: true, message: 'Saved.' });
    expect((await step(renewalId, 'update', { quantity: '8', dockingId: fixtures.renewalDocking, notes: 'Two fewer' })).state).toMatchObject({ ok: true });
    expect((await (await getEm()).findOneOrFail(RenewalSchema, { id: renewalId })).quantity).toBe(8);
    expect((await step(renewalId, 'ordered')).state).toMatchObject({ ok: true });
    expect(await status()).toBe('ordered');
    const fitted = await step(renewalId, 'fitted', { fittedOn: day(0) });
    expect(fitted.state?.message).toMatch(/^Recorded as fitted/);
    expect(await status()).toBe('fitted');
    const fresh = await (await getEm()).findOneOrFail(RenewalSchema, { id: renewalId });
    expect(fresh.newGroupId).toBeTruthy();
    expect(fresh.group.id).toBe(groupId);

    const another = await proposedRenewal();
    expect((await step(another.renewalId, 'cancel')).state).toMatchObject({ ok: true });
    expect(await status(another.renewalId)).toBe('cancelled');
  });

  it('an unknown step is refused and changes nothing', async () => {
    const { renewalStepAction } = await MODULES['app/o/[org]/dockings/actions.ts']();
    const { renewalId } = await proposedRenewal();
    await signInAs(home.users.planner);
    const state = await refusedWithoutWrites('renewal', () => invoke(() => renewalStepAction(home.organisation.slug, { ok: false }, formDataOf({ renewalId, step: 'teleport' }))));
    expect(state).toMatchObject({ ok: false, message: 'Unknown step.' });
  });
});

describe('input errors through the form actions', () => {
  it('an invalid form is refused with the fields named, the typed values kept, and nothing written', async () => {
    const { createAssetAction } = await MODULES['app/o/[org]/assets/actions.ts']();
    await signInAs(home.users.engineer);
    const state = await refusedWithoutWrites('asset', () => invoke(() => createAssetAction(home.organisation.slug, { ok: false }, formDataOf({ kind: 'vessel', name: 'Bad Boat', hullMaterial: 'steel', imoNumber: '12' }))));
    expect(state.ok).toBe(false);
    expect(Object.keys(state.fieldErrors ?? {})).toEqual(['imoNumber']);
    expect(state.values).toMatchObject({ name: 'Bad Boat', imoNumber: '12' });
  });

  it('a new design for a new asset creates both, or neither when the particulars are invalid', async () => {
    const { createDesignAction } = await MODULES['app/o/[org]/designs/actions.ts']();
    await signInAs(home.users.engineer);
    const refused = await refusedWithoutWrites('asset', () =>
      invoke(() => createDesignAction(home.organisation.slug, { ok: false }, formDataOf({ assetId: 'new', 'asset.kind': 'vessel', 'asset.name': '', 'asset.hullMaterial': 'steel' }))),
    );
    expect(refused.ok).toBe(false);
    expect(refused.fieldErrors?.name).toBeTruthy();
    const assets = await rowCount('asset');
    const created = await invoke(() => createDesignAction(home.organisation.slug, { ok: false }, formDataOf({ assetId: 'new', 'asset.kind': 'vessel', 'asset.name': 'Desk-born Vessel', 'asset.hullMaterial': 'steel', title: 'First look' })));
    expect(created.redirect).toMatch(new RegExp(`/designs/${UUID}$`));
    expect(await rowCount('asset')).toBe(assets + 1);
  });
});

// ---------------------------------------------------------------------------------------------------------
// Actions outside an organisation: each with what it does for the browser and what it refuses.

async function publicAction(module: ModulePath, name: string, input: Input): Promise<Outcome> {
  const action = (await MODULES[module]())[name as never] as (previous: ActionState, formData: FormData) => Promise<ActionState>;
  return invoke(() => action({ ok: false }, formDataOf(input)));
}

/** The session the cookie jar holds belongs to this user (a real, valid session). */
async function expectSignedInAs(userId: string) {
  const id = sessionCookie();
  expect(id, 'a session cookie is set').toBeTruthy();
  const { user } = await getLucia().validateSession(id!);
  expect(user?.id).toBe(userId);
}

async function tokenFromOutbox(email: string, path: 'verify' | 'reset') {
  const messages = await (await getEm()).find(OutboxMessageSchema, { toAddress: email }, { orderBy: { createdAt: 'desc' } });
  const match = messages.map((m) => m.textBody.match(new RegExp(`/${path}/([\\w-]+)`))).find(Boolean);
  if (!match) throw new Error(`no ${path} link queued for ${email}`);
  return match[1];
}

const userByEmail = async (email: string) => (await getEm()).findOne(UserSchema, { email });

const PUBLIC_ACTIONS: PublicActionCase[] = [
  {
    module: 'app/(auth)/sign-up/actions.ts',
    name: 'signUpAction',
    scenarios: [
      {
        title: 'creates the account and asks the person to open the link mailed to them (no session until then)',
        run: async () => {
          await signInAs(null);
          const email = uniqueEmail('signup');
          const outcome = await publicAction('app/(auth)/sign-up/actions.ts', 'signUpAction', { name: 'Ada Keel', email, password: STRONG_PASSWORD });
          expect(outcome.state).toMatchObject({ ok: true, message: `Check your e-mail: we sent a message to ${email}. Open the link in it to confirm the address and sign in.` });
          const user = await userByEmail(email);
          expect(user?.emailVerifiedAt).toBeNull();
          expect(sessionCookie()).toBeUndefined();
          expect(await tokenFromOutbox(email, 'verify')).toBeTruthy();
        },
      },
      {
        title: 'a weak password is refused with the field named, never echoed back, and nothing is written',
        run: async () => {
          await signInAs(null);
          const email = uniqueEmail('weak');
          const state = await refusedWithoutWrites('app_user', () => publicAction('app/(auth)/sign-up/actions.ts', 'signUpAction', { name: 'Weak', email, password: 'password123' }));
          expect(state.ok).toBe(false);
          expect(state.fieldErrors?.password?.[0]).toMatch(/too common/);
          expect(state.values).toEqual({ name: 'Weak', email });
          expect(sessionCookie()).toBeUndefined();
        },
      },
    ],
  },
  {
    module: 'app/(auth)/sign-in/actions.ts',
    name: 'signInAction',
    scenarios: [
      {
        title: 'signs the browser in and goes back to the page it came from',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          const outcome = await publicAction('app/(auth)/sign-in/actions.ts', 'signInAction', { email: user.email, password: TEST_PASSWORD, next: '/o/somewhere/dockings' });
          expect(outcome.redirect).toBe('/o/somewhere/dockings');
          await expectSignedInAs(user.id);
        },
      },
      {
        title: 'with no page to go back to, a member of exactly one organisation lands in it',
        run: async () => {
          await signInAs(null);
          const { organisation, users } = await makeOrgWithRoles(await getEm(), 'Only Harbour');
          const outcome = await publicAction('app/(auth)/sign-in/actions.ts', 'signInAction', { email: users.inspector.email, password: TEST_PASSWORD, next: '' });
          expect(outcome.redirect).toBe(`/o/${organisation.slug}`);
        },
      },
      {
        title: 'with no page to go back to, a member of no organisation (or of several) lands on the list',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          const outcome = await publicAction('app/(auth)/sign-in/actions.ts', 'signInAction', { email: user.email, password: TEST_PASSWORD, next: '' });
          expect(outcome.redirect).toBe('/orgs');
        },
      },
      {
        title: 'a "next" address on another site is replaced by /orgs',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          const outcome = await publicAction('app/(auth)/sign-in/actions.ts', 'signInAction', { email: user.email, password: TEST_PASSWORD, next: '//evil.example/steal' });
          expect(outcome.redirect).toBe('/orgs');
        },
      },
      {
        title: 'a wrong password is refused; only the failed attempt is recorded and no session is opened',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          const before = await databaseFingerprint();
          const outcome = await publicAction('app/(auth)/sign-in/actions.ts', 'signInAction', { email: user.email, password: 'not-the-password-1' });
          expect(outcome.state).toMatchObject({ ok: false, message: 'The e-mail address or password is not right.' });
          expect(outcome.state?.values).toEqual({ email: user.email });
          // The failure is counted in the rate limits' own table, outside the request's transaction.
          expect(await databaseFingerprint()).toEqual(before);
          expect(sessionCookie()).toBeUndefined();
        },
      },
    ],
  },
  {
    module: 'app/(auth)/verify/[token]/actions.ts',
    name: 'verifyEmailAction',
    scenarios: [
      {
        title: 'confirms the address from the e-mailed link and goes to /orgs',
        run: async () => {
          await signInAs(null);
          const email = uniqueEmail('verify');
          await inUnitOfWork((w) => signUp({ ...w, input: { name: 'Vera', email, password: STRONG_PASSWORD } }));
          const outcome = await publicAction('app/(auth)/verify/[token]/actions.ts', 'verifyEmailAction', { token: await tokenFromOutbox(email, 'verify') });
          expect(outcome.redirect).toBe('/orgs?verified=1');
          expect((await userByEmail(email))?.emailVerifiedAt).toBeInstanceOf(Date);
        },
      },
      {
        title: 'an unknown link is refused and nothing is written',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('user_token', () => publicAction('app/(auth)/verify/[token]/actions.ts', 'verifyEmailAction', { token: 'x'.repeat(43) }));
          expect(state).toMatchObject({ ok: false, message: 'This confirmation link is not valid or was already used. Ask for a new one.' });
        },
      },
    ],
  },
  {
    module: 'app/(auth)/reset/actions.ts',
    name: 'requestResetAction',
    scenarios: [
      {
        title: 'queues a reset link for a known address',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          const outcome = await publicAction('app/(auth)/reset/actions.ts', 'requestResetAction', { email: user.email });
          expect(outcome.state).toMatchObject({ ok: true, message: expect.stringMatching(/^If an account exists for that address/) });
          expect(await tokenFromOutbox(user.email, 'reset')).toBeTruthy();
        },
      },
      {
        title: 'answers the same for an unknown address, makes no link and mails the address that it has no account',
        run: async () => {
          await signInAs(null);
          const email = uniqueEmail('nobody');
          const tokens = await tableFingerprint('user_token');
          const outcome = await publicAction('app/(auth)/reset/actions.ts', 'requestResetAction', { email });
          expect(outcome.state).toMatchObject({ ok: true, message: expect.stringMatching(/^If an account exists for that address/) });
          expect(await tableFingerprint('user_token')).toBe(tokens);
          expect(await (await getEm()).count(OutboxMessageSchema, { toAddress: email, subject: 'Password reset for Tidewarden' })).toBe(1);
        },
      },
    ],
  },
  {
    module: 'app/(auth)/reset/actions.ts',
    name: 'resetPasswordAction',
    scenarios: [
      {
        title: 'sets the new password from the e-mailed link and goes to sign-in',
        run: async () => {
          await signInAs(null);
          const user = await makeUser(await getEm());
          await inUnitOfWork((w) => requestPasswordReset({ ...w, input: { email: user.email } }));
          const outcome = await publicAction('app/(auth)/reset/actions.ts', 'resetPasswordAction', { token: await tokenFromOutbox(user.email, 'reset'), password: 'new-keel-plate-42' });
          expect(outcome.redirect).toBe('/sign-in?reset=1');
          expect(await verifyPassword((await userByEmail(user.email))!.passwordHash, 'new-keel-plate-42')).toBe(true);
        },
      },
      {
        title: 'an unknown link is refused, the password is not echoed, nothing is written',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('app_user', () => publicAction('app/(auth)/reset/actions.ts', 'resetPasswordAction', { token: 'y'.repeat(43), password: 'new-keel-plate-42' }));
          expect(state).toMatchObject({ ok: false, message: 'This password reset link is not valid or was already used. Ask for a new one.' });
          expect(state.values).toEqual({});
        },
      },
    ],
  },
  {
    module: 'app/(auth)/invite/[token]/actions.ts',
    name: 'acceptInvitationAction',
    scenarios: [
      {
        title: 'a signed-in invitee joins with the invited role and goes to the organisation',
        run: async () => {
          const invitee = await makeUser(await getEm());
          const { token } = await as('owner', (c) => inviteMember(c, { email: invitee.email, role: 'inspector' }));
          await signInAs(invitee);
          const outcome = await publicAction('app/(auth)/invite/[token]/actions.ts', 'acceptInvitationAction', { token });
          expect(outcome.redirect).toBe(`/o/${home.organisation.slug}`);
          expect((await (await getEm()).findOneOrFail(MembershipSchema, { user: invitee.id, organisation: home.organisation.id })).role).toBe('inspector');
        },
      },
      {
        title: 'without a session: asked to sign in first, nothing written',
        run: async () => {
          const invitee = await makeUser(await getEm());
          const { token } = await as('owner', (c) => inviteMember(c, { email: invitee.email, role: 'viewer' }));
          await signInAs(null);
          const state = await refusedWithoutWrites('membership', () => publicAction('app/(auth)/invite/[token]/actions.ts', 'acceptInvitationAction', { token }));
          expect(state).toMatchObject({ ok: false, message: 'Sign in first, then accept the invitation.' });
        },
      },
      {
        title: 'someone signed in with another address is refused, nothing written',
        run: async () => {
          const { token } = await as('owner', (c) => inviteMember(c, { email: uniqueEmail('meant-for'), role: 'viewer' }));
          await signInAs(await makeUser(await getEm()));
          const state = await refusedWithoutWrites('membership', () => publicAction('app/(auth)/invite/[token]/actions.ts', 'acceptInvitationAction', { token }));
          expect(state.ok).toBe(false);
          expect(state.message).toMatch(/^This invitation is for meant-for-\w+@test\.example\. Sign in with that address/);
        },
      },
    ],
  },
  {
    module: 'app/(auth)/invite/[token]/actions.ts',
    name: 'acceptInvitationNewUserAction',
    scenarios: [
      {
        title: 'a new person gets a confirmed account and membership, is signed in and goes to the organisation',
        run: async () => {
          const email = uniqueEmail('newcomer');
          const { token } = await as('owner', (c) => inviteMember(c, { email, role: 'engineer' }));
          await signInAs(null);
          const outcome = await publicAction('app/(auth)/invite/[token]/actions.ts', 'acceptInvitationNewUserAction', { token, name: 'New Comer', password: STRONG_PASSWORD });
          expect(outcome.redirect).toBe(`/o/${home.organisation.slug}`);
          const user = await userByEmail(email);
          expect(user?.emailVerifiedAt).toBeInstanceOf(Date);
          expect((await (await getEm()).findOneOrFail(MembershipSchema, { user: user!.id, organisation: home.organisation.id })).role).toBe('engineer');
          await expectSignedInAs(user!.id);
        },
      },
      {
        title: 'an unknown link is refused and no account is created',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('app_user', () => publicAction('app/(auth)/invite/[token]/actions.ts', 'acceptInvitationNewUserAction', { token: 'z'.repeat(43), name: 'Nobody', password: STRONG_PASSWORD }));
          expect(state.ok).toBe(false);
          expect(state.message).toMatch(/not valid/);
          expect(sessionCookie()).toBeUndefined();
        },
      },
    ],
  },
  {
    module: 'app/orgs/actions.ts',
    name: 'createOrganisationAction',
    scenarios: [
      {
        title: 'a confirmed user creates an organisation, becomes its owner and goes to it',
        run: async () => {
          const user = await makeUser(await getEm());
          await signInAs(user);
          const outcome = await publicAction('app/orgs/actions.ts', 'createOrganisationAction', { name: 'Quayside Action Works' });
          expect(outcome.redirect).toMatch(/^\/o\/quayside-action-works(-\d+)?$/);
          const slug = outcome.redirect!.slice('/o/'.length);
          const membership = await (await getEm()).findOneOrFail(MembershipSchema, { user: user.id, organisation: { slug } });
          expect(membership.role).toBe('owner');
        },
      },
      {
        title: 'without a session: asked to sign in, nothing written',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('organisation', () => publicAction('app/orgs/actions.ts', 'createOrganisationAction', { name: 'Ghost Harbour' }));
          expect(state.ok).toBe(false);
          expect(state.message).toMatch(/sign in/i);
        },
      },
      {
        title: 'an unconfirmed user is asked to confirm the address first, nothing written',
        run: async () => {
          await signInAs(await makeUser(await getEm(), { verified: false }));
          const state = await refusedWithoutWrites('organisation', () => publicAction('app/orgs/actions.ts', 'createOrganisationAction', { name: 'Unconfirmed Harbour' }));
          expect(state).toMatchObject({ ok: false, message: 'Confirm your e-mail address before creating an organisation.' });
        },
      },
    ],
  },
  {
    module: 'app/orgs/actions.ts',
    name: 'resendVerificationAction',
    scenarios: [
      {
        title: 'sends a new confirmation link to an unconfirmed user',
        run: async () => {
          const user = await makeUser(await getEm(), { verified: false });
          await signInAs(user);
          const outcome = await publicAction('app/orgs/actions.ts', 'resendVerificationAction', {});
          expect(outcome.state).toMatchObject({ ok: true, message: `A new confirmation link is on its way to ${user.email}.` });
          expect(await tokenFromOutbox(user.email, 'verify')).toBeTruthy();
        },
      },
      {
        title: 'without a session: asked to sign in, nothing written',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('user_token', () => publicAction('app/orgs/actions.ts', 'resendVerificationAction', {}));
          expect(state.ok).toBe(false);
          expect(state.message).toMatch(/sign in/i);
        },
      },
    ],
  },
  {
    module: 'app/orgs/actions.ts',
    name: 'signOutAction',
    scenarios: [
      {
        title: 'ends the session, clears the cookie and goes to sign-in',
        run: async () => {
          const user = await makeUser(await getEm());
          const sessionId = await signInAs(user, { fresh: true });
          const { signOutAction } = await MODULES['app/orgs/actions.ts']();
          const outcome = await invoke(() => signOutAction());
          expect(outcome.redirect).toBe('/sign-in');
          expect(sessionCookie()).toBeUndefined();
          expect(await (await getEm()).count(SessionSchema, { id: sessionId! })).toBe(0);
        },
      },
    ],
  },
  {
    module: 'app/o/[org]/account/actions.ts',
    name: 'changePasswordAction',
    scenarios: [
      {
        title: 'changes the password, ends the other sessions and keeps this browser signed in',
        run: async () => {
          const user = await makeUser(await getEm());
          const oldSession = await signInAs(user, { fresh: true });
          const outcome = await publicAction('app/o/[org]/account/actions.ts', 'changePasswordAction', { currentPassword: TEST_PASSWORD, password: 'fresh-anode-bolt-1' });
          expect(outcome.state).toMatchObject({ ok: true, message: 'Password changed. Every other device has been signed out.' });
          expect(outcome.state?.values).toBeUndefined();
          expect(await (await getEm()).count(SessionSchema, { id: oldSession! })).toBe(0);
          expect(sessionCookie()).not.toBe(oldSession);
          await expectSignedInAs(user.id);
          expect(await verifyPassword((await userByEmail(user.email))!.passwordHash, 'fresh-anode-bolt-1')).toBe(true);
        },
      },
      {
        title: 'a wrong current password is refused with the field named, nothing written, the session kept',
        run: async () => {
          const user = await makeUser(await getEm());
          const session = await signInAs(user, { fresh: true });
          const state = await refusedWithoutWrites('app_user', () => publicAction('app/o/[org]/account/actions.ts', 'changePasswordAction', { currentPassword: 'not-it-at-all', password: 'fresh-anode-bolt-1' }));
          expect(state.ok).toBe(false);
          expect(state.fieldErrors?.currentPassword).toEqual(['The current password is not right.']);
          expect(state.values).toEqual({});
          expect(await (await getEm()).count(SessionSchema, { id: session! })).toBe(1);
        },
      },
      {
        title: 'without a session: asked to sign in, nothing written',
        run: async () => {
          await signInAs(null);
          const state = await refusedWithoutWrites('app_user', () => publicAction('app/o/[org]/account/actions.ts', 'changePasswordAction', { currentPassword: TEST_PASSWORD, password: 'fresh-anode-bolt-1' }));
          expect(state.ok).toBe(false);
          expect(state.message).toMatch(/sign in/i);
        },
      },
    ],
  },
];

describe('public server actions, as the browser calls them', () => {
  for (const c of PUBLIC_ACTIONS) {
    for (const s of c.scenarios) it(`${c.name}: ${s.title}`, s.run);
  }
});

describe('the action tables', () => {
  it('list every action exported by an actions.ts of the app, and nothing else', async () => {
    const found: string[] = [];
    for (const file of await filesNamed('app', 'actions.ts')) {
      const mod = await importFile(file);
      expect(Object.keys(MODULES), `${file} is in MODULES`).toContain(file);
      const listed = await MODULES[file as ModulePath]();
      for (const [name, value] of Object.entries(mod)) {
        expect(typeof value, `${file}: ${name} is an action`).toBe('function');
        expect(listed[name as never], `${file}: ${name} is loaded from its own file`).toBe(value);
        found.push(`${file}: ${name}`);
      }
    }
    const listed = [...ORG_ACTIONS, ...PUBLIC_ACTIONS].map((c) => `${c.module}: ${c.name}`);
    expect(found.filter((f) => !listed.includes(f)), 'actions missing from the tables').toEqual([]);
    expect(listed.filter((l) => !found.includes(l)), 'table entries without an action').toEqual([]);
    expect(new Set(listed).size).toBe(listed.length);
  });

  it("give each organisation action the wrapper and permission it declares (orgAction('permission', ...))", async () => {
    const declared: Record<string, string> = {};
    for (const file of Object.keys(MODULES)) {
      const source = await readFile(path.join(ROOT, file), 'utf8');
      for (const [, name, wrapper, permission] of source.matchAll(/^export const (\w+) = (orgAction|orgJsonAction|publicAction)\((?:'([\w:]+)')?/gm)) {
        declared[`${file}: ${name}`] = wrapper === 'publicAction' ? 'public' : `${wrapper === 'orgAction' ? 'form' : 'json'} ${permission}`;
      }
      for (const [, name] of source.matchAll(/^export async function (\w+)\(\)/gm)) declared[`${file}: ${name}`] = 'public';
    }
    const table = Object.fromEntries([...ORG_ACTIONS.map((c) => [`${c.module}: ${c.name}`, `${c.kind} ${c.permission}`]), ...PUBLIC_ACTIONS.map((c) => [`${c.module}: ${c.name}`, 'public'])]);
    expect(table).toEqual(declared);
  });
});
