import { CAPTURE_ITEM_STATE_LABELS, captureQueueSummary, type CaptureItemState } from '@/lib/labels/capture';
import type { CaptureItemResult } from '@/lib/schemas/surveys';

/**
 * The capture queue's items and how they move (pure: the page, the service worker and the unit tests share it).
 *
 *   waiting ──send──► sending ──recorded/duplicate──► sent (then dropped from the phone)
 *      ▲                 │ no connection, 401, 5xx: back to waiting (nothing lost, sent again later)
 *      │                 ├─ conflict ─► conflict ─┐  the member edits and sends again (back to waiting)
 *      │                 ├─ invalid ──► invalid ──┤  or discards it after a confirm
 *      └─ edit / resend ─┴─ photo refused ► failed ┘
 *
 * An item is "sent" only when the server answered recorded or duplicate (a photo: its attachment id).
 * An item left "sending" by a closed app is sent again: the server answers a repeat as a duplicate.
 */
export interface QueuedReading {
  location: string;
  potentialV: number | null;
  electrode: string | null;
  anodeGroupId: string | null;
  /** The group's label when it was chosen, to show the item offline. */
  anodeGroupLabel: string | null;
  remainingFraction: number | null;
  comment: string | null;
}

export interface QueuedPhoto {
  file: Blob;
  filename: string;
  caption: string | null;
}

export interface CaptureItem {
  deviceId: string;
  kind: 'reading' | 'photo';
  org: string;
  surveyId: string;
  /** The member who captured it: only that member's session sends it or sees it. */
  userId: string;
  createdAt: number;
  state: CaptureItemState;
  message: string | null;
  fieldErrors?: Record<string, string[]>;
  attempts: number;
  reading?: QueuedReading;
  photo?: QueuedPhoto;
  /** What the server made of it, once sent. */
  serverId?: string;
}

export const isWaiting = (item: CaptureItem) => item.state === 'waiting' || item.state === 'sending';
export const needsYou = (item: CaptureItem) => item.state === 'conflict' || item.state === 'invalid' || item.state === 'failed';

/** The item as the capture route expects it. */
export function toCaptureRequestItem(item: CaptureItem) {
  const r = item.reading!;
  return { deviceId: item.deviceId, kind: 'reading' as const, location: r.location, potentialV: r.potentialV, electrode: r.electrode, anodeGroupId: r.anodeGroupId, remainingFraction: r.remainingFraction, comment: r.comment };
}

/** The most readings one request carries (CAPTURE_BATCH_MAX on the server). */
export const CAPTURE_BATCH_SIZE = 50;

/**
 * The readings that wait, in the requests that carry them: one member, one survey and at most
 * CAPTURE_BATCH_SIZE items per request, oldest first. A request names the member who captured its items
 * (`capturedBy`), and the server records them only under that member's own session.
 */
export function captureBatches(items: CaptureItem[]): { org: string; surveyId: string; capturedBy: string; items: CaptureItem[] }[] {
  const groups = new Map<string, CaptureItem[]>();
  for (const item of items) {
    if (item.kind !== 'reading') continue;
    const key = JSON.stringify([item.userId, item.org, item.surveyId]);
    groups.set(key, [...(groups.get(key) ?? []), item]);
  }
  const batches: { org: string; surveyId: string; capturedBy: string; items: CaptureItem[] }[] = [];
  for (const group of groups.values()) {
    for (let start = 0; start < group.length; start += CAPTURE_BATCH_SIZE) {
      const slice = group.slice(start, start + CAPTURE_BATCH_SIZE);
      batches.push({ org: slice[0].org, surveyId: slice[0].surveyId, capturedBy: slice[0].userId, items: slice });
    }
  }
  return batches;
}

/** The body of one capture request. */
export const captureRequestBody = (batch: { capturedBy: string; items: CaptureItem[] }) => ({ capturedBy: batch.capturedBy, items: batch.items.map(toCaptureRequestItem) });

/**
 * What a capture request's answer means: results item by item, or a failure of the whole request. A 200 that
 * is not our JSON (a hotel or harbour Wi-Fi login page, a redirect followed to another page) was never seen
 * by the capture route: the items wait and are sent again.
 */
export function readCaptureResponse(res: { status: number; ok: boolean; redirected: boolean } | null, body: unknown): { results: CaptureItemResult[] } | BatchFailure {
  if (!res) return { kind: 'offline' };
  const parsed = body && typeof body === 'object' ? (body as { results?: unknown; error?: { message?: unknown } }) : null;
  if (res.ok && !res.redirected && Array.isArray(parsed?.results)) return { results: parsed.results as CaptureItemResult[] };
  if (res.ok || res.redirected || !parsed) return res.status === 401 ? { kind: 'signed-out' } : { kind: 'server', status: res.status };
  return batchFailureOf(res.status, typeof parsed.error?.message === 'string' ? parsed.error.message : null);
}

/** An item after the server's answer for it. */
export function applyCaptureResult(item: CaptureItem, result: CaptureItemResult): CaptureItem {
  switch (result.status) {
    case 'recorded':
    case 'duplicate':
      return { ...item, state: 'sent', message: result.message, fieldErrors: undefined, serverId: result.readingId };
    case 'conflict':
      return { ...item, state: 'conflict', message: result.message, fieldErrors: undefined };
    case 'invalid':
      return { ...item, state: 'invalid', message: result.message, fieldErrors: result.fieldErrors };
  }
}

/** Why a whole request was not answered item by item, and what it means for its items. */
export type BatchFailure = { kind: 'offline' } | { kind: 'signed-out' } | { kind: 'not-member'; message: string } | { kind: 'server'; status: number } | { kind: 'refused'; status: number; message: string };

export const OFFLINE_MESSAGE = 'No connection: saved on this phone; it is sent when the connection returns.';
export const SIGNED_OUT_MESSAGE = 'Your session has ended: sign in again to send; it stays saved on this phone.';
export const SERVER_MESSAGE = 'The server did not take it this time; it stays saved on this phone and is sent again.';

export function batchFailureOf(status: number | null, message?: string | null): BatchFailure {
  if (status === null) return { kind: 'offline' };
  if (status === 401) return { kind: 'signed-out' };
  if (status === 404) return { kind: 'not-member', message: message ?? 'This organisation or survey is no longer open to you.' };
  if (status >= 500 || status === 408 || status === 409 || status === 429) return { kind: 'server', status };
  return { kind: 'refused', status, message: message ?? `The server refused it (${status}).` };
}

/** An item whose request failed as a whole: it waits again, or needs the member when waiting cannot help. */
export function applyBatchFailure(item: CaptureItem, failure: BatchFailure): CaptureItem {
  switch (failure.kind) {
    // A try that never reached the server (no signal, the session ended) does not count towards the tries after
    // which a reading can be discarded: a survey worked without signal must not fill with "Discard" buttons.
    case 'offline':
      return { ...item, state: 'waiting', message: OFFLINE_MESSAGE, attempts: notCounted(item) };
    case 'signed-out':
      return { ...item, state: 'waiting', message: SIGNED_OUT_MESSAGE, attempts: notCounted(item) };
    case 'server':
      return { ...item, state: 'waiting', message: SERVER_MESSAGE };
    case 'not-member':
      return { ...item, state: 'conflict', message: failure.message };
    case 'refused':
      return { ...item, state: item.kind === 'photo' ? 'failed' : 'conflict', message: failure.message };
  }
}

/** What an upload answers (lib/client/upload-photo.ts); `conflict` is read when the uploader gives it. */
export type PhotoUploadResult = { ok: true; attachmentId: string } | { ok: false; retry: boolean; message: string; conflict?: boolean; offline?: boolean };

/** The attempts of an item whose last try (counted when it started) never reached the server. */
function notCounted(item: CaptureItem): number {
  return Math.max(0, item.attempts - 1);
}

/**
 * A photo after its upload: sent, waiting again (`retry`), a conflict the member can resolve and send again
 * (`conflict`: the survey deleted, the role changed, another member's photo; the file itself is fine), or
 * refused for the file's own faults (type, size) until discarded.
 */
export function applyPhotoResult(item: CaptureItem, result: PhotoUploadResult): CaptureItem {
  if (result.ok) return { ...item, state: 'sent', message: 'Photo sent.', serverId: result.attachmentId };
  if (result.retry) return { ...item, state: 'waiting', message: result.message, ...(result.offline ? { attempts: notCounted(item) } : {}) };
  const conflict = 'conflict' in result && result.conflict === true;
  return { ...item, state: conflict ? 'conflict' : 'failed', message: result.message };
}

/** An item taken up again by the member (edited or "send again"): waiting, its old answer forgotten. */
export function resubmit(item: CaptureItem, reading?: QueuedReading): CaptureItem {
  return { ...item, state: 'waiting', message: null, fieldErrors: undefined, ...(reading ? { reading } : {}) };
}

/** The counts and the sentence the page's status region reads. */
export function summarize(items: CaptureItem[]) {
  const waiting = items.filter(isWaiting).length;
  const attention = items.filter(needsYou).length;
  return { waiting, attention, sentence: captureQueueSummary(waiting, attention) };
}

export const itemStateWords = (item: CaptureItem) => CAPTURE_ITEM_STATE_LABELS[item.state];
