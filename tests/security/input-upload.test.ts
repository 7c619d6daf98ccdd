// Uploads are limited while they are read: a chunked body with no Content-Length is counted as it
// streams and refused at the limit, without the rest being read or buffered; captions are checked text.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { NextRequest } from 'next/server';
import type { Organisation, User } from '@/entities';
import type { Role } from '@/lib/roles';
import { getEm, getOrm } from '@/lib/server/db';
import { createAsset } from '@/lib/server/services/assets/create-asset';
import { createSurvey } from '@/lib/server/services/surveys/create-survey';
import { MAX_ATTACHMENT_BYTES } from '@/lib/server/services/surveys/attachments';
import { MAX_CSV_BYTES } from '@/lib/server/services/surveys/import-survey-csv';
import { CONTROL_CHARACTER_MESSAGE } from '@/lib/schemas/text';
import { ctxFor, makeOrgWithRoles, runAs } from '../fixtures/factories';
import { nextHeadersMock } from '../fixtures/next-headers-mock';
import { databaseFingerprint, signInAs } from '../fixtures/entry-points';

vi.mock('next/headers', () => nextHeadersMock);

const MB = 1024 * 1024;
const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52];

let home: { organisation: Organisation; users: Record<Role, User> };
let surveyId: string;

/**
 * A body of `total` bytes made on demand, 1 MB at a time, that counts what the server pulled from it:
 * `head` first (multipart framing and a PNG signature), then filler.
 */
function lazyBody(total: number, head: Uint8Array, tail = new Uint8Array()) {
  const chunk = new Uint8Array(MB).fill(0x41);
  let sent = 0;
  const counter = { pulled: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) {
        if (tail.length) controller.enqueue(tail);
        controller.close();
        return;
      }
      const part = sent === 0 ? head : chunk.subarray(0, Math.min(MB, total - sent));
      sent += part.byteLength;
      counter.pulled += part.byteLength;
      controller.enqueue(part);
    },
  });
  return { stream, counter };
}

type Handler = (req: NextRequest, route: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function post(path: 'attachments' | 'readings', contentType: string, body: ReadableStream<Uint8Array> | FormData) {
  const mod = path === 'attachments' ? await import('@/app/api/orgs/[org]/surveys/[surveyId]/attachments/route') : await import('@/app/api/orgs/[org]/surveys/[surveyId]/readings/route');
  const headers: Record<string, string> = { origin: 'http://127.0.0.1', 'sec-fetch-site': 'same-origin', 'idempotency-key': randomUUID() };
  if (contentType) headers['content-type'] = contentType;
  const init = { method: 'POST', headers, body, duplex: 'half' } as ConstructorParameters<typeof NextRequest>[1];
  const req = new NextRequest(`http://127.0.0.1/api/orgs/${home.organisation.slug}/surveys/${surveyId}/${path}`, init);
  const res = await (mod.POST as Handler)(req, { params: Promise.resolve({ org: home.organisation.slug, surveyId }) });
  return { status: res.status, body: await res.json() };
}

beforeAll(async () => {
  home = await makeOrgWithRoles(await getEm(), 'Upload Harbour');
  const as = async (role: Role) => ctxFor(await getEm(), home.organisation, home.users[role]);
  const vessel = await runAs(as('engineer'), (c) => createAsset(c, { kind: 'vessel', name: 'Upload Vessel', hullMaterial: 'steel' }));
  surveyId = (await runAs(as('inspector'), (c) => createSurvey(c, { assetId: vessel.id, surveyedOn: '2026-01-05', method: 'diver', defaultElectrode: 'ag-agcl-seawater' }))).id;
});
afterAll(async () => (await getOrm()).close(true));

describe('an oversized upload without a Content-Length', () => {
  it('a 200 MB multipart photo: 413 once the limit is passed, the rest never read, nothing stored', async () => {
    await signInAs(home.users.inspector);
    const boundary = `----probe${randomUUID()}`;
    const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.png"\r\nContent-Type: image/png\r\n\r\n`);
    const { stream, counter } = lazyBody(200 * MB, new Uint8Array([...head, ...PNG]), new TextEncoder().encode(`\r\n--${boundary}--\r\n`));
    const before = await databaseFingerprint();
    const res = await post('attachments', `multipart/form-data; boundary=${boundary}`, stream);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toBe('The file is larger than 10 MB; nothing was imported.');
    expect(counter.pulled, 'bytes read before refusing').toBeLessThan(MAX_ATTACHMENT_BYTES + 4 * MB);
    expect(await databaseFingerprint()).toEqual(before);
  });

  it('a 200 MB CSV of readings as the raw body: 413 at the limit, nothing stored', async () => {
    await signInAs(home.users.inspector);
    const { stream, counter } = lazyBody(200 * MB, new TextEncoder().encode('location,potential_v,electrode,remaining\n'));
    const before = await databaseFingerprint();
    const res = await post('readings', 'text/csv', stream);
    expect(res.status).toBe(413);
    expect(counter.pulled).toBeLessThan(MAX_CSV_BYTES + 4 * MB);
    expect(await databaseFingerprint()).toEqual(before);
  });

  it('a photo under the limit is still stored', async () => {
    await signInAs(home.users.inspector);
    const form = new FormData();
    form.set('file', new File([new Uint8Array([...PNG, ...new Uint8Array(MB / 2)])], 'hull.png', { type: 'image/png' }));
    form.set('caption', 'Hull at frame 20');
    const res = await post('attachments', '', form);
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({ filename: 'hull.png', contentType: 'image/png', sizeBytes: PNG.length + MB / 2 });
  });
});

describe('the caption of an attachment', () => {
  it('a NUL byte in it: 422 naming the caption, nothing stored', async () => {
    await signInAs(home.users.inspector);
    const form = new FormData();
    form.set('file', new File([new Uint8Array(PNG)], 'bow.png', { type: 'image/png' }));
    form.set('caption', 'Bow \u0000 thruster');
    const before = await databaseFingerprint();
    const res = await post('attachments', '', form);
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors).toEqual({ caption: [CONTROL_CHARACTER_MESSAGE] });
    expect(await databaseFingerprint()).toEqual(before);
  });
});
