// Shared by the billing security tests: an organisation subscribed through the real checkout flow of the
// local payment fake (started by the test runner). Its webhooks never reach the integration database (they
// go to a port where no app listens, or under `npm test` to the end-to-end app and its own database), so
// for these organisations the app is "down" unless a test delivers an event itself.
import { OrganisationSchema, type Organisation, type User } from '@/entities';
import type { Role } from '@/lib/roles';
import type { PlanId } from '@/lib/billing/plans';
import { getEm } from '@/lib/server/db';
import { getEnv } from '@/lib/server/env';
import { confirmCheckout, startCheckout } from '@/lib/server/services/billing/manage-subscription';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';

export const fakeUrl = () => `http://127.0.0.1:${getEnv().STRIPE_API_PORT}`;

export interface TestOrg {
  organisation: Organisation;
  users: Record<Role, User>;
}

export const memberCtx = async (org: TestOrg, role: Role = 'owner') => ctxFor(await getEm(), org.organisation, org.users[role]);
export const reloadOrg = async (org: TestOrg) => (await getEm()).findOneOrFail(OrganisationSchema, { id: org.organisation.id });

/** Pays a checkout page of the fake with a test card; answers the fake's response (303 on success). */
export async function payCheckout(checkoutUrl: string, card = '4242424242424242') {
  const id = new URL(checkoutUrl).pathname.split('/').pop();
  return fetch(`${fakeUrl()}/checkout/${id}/pay`, { method: 'POST', body: new URLSearchParams({ card }), redirect: 'manual' });
}

/** A new organisation with a paid subscription on `plan`, recorded as the browser's return from checkout records it. */
export async function subscribedOrg(name: string, plan: PlanId): Promise<TestOrg> {
  const org = await makeOrgWithRoles(await getEm(), name);
  const url = await runAs(memberCtx(org), (c) => startCheckout(c, { plan }));
  const paid = await payCheckout(url);
  if (paid.status !== 303) throw new Error(`checkout was not paid: ${paid.status}`);
  const sessionId = new URL(paid.headers.get('location')!).searchParams.get('session_id')!;
  await runAs(memberCtx(org), (c) => confirmCheckout(c, sessionId));
  return org;
}

/** The fake's delivery record of every event about a customer (or subscription), oldest first. */
export async function deliveriesOf(objectId: string) {
  const res = await fetch(`${fakeUrl()}/__control/events`);
  const body = (await res.json()) as { webhook_url: string | null; data: { id: string; type: string; data: { object: { id: string; customer?: string } }; delivery: { state: string; attempts: { status?: number; error?: string }[] } }[] };
  return { webhookUrl: body.webhook_url, events: body.data.filter((e) => e.data.object.customer === objectId || e.data.object.id === objectId) };
}
