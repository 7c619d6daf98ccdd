import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { getEm } from './db';
import { AppError } from './errors';
import { getCurrentUser } from './auth/session';
import { getOrgContextOrThrow, type OrgContext } from './org-context';
import { Effects } from './unit-of-work';
import { can, type Permission } from './permissions';

/** For server components under /o/[org]: the member's context, or sign-in, or a plain 404. */
export const getPageOrgContext = cache(async (slug: string): Promise<OrgContext> => {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(`/o/${slug}`)}`);
  try {
    // Pages only read: services never flush, and effects recorded here are never applied.
    return await getOrgContextOrThrow(await getEm(), user, slug, null, new Effects(), true);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not-found') notFound();
    throw error;
  }
});

/** Pages a role may not open answer 404 as well, so they look the same as absent ones. */
export async function getPageOrgContextWith(slug: string, permission: Permission) {
  const ctx = await getPageOrgContext(slug);
  if (!can(ctx.role, permission)) notFound();
  return ctx;
}
