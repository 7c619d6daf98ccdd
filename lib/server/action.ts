import { isRedirectError } from 'next/dist/client/components/redirect-error';
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

/**
 * Runs an action's body in the organisation's unit of work. A redirect thrown by the body (Next's way
 * of navigating after an action) means success: it is held until the transaction has committed.
 */
async function runOrgActionBody<T>(slug: string, permission: Permission, body: (ctx: OrgContext) => Promise<T>): Promise<T | undefined> {
  const { user } = await getCurrentSession();
  if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
  let redirectAfterCommit: unknown = null;
  const value = await runInOrg({ user: toCurrentUser(user), slug, permission, ip: await clientAddress() }, async (ctx) => {
    try {
      return await body(ctx);
    } catch (error) {
      if (!isRedirectError(error)) throw error;
      redirectAfterCommit = error;
      return undefined;
    }
  });
  if (redirectAfterCommit) throw redirectAfterCommit;
  return value;
}

/**
 * The one wrapper for organisation server actions (bind the slug from the page's URL as the first argument).
 * Same way in as withOrg: session, membership, permission, one transaction, effects after commit, one error shape.
 */
export function orgAction(permission: Permission, body: (ctx: OrgContext, formData: FormData) => Promise<ActionState | void>) {
  return async (slug: string, _previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      return (await runOrgActionBody(slug, permission, (ctx) => body(ctx, formData))) ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}

/** For actions outside an organisation (sign-in, sign-up, invitations...): one transaction as well. */
export function publicAction(body: (args: { em: EntityManager; effects: Effects; ip: string; user: CurrentUser | null }, formData: FormData) => Promise<ActionState | void>) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      const { user } = await getCurrentSession();
      const ip = await clientAddress();
      let redirectAfterCommit: unknown = null;
      const state = await runUnitOfWork(async (em, effects) => {
        try {
          return await body({ em, effects, ip, user: user ? toCurrentUser(user) : null }, formData);
        } catch (error) {
          if (!isRedirectError(error)) throw error;
          redirectAfterCommit = error;
          return undefined;
        }
      });
      if (redirectAfterCommit) throw redirectAfterCommit;
      return state ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}

export type JsonActionResult<T> = { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/** Server actions called from client code with JSON-like data (not a form): same way in, one result shape. */
export function orgJsonAction<T>(permission: Permission, body: (ctx: OrgContext, input: unknown) => Promise<T>) {
  return async (slug: string, input: unknown): Promise<JsonActionResult<T>> => {
    try {
      return { ok: true, data: (await runOrgActionBody(slug, permission, (ctx) => body(ctx, input))) as T };
    } catch (error) {
      if (isRedirectError(error)) throw error;
      const { body: errorBody } = toErrorBody(error);
      return { ok: false, message: errorBody.error.message, fieldErrors: errorBody.error.fieldErrors };
    }
  };
}
