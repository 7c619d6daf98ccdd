'use client';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { usePathname } from 'next/navigation';
import { Button } from './button';
import type { ActionState } from '@/lib/server/action';
import { IDEMPOTENCY_FIELD, newIdempotencyKey } from '@/lib/client/idempotency-key';

/** How long a removal can be undone from the screen. */
export const UNDO_SECONDS = 10;

export interface Notice {
  /** What was done, in words the user recognises ("Removed Ann Other (ann@…)"). */
  message: string;
  ok: boolean;
  /** Present while the change can be undone: the button's accessible name and what it runs. */
  undo?: { label: string; run: () => void | Promise<unknown> };
  /** Changes on every new notice, so the same words twice still show (and restart the countdown). */
  id: number;
}

/**
 * The confirmation of a change, announced politely (role status) and, for a
 * removal, with an Undo button for UNDO_SECONDS seconds. The live region is always in the page, so
 * screen readers hear each new message.
 */
export function NoticeBar({ notice, pending = false }: { notice: Notice | null; pending?: boolean }) {
  const [left, setLeft] = useState(0);
  const noticeId = notice?.id;
  const canUndo = Boolean(notice?.undo);
  useEffect(() => {
    if (!canUndo) return;
    setLeft(UNDO_SECONDS);
    const timer = setInterval(() => setLeft((s) => (s > 0 ? s - 1 : 0)), 1000);
    return () => clearInterval(timer);
  }, [noticeId, canUndo]);
  const undo = notice?.undo && left > 0 ? notice.undo : null;
  return (
    <div role="status" aria-live="polite" className="empty:hidden">
      {notice ? (
        <div
          data-testid="notice"
          className={`flex flex-wrap items-center gap-3 rounded-[3px] border px-3 py-2 text-sm ${notice.ok ? 'border-state-sound/40 bg-state-soundbg text-state-sound' : 'border-state-action/40 bg-state-actionbg text-state-action'}`}
        >
          <span className="flex-1">{notice.message}</span>
          {undo ? (
            <Button type="button" variant="secondary" disabled={pending} onClick={undo.run} aria-label={`${undo.label} (${left} s left)`}>
              Undo <span className="text-xs text-ink-soft" aria-hidden="true">({left} s)</span>
            </Button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}

/** A notice from an action's answer, with a fresh id each time the answer changes. */
export function useNotice() {
  const [notice, setNotice] = useState<Notice | null>(null);
  return {
    notice,
    show: (next: Omit<Notice, 'id'>) => setNotice({ ...next, id: Date.now() + Math.random() }),
    clear: () => setNotice(null),
  };
}

// A notice that must outlive the control that caused it (the archived row is gone once the page
// refreshes): one store for the page, shown by NoticeHost at the foot of the window.
type Listener = () => void;
let current: Notice | null = null;
const listeners = new Set<Listener>();
const emit = () => listeners.forEach((listener) => listener());

/** Shows a notice in the page's NoticeHost (replacing the one before). */
export function announce(next: Omit<Notice, 'id'>) {
  current = { ...next, id: Date.now() + Math.random() };
  emit();
}

/** Takes the page's notice away (e.g. once a save has made its Undo meaningless). */
export function dismissNotice() {
  if (!current) return;
  current = null;
  emit();
}

/** The page-wide notice: polite, dismissable, with Undo while it lasts. Mounted once, in Providers. */
export function NoticeHost() {
  const notice = useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => current,
    () => null,
  );
  const [pending, setPending] = useState(false);
  // A notice (and its Undo) belongs to the page it was given on.
  const pathname = usePathname();
  useEffect(() => dismissNotice(), [pathname]);
  const shownId = notice?.id;
  useEffect(() => {
    if (shownId === undefined) return;
    // Gone a few seconds after the Undo has lapsed; a newer notice keeps its own time.
    const timer = setTimeout(() => {
      if (current?.id === shownId) {
        current = null;
        emit();
      }
    }, (UNDO_SECONDS + 5) * 1000);
    return () => clearTimeout(timer);
  }, [shownId]);
  const wrapped = notice?.undo
    ? {
        ...notice,
        undo: {
          label: notice.undo.label,
          run: () => {
            setPending(true);
            Promise.resolve(notice.undo!.run()).finally(() => setPending(false));
          },
        },
      }
    : notice;
  return (
    <div className="no-print pointer-events-none fixed inset-x-0 bottom-4 z-50 flex justify-center px-4">
      <div className="pointer-events-auto w-full max-w-xl shadow-lg">
        <NoticeBar notice={wrapped} pending={pending} />
      </div>
    </div>
  );
}

type UndoableAction = (prev: ActionState, formData: FormData) => Promise<ActionState>;

/**
 * The Undo button's work for a removal: sends `action` (the restore) with `fields` and says its answer in the
 * page's notice, then runs `after` (refresh what it changed). The idempotency key is made once, when the notice
 * is given, so a double click or a retried request restores once and replays the first answer.
 */
export function undoBy(action: UndoableAction, fields: Record<string, string>, after?: (answer: ActionState) => void | Promise<void>) {
  const key = newIdempotencyKey();
  return async () => {
    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) form.set(name, value);
    form.set(IDEMPOTENCY_FIELD, key);
    const answer = await action({ ok: false }, form);
    announce({ ok: answer.ok, message: answer.message ?? '' });
    await after?.(answer);
  };
}
