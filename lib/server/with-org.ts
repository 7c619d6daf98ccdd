import { NextResponse, type NextRequest } from 'next/server';
import type { z } from 'zod';
import { AppError, toErrorBody } from './errors';
import { getCurrentSession, toCurrentUser, clientAddress } from './auth/session';
import type { OrgContext } from './org-context';
import type { Permission } from './permissions';
import { readInOrg, runInOrg } from './unit-of-work';
import { claimIdempotencyKey, IDEMPOTENCY_HEADER, idempotencyFingerprint, readIdempotencyKey, storeIdempotentResult, type StoredResult } from './idempotency';

type Params = Record<string, string>;

interface Options<Q extends z.ZodType | undefined> {
  permission: Permission;
  query?: Q;
  /** An entry point that only reads or computes (the JSON lists, the stateless calculation): served through readInOrg (no transaction); a change recorded there throws. */
  readOnly?: boolean;
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
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** What a keyed request was sent with, for its fingerprint: a JSON body as text, any other body by type and length. */
async function requestFingerprint(req: NextRequest): Promise<string> {
  const contentType = req.headers.get('content-type') ?? '';
  const body = /^application\/json\b/i.test(contentType) ? await req.clone().text() : `${contentType}:${req.headers.get('content-length') ?? ''}`;
  return idempotencyFingerprint(`route:${req.method}:${req.nextUrl.pathname}${req.nextUrl.search}`, body);
}

/** A stored first answer, given again to a repeat of the same keyed request. */
function replayResponse(stored: StoredResult): Response {
  if (stored.kind === 'response') return new Response(stored.body, { status: stored.status, headers: stored.contentType ? { 'content-type': stored.contentType } : {} });
  return NextResponse.json(stored.kind === 'value' ? stored.value : null);
}

async function toStoredResult(result: unknown): Promise<StoredResult> {
  if (result instanceof Response) return { kind: 'response', status: result.status, contentType: result.headers.get('content-type'), body: await result.clone().text() };
  return { kind: 'value', value: result ?? null };
}

/**
 * The one wrapper for organisation route handlers: authenticates, then hands the work to runInOrg
 * (membership from the URL, permission, one transaction, effects after commit), validates the query
 * with zod and maps every failure to one JSON error shape. An unsafe request with an Idempotency-Key
 * header is done once per key: a repeat gets the first answer (see lib/server/idempotency.ts).
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
      const key = UNSAFE.has(req.method) ? readIdempotencyKey(req.headers.get(IDEMPOTENCY_HEADER)) : null;
      const claim = key ? { owner: user.id, key, fingerprint: await requestFingerprint(req) } : null;
      // A keyed request stores its answer for repeats, which is a write: it takes the unit of work.
      const readOnly = options.readOnly === true && !claim;
      const result = await (readOnly ? readInOrg : runInOrg)({ user: toCurrentUser(user), slug: params.org ?? '', permission: options.permission, ip: await clientAddress() }, async (ctx) => {
        if (claim) {
          const replay = await claimIdempotencyKey(ctx.em, claim);
          if (replay) return replayResponse(replay);
        }
        const query = options.query ? options.query.parse(Object.fromEntries(req.nextUrl.searchParams)) : undefined;
        const value = await handler({ req, ctx, params, query: query as never });
        if (claim) await storeIdempotentResult(ctx.em, claim, await toStoredResult(value));
        return value;
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
