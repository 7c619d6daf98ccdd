'use client';
import { useCallback, useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { StatusTag } from '@/components/ui/status-tag';
import { CAPTURE_STATE_TONES } from '@/lib/status/palette';
import { CAPTURE_KIND_LABELS, ELECTRODE_LABELS } from '@/lib/labels';
import { captureReadingSchema, SURVEY_ELECTRODE_VALUES } from '@/lib/schemas/surveys';
import { newIdempotencyKey } from '@/lib/client/idempotency-key';
import { nextLocation } from '@/lib/surveys/next-location';
import { CAPTURE_CHANGED_EVENT, deleteItem, getSetting, itemsOf, putItem, putSetting } from '@/lib/offline/capture-db';
import { isWaiting, itemStateWords, needsYou, resubmit, summarize, type CaptureItem, type QueuedReading } from '@/lib/offline/capture-state';
import { CAPTURE_SYNC_TAG, sendCaptureQueue } from '@/lib/offline/send-queue';

type Electrode = (typeof SURVEY_ELECTRODE_VALUES)[number];
const ELECTRODE_OPTIONS = SURVEY_ELECTRODE_VALUES.map((value) => ({ value, label: ELECTRODE_LABELS[value] ?? value }));
const RETRY_MS = 20_000;

interface Props {
  org: string;
  surveyId: string;
  userId: string;
  defaultElectrode: string;
  groups: { id: string; label: string }[];
  /** The locations of the survey's last two readings, older first: the form proposes the next one. */
  lastLocations: string[];
}

interface Draft {
  location: string;
  potentialV: string;
  anodeGroupId: string;
  remainingPercent: string;
  comment: string;
}

const emptyDraft = (location: string, anodeGroupId = ''): Draft => ({ location, potentialV: '', anodeGroupId, remainingPercent: '', comment: '' });
const numberOrNull = (text: string) => (text.trim() === '' ? null : Number(text.trim().replace(',', '.')));

/** Asks the service worker to send the queue when the connection returns, where the browser has Background Sync. */
async function askForBackgroundSync() {
  try {
    const registration = await navigator.serviceWorker?.getRegistration();
    const sync = (registration as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined)?.sync;
    await sync?.register(CAPTURE_SYNC_TAG);
  } catch {
    // No Background Sync here: the page sends on "online", on the next open and with "Send now".
  }
}

/**
 * Capture on site, phone first: readings and photos are saved on the phone (IndexedDB) with a UUID made here and
 * sent when there is a connection (at once, when the connection returns, on the next open, by Background Sync
 * or with "Send now"); the server records each once. The status region always says how many wait and what
 * needs the member; a reading or photo is called sent only once the server has answered for it.
 */
export function CapturePanel({ org, surveyId, userId, defaultElectrode, groups, lastLocations }: Props) {
  const router = useRouter();
  const [items, setItems] = useState<CaptureItem[]>([]);
  const [loaded, setLoaded] = useState(false);
  const [electrode, setElectrode] = useState<Electrode>((SURVEY_ELECTRODE_VALUES as readonly string[]).includes(defaultElectrode) ? (defaultElectrode as Electrode) : 'ag-agcl-seawater');
  const [recent, setRecent] = useState<string[]>(lastLocations.slice(-2));
  const [draft, setDraft] = useState<Draft>(() => emptyDraft(lastLocations.length ? nextLocation(lastLocations.at(-1)!, lastLocations.at(-2)) : ''));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [editing, setEditing] = useState<string | null>(null);
  const [notice, setNotice] = useState<string>('');
  const [sending, setSending] = useState(false);
  const [confirmDiscard, setConfirmDiscard] = useState<string | null>(null);
  const [caption, setCaption] = useState('');
  const [photoError, setPhotoError] = useState<string | null>(null);
  const photoInput = useRef<HTMLInputElement>(null);
  const sendingRef = useRef(false);
  const electrodeKey = `electrode:${surveyId}`;
  const locationsKey = `locations:${surveyId}`;

  const reload = useCallback(async () => {
    const mine = (await itemsOf(userId)).filter((i) => i.org === org && i.surveyId === surveyId);
    setItems(mine);
    setLoaded(true);
    return mine;
  }, [org, surveyId, userId]);

  const send = useCallback(
    async (why: 'auto' | 'button') => {
      if (sendingRef.current) return;
      if (why === 'auto' && !navigator.onLine) return;
      sendingRef.current = true;
      setSending(true);
      try {
        const outcome = await sendCaptureQueue(userId);
        if (outcome.sent) router.refresh();
        const parts: string[] = [];
        if (outcome.sent) parts.push(`${outcome.sent} sent.`);
        if (outcome.offline) parts.push('No connection: what waits stays saved on this phone and is sent when the connection returns.');
        else if (why === 'button' && !outcome.sent && !outcome.waiting) parts.push('Nothing waits to be sent.');
        if (parts.length) setNotice(parts.join(' '));
      } catch {
        setNotice('Sending stopped; everything stays saved on this phone and is sent again.');
      } finally {
        sendingRef.current = false;
        setSending(false);
        await reload();
      }
    },
    [reload, router, userId],
  );

  // The electrode chosen for this survey and the last locations, then the queue; send what waits on opening.
  useEffect(() => {
    let live = true;
    (async () => {
      const chosen = await getSetting<Electrode>(electrodeKey);
      if (live && chosen) setElectrode(chosen);
      const locations = await getSetting<string[]>(locationsKey);
      if (live && locations?.length) {
        setRecent(locations);
        setDraft((d) => (d.location ? d : { ...d, location: nextLocation(locations.at(-1)!, locations.at(-2)) }));
      }
      const mine = await reload();
      if (live && mine.some(isWaiting)) void send('auto');
    })();
    return () => {
      live = false;
    };
  }, [electrodeKey, locationsKey, reload, send]);

  // Follow the queue as other tabs and the service worker change it; send when the connection returns, and
  // try again now and then while something waits.
  useEffect(() => {
    const changed = () => void reload();
    const online = () => void send('auto');
    window.addEventListener(CAPTURE_CHANGED_EVENT, changed);
    window.addEventListener('online', online);
    const channel = typeof BroadcastChannel !== 'undefined' ? new BroadcastChannel(CAPTURE_CHANGED_EVENT) : null;
    channel?.addEventListener('message', changed);
    const timer = window.setInterval(() => {
      if (!navigator.onLine) return;
      void itemsOf(userId).then((all) => {
        if (all.some(isWaiting)) void send('auto');
      });
    }, RETRY_MS);
    return () => {
      window.removeEventListener(CAPTURE_CHANGED_EVENT, changed);
      window.removeEventListener('online', online);
      channel?.close();
      window.clearInterval(timer);
    };
  }, [reload, send, userId]);

  const queued = () => {
    void askForBackgroundSync();
    if (navigator.onLine) void send('auto');
  };

  async function saveReading(event: React.FormEvent) {
    event.preventDefault();
    const reading: QueuedReading = {
      location: draft.location.trim(),
      potentialV: numberOrNull(draft.potentialV),
      electrode: draft.potentialV.trim() === '' ? null : electrode,
      anodeGroupId: draft.anodeGroupId || null,
      anodeGroupLabel: groups.find((g) => g.id === draft.anodeGroupId)?.label ?? null,
      remainingFraction: draft.remainingPercent.trim() === '' ? null : Number(draft.remainingPercent.trim().replace(',', '.')) / 100,
      comment: draft.comment.trim() || null,
    };
    const deviceId = editing ?? newIdempotencyKey();
    // The server's own rules, checked here first so a mistake is shown at once, offline too.
    const checked = captureReadingSchema(electrode).safeParse({ deviceId, kind: 'reading', ...reading });
    if (!checked.success || (reading.remainingFraction !== null && Number.isNaN(reading.remainingFraction))) {
      const fieldErrors: Record<string, string[]> = {};
      for (const issue of checked.success ? [] : checked.error.issues) {
        const key = String(issue.path[0] === 'remainingFraction' ? 'remainingPercent' : (issue.path[0] ?? 'location'));
        (fieldErrors[key] ??= []).push(issue.message);
      }
      if (reading.remainingFraction !== null && Number.isNaN(reading.remainingFraction)) fieldErrors.remainingPercent = ['Remaining: enter a number of per cent, e.g. 65.'];
      if (Number.isNaN(reading.potentialV)) fieldErrors.potentialV = ['Potential: enter a number of volts, e.g. -0.95.'];
      setErrors(fieldErrors);
      setNotice('Not saved: correct the fields marked.');
      return;
    }
    const existing = editing ? items.find((i) => i.deviceId === editing) : undefined;
    const item: CaptureItem = existing
      ? resubmit(existing, reading)
      : { deviceId, kind: 'reading', org, surveyId, userId, createdAt: Date.now(), state: 'waiting', message: null, attempts: 0, reading };
    await putItem(item);
    const locations = [...recent, reading.location].slice(-2);
    setRecent(locations);
    await putSetting(locationsKey, locations);
    setErrors({});
    setEditing(null);
    setDraft(emptyDraft(nextLocation(reading.location, recent.at(-1) ?? null), draft.anodeGroupId));
    setNotice(`Saved on this phone: reading at ${reading.location}.`);
    await reload();
    queued();
  }

  async function savePhoto(event: React.FormEvent) {
    event.preventDefault();
    const file = photoInput.current?.files?.[0];
    if (!file || !file.size) return setPhotoError('Take or choose a photo first.');
    if (!file.type.startsWith('image/')) return setPhotoError('Choose a photo (JPEG or PNG).');
    setPhotoError(null);
    const deviceId = newIdempotencyKey();
    const item: CaptureItem = {
      deviceId,
      kind: 'photo',
      org,
      surveyId,
      userId,
      createdAt: Date.now(),
      state: 'waiting',
      message: null,
      attempts: 0,
      photo: { file: new Blob([await file.arrayBuffer()], { type: file.type }), filename: file.name || `photo-${deviceId.slice(0, 8)}.jpg`, caption: caption.trim() || null },
    };
    await putItem(item);
    if (photoInput.current) photoInput.current.value = '';
    setCaption('');
    setNotice(`Saved on this phone: photo ${item.photo!.filename}.`);
    await reload();
    queued();
  }

  function edit(item: CaptureItem) {
    const r = item.reading!;
    setEditing(item.deviceId);
    setErrors(item.fieldErrors?.remainingFraction ? { ...item.fieldErrors, remainingPercent: item.fieldErrors.remainingFraction } : (item.fieldErrors ?? {}));
    setDraft({
      location: r.location,
      potentialV: r.potentialV === null ? '' : String(r.potentialV),
      anodeGroupId: r.anodeGroupId && groups.some((g) => g.id === r.anodeGroupId) ? r.anodeGroupId : '',
      remainingPercent: r.remainingFraction === null ? '' : String(Math.round(r.remainingFraction * 1000) / 10),
      comment: r.comment ?? '',
    });
    setNotice(`Editing the reading at ${r.location}: change it and save to send it again.`);
  }

  async function sendAgain(item: CaptureItem) {
    await putItem(resubmit(item));
    await reload();
    queued();
  }

  async function discard(deviceId: string) {
    const item = items.find((i) => i.deviceId === deviceId);
    await deleteItem(deviceId);
    setConfirmDiscard(null);
    if (editing === deviceId) setEditing(null);
    setNotice(item ? `Discarded: ${describe(item)}. It was never recorded.` : 'Discarded.');
    await reload();
  }

  const summary = summarize(items);
  const shown = items.filter((i) => isWaiting(i) || needsYou(i));
  const field = (name: keyof Draft) => ({
    name,
    value: draft[name],
    errors: errors[name],
    onChange: (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setDraft((d) => ({ ...d, [name]: e.target.value })),
  });

  return (
    <div className="flex flex-col gap-4" data-capture-ready={loaded ? 'true' : undefined}>
      <div className="rounded-[3px] border border-rule bg-paper-sunk px-3 py-2">
        <p role="status" aria-live="polite" aria-atomic="true" className="text-sm font-medium text-ink" data-testid="capture-status">
          {loaded ? summary.sentence : 'Reading what is saved on this phone…'}
          {notice ? <span className="block font-normal text-ink-soft">{notice}</span> : null}
        </p>
        <div className="mt-2 flex flex-wrap items-center gap-2">
          <Button type="button" variant="secondary" onClick={() => void send('button')} disabled={sending || !summary.waiting}>
            {sending ? 'Sending…' : 'Send now'}
          </Button>
        </div>
      </div>

      <SelectField
        label="Reference electrode for this survey"
        name="captureElectrode"
        value={electrode}
        options={ELECTRODE_OPTIONS}
        onChange={(e) => {
          const value = e.target.value as Electrode;
          setElectrode(value);
          void putSetting(electrodeKey, value);
        }}
      />

      <form onSubmit={saveReading} noValidate aria-label="Capture a reading" className="grid grid-cols-2 gap-3">
        <Field className="col-span-2" label="Location" {...field('location')} autoComplete="off" placeholder="Fr 22 P, Pile B7" />
        <Field label="Potential" {...field('potentialV')} inputMode="decimal" unit="V" hint={`against ${ELECTRODE_LABELS[electrode]}`} />
        <Field label="Remaining" {...field('remainingPercent')} inputMode="decimal" unit="%" />
        <SelectField className="col-span-2" label="Anode group" {...field('anodeGroupId')} options={[{ value: '', label: 'None' }, ...groups.map((g) => ({ value: g.id, label: g.label }))]} />
        <Field className="col-span-2" label="Comment" {...field('comment')} />
        <div className="col-span-2 flex flex-wrap gap-2">
          <Button type="submit" className="min-h-11 flex-1">
            {editing ? 'Save and send again' : 'Save reading'}
          </Button>
          {editing ? (
            <Button type="button" variant="secondary" className="min-h-11" onClick={() => {
              setEditing(null);
              setErrors({});
              setDraft(emptyDraft(recent.length ? nextLocation(recent.at(-1)!, recent.at(-2)) : ''));
            }}>
              Stop editing
            </Button>
          ) : null}
        </div>
      </form>

      <form onSubmit={savePhoto} noValidate aria-label="Capture a photo" className="flex flex-col gap-3 border-t border-rule pt-3">
        <label className="flex flex-col gap-1 text-xs font-medium text-ink-soft">
          Photo
          <input ref={photoInput} type="file" name="photo" accept="image/*" capture="environment" className="min-h-11 max-w-full text-sm text-ink" onChange={() => setPhotoError(null)} />
        </label>
        <Field label="What the photo shows" name="photoCaption" value={caption} onChange={(e) => setCaption(e.target.value)} />
        {photoError ? <p role="alert" className="text-sm text-state-action">{photoError}</p> : null}
        <Button type="submit" variant="secondary" className="min-h-11">
          Save photo
        </Button>
      </form>

      {shown.length ? (
        <section aria-label="Saved on this phone" className="border-t border-rule pt-3">
          <h3 className="mb-2 text-sm font-semibold text-ink">Saved on this phone</h3>
          <ul className="flex flex-col gap-2">
            {shown.map((item) => (
              <li key={item.deviceId} className="rounded-[3px] border border-rule p-2 text-sm" data-testid="capture-item">
                <div className="flex flex-wrap items-center gap-2">
                  <StatusTag tone={CAPTURE_STATE_TONES[item.state]}>{itemStateWords(item)}</StatusTag>
                  <span className="min-w-0 break-words">{CAPTURE_KIND_LABELS[item.kind]}: {describe(item)}</span>
                </div>
                {item.message ? <p className={`mt-1 ${needsYou(item) ? 'text-state-action' : 'text-ink-soft'}`}>{item.message}</p> : null}
                {needsYou(item) ? (
                  <div className="mt-2 flex flex-wrap gap-2">
                    {item.kind === 'reading' ? (
                      <Button type="button" variant="secondary" className="min-h-11" onClick={() => edit(item)}>
                        Edit {describe(item)}
                      </Button>
                    ) : null}
                    {item.state !== 'failed' ? (
                      <Button type="button" variant="secondary" className="min-h-11" onClick={() => void sendAgain(item)}>
                        Send again
                      </Button>
                    ) : null}
                    {confirmDiscard === item.deviceId ? (
                      <span className="flex flex-wrap items-center gap-2">
                        <span>Discard it for good? It was never recorded.</span>
                        <Button type="button" variant="danger" className="min-h-11" onClick={() => void discard(item.deviceId)}>
                          Yes, discard
                        </Button>
                        <Button type="button" variant="ghost" className="min-h-11" onClick={() => setConfirmDiscard(null)}>
                          Keep it
                        </Button>
                      </span>
                    ) : (
                      <Button type="button" variant="danger" className="min-h-11" onClick={() => setConfirmDiscard(item.deviceId)}>
                        Discard
                      </Button>
                    )}
                  </div>
                ) : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

function describe(item: CaptureItem): string {
  if (item.kind === 'photo') return item.photo?.caption ? `${item.photo.filename} (${item.photo.caption})` : (item.photo?.filename ?? 'photo');
  const r = item.reading!;
  const parts = [r.location];
  if (r.potentialV !== null) parts.push(`${r.potentialV} V`);
  if (r.remainingFraction !== null) parts.push(`${Math.round(r.remainingFraction * 1000) / 10} % remaining`);
  if (r.anodeGroupLabel) parts.push(r.anodeGroupLabel);
  return parts.join(', ');
}
