import { createHash } from 'node:crypto';
import { redirect } from 'next/navigation';
import { isRedirectError, type RedirectError } from 'next/dist/client/components/redirect-error';
import { getRedirectTypeFromError, getURLFromRedirectError } from 'next/dist/client/components/redirect';
import { claimIdempotencyKey, formFingerprintInput, IDEMPOTENCY_FIELD, idempotencyFingerprint, readIdempotencyKey, storeIdempotentResult, type IdempotencyClaim, type StoredResult } from './idempotency';
import { AppError, toErrorBody } from './errors';
import { getCurrentSession, toCurrentUser, clientAddress } from './auth/session';
import type { OrgContext, CurrentUser } from './org-context';
import { runInOrg, runUnitOfWork, type Effects } from './unit-of-work';
import type { Permission } from './permissions';
import type { EntityManager } from '@mikro-orm/postgresql';

/** What every server action returns: plain data, the typed values kept so the form can show them again. */
export interface ActionState {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  values?: Record<string, string>;
  data?: Record<string, unknown>;
}

export const initialActionState: ActionState = { ok: false };

function formValues(formData: FormData | undefined): Record<string, string> {
  const values: Record<string, string> = {};
  if (!formData) return values;
  for (const [key, value] of formData.entries()) {
    // Never echo secrets back into a page.
    if (typeof value === 'string' && !/password|token/i.test(key)) values[key] = value;
  }
  return values;
}

/** The record id a form carries in a hidden field; a missing one means a stale page. */
export function formId(formData: FormData, name: string): string {
  const value = formData.get(name);
  if (typeof value !== 'string' || !value) throw new AppError('invalid', 'The form is missing an identifier; reload the page.');
  return value;
}

export const formObject = (formData: FormData) => Object.fromEntries([...formData.entries()].filter(([, v]) => typeof v === 'string'));

async function toState(error: unknown, formData?: FormData): Promise<ActionState> {
  if (isRedirectError(error)) throw error;
  const { body } = toErrorBody(error);
  return { ok: false, message: body.error.message, fieldErrors: body.error.fieldErrors, values: formValues(formData) };
}

/** A form's key, taken out of the form so no service ever sees it as a field. */
function takeFormKey(formData: FormData): string | null {
  const key = readIdempotencyKey(formData.get(IDEMPOTENCY_FIELD));
  formData.delete(IDEMPOTENCY_FIELD);
  return key;
}

/** A JSON action's key, taken out of its input object. */
function takeInputKey(input: unknown): { key: string | null; input: unknown } {
  if (!input || typeof input !== 'object' || Array.isArray(input) || !(IDEMPOTENCY_FIELD in input)) return { key: null, input };
  const { [IDEMPOTENCY_FIELD]: raw, ...rest } = input as Record<string, unknown>;
  return { key: readIdempotencyKey(raw), input: rest };
}

// Which action a key was spent on: the body's source is the same for every call of one action and differs between actions.
const actionScope = (body: (...args: never[]) => unknown) => createHash('sha256').update(body.toString()).digest('hex').slice(0, 16);

/**
 * The body of a write, once per idempotency key: claims the key at the start of the transaction (a repeat
 * returns the first result, see lib/server/idempotency.ts), runs the body, holds a redirect until after
 * the commit and stores the result (value or redirect) with the key in the same transaction.
 */
async function onceInTransaction<T>(em: EntityManager, claim: IdempotencyClaim | null, body: () => Promise<T>): Promise<{ value?: T; redirect?: unknown; replay?: StoredResult }> {
  if (claim) {
    const replay = await claimIdempotencyKey(em, claim);
    if (replay) return { replay };
  }
  let value: T | undefined;
  let redirectAfterCommit: unknown = null;
  try {
    value = await body();
  } catch (error) {
    if (!isRedirectError(error)) throw error;
    redirectAfterCommit = error;
  }
  if (claim) {
    const stored: StoredResult = redirectAfterCommit
      ? { kind: 'redirect', url: getURLFromRedirectError(redirectAfterCommit as RedirectError), type: getRedirectTypeFromError(redirectAfterCommit as RedirectError) }
      : { kind: 'value', value: value ?? null };
    await storeIdempotentResult(em, claim, stored);
  }
  return redirectAfterCommit ? { redirect: redirectAfterCommit } : { value };
}

/** After the commit: the held redirect (or the first write's redirect, replayed), else the value. */
function settleOutcome<T>(outcome: { value?: T; redirect?: unknown; replay?: StoredResult }): T | undefined {
  if (outcome.redirect) throw outcome.redirect;
  if (outcome.replay?.kind === 'redirect') redirect(outcome.replay.url, outcome.replay.type);
  if (outcome.replay) return (outcome.replay.kind === 'value' ? outcome.replay.value : undefined) as T | undefined;
  return outcome.value;
}

/**
 * Runs an action's body in the organisation's unit of work. A redirect thrown by the body (Next's way
 * of navigating after an action) means success: it is held until the transaction has committed.
 */
async function runOrgActionBody<T>(slug: string, permission: Permission, once: { key: string | null; scope: string; input: unknown }, body: (ctx: OrgContext) => Promise<T>): Promise<T | undefined> {
  const { user } = await getCurrentSession();
  if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
  const claim = once.key ? { owner: user.id, key: once.key, fingerprint: idempotencyFingerprint(`${once.scope}:${slug}:${permission}`, once.input) } : null;
  const outcome = await runInOrg({ user: toCurrentUser(user), slug, permission, ip: await clientAddress() }, (ctx) => onceInTransaction(ctx.em, claim, () => body(ctx)));
  return settleOutcome(outcome);
}

/**
 * The one wrapper for organisation server actions (bind the slug from the page's URL as the first argument).
 * Same way in as withOrg: session, membership, permission, one transaction, effects after commit, one error shape.
 * A form's hidden idempotencyKey makes a double submit or a retry return the first result.
 */
export function orgAction(permission: Permission, body: (ctx: OrgContext, formData: FormData) => Promise<ActionState | void>) {
  const scope = `action:${actionScope(body)}`;
  return async (slug: string, _previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      const key = takeFormKey(formData);
      return (await runOrgActionBody(slug, permission, { key, scope, input: formFingerprintInput(formData) }, (ctx) => body(ctx, formData))) ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}

/** For actions outside an organisation (sign-in, sign-up, invitations...): one transaction as well. */
export function publicAction(body: (args: { em: EntityManager; effects: Effects; ip: string; user: CurrentUser | null }, formData: FormData) => Promise<ActionState | void>) {
  const scope = `public:${actionScope(body)}`;
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      const key = takeFormKey(formData);
      const { user } = await getCurrentSession();
      const ip = await clientAddress();
      const claim = key ? { owner: user?.id ?? 'anonymous', key, fingerprint: idempotencyFingerprint(scope, formFingerprintInput(formData)) } : null;
      const outcome = await runUnitOfWork((em, effects) => onceInTransaction(em, claim, () => body({ em, effects, ip, user: user ? toCurrentUser(user) : null }, formData)));
      return settleOutcome(outcome) ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}

export type JsonActionResult<T> = { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/**
 * Server actions called from client code with JSON-like data (not a form): same way in, one result shape.
 * An `idempotencyKey` field of the input object makes a repeat return the first result.
 */
export function orgJsonAction<T>(permission: Permission, body: (ctx: OrgContext, input: unknown) => Promise<T>) {
  const scope = `json:${actionScope(body)}`;
  return async (slug: string, rawInput: unknown): Promise<JsonActionResult<T>> => {
    try {
      const { key, input } = takeInputKey(rawInput);
      return { ok: true, data: (await runOrgActionBody(slug, permission, { key, scope, input }, (ctx) => body(ctx, input))) as T };
    } catch (error) {
      if (isRedirectError(error)) throw error;
      const { body: errorBody } = toErrorBody(error);
      return { ok: false, message: errorBody.error.message, fieldErrors: errorBody.error.fieldErrors };
    }
  };
}
