'use client';
import { useRef, useState } from 'react';
import { clearOfflineData, unsentOnThisPhone } from '@/lib/offline/sign-out';
import { SIGN_OUT_WORDS } from '@/lib/labels/capture';

/**
 * The sign-out form: before the session ends it clears what the phone keeps for offline use (cached survey pages,
 * the capture queue). When captured items were never sent, or the phone's storage cannot be read, it says so and
 * asks first; "Keep them" stays signed in. Without a connection it deletes nothing: the session could not end.
 */
export function SignOutForm({ action, className, buttonClassName, children }: { action: () => Promise<void>; className?: string; buttonClassName: string; children?: React.ReactNode }) {
  const form = useRef<HTMLFormElement>(null);
  const cleared = useRef(false);
  // What stands between the click and the sign-out: items never sent (a count), storage that could not be read
  // ('unknown'), or no connection ('offline': the session cannot be ended, so nothing is deleted either).
  const [question, setQuestion] = useState<number | 'unknown' | 'offline' | null>(null);

  async function clearAndSubmit() {
    await clearOfflineData();
    cleared.current = true;
    form.current?.requestSubmit();
  }

  return (
    <form
      ref={form}
      action={action}
      className={className}
      onSubmit={(event) => {
        if (cleared.current) return;
        event.preventDefault();
        void (async () => {
          // Nothing is deleted unless the server can be reached (the sign-out needs it): a phone that believes it
          // is online on one bar, or behind a harbour Wi-Fi's sign-in page, would lose its pages and stay signed in.
          if (!(await serverReachable())) return setQuestion('offline');
          const count = await unsentOnThisPhone();
          if (count === null) setQuestion('unknown');
          else if (count) setQuestion(count);
          else await clearAndSubmit();
        })();
      }}
    >
      {children}
      {question === 'offline' ? (
        <span role="alert" className="flex flex-col gap-1">
          <span>{SIGN_OUT_WORDS.offline}</span>
          <button type="button" className={buttonClassName} onClick={() => setQuestion(null)}>
            {SIGN_OUT_WORDS.understood}
          </button>
        </span>
      ) : question !== null ? (
        <span role="alert" className="flex flex-col gap-1">
          <span>{question === 'unknown' ? SIGN_OUT_WORDS.unknown : SIGN_OUT_WORDS.unsent(question)}</span>
          <button type="button" className={buttonClassName} onClick={() => void clearAndSubmit()}>
            {question === 'unknown' ? SIGN_OUT_WORDS.signOutAnyway : SIGN_OUT_WORDS.deleteAndSignOut}
          </button>
          <button type="button" className={buttonClassName} onClick={() => setQuestion(null)}>
            {SIGN_OUT_WORDS.keep}
          </button>
        </span>
      ) : (
        <button type="submit" className={buttonClassName}>
          Sign out
        </button>
      )}
    </form>
  );
}

/** Whether this app's server answers at all (any status), within a few seconds. */
async function serverReachable(): Promise<boolean> {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return false;
  try {
    const res = await fetch('/api/health', { cache: 'no-store', credentials: 'omit', signal: AbortSignal.timeout(5000) });
    // A captive portal answers from elsewhere: only this app's own answer counts.
    return !res.redirected && res.headers.get('content-type')?.includes('application/json') === true;
  } catch {
    return false;
  }
}
