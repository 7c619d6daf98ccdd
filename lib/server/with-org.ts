import { NextResponse, type NextRequest } from 'next/server';
import type { z } from 'zod';
import { AppError, toErrorBody } from './errors';
import { getCurrentSession, toCurrentUser, clientAddress } from './auth/session';
import type { OrgContext } from './org-context';
import type { Permission } from './permissions';
import { runInOrg } from './unit-of-work';

type Params = Record<string, string>;

interface Options<Q extends z.ZodType | undefined> {
  permission: Permission;
  query?: Q;
}

export interface OrgRouteArgs<Q> {
  req: NextRequest;
  ctx: OrgContext;
  params: Params;
  query: Q;
}

/**
 * The one wrapper for organisation route handlers: authenticates, then hands the work to runInOrg
 * (membership from the URL, permission, one transaction, effects after commit), validates the query
 * with zod and maps every failure to one JSON error shape.
 */
export function withOrg<Q extends z.ZodType | undefined = undefined>(
  handler: (args: OrgRouteArgs<Q extends z.ZodType ? z.infer<Q> : undefined>) => Promise<unknown>,
  options: Options<Q>,
) {
  return async (req: NextRequest, route: { params: Promise<Params> }) => {
    try {
      const params = await route.params;
      const { user } = await getCurrentSession();
      if (!user) throw new AppError('unauthenticated', 'Sign in to continue.');
      const result = await runInOrg({ user: toCurrentUser(user), slug: params.org ?? '', permission: options.permission, ip: await clientAddress() }, async (ctx) => {
        const query = options.query ? options.query.parse(Object.fromEntries(req.nextUrl.searchParams)) : undefined;
        return handler({ req, ctx, params, query: query as never });
      });
      return result instanceof Response ? result : NextResponse.json(result);
    } catch (error) {
      const { status, body } = toErrorBody(error);
      return NextResponse.json(body, { status });
    }
  };
}

/** Reads and validates a JSON body; malformed JSON is an input error, not a crash. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  let raw: unknown;
  try {
    raw = await req.json();
  } catch {
    throw new AppError('invalid', 'The request body is not valid JSON.');
  }
  return schema.parse(raw);
}
