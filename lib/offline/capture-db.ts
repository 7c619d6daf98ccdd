import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { CaptureItem } from './capture-state';

/**
 * The phone's capture queue in IndexedDB (the page and the service worker open the same database): one
 * record per captured reading or photo, keyed by the UUID made on the device, photos as Blobs.
 */
interface CaptureDb extends DBSchema {
  items: { key: string; value: CaptureItem; indexes: { byUser: string } };
  /** Small settings per survey: the electrode chosen at the top of the capture form, the last locations. */
  settings: { key: string; value: { key: string; value: unknown } };
}

export const CAPTURE_DB_NAME = 'tidewarden-capture';
/** Fired on the page whenever the queue changed (a save, a send, a discard). */
export const CAPTURE_CHANGED_EVENT = 'tidewarden:capture-changed';

let opened: Promise<IDBPDatabase<CaptureDb>> | null = null;

export function captureDb() {
  opened ??= openCaptureDb();
  return opened;
}

function openCaptureDb() {
  const opening = openDB<CaptureDb>(CAPTURE_DB_NAME, 1, {
    upgrade(db) {
      const items = db.createObjectStore('items', { keyPath: 'deviceId' });
      items.createIndex('byUser', 'userId');
      db.createObjectStore('settings', { keyPath: 'key' });
    },
    // Another tab upgrading or deleting the database (sign-out): let it, and open again next time.
    blocking() {
      void opened?.then((db) => db.close());
      opened = null;
    },
  });
  // A refused open (storage full, private mode, another tab blocking) is not kept: the next call tries again.
  const kept = opening.catch((error: unknown) => {
    if (opened === kept) opened = null;
    throw error;
  });
  return kept;
}

export async function putItem(item: CaptureItem) {
  await (await captureDb()).put('items', item);
  announce();
}

export async function getItem(deviceId: string) {
  return (await captureDb()).get('items', deviceId);
}

export async function deleteItem(deviceId: string) {
  await (await captureDb()).delete('items', deviceId);
  announce();
}

/** The member's items, oldest first (the order they were captured in). */
export async function itemsOf(userId: string): Promise<CaptureItem[]> {
  const items = await (await captureDb()).getAllFromIndex('items', 'byUser', userId);
  return items.sort((a, b) => a.createdAt - b.createdAt);
}

export async function allItems(): Promise<CaptureItem[]> {
  return (await captureDb()).getAll('items');
}

export async function getSetting<T>(key: string): Promise<T | undefined> {
  return (await (await captureDb()).get('settings', key))?.value as T | undefined;
}

export async function putSetting(key: string, value: unknown) {
  await (await captureDb()).put('settings', { key, value });
}

/** Everything the queue holds, unsent items included (sign-out, after the member confirmed). */
export async function clearCaptureDb() {
  const db = await captureDb();
  const tx = db.transaction(['items', 'settings'], 'readwrite');
  await Promise.all([tx.objectStore('items').clear(), tx.objectStore('settings').clear(), tx.done]);
  announce();
}

function announce() {
  if (typeof window !== 'undefined') window.dispatchEvent(new Event(CAPTURE_CHANGED_EVENT));
  if (typeof BroadcastChannel !== 'undefined') {
    const channel = new BroadcastChannel(CAPTURE_CHANGED_EVENT);
    channel.postMessage('changed');
    channel.close();
  }
}
