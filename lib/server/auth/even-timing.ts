import { setTimeout as sleep } from 'node:timers/promises';

/**
 * Runs the work (a whole action: its transaction, commit and answer) and answers no sooner than `ms` after it
 * started, so the time taken does not tell which branch ran. The branches already do alike work (the address
 * is mailed either way); the floor hides what still differs (a row more or less). Errors and redirects wait
 * the same way. Only for forms whose answer must not reveal whether an account exists.
 */
export async function answerNoSoonerThan<T>(ms: number, work: () => Promise<T>): Promise<T> {
  const started = performance.now();
  try {
    return await work();
  } finally {
    const left = ms - (performance.now() - started);
    if (left > 0) await sleep(left);
  }
}

/** Sign-up hashes the password either way; a new account writes a few more rows. */
export const SIGN_UP_FLOOR_MS = 750;
/** A reset request mails the address either way; a known one writes its link as well. */
export const RESET_REQUEST_FLOOR_MS = 500;
