import { OFFLINE_CACHE_NAMES } from './cache-names';
import { allItems, clearCaptureDb } from './capture-db';
import { isWaiting, needsYou } from './capture-state';

/** How many captured items on this phone were never recorded (any member's): signing out would delete them. */
export async function unsentOnThisPhone(): Promise<number> {
  try {
    return (await allItems()).filter((i) => isWaiting(i) || needsYou(i)).length;
  } catch {
    return 0;
  }
}

/**
 * Forgets what this phone keeps of the organisation's data: the cached survey pages and lists, and the capture
 * queue with its photos and settings. Run at sign-out (after the member agreed to lose anything unsent), so the
 * next person to use the phone reads none of it. The build's static files stay (they hold no one's data).
 */
export async function clearOfflineData() {
  if (typeof caches !== 'undefined') await Promise.all(Object.values(OFFLINE_CACHE_NAMES).map((name) => caches.delete(name).catch(() => false)));
  await clearCaptureDb().catch(() => undefined);
}
