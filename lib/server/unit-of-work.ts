import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from './db';
import { kickOutbox } from './mail/outbox';
import { getOrgContextOrThrow, requirePermission, type CurrentUser, type OrgContext } from './org-context';
import type { Permission } from './permissions';
import { recomputeRenewals } from './services/planner/recompute-renewals';
import { OrganisationSchema, type Membership } from '@/entities';

/**
 * What a change asks to happen because of it. Services record effects; the unit of work applies them:
 * renewal proposals and outlooks for the assets touched are recomputed inside the same transaction
 * (so they commit with the change or not at all), mail is kicked and paths revalidated after the commit
 * (so nobody is told about a change that was rolled back).
 */
export class Effects {
  readonly assetIds = new Set<string>();
  allAssets = false;
  mail = false;
  readonly paths = new Set<string>();
  private readonly committed: (() => unknown)[] = [];
  /** The organisation context the recompute runs in; set when the context is built. */
  ctx: OrgContext | null = null;

  /** Something that feeds an asset's forecast or schedule changed (group, docking, survey, renewal). */
  assetChanged(...ids: string[]) {
    for (const id of ids) this.assetIds.add(id);
  }

  /** Something that feeds every asset's schedule changed (the organisation's renewal margin). */
  organisationChanged() {
    this.allAssets = true;
  }

  /** A message was put in the outbox; try to deliver it right after the commit. */
  mailQueued() {
    this.mail = true;
  }

  /** Work that must only happen once the change exists for everyone (a session for a new account). */
  onCommit(step: () => unknown) {
    this.committed.push(step);
  }

  /** A page whose server-rendered data changed. */
  revalidate(path: string) {
    this.paths.add(path);
  }

  /** Inside the transaction, before commit: the scheduler's proposals follow the change. */
  async settle(em: EntityManager) {
    await em.flush();
    if (!this.ctx || (!this.allAssets && !this.assetIds.size)) return;
    await recomputeRenewals(this.ctx, this.allAssets ? undefined : [...this.assetIds]);
    await em.flush();
    const slug = this.ctx.organisation.slug;
    this.revalidate(`/o/${slug}`);
    this.revalidate(`/o/${slug}/dockings`);
    for (const id of this.assetIds) this.revalidate(`/o/${slug}/assets/${id}`);
  }

  /** After the commit. Never throws: the change is committed and the user's message must stay true. */
  async afterCommit() {
    for (const step of this.committed) {
      try {
        await step();
      } catch (error) {
        console.error('[tidewarden] a step after commit failed; the change itself is saved', error instanceof Error ? error.message : error);
      }
    }
    if (this.mail) kickOutbox(getEm);
    if (!this.paths.size) return;
    try {
      const { revalidatePath } = await import('next/cache');
      for (const path of this.paths) revalidatePath(path);
    } catch (error) {
      // Outside a Next request (worker, scripts, tests) there is no page cache to revalidate.
      if (process.env.TIDEWARDEN_DEBUG_EFFECTS) console.warn('[tidewarden] revalidate skipped', error);
    }
  }
}

/** What a service needs to write: a transaction's EntityManager and the effects collector. */
export interface Work {
  em: EntityManager;
  effects: Effects;
}

/**
 * The one unit of work: opens a transaction, runs the work, applies the in-transaction effects, commits,
 * then runs the after-commit effects. A throw anywhere rolls everything back, recompute included.
 */
export async function runUnitOfWork<T>(work: (tx: EntityManager, effects: Effects) => Promise<T>, options: { em?: EntityManager } = {}): Promise<T> {
  const em = options.em ?? (await getEm());
  const effects = new Effects();
  const value = await em.transactional(async (tx) => {
    const result = await work(tx, effects);
    await effects.settle(tx);
    return result;
  });
  await effects.afterCommit();
  return value;
}

export interface OrgAccess {
  user: CurrentUser;
  /** The organisation's slug from the URL; never an id sent by the client. */
  slug: string;
  permission: Permission;
  ip?: string | null;
}

/**
 * The way in for every organisation entry point (route handlers, form actions, JSON actions, tests):
 * membership and permission resolved inside the transaction, then the work, then the effects.
 */
export function runInOrg<T>(access: OrgAccess, work: (ctx: OrgContext) => Promise<T>): Promise<T> {
  return runUnitOfWork(async (tx, effects) => {
    const ctx = await getOrgContextOrThrow(tx, access.user, access.slug, access.ip ?? null, effects);
    requirePermission(ctx, access.permission);
    return work(ctx);
  });
}

/**
 * The way in for an organisation entry point that only reads (the JSON lists): the same membership and
 * permission checks as runInOrg, without a transaction (a read has nothing to commit or roll back, and
 * begin, flush and commit were a third of a list request's cost). A read that records a change is a
 * programming error: it throws before answering, and nothing is written (nothing is ever flushed here). The check
 * sees the entity manager's changes and the effects; a native statement (em.execute, nativeUpdate) would run on its
 * own, so a read-only route must call only services that read.
 */
export async function readInOrg<T>(access: OrgAccess, work: (ctx: OrgContext) => Promise<T>): Promise<T> {
  const em = await getEm();
  const effects = new Effects();
  const ctx = await getOrgContextOrThrow(em, access.user, access.slug, access.ip ?? null, effects, true);
  requirePermission(ctx, access.permission);
  const value = await work(ctx);
  const uow = em.getUnitOfWork();
  uow.computeChangeSets();
  if (uow.getChangeSets().length || uow.getRemoveStack().size || effects.assetIds.size || effects.allAssets || effects.mail || effects.paths.size) {
    throw new Error('A read-only entry point recorded a change; nothing was written. Serve it through runInOrg.');
  }
  return value;
}

const SCHEDULER_USER: CurrentUser = { id: '00000000-0000-0000-0000-000000000000', email: 'scheduler@tidewarden.invalid', name: 'Tidewarden scheduler', emailVerified: true };

/** The scheduler acts inside an organisation as itself: it reads, recomputes and sends; it never edits users' data. */
export function runAsSystem<T>(organisationId: string, work: (ctx: OrgContext) => Promise<T>, options: { em?: EntityManager } = {}): Promise<T> {
  return runUnitOfWork(async (tx, effects) => {
    const organisation = await tx.findOneOrFail(OrganisationSchema, { id: organisationId });
    const ctx: OrgContext = { em: tx, organisation, role: 'owner', membership: { role: 'owner' } as Membership, user: SCHEDULER_USER, ip: null, effects };
    effects.ctx = ctx;
    return work(ctx);
  }, options);
}
