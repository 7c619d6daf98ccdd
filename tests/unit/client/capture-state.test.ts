import { describe, expect, it } from 'vitest';
import {
  applyBatchFailure,
  applyCaptureResult,
  applyPhotoResult,
  batchFailureOf,
  OFFLINE_MESSAGE,
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

  it('a photo waits when the upload can be tried again and is refused for good otherwise', () => {
    expect(applyPhotoResult(photo(), { ok: true, attachmentId: 'a1' })).toMatchObject({ state: 'sent', serverId: 'a1' });
    expect(applyPhotoResult(photo(), { ok: false, retry: true, message: 'No connection.' })).toMatchObject({ state: 'waiting', message: 'No connection.' });
    expect(applyPhotoResult(photo(), { ok: false, retry: false, message: 'Not a photo.' })).toMatchObject({ state: 'failed', message: 'Not a photo.' });
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
