// Keeps a long-running child (the worker, the fakes) alive: when it exits without being asked to,
// it is started again after a growing pause, and one line in the log says so. A child that stayed up
// for a while before failing starts again from the shortest pause. Plain Node, no dependencies.

/** Pauses before the 1st, 2nd, 3rd … restart; the last one repeats. */
export const RESTART_DELAYS_MS = [1_000, 2_000, 5_000, 10_000, 30_000, 60_000];
/** A child that ran this long before it stopped counts as healthy: its next restart waits the shortest pause. */
export const STABLE_AFTER_MS = 60_000;

/**
 * @param {{
 *   name: string,
 *   spawnChild: () => import('node:child_process').ChildProcess,
 *   log: (line: string) => void,
 *   delays?: number[],
 *   stableAfterMs?: number,
 *   now?: () => number,
 *   schedule?: (fn: () => void, ms: number) => unknown,
 *   cancel?: (handle: unknown) => void,
 * }} options
 */
export function supervise({ name, spawnChild, log, delays = RESTART_DELAYS_MS, stableAfterMs = STABLE_AFTER_MS, now = Date.now, schedule = setTimeout, cancel = clearTimeout }) {
  let child = null;
  let stopped = false;
  let failuresInARow = 0;
  let restarts = 0;
  let startedAt = 0;
  let timer = null;

  const launch = () => {
    startedAt = now();
    const current = spawnChild();
    child = current;
    current.once('exit', (code, signal) => {
      if (stopped || current !== child) return;
      if (now() - startedAt >= stableAfterMs) failuresInARow = 0;
      const delay = delays[Math.min(failuresInARow, delays.length - 1)];
      failuresInARow += 1;
      restarts += 1;
      const how = signal ? `signal ${signal}` : `exit code ${code}`;
      log(`${name} stopped unexpectedly (${how}); starting it again in ${formatPause(delay)} (restart ${restarts}).`);
      timer = schedule(() => {
        timer = null;
        if (!stopped) launch();
      }, delay);
    });
  };
  launch();

  return {
    name,
    /** The child running now (a new process after each restart). */
    get child() {
      return child;
    },
    get restarts() {
      return restarts;
    },
    /** No more restarts; the caller stops the current child. */
    stop() {
      stopped = true;
      if (timer) cancel(timer);
      timer = null;
      return child;
    },
  };
}

function formatPause(ms) {
  return ms >= 1000 ? `${Math.round(ms / 100) / 10} s` : `${ms} ms`;
}
