'use client';
import { useCallback, useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Field, SelectField } from '@/components/ui/field';
import { StatusTag } from '@/components/ui/status-tag';
import { CAPTURE_STATE_TONES } from '@/lib/status/palette';
import { CAPTURE_KIND_LABELS, ELECTRODE_LABELS } from '@/lib/labels';
import { SURVEY_ELECTRODE_VALUES } from '@/lib/surveys/electrodes';
import { newIdempotencyKey } from '@/lib/client/idempotency-key';
import { nextLocation } from '@/lib/surveys/next-location';
import { CAPTURE_CHANGED_EVENT, deleteItem, getSetting, itemsOf, putItem, putSetting } from '@/lib/offline/capture-db';
import { isWaiting, itemStateWords, needsYou, resubmit, summarize, type CaptureItem, type QueuedReading } from '@/lib/offline/capture-state';
import { CAPTURE_SYNC_TAG, sendCaptureQueue } from '@/lib/offline/send-queue';

type Electrode = (typeof SURVEY_ELECTRODE_VALUES)[number];
/**
 * The server's rules for a captured reading, with zod: loaded after the page has come to life (and then kept), not
 * with the page, as it is first needed on saving. Part of the survey page's first-load JavaScript otherwise (npm run
 * bench). Offline it comes from the service worker's precache like every other script of the build.
 */
const loadCaptureSchema = () => import('@/lib/schemas/surveys').then((m) => m.captureReadingSchema);
const ELECTRODE_OPTIONS = SURVEY_ELECTRODE_VALUES.map((value) => ({ value, label: ELECTRODE_LABELS[value] ?? value }));
const RETRY_MS = 20_000;
/** The attachments route's limit (MAX_ATTACHMENT_BYTES): a larger photo is refused before it is queued. */
const PHOTO_MAX_BYTES = 10 * 1024 * 1024;
const PHOTO_TYPES = ['image/jpeg', 'image/png'];
/** After this many tries a reading that still waits can be discarded (a server fault that will not pass). */
const DISCARD_AFTER_ATTEMPTS = 5;
/** Below this much free storage the panel says so (photos are kept as they were taken). */
const LOW_STORAGE_BYTES = 50 * 1024 * 1024;
/** What the status says when the phone's storage refused an item: nothing was kept. */
const NOT_OPENED = "This phone's storage could not be opened (full, or private browsing): nothing captured here can be kept on it now. Free some space or leave private browsing, then open the page again.";
const NOT_SAVED = 'NOT saved on this phone: its storage refused it (full, or private browsing). Free some space or leave private browsing, then save again; what you typed is still in the form.';

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
// A typographic minus (U+2212) from a text keyboard counts as a minus sign.
const numberOrNull = (text: string) => (text.trim() === '' ? null : Number(text.trim().replace('\u2212', '-').replace(',', '.')));

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
  const serverProposal = lastLocations.length ? nextLocation(lastLocations.at(-1)!, lastLocations.at(-2)) : '';
  const [draft, setDraft] = useState<Draft>(() => emptyDraft(serverProposal));
  // The UUID of the reading and of the photo being captured: made when the draft starts and kept through every
  // tap and retry of its save, renewed only once it is saved, so a double tap saves one item.
  const [draftId, setDraftId] = useState(() => newIdempotencyKey());
  const [photoId, setPhotoId] = useState(() => newIdempotencyKey());
  const saving = useRef(false);
  const [busy, setBusy] = useState(false);
  // The electrode of the reading being edited (its own, not the one chosen for new readings).
  const [editElectrode, setEditElectrode] = useState<Electrode | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);
  const [storageNote, setStorageNote] = useState<string | null>(null);
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

  // The rules are fetched now, so that the first save does not wait for them (and has them if the signal goes later).
  useEffect(() => {
    void loadCaptureSchema().catch(() => undefined);
  }, []);

  // The electrode chosen for this survey and the last locations, then the queue; send what waits on opening.
  useEffect(() => {
    let live = true;
    (async () => {
      const chosen = await getSetting<Electrode>(electrodeKey);
      if (live && chosen) setElectrode(chosen);
      // The phone's own last two captures come before the survey's stored readings (which carry no order of capture).
      const locations = await getSetting<string[]>(locationsKey);
      if (live && locations?.length) {
        setRecent(locations);
        setDraft((d) => (d.location && d.location !== serverProposal ? d : { ...d, location: nextLocation(locations.at(-1)!, locations.at(-2)) }));
      }
      const mine = await reload();
      if (live && mine.some(isWaiting)) void send('auto');
    })().catch(() => {
      // The phone's storage cannot be opened (full, private browsing): say so rather than wait for ever.
      if (!live) return;
      setLoaded(true);
      setSaveError(NOT_OPENED);
    });
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the proposal from the server is the first render's
  }, [electrodeKey, locationsKey, reload, send]);

  // Ask the browser to keep the queue through storage pressure, and say so when little room is left.
  useEffect(() => {
    const storage = navigator.storage;
    void storage?.persist?.().catch(() => false);
    void storage
      ?.estimate?.()
      .then(({ quota, usage }) => {
        if (quota !== undefined && usage !== undefined && quota - usage < LOW_STORAGE_BYTES) {
          setStorageNote(`Little room left on this phone for captured items: about ${Math.max(0, Math.floor((quota - usage) / 1024 / 1024))} MB free.`);
        }
      })
      .catch(() => undefined);
  }, []);

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

  /** One save at a time: a second tap while the first is being kept on the phone does nothing. */
  const onceAtATime = (save: () => Promise<void>) => async (event: React.FormEvent) => {
    event.preventDefault();
    if (saving.current || !loaded) return;
    saving.current = true;
    setBusy(true);
    try {
      await save();
    } finally {
      saving.current = false;
      setBusy(false);
    }
  };
  const saveReading = onceAtATime(() => saveReadingNow());

  async function saveReadingNow() {
    const readingElectrode = editing && editElectrode ? editElectrode : electrode;
    const reading: QueuedReading = {
      location: draft.location.trim(),
      potentialV: numberOrNull(draft.potentialV),
      electrode: draft.potentialV.trim() === '' ? null : readingElectrode,
      anodeGroupId: draft.anodeGroupId || null,
      anodeGroupLabel: groups.find((g) => g.id === draft.anodeGroupId)?.label ?? null,
      remainingFraction: draft.remainingPercent.trim() === '' ? null : Number(draft.remainingPercent.trim().replace(',', '.')) / 100,
      comment: draft.comment.trim() || null,
    };
    const deviceId = editing ?? draftId;
    // The server's own rules, checked here first so a mistake is shown at once, offline too.
    const captureReadingSchema = await loadCaptureSchema();
    const checked = captureReadingSchema(readingElectrode).safeParse({ deviceId, kind: 'reading', ...reading });
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
    try {
      await putItem(item);
    } catch {
      setNotice('');
      setSaveError(NOT_SAVED);
      return;
    }
    setSaveError(null);
    setErrors({});
    setEditing(null);
    setEditElectrode(null);
    if (existing) {
      // An old item corrected: the proposal goes on from the last capture, not from the edited one.
      setDraft(emptyDraft(recent.length ? nextLocation(recent.at(-1)!, recent.at(-2)) : '', draft.anodeGroupId));
    } else {
      const locations = [...recent, reading.location].slice(-2);
      setRecent(locations);
      // The form is cleared for the next reading as soon as this one is kept, before the proposal is stored:
      // what the inspector starts typing next is not overwritten by a reset arriving after it.
      setDraft(emptyDraft(nextLocation(reading.location, recent.at(-1) ?? null), draft.anodeGroupId));
      setDraftId(newIdempotencyKey());
      await putSetting(locationsKey, locations).catch(() => undefined);
    }
    setNotice(`Saved on this phone: reading at ${reading.location}.`);
    await reload();
    queued();
  }

  const savePhoto = onceAtATime(() => savePhotoNow());

  async function savePhotoNow() {
    const file = photoInput.current?.files?.[0];
    if (!file || !file.size) return setPhotoError('Take or choose a photo first.');
    if (!PHOTO_TYPES.includes(file.type)) return setPhotoError('Choose a photo in JPEG or PNG.');
    if (file.size > PHOTO_MAX_BYTES) return setPhotoError(`The photo is larger than ${PHOTO_MAX_BYTES / 1024 / 1024} MB; take it at a lower resolution and save again.`);
    setPhotoError(null);
    const deviceId = photoId;
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
    try {
      await putItem(item);
    } catch {
      setNotice('');
      setSaveError(NOT_SAVED);
      return;
    }
    setSaveError(null);
    setPhotoId(newIdempotencyKey());
    if (photoInput.current) photoInput.current.value = '';
    setCaption('');
    setNotice(`Saved on this phone: photo ${item.photo!.filename}.`);
    await reload();
    queued();
  }

  function edit(item: CaptureItem) {
    const r = item.reading!;
    setEditing(item.deviceId);
    setEditElectrode(r.electrode && (SURVEY_ELECTRODE_VALUES as readonly string[]).includes(r.electrode) ? (r.electrode as Electrode) : null);
    setErrors(item.fieldErrors?.remainingFraction ? { ...item.fieldErrors, remainingPercent: item.fieldErrors.remainingFraction } : (item.fieldErrors ?? {}));
    setDraft({
      location: r.location,
      potentialV: r.potentialV === null ? '' : String(r.potentialV),
      anodeGroupId: r.anodeGroupId && groups.some((g) => g.id === r.anodeGroupId) ? r.anodeGroupId : '',
      remainingPercent: r.remainingFraction === null ? '' : String(Math.round(r.remainingFraction * 1000) / 10),
      comment: r.comment ?? '',
    });
    setNotice(`Editing the reading at ${r.location}${r.electrode ? ` (taken against ${ELECTRODE_LABELS[r.electrode] ?? r.electrode})` : ''}: change it and save to send it again.`);
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
    if (editing === deviceId) {
      setEditing(null);
      setEditElectrode(null);
    }
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
    <div className="flex flex-col gap-4" data-capture-panel="" data-capture-ready={loaded ? 'true' : undefined}>
      <div className="rounded-[3px] border border-rule bg-paper-sunk px-3 py-2">
        <p role="status" aria-live="polite" aria-atomic="true" className="text-sm font-medium text-ink" data-testid="capture-status">
          {loaded ? summary.sentence : 'Reading what is saved on this phone…'}
          {notice ? <span className="block font-normal text-ink-soft">{notice}</span> : null}
        </p>
        <p role="alert" className="text-sm font-semibold text-state-action empty:hidden" data-testid="capture-save-error">
          {saveError ?? ''}
        </p>
        {storageNote ? <p className="text-sm text-ink-soft">{storageNote}</p> : null}
        <div className="mt-2 flex flex-wrap items-center gap-2">
          <Button type="button" variant="secondary" onClick={() => void send('button')} disabled={sending || !summary.waiting}>
            {sending ? 'Sending…' : 'Send now'}
          </Button>
        </div>
      </div>

      <SelectField
        label={editing ? 'Reference electrode of the reading being edited' : 'Reference electrode for this survey'}
        name="captureElectrode"
        value={editing && editElectrode ? editElectrode : electrode}
        options={ELECTRODE_OPTIONS}
        onChange={(e) => {
          const value = e.target.value as Electrode;
          if (editing) return setEditElectrode(value);
          setElectrode(value);
          void putSetting(electrodeKey, value).catch(() => undefined);
        }}
      />

      <form onSubmit={saveReading} noValidate aria-label="Capture a reading" className="grid grid-cols-2 gap-3">
        <Field className="col-span-2" label="Location" {...field('location')} autoComplete="off" placeholder="Fr 22 P, Pile B7" />
        {/* A text keyboard: the decimal pad of some phones has no minus sign, and potentials are negative. */}
        <Field label="Potential" {...field('potentialV')} inputMode="text" pattern="[+\-]?[0-9]*([.,][0-9]*)?" autoComplete="off" autoCorrect="off" spellCheck={false} unit="V" hint={`against ${ELECTRODE_LABELS[editing && editElectrode ? editElectrode : electrode]}`} />
        <Field label="Remaining" {...field('remainingPercent')} inputMode="decimal" unit="%" />
        <SelectField className="col-span-2" label="Anode group" {...field('anodeGroupId')} options={[{ value: '', label: 'None' }, ...groups.map((g) => ({ value: g.id, label: g.label }))]} />
        <Field className="col-span-2" label="Comment" {...field('comment')} />
        <div className="col-span-2 flex flex-wrap gap-2">
          {/* Disabled until the page has started and read the queue: a tap before that would not be saved. */}
          <Button type="submit" className="min-h-11 flex-1" disabled={!loaded || busy}>
            {editing ? 'Save and send again' : 'Save reading'}
          </Button>
          {editing ? (
            <Button type="button" variant="secondary" className="min-h-11" onClick={() => {
              setEditing(null);
              setEditElectrode(null);
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
          <input ref={photoInput} type="file" name="photo" accept={PHOTO_TYPES.join(',')} capture="environment" className="min-h-11 max-w-full text-sm text-ink file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-[3px] file:border file:border-solid file:border-tide-600 file:bg-paper file:px-4 file:text-sm file:font-medium file:text-tide-700" onChange={() => setPhotoError(null)} />
        </label>
        <Field label="What the photo shows" name="photoCaption" value={caption} onChange={(e) => setCaption(e.target.value)} />
        {photoError ? <p role="alert" className="text-sm text-state-action">{photoError}</p> : null}
        <Button type="submit" variant="secondary" className="min-h-11" disabled={!loaded || busy}>
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
                {needsYou(item) || (item.state === 'waiting' && item.attempts >= DISCARD_AFTER_ATTEMPTS) ? (
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
