import { isRedirectError } from 'next/dist/client/components/redirect-error';
import { getEm } from './db';
import { AppError, toErrorBody } from './errors';
import { getCurrentSession, toCurrentUser, clientAddress } from './auth/session';
import { getOrgContextOrThrow, requirePermission, type OrgContext, type CurrentUser } from './org-context';
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

export const formObject = (formData: FormData) => Object.fromEntries([...formData.entries()].filter(([, v]) => typeof v === 'string'));

async function toState(error: unknown, formData?: FormData): Promise<ActionState> {
  if (isRedirectError(error)) throw error;
  const { body } = toErrorBody(error);
  return { ok: false, message: body.error.message, fieldErrors: body.error.fieldErrors, values: formValues(formData) };
}

/**
 * The one wrapper for organisation server actions (bind the slug from the page's URL as the first argument).
 * Same checks as withOrg: session, membership, permission, a fresh EntityManager, one error shape.
 */
export function orgAction(
  permission: Permission,
  body: (ctx: OrgContext, formData: FormData) => Promise<ActionState | void>,
) {
  return async (slug: string, _previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      const { user } = await getCurrentSession();
      if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
      const ctx = await getOrgContextOrThrow(await getEm(), toCurrentUser(user), slug, await clientAddress());
      requirePermission(ctx, permission);
      return (await body(ctx, formData)) ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}

/** For actions outside an organisation (sign-in, sign-up, invitations...). */
export function publicAction(body: (args: { em: EntityManager; ip: string; user: CurrentUser | null }, formData: FormData) => Promise<ActionState | void>) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    try {
      const { user } = await getCurrentSession();
      return (await body({ em: await getEm(), ip: await clientAddress(), user: user ? toCurrentUser(user) : null }, formData)) ?? { ok: true };
    } catch (error) {
      return toState(error, formData);
    }
  };
}


export type JsonActionResult<T> = { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/** Server actions called from client code with JSON-like data (not a form): same checks, one result shape. */
export function orgJsonAction<T>(permission: Permission, body: (ctx: OrgContext, input: unknown) => Promise<T>) {
  return async (slug: string, input: unknown): Promise<JsonActionResult<T>> => {
    try {
      const { user } = await getCurrentSession();
      if (!user) throw new AppError('unauthenticated', 'Your session has ended; sign in again.');
      const ctx = await getOrgContextOrThrow(await getEm(), toCurrentUser(user), slug, await clientAddress());
      requirePermission(ctx, permission);
      return { ok: true, data: await body(ctx, input) };
    } catch (error) {
      if (isRedirectError(error)) throw error;
      const { body: errorBody } = toErrorBody(error);
      return { ok: false, message: errorBody.error.message, fieldErrors: errorBody.error.fieldErrors };
    }
  };
}
