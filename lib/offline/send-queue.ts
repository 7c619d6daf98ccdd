import { uploadSurveyPhoto } from '@/lib/client/upload-photo';
import { deleteItem, getItem, itemsOf, allItems, putItem } from './capture-db';
import { applyBatchFailure, applyCaptureResult, applyPhotoResult, batchFailureOf, captureBatches, captureRequestBody, isWaiting, readCaptureResponse, type BatchFailure, type CaptureItem } from './capture-state';

/** How long one request may take before it counts as no connection. */
const SEND_TIMEOUT_MS = 30_000;
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

  /** Sends one request and writes its answer back item by item; returns the whole request's failure, if any. */
  const sendBatch = async (batch: { org: string; surveyId: string; capturedBy: string; items: CaptureItem[] }): Promise<BatchFailure | null> => {
    for (const item of batch.items) {
      const current = await getItem(item.deviceId);
      if (current) await putItem({ ...current, state: 'sending', attempts: current.attempts + 1 });
    }
    let res: Response | null = null;
    let body: unknown = null;
    let timedOut = false;
    try {
      res = await fetcher(`/api/orgs/${encodeURIComponent(batch.org)}/surveys/${encodeURIComponent(batch.surveyId)}/capture`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        credentials: 'same-origin',
        body: JSON.stringify(captureRequestBody(batch)),
        // A request that hangs (a dying signal) must not hold the send lock for ever: after this long it counts as no connection.
        signal: AbortSignal.timeout(SEND_TIMEOUT_MS),
      });
      body = await res.json().catch(() => null);
    } catch (error) {
      res = null;
      // A request that hung until the timeout reached something: it counts as a try (else a batch that always
      // hangs could never be discarded), though it is answered as no connection.
      timedOut = error instanceof Error && error.name === 'TimeoutError';
    }
    const answer = readCaptureResponse(res, body);
    if ('results' in answer) {
      const byId = new Map(answer.results.map((r) => [r.deviceId, r]));
      for (const item of batch.items) {
        const result = byId.get(item.deviceId);
        const current = await getItem(item.deviceId);
        if (!current) continue; // discarded meanwhile
        const next = result ? applyCaptureResult(current, result) : applyBatchFailure(current, batchFailureOf(500));
        if (next.state === 'sent') {
          await deleteItem(item.deviceId);
          sent += 1;
        } else await putItem(next);
      }
      return null;
    }
    for (const item of batch.items) {
      const current = await getItem(item.deviceId);
      if (current) await putItem(timedOut ? { ...applyBatchFailure(current, answer), attempts: current.attempts } : applyBatchFailure(current, answer));
    }
    return answer;
  };

  for (const batch of captureBatches(items)) {
    if (offline) break;
    const failure = await sendBatch(batch);
    if (failure?.kind === 'offline') offline = true;
    // A server fault on a batch may be one item's doing: send its items one at a time, so the others are recorded
    // and only the one that fails waits (and can be discarded after a few attempts).
    else if (failure?.kind === 'server' && failure.status >= 500 && batch.items.length > 1) {
      for (const item of batch.items) {
        if (offline) break;
        if ((await sendBatch({ ...batch, items: [item] }))?.kind === 'offline') offline = true;
      }
    }
  }
  for (const item of items.filter((i) => i.kind === 'photo')) {
    if (offline) break;
    const current = await getItem(item.deviceId);
    if (!current || !isWaiting(current) || !current.photo) continue;
    await putItem({ ...current, state: 'sending', attempts: current.attempts + 1 });
    const result = await uploadSurveyPhoto({ org: current.org, surveyId: current.surveyId, deviceId: current.deviceId, file: current.photo.file, filename: current.photo.filename, caption: current.photo.caption, capturedBy: current.userId, signal: AbortSignal.timeout(SEND_TIMEOUT_MS) });
    const latest = await getItem(item.deviceId);
    if (!latest) continue;
    const next = applyPhotoResult(latest, result);
    if (next.state === 'sent') {
      await deleteItem(item.deviceId);
      sent += 1;
    } else {
      await putItem(next);
      if (!result.ok && result.offline) offline = true;
    }
  }
  const left = userId ? await itemsOf(userId) : await allItems();
  return { sent, waiting: left.filter(isWaiting).length, attention: left.filter((i) => !isWaiting(i)).length, offline };
}
