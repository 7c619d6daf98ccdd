import { afterEach, describe, expect, it, vi } from 'vitest';
import { uploadSurveyPhoto } from '@/lib/client/upload-photo';

// The offline queue keeps a photo it may send again (conflict) apart from one refused for the file itself (failed):
// the uploader says which, from the app's answer to the upload link request.
const args = { org: 'gullhaven', surveyId: 'survey-1', deviceId: 'item-12345678', file: new Blob([new Uint8Array([0xff, 0xd8, 0xff])], { type: 'image/jpeg' }), filename: 'b7.jpg', caption: null, capturedBy: 'user-1' };
const answer = (status: number, message: string) => new Response(JSON.stringify({ error: { code: 'x', message } }), { status, headers: { 'content-type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('uploadSurveyPhoto', () => {
  it.each([
    [403, 'Captured by another member on this phone; sign in as them to send.'],
    [404, 'That survey does not exist.'],
  ])('a %i on the link request is a conflict that can pass (kept, sent again later)', async (status, message) => {
    vi.stubGlobal('fetch', vi.fn(async () => answer(status, message)));
    expect(await uploadSurveyPhoto(args)).toEqual({ ok: false, retry: false, message, conflict: true });
  });

  it('a 422 (the file itself) is final, not a conflict; a 503 is retried', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => answer(422, 'Only JPEG and PNG photos and PDF reports can be attached.')));
    expect(await uploadSurveyPhoto(args)).toEqual({ ok: false, retry: false, message: 'Only JPEG and PNG photos and PDF reports can be attached.' });
    vi.stubGlobal('fetch', vi.fn(async () => answer(503, 'The file storage cannot be reached just now.')));
    expect(await uploadSurveyPhoto(args)).toMatchObject({ ok: false, retry: true });
  });

  it('names the member who captured the photo in the link request', async () => {
    const fetchMock = vi.fn(async () => answer(404, 'gone'));
    vi.stubGlobal('fetch', fetchMock);
    await uploadSurveyPhoto(args);
    const [, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(JSON.parse(String(init.body))).toMatchObject({ deviceId: 'item-12345678', capturedBy: 'user-1' });
  });
});
