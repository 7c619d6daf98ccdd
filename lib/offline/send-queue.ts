import { uploadSurveyPhoto } from '@/lib/client/upload-photo';
import type { CaptureItemResult } from '@/lib/schemas/surveys';
import { deleteItem, getItem, itemsOf, allItems, putItem } from './capture-db';
import { applyBatchFailure, applyCaptureResult, applyPhotoResult, batchFailureOf, isWaiting, toCaptureRequestItem, type CaptureItem } from './capture-state';

/** The most readings one request carries (CAPTURE_BATCH_MAX on the server). */
const BATCH = 50;
export const CAPTURE_SYNC_TAG = 'tidewarden-capture';

export interface SendOutcome {
  sent: number;
  waiting: number;
  attention: number;
  offline: boolean;
}

/**
 * Sends what waits in the queue (the member's items, or every member's when the service worker sends on a
 * Background Sync): the readings of each survey in batches to the capture route, then the photos one by one,
 * so a waiting photo never holds a reading back. One sender at a time on the phone (a Web Lock shared by the
 * pages and the service worker); each answer is written back item by item, and a sent item is dropped.
 */
export async function sendCaptureQueue(userId: string | null, fetcher: typeof fetch = fetch): Promise<SendOutcome> {
  const run = () => sendNow(userId, fetcher);
  const locks = (globalThis.navigator as Navigator | undefined)?.locks;
  return locks ? locks.request('tidewarden-capture-send', run) : run();
}

async function sendNow(userId: string | null, fetcher: typeof fetch): Promise<SendOutcome> {
  const items = (userId ? await itemsOf(userId) : await allItems()).filter(isWaiting);
  let sent = 0;
  let offline = false;
  const readings = items.filter((i) => i.kind === 'reading');
  const groups = new Map<string, CaptureItem[]>();
  for (const item of readings) groups.set(`${item.org}/${item.surveyId}`, [...(groups.get(`${item.org}/${item.surveyId}`) ?? []), item]);
  for (const group of groups.values()) {
    for (let start = 0; start < group.length && !offline; start += BATCH) {
      const batch = group.slice(start, start + BATCH);
      for (const item of batch) await putItem({ ...item, state: 'sending', attempts: item.attempts + 1 });
      let res: Response | null = null;
      try {
        res = await fetcher(`/api/orgs/${encodeURIComponent(batch[0].org)}/surveys/${encodeURIComponent(batch[0].surveyId)}/capture`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          credentials: 'same-origin',
          body: JSON.stringify({ items: batch.map(toCaptureRequestItem) }),
        });
      } catch {
        res = null;
      }
      const body = res ? ((await res.json().catch(() => null)) as { results?: CaptureItemResult[]; error?: { message?: string } } | null) : null;
      if (res?.ok && body?.results) {
        const byId = new Map(body.results.map((r) => [r.deviceId, r]));
        for (const item of batch) {
          const result = byId.get(item.deviceId);
          const current = await getItem(item.deviceId);
          if (!current) continue; // discarded meanwhile
          const next = result ? applyCaptureResult(current, result) : applyBatchFailure(current, batchFailureOf(500));
          if (next.state === 'sent') {
            await deleteItem(item.deviceId);
            sent += 1;
          } else await putItem(next);
        }
      } else {
        const failure = batchFailureOf(res ? res.status : null, body?.error?.message);
        if (failure.kind === 'offline') offline = true;
        for (const item of batch) {
          const current = await getItem(item.deviceId);
          if (current) await putItem(applyBatchFailure(current, failure));
        }
      }
    }
  }
  for (const item of items.filter((i) => i.kind === 'photo')) {
    if (offline) break;
    const current = await getItem(item.deviceId);
    if (!current || !isWaiting(current) || !current.photo) continue;
    await putItem({ ...current, state: 'sending', attempts: current.attempts + 1 });
    const result = await uploadSurveyPhoto({ org: current.org, surveyId: current.surveyId, deviceId: current.deviceId, file: current.photo.file, filename: current.photo.filename, caption: current.photo.caption });
    const latest = await getItem(item.deviceId);
    if (!latest) continue;
    const next = applyPhotoResult(latest, result);
    if (next.state === 'sent') {
      await deleteItem(item.deviceId);
      sent += 1;
    } else {
      await putItem(next);
      if (!result.ok && result.retry && result.message.startsWith('No connection')) offline = true;
    }
  }
  const left = userId ? await itemsOf(userId) : await allItems();
  return { sent, waiting: left.filter(isWaiting).length, attention: left.filter((i) => !isWaiting(i)).length, offline };
}
