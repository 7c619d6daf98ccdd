'use client';
import { useRef, useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { uploadSurveyPhoto } from '@/lib/client/upload-photo';

const newDeviceId = () => crypto.randomUUID();

/**
 * Attaches a JPEG/PNG photo or a PDF report (at most 10 MB). The file goes from the browser straight to the
 * object storage (an upload link from the app, then a check by the app of the type from the file's content).
 * On a phone a second button opens the camera.
 */
export function AttachmentUpload({ org, surveyId }: { org: string; surveyId: string }) {
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  // One id per chosen file: a double submit or a retry after a failure is the same upload (attached once);
  // a new id once it is attached or another file is chosen.
  const deviceId = useRef<string>(newDeviceId());
  return (
    <form
      ref={form}
      className="flex flex-wrap items-end gap-3"
      onChange={(event) => {
        if (event.target instanceof HTMLInputElement && event.target.type === 'file') deviceId.current = newDeviceId();
      }}
      onSubmit={(event) => {
        event.preventDefault();
        if (pending) return;
        const data = new FormData(event.currentTarget);
        const chosen = [data.get('file'), data.get('photo')].find((f): f is File => f instanceof File && f.size > 0);
        if (!chosen) return setMessage({ ok: false, text: 'Choose a photo or a PDF first.' });
        const caption = String(data.get('caption') ?? '').trim() || null;
        start(async () => {
          const result = await uploadSurveyPhoto({ org, surveyId, deviceId: deviceId.current, file: chosen, filename: chosen.name || 'photo.jpg', caption });
          if (result.ok) {
            deviceId.current = newDeviceId();
            setMessage({ ok: true, text: `${chosen.name || 'The photo'} attached.` });
            form.current?.reset();
            router.refresh();
          } else setMessage({ ok: false, text: result.retry ? `${result.message} Press Attach again to retry.` : result.message });
        });
      }}
    >
      <label className="flex min-w-0 max-w-full flex-col gap-1 text-xs text-ink-soft">
        Photo or report
        <input type="file" name="file" accept="image/jpeg,image/png,application/pdf" className="max-w-full text-sm text-ink max-lg:min-h-11" />
      </label>
      <label className="flex min-w-0 max-w-full flex-col gap-1 text-xs text-ink-soft lg:hidden">
        Take a photo
        <input type="file" name="photo" accept="image/*" capture="environment" className="max-w-full text-sm text-ink max-lg:min-h-11" />
      </label>
      <label className="flex flex-col gap-1 text-xs text-ink-soft">
        Caption
        <input name="caption" className="rounded-[3px] border border-rule-strong bg-paper-raised px-2 py-1 text-sm text-ink max-lg:min-h-11" />
      </label>
      <Button type="submit" variant="secondary" disabled={pending}>
        Attach
      </Button>
      {message ? <p role={message.ok ? 'status' : 'alert'} className={`w-full text-sm ${message.ok ? 'text-state-sound' : 'text-state-action'}`}>{message.text}</p> : null}
    </form>
  );
}
