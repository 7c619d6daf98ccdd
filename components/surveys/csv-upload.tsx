'use client';
import { useRef, useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { ELECTRODE_OPTIONS } from './new-survey-form';
import { IDEMPOTENCY_HEADER, useIdempotencyKey } from '@/lib/client/idempotency-key';

interface Result {
  ok: boolean;
  message: string;
  lines?: string[];
  /** Offered after a refusal when some lines are valid: "import the good lines only". */
  goodLines?: string;
}

/**
 * Uploads a CSV of readings. A file with bad lines writes nothing: the errors come back by line, and the
 * user can then import the good lines only (an explicit second submit of the same file). Rows already in
 * the survey are skipped and counted.
 */
export function CsvUpload({ org, surveyId, electrode }: { org: string; surveyId: string; electrode: string }) {
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const [result, setResult] = useState<Result | null>(null);
  const [pending, start] = useTransition();
  // One key per upload: a double submit is stored once; the key is renewed once the upload is answered.
  const uploadKey = useIdempotencyKey();
  const send = (data: FormData) => {
    const file = data.get('file');
    if (!(file instanceof File) || !file.size) {
      setResult({ ok: false, message: 'Choose a CSV file first.' });
      return;
    }
    start(async () => {
      const res = await fetch(`/api/orgs/${org}/surveys/${surveyId}/readings`, { method: 'POST', body: data, headers: { [IDEMPOTENCY_HEADER]: uploadKey.current() } });
      uploadKey.renew();
      const body = await res.json().catch(() => null);
      if (res.ok) {
        setResult({ ok: true, message: body.message });
        form.current?.reset();
        router.refresh();
      } else {
        setResult({ ok: false, message: body?.error?.message ?? `The upload failed (${res.status}).`, lines: body?.error?.fieldErrors?.csv, goodLines: body?.error?.fieldErrors?.goodLines?.[0] });
      }
    });
  };
  return (
    <form
      ref={form}
      onSubmit={(event) => {
        event.preventDefault();
        send(new FormData(event.currentTarget));
      }}
      onChange={() => setResult((r) => (r && !r.ok ? null : r))}
      className="flex flex-col gap-3"
      aria-label="Upload readings"
    >
      <div className="grid grid-cols-1 gap-3 md:grid-cols-[1fr_14rem]">
        <label className="flex flex-col gap-1 text-xs text-ink-soft">
          CSV file of readings (at most 5 MB)
          <input type="file" name="file" accept=".csv,text/csv" className="text-sm text-ink" />
        </label>
        <SelectField label="Electrode where the file leaves it blank" name="defaultElectrode" options={ELECTRODE_OPTIONS} defaultValue={electrode} />
      </div>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? 'Checking…' : 'Upload readings'}
        </Button>
        <a className="text-sm text-tide-600 underline" href={`/api/orgs/${org}/surveys/template`}>
          Download the template
        </a>
      </div>
      {result ? (
        <div role={result.ok ? 'status' : 'alert'} className={`rounded-[3px] border px-3 py-2 text-sm ${result.ok ? 'border-state-sound/40 bg-state-soundbg text-state-sound' : 'border-state-action/40 bg-state-actionbg text-state-action'}`}>
          <p>{result.message}</p>
          {result.lines?.length ? (
            <ul className="mt-1 max-h-48 list-disc overflow-auto pl-5 text-xs">
              {result.lines.map((line, i) => (
                <li key={i}>{line}</li>
              ))}
            </ul>
          ) : null}
          {result.goodLines ? (
            <div className="mt-2 flex flex-wrap items-center gap-2 text-ink">
              <span>{result.goodLines}</span>
              <Button
                type="button"
                variant="secondary"
                disabled={pending}
                onClick={() => {
                  if (!form.current) return;
                  const data = new FormData(form.current);
                  data.set('goodLinesOnly', '1');
                  send(data);
                }}
              >
                Import the good lines only
              </Button>
            </div>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
