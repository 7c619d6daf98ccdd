import { CURRENT_USER_SETTING, isOtherMembersCache } from './cache-names';
import { allItems, clearCaptureDb, putSetting } from './capture-db';
import { isWaiting, needsYou } from './capture-state';

/**
 * How many captured items on this phone were never recorded (any member's): signing out would delete them. Null
 * when the phone's storage could not be read: then nobody can say nothing waits, and the member is asked.
 */
export async function unsentOnThisPhone(): Promise<number | null> {
  try {
    return (await allItems()).filter((i) => isWaiting(i) || needsYou(i)).length;
  } catch {
    return null;
  }
}

/**
 * Deletes the cached survey pages and lists of every member but `userId` (all of them when `userId` is null).
 * Run when the member signed in on this phone changes, so one member's copies are never opened by another.
 */
export async function deleteOtherMembersCaches(userId: string | null) {
  if (typeof caches === 'undefined') return;
  const names = await caches.keys().catch(() => [] as string[]);
  await Promise.all(names.filter((name) => isOtherMembersCache(name, userId)).map((name) => caches.delete(name).catch(() => false)));
}

/**
 * Names the member signed in on this phone for the service worker, which serves only that member's cached pages
 * and sends only that member's queue, and deletes every other member's cached pages and lists. With null (the
 * sign-in page: nobody is signed in) the worker serves and sends nothing; the caches stay until a member is
 * named, so a member whose session merely ended keeps their pages.
 */
export async function markSignedIn(userId: string | null) {
  await putSetting(CURRENT_USER_SETTING, userId).catch(() => undefined);
  if (userId) await deleteOtherMembersCaches(userId);
}

/**
 * Forgets what this phone keeps of the organisation's data: the cached survey pages and lists, and the capture
 * queue with its photos and settings. Run at sign-out (after the member agreed to lose anything unsent), so the
 * next person to use the phone reads none of it. The build's static files stay (they hold no one's data).
 */
export async function clearOfflineData() {
  await deleteOtherMembersCaches(null);
  await clearCaptureDb().catch(() => undefined);
}
