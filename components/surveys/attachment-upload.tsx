'use client';
import { useRef, useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { IDEMPOTENCY_HEADER, useIdempotencyKey } from '@/lib/client/idempotency-key';

/** Attaches a JPEG/PNG photo or a PDF report (at most 10 MB); the type is checked from the file's content. */
export function AttachmentUpload({ org, surveyId }: { org: string; surveyId: string }) {
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  // One key per upload: a double submit is stored once; the key is renewed once the upload is answered.
  const uploadKey = useIdempotencyKey();
  return (
    <form
      ref={form}
      className="flex flex-wrap items-end gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        const data = new FormData(event.currentTarget);
        const file = data.get('file');
        if (!(file instanceof File) || !file.size) return setMessage({ ok: false, text: 'Choose a photo or a PDF first.' });
        start(async () => {
          const res = await fetch(`/api/orgs/${org}/surveys/${surveyId}/attachments`, { method: 'POST', body: data, headers: { [IDEMPOTENCY_HEADER]: uploadKey.current() } });
          uploadKey.renew();
          const body = await res.json().catch(() => null);
          if (res.ok) {
            setMessage({ ok: true, text: `${body.attachment.filename} attached.` });
            form.current?.reset();
            router.refresh();
          } else setMessage({ ok: false, text: body?.error?.message ?? `The upload failed (${res.status}).` });
        });
      }}
    >
      <label className="flex min-w-0 max-w-full flex-col gap-1 text-xs text-ink-soft">
        Photo or report
        <input type="file" name="file" accept="image/jpeg,image/png,application/pdf" className="max-w-full text-sm text-ink max-lg:min-h-11" />
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
