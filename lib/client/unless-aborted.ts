/**
 * Settles as `work` does, unless `signal` aborts first: then it rejects with the signal's reason.
 * For work that cannot take a signal itself (a server action): the caller stops waiting, the work runs on.
 */
export function unlessAborted<T>(work: Promise<T>, signal: AbortSignal): Promise<T> {
  if (signal.aborted) return Promise.reject(signal.reason);
  return new Promise<T>((resolve, reject) => {
    const onAbort = () => reject(signal.reason);
    signal.addEventListener('abort', onAbort, { once: true });
    work.then(resolve, reject).finally(() => signal.removeEventListener('abort', onAbort));
  });
}
