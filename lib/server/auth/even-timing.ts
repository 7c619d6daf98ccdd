import { setTimeout as sleep } from 'node:timers/promises';
import type { Effects } from '../unit-of-work';

/**
 * Call first in an action whose answer must not reveal whether an account exists: once the change is
 * committed, the answer waits until `ms` have passed since this call, so the time taken does not tell which
 * branch ran. The branches already do alike work (the address is mailed either way); the floor hides what
 * still differs (a row more or less, written at the flush just before the commit).
 */
export function answerNoSoonerThan(effects: Effects, ms: number) {
  const started = performance.now();
  effects.onCommit(async () => {
    const left = ms - (performance.now() - started);
    if (left > 0) await sleep(left);
  });
}

/** Sign-up hashes the password either way; a new account writes a few more rows. */
export const SIGN_UP_FLOOR_MS = 750;
/** A reset request mails the address either way; a known one writes its link as well. */
export const RESET_REQUEST_FLOOR_MS = 500;
