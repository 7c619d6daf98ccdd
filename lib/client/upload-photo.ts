// Direct upload of a survey photo or report from the browser: ask the app for an upload link (presign), PUT the
// file to the object storage, then ask the app to check and record it (complete). `deviceId` names the item on
// the device: calling again with the same id after any failure is safe (the app answers "already attached" or
// the same upload with a fresh link to a new staging key), which is what an offline queue does.

/**
 * `conflict`: refused for a reason that can pass (no permission now, the survey deleted and perhaps restored later,
 * captured by another member on this phone): the queue keeps the photo and offers to send it again.
 */
export type UploadPhotoResult = { ok: true; attachmentId: string } | { ok: false; retry: boolean; message: string; conflict?: boolean; offline?: boolean };

export interface UploadPhotoArgs {
  org: string;
  surveyId: string;
  deviceId: string;
  file: Blob;
  filename: string;
  caption: string | null;
  /** The member who captured the photo on this device (sent by the offline queue). */
  capturedBy?: string;
  signal?: AbortSignal;
}

const ALLOWED_TYPES = ['image/jpeg', 'image/png', 'application/pdf'];
const OFFLINE = 'The upload could not reach the server; it can be sent again later.';
const STORAGE_DOWN = 'The file storage cannot be reached just now; nothing was recorded. Try again in a few minutes.';

/** The type to declare: the browser's, or from the name when the browser gives none (the server sniffs the bytes anyway). */
function declaredType(file: Blob, filename: string): string {
  if (ALLOWED_TYPES.includes(file.type)) return file.type;
  const ext = filename.toLowerCase().split('.').pop();
  if (ext === 'jpg' || ext === 'jpeg') return 'image/jpeg';
  if (ext === 'png') return 'image/png';
  if (ext === 'pdf') return 'application/pdf';
  return file.type || 'application/octet-stream';
}

async function errorMessage(res: Response, fallback: string): Promise<string> {
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; fieldErrors?: Record<string, string[]> } } | null;
  const field = body?.error?.fieldErrors ? Object.values(body.error.fieldErrors).flat()[0] : undefined;
  return field ?? body?.error?.message ?? fallback;
}

/** A refusal the user has to act on (wrong type, too large, no permission) is final; the rest can be retried. */
const retryable = (status: number) => status === 408 || status === 429 || status >= 500;
/** No permission (now) or no such survey (deleted, perhaps restored later): not the file's fault. */
const passing = (status: number) => status === 403 || status === 404;
const refusal = async (res: Response, fallback: string): Promise<UploadPhotoResult> => ({
  ok: false,
  retry: retryable(res.status),
  message: await errorMessage(res, fallback),
  ...(passing(res.status) ? { conflict: true } : {}),
});

async function presign(args: UploadPhotoArgs, contentType: string) {
  const res = await fetch(`/api/orgs/${encodeURIComponent(args.org)}/surveys/${encodeURIComponent(args.surveyId)}/attachments/uploads`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ deviceId: args.deviceId, filename: args.filename, contentType, sizeBytes: args.file.size, caption: args.caption, capturedBy: args.capturedBy }),
    signal: args.signal,
    credentials: 'same-origin',
  });
  return res;
}

async function complete(args: UploadPhotoArgs): Promise<UploadPhotoResult> {
  const res = await fetch(`/api/orgs/${encodeURIComponent(args.org)}/surveys/${encodeURIComponent(args.surveyId)}/attachments/uploads/${encodeURIComponent(args.deviceId)}/complete`, {
    method: 'POST',
    signal: args.signal,
    credentials: 'same-origin',
  });
  if (res.ok) {
    const body = (await res.json()) as { attachment: { id: string } };
    return { ok: true, attachmentId: body.attachment.id };
  }
  return refusal(res, `The upload could not be recorded (${res.status}).`);
}

export async function uploadSurveyPhoto(args: UploadPhotoArgs): Promise<UploadPhotoResult> {
  const contentType = declaredType(args.file, args.filename);
  try {
    // An expired link is answered by asking for a fresh one (a new staging key): at most one more round.
    for (let attempt = 0; attempt < 2; attempt++) {
      const res = await presign(args, contentType);
      if (!res.ok) return refusal(res, `The upload was refused (${res.status}).`);
      const { upload } = (await res.json()) as {
        upload: { status: 'done'; attachment: { id: string } } | { status: 'upload'; url: string; method: 'PUT'; headers: Record<string, string> };
      };
      if (upload.status === 'done') return { ok: true, attachmentId: upload.attachment.id };
      let put: Response;
      try {
        put = await fetch(upload.url, { method: upload.method, headers: upload.headers, body: args.file, signal: args.signal, credentials: 'omit' });
      } catch (error) {
        if (args.signal?.aborted) throw error;
        // A storage that does not answer (or refuses the cross-origin request outright) looks the same from here.
        return { ok: false, retry: true, message: STORAGE_DOWN };
      }
      if (put.ok) return await complete(args);
      const text = await put.text().catch(() => '');
      // The link's time ran out (a slow network, a phone asleep): ask for a fresh link.
      if (put.status === 403 && /Request has expired/i.test(text)) continue;
      if (put.status >= 500) return { ok: false, retry: true, message: STORAGE_DOWN };
      return { ok: false, retry: false, message: `The file storage refused the file (${put.status}); it was not attached.` };
    }
    return { ok: false, retry: true, message: 'The upload link kept expiring before the file arrived; try again on a better connection.' };
  } catch (error) {
    if (args.signal?.aborted) return { ok: false, retry: true, message: 'The upload was cancelled; nothing was attached.' };
    return { ok: false, retry: true, message: OFFLINE, offline: true };
  }
}
