import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { CaptureItem } from '@/lib/offline/capture-state';

// The sender against an in-memory queue (the IndexedDB wrapper stood in for): how a failed try is counted.
const store = new Map<string, CaptureItem>();
vi.mock('@/lib/offline/capture-db', () => ({
  getItem: async (id: string) => store.get(id),
  putItem: async (item: CaptureItem) => void store.set(item.deviceId, item),
  deleteItem: async (id: string) => void store.delete(id),
  itemsOf: async (userId: string) => [...store.values()].filter((i) => i.userId === userId),
  allItems: async () => [...store.values()],
}));
vi.mock('@/lib/client/upload-photo', () => ({ uploadSurveyPhoto: vi.fn() }));

const reading = (): CaptureItem => ({
  deviceId: '6f1d2f0e-2b4a-4c55-9a53-3f0a4d1e8b21',
  kind: 'reading',
  org: 'quay',
  surveyId: 'a0888fb8-7401-4b07-946a-944887288898',
  userId: 'u1',
  createdAt: 1,
  state: 'waiting',
  message: null,
  attempts: 2,
  reading: { location: 'Pile B7', potentialV: -0.95, electrode: null, remainingFraction: null, anodeGroupId: null, comment: null } as CaptureItem['reading'],
});

beforeEach(() => {
  store.clear();
  store.set(reading().deviceId, reading());
});

describe('sendCaptureQueue', () => {
  it('a try that never left the phone (no network) is not counted', async () => {
    const { sendCaptureQueue } = await import('@/lib/offline/send-queue');
    const outcome = await sendCaptureQueue('u1', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))) as unknown as typeof fetch);
    expect(outcome).toMatchObject({ offline: true, waiting: 1 });
    expect(store.get(reading().deviceId)).toMatchObject({ state: 'waiting', attempts: 2 });
  });

  it('a try that hung until the timeout is counted (a batch that always hangs can be discarded in the end)', async () => {
    const { sendCaptureQueue } = await import('@/lib/offline/send-queue');
    const outcome = await sendCaptureQueue('u1', vi.fn(async () => Promise.reject(new DOMException('The operation timed out.', 'TimeoutError'))) as unknown as typeof fetch);
    expect(outcome).toMatchObject({ offline: true, waiting: 1 });
    expect(store.get(reading().deviceId)).toMatchObject({ state: 'waiting', attempts: 3 });
  });

  it('a server fault is counted; a recorded answer drops the item', async () => {
    const { sendCaptureQueue } = await import('@/lib/offline/send-queue');
    await sendCaptureQueue('u1', vi.fn(async () => new Response('{}', { status: 503 })) as unknown as typeof fetch);
    expect(store.get(reading().deviceId)).toMatchObject({ state: 'waiting', attempts: 3 });
    const recorded = { results: [{ deviceId: reading().deviceId, status: 'recorded', readingId: 'r1', message: 'Recorded at Pile B7.' }] };
    const outcome = await sendCaptureQueue('u1', vi.fn(async () => new Response(JSON.stringify(recorded), { status: 200, headers: { 'content-type': 'application/json' } })) as unknown as typeof fetch);
    expect(outcome).toMatchObject({ sent: 1, waiting: 0 });
    expect(store.size).toBe(0);
  });
});
