'use client';
import { useRef, useState } from 'react';
import { clearOfflineData, unsentOnThisPhone } from '@/lib/offline/sign-out';

/**
 * The sign-out form: before the session ends it clears what the phone keeps for offline use (cached survey pages,
 * the capture queue). When captured items were never sent it says so and asks first; "Keep them" stays signed in.
 */
export function SignOutForm({ action, className, buttonClassName, children }: { action: () => Promise<void>; className?: string; buttonClassName: string; children?: React.ReactNode }) {
  const form = useRef<HTMLFormElement>(null);
  const cleared = useRef(false);
  const [unsent, setUnsent] = useState(0);

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
        void unsentOnThisPhone().then((count) => (count ? setUnsent(count) : clearAndSubmit()));
      }}
    >
      {children}
      {unsent ? (
        <span role="alert" className="flex flex-col gap-1">
          <span>
            {unsent} captured item{unsent === 1 ? ' has' : 's have'} not been sent. Signing out deletes {unsent === 1 ? 'it' : 'them'} from this phone.
          </span>
          <button type="button" className={buttonClassName} onClick={() => void clearAndSubmit()}>
            Delete and sign out
          </button>
          <button type="button" className={buttonClassName} onClick={() => setUnsent(0)}>
            Keep them and stay signed in
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
