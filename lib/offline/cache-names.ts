/**
 * The service worker's runtime caches (lib/offline/service-worker.ts). The survey pages and lists are kept per
 * member (`<base>:<userId>`), so one member's copies are never served to another on a shared phone; the page
 * deletes the other members' caches when the member changes, and all of them on sign-out.
 */
export const OFFLINE_CACHE_BASES = { pages: 'tidewarden-survey-pages', lists: 'tidewarden-survey-lists' } as const;

/** The build's scripts and styles a kept page needs, kept across builds (they hold no one's data). */
export const STATIC_CACHE_NAME = 'tidewarden-static';

export const userCacheName = (base: string, userId: string) => `${base}:${userId}`;

/** Whether a cache holds some member's survey pages or lists (the old unsuffixed names included). */
export const isMemberCache = (name: string) => Object.values(OFFLINE_CACHE_BASES).some((base) => name === base || name.startsWith(`${base}:`));

/** Whether a member cache belongs to someone other than `userId` (every member cache when `userId` is null). */
export const isOtherMembersCache = (name: string, userId: string | null) =>
  isMemberCache(name) && (userId === null || !Object.values(OFFLINE_CACHE_BASES).some((base) => name === userCacheName(base, userId)));

/** The capture database's setting naming the member signed in on this phone (whose queue is sent). */
export const CURRENT_USER_SETTING = 'current-user';
