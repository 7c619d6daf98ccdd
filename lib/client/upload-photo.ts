/**
 * Uploads one survey photo from the phone's capture queue. The integrator may swap this file for the version
 * that uploads straight to object storage: callers rely only on this signature and its answers.
 *
 * Sent over the multipart attachments route with the item's UUID as its Idempotency-Key, so a repeat (a retry
 * after a cut connection, the app restarted mid-send) is stored once: the server answers it with the first
 * upload's attachment. `retry: true` means nothing final happened (no connection, session ended, server busy):
 * keep the photo and send it again later; `retry: false` means the server refused this photo (type, size,
 * permission) and sending it again will not help.
 */
export async function uploadSurveyPhoto(args: {
  org: string;
  surveyId: string;
  deviceId: string;
  file: Blob;
  filename: string;
  caption: string | null;
  signal?: AbortSignal;
}): Promise<{ ok: true; attachmentId: string } | { ok: false; retry: boolean; message: string }> {
  const form = new FormData();
  form.set('file', args.file, args.filename);
  if (args.caption) form.set('caption', args.caption);
  let res: Response;
  try {
    res = await fetch(`/api/orgs/${encodeURIComponent(args.org)}/surveys/${encodeURIComponent(args.surveyId)}/attachments`, {
      method: 'POST',
      body: form,
      headers: { 'Idempotency-Key': args.deviceId },
      credentials: 'same-origin',
      signal: args.signal,
    });
  } catch {
    return { ok: false, retry: true, message: 'No connection: the photo stays saved on this phone and is sent when the connection returns.' };
  }
  const body = (await res.json().catch(() => null)) as { attachment?: { id: string }; error?: { message?: string } } | null;
  if (res.ok && body?.attachment?.id) return { ok: true, attachmentId: body.attachment.id };
  if (res.status === 401) return { ok: false, retry: true, message: 'Your session has ended: sign in again to send the photo; it stays saved on this phone.' };
  if (res.status >= 500 || res.status === 408 || res.status === 409 || res.status === 429 || res.ok) {
    return { ok: false, retry: true, message: 'The server did not take the photo this time; it stays saved on this phone and is sent again.' };
  }
  return { ok: false, retry: false, message: body?.error?.message ?? `The photo was refused (${res.status}).` };
}
