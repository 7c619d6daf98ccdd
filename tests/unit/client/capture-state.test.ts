import { describe, expect, it } from 'vitest';
import {
  applyBatchFailure,
  applyCaptureResult,
  applyPhotoResult,
  batchFailureOf,
  captureBatches,
  captureRequestBody,
  OFFLINE_MESSAGE,
  readCaptureResponse,
  resubmit,
  SIGNED_OUT_MESSAGE,
  summarize,
  toCaptureRequestItem,
  type CaptureItem,
} from '@/lib/offline/capture-state';

const reading = (over: Partial<CaptureItem> = {}): CaptureItem => ({
  deviceId: '6f1c2a52-2f44-4c1e-9a55-0d5f6d6d7a01',
  kind: 'reading',
  org: 'quay-works',
  surveyId: '1b7d8e3a-5b8c-4f0e-8d4c-2c8a9b1e0f11',
  userId: 'u1',
  createdAt: 1,
  state: 'sending',
  message: null,
  attempts: 1,
  reading: { location: 'Fr 22 P', potentialV: -0.95, electrode: 'ag-agcl-seawater', anodeGroupId: null, anodeGroupLabel: null, remainingFraction: null, comment: null },
  ...over,
});
const photo = (over: Partial<CaptureItem> = {}): CaptureItem => ({ ...reading(), kind: 'photo', reading: undefined, photo: { file: new Blob(['x']), filename: 'a.png', caption: null }, ...over });

describe('the capture queue state machine', () => {
  it('is sent only on recorded or duplicate, keeping the id the server gave', () => {
    expect(applyCaptureResult(reading(), { deviceId: 'x', status: 'recorded', message: 'Recorded at Fr 22 P.', readingId: 'r1' })).toMatchObject({ state: 'sent', serverId: 'r1' });
    expect(applyCaptureResult(reading(), { deviceId: 'x', status: 'duplicate', message: 'Already recorded.', readingId: 'r1' })).toMatchObject({ state: 'sent', serverId: 'r1' });
  });

  it('keeps a conflict or an invalid item with its message and field errors, for the member to resolve', () => {
    expect(applyCaptureResult(reading(), { deviceId: 'x', status: 'conflict', message: 'Survey deleted.' })).toMatchObject({ state: 'conflict', message: 'Survey deleted.' });
    const invalid = applyCaptureResult(reading(), { deviceId: 'x', status: 'invalid', message: 'Bad potential.', fieldErrors: { potentialV: ['Bad potential.'] } });
    expect(invalid).toMatchObject({ state: 'invalid', fieldErrors: { potentialV: ['Bad potential.'] } });
    expect(summarize([invalid, reading({ state: 'waiting' })])).toMatchObject({ waiting: 1, attention: 1 });
  });

  it('a cut connection, a lost session or a server fault puts the item back to waiting, never loses it', () => {
    expect(applyBatchFailure(reading(), batchFailureOf(null))).toMatchObject({ state: 'waiting', message: OFFLINE_MESSAGE });
    expect(applyBatchFailure(reading(), batchFailureOf(401))).toMatchObject({ state: 'waiting', message: SIGNED_OUT_MESSAGE });
    for (const status of [500, 502, 503, 429, 409]) expect(applyBatchFailure(reading(), batchFailureOf(status)).state).toBe('waiting');
    expect(applyBatchFailure(reading(), batchFailureOf(404, 'Organisation was not found.'))).toMatchObject({ state: 'conflict', message: 'Organisation was not found.' });
    expect(applyBatchFailure(photo(), batchFailureOf(413, 'Too large.'))).toMatchObject({ state: 'failed', message: 'Too large.' });
  });

  it('a try that never reached the server does not count towards discarding; a server fault does', () => {
    // The sender counts the try when it starts (attempts 3 -> 4); the answer decides whether it stands.
    expect(applyBatchFailure(reading({ attempts: 4 }), batchFailureOf(null)).attempts).toBe(3);
    expect(applyBatchFailure(reading({ attempts: 4 }), batchFailureOf(401)).attempts).toBe(3);
    expect(applyBatchFailure(reading({ attempts: 4 }), batchFailureOf(503)).attempts).toBe(4);
    expect(applyPhotoResult(photo({ attempts: 2 }), { ok: false, retry: true, message: 'No connection.', offline: true }).attempts).toBe(1);
    expect(applyPhotoResult(photo({ attempts: 2 }), { ok: false, retry: true, message: 'Storage down.' }).attempts).toBe(2);
    expect(applyBatchFailure(reading({ attempts: 0 }), batchFailureOf(null)).attempts).toBe(0);
  });

  it('a photo waits when the upload can be tried again and is refused for good otherwise', () => {
    expect(applyPhotoResult(photo(), { ok: true, attachmentId: 'a1' })).toMatchObject({ state: 'sent', serverId: 'a1' });
    expect(applyPhotoResult(photo(), { ok: false, retry: true, message: 'No connection.' })).toMatchObject({ state: 'waiting', message: 'No connection.' });
    expect(applyPhotoResult(photo(), { ok: false, retry: false, message: 'Not a photo.' })).toMatchObject({ state: 'failed', message: 'Not a photo.' });
  });

  it('a photo refused for a reason that can pass (the uploader says conflict) can be sent again; one refused for the file itself cannot', () => {
    const conflict = applyPhotoResult(photo(), { ok: false, retry: false, message: 'This survey no longer exists.', conflict: true });
    expect(conflict).toMatchObject({ state: 'conflict', message: 'This survey no longer exists.' });
    expect(resubmit(conflict)).toMatchObject({ state: 'waiting', message: null });
    expect(applyPhotoResult(photo(), { ok: false, retry: false, message: 'Too large.', conflict: false }).state).toBe('failed');
    expect(summarize([conflict]).attention).toBe(1);
  });

  it('a request carries one member\'s readings of one survey, at most 50, and names that member', () => {
    const mine = Array.from({ length: 51 }, (_, i) => reading({ deviceId: `m${i}`, state: 'waiting', createdAt: i }));
    const theirs = reading({ deviceId: 't1', userId: 'u2', state: 'waiting' });
    const otherSurvey = reading({ deviceId: 'o1', surveyId: 'c2f0a7a4-6f0b-4a55-9e8c-5d1f3a2b4c61', state: 'waiting' });
    const batches = captureBatches([...mine.slice(0, 10), theirs, otherSurvey, ...mine.slice(10), photo({ deviceId: 'p1', state: 'waiting' })]);
    expect(batches.map((b) => [b.capturedBy, b.surveyId, b.items.length])).toEqual([
      ['u1', reading().surveyId, 50],
      ['u1', reading().surveyId, 1],
      ['u2', reading().surveyId, 1],
      ['u1', otherSurvey.surveyId, 1],
    ]);
    for (const batch of batches) expect(new Set(batch.items.map((i) => i.userId))).toEqual(new Set([batch.capturedBy]));
    expect(batches[0].items.map((i) => i.deviceId)).toEqual(mine.slice(0, 50).map((i) => i.deviceId));
    expect(captureRequestBody(batches[2])).toEqual({ capturedBy: 'u2', items: [toCaptureRequestItem(theirs)] });
  });

  it('a 200 that is not the capture route\'s answer (a Wi-Fi login page, a followed redirect) leaves the items waiting', () => {
    const results = [{ deviceId: 'x', status: 'recorded' as const, message: 'Recorded.' }];
    expect(readCaptureResponse({ status: 200, ok: true, redirected: false }, { results })).toEqual({ results });
    for (const [res, body] of [
      [{ status: 200, ok: true, redirected: false }, null],
      [{ status: 200, ok: true, redirected: false }, { welcome: 'Harbour Wi-Fi' }],
      [{ status: 200, ok: true, redirected: true }, { results }],
    ] as const) {
      const failure = readCaptureResponse(res, body);
      expect(failure).toMatchObject({ kind: 'server' });
      expect(applyBatchFailure(reading(), failure as Parameters<typeof applyBatchFailure>[1]).state).toBe('waiting');
    }
    expect(readCaptureResponse(null, null)).toEqual({ kind: 'offline' });
    expect(readCaptureResponse({ status: 401, ok: false, redirected: false }, null)).toEqual({ kind: 'signed-out' });
    expect(readCaptureResponse({ status: 404, ok: false, redirected: false }, { error: { message: 'Gone.' } })).toEqual({ kind: 'not-member', message: 'Gone.' });
    expect(readCaptureResponse({ status: 422, ok: false, redirected: false }, { error: { message: 'Bad.' } })).toMatchObject({ kind: 'refused', message: 'Bad.' });
  });

  it('an edited item waits again under the same UUID, its old answer forgotten', () => {
    const edited = resubmit(reading({ state: 'invalid', message: 'Bad', fieldErrors: { potentialV: ['Bad'] } }), { ...reading().reading!, potentialV: -0.9 });
    expect(edited).toMatchObject({ state: 'waiting', message: null, fieldErrors: undefined, deviceId: reading().deviceId });
    expect(toCaptureRequestItem(edited)).toEqual({ deviceId: reading().deviceId, kind: 'reading', location: 'Fr 22 P', potentialV: -0.9, electrode: 'ag-agcl-seawater', anodeGroupId: null, remainingFraction: null, comment: null });
  });

  it('says how many wait and how many need the member, in words', () => {
    expect(summarize([]).sentence).toBe('Everything captured here is sent.');
    expect(summarize([reading({ state: 'waiting' }), reading({ state: 'sending' }), photo({ state: 'waiting' })]).sentence).toBe('Saved on this phone — 3 waiting to send');
    expect(summarize([reading({ state: 'waiting' }), photo({ state: 'failed' })]).sentence).toBe('Saved on this phone — 1 waiting to send; 1 needs your attention');
  });
});
