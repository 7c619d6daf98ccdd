import { EventEmitter } from 'node:events';
import { spawn, type ChildProcess } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { supervise } from '../../../scripts/lib/supervise.mjs';

/** A stand-in child process: exits when the test says so. */
function fakeChild() {
  const child = new EventEmitter() as EventEmitter & { die: (code: number) => void };
  child.die = (code) => child.emit('exit', code, null);
  return child;
}

/** A clock and scheduler the test drives by hand. */
function manualTime() {
  let now = 0;
  const pending: { at: number; fn: () => void; cancelled: boolean }[] = [];
  return {
    now: () => now,
    schedule: (fn: () => void, ms: number) => {
      const handle = { at: now + ms, fn, cancelled: false };
      pending.push(handle);
      return handle;
    },
    cancel: (handle: unknown) => {
      (handle as { cancelled: boolean }).cancelled = true;
    },
    advance(ms: number) {
      now += ms;
      for (const job of pending.splice(0)) {
        if (job.cancelled) continue;
        if (job.at <= now) job.fn();
        else pending.push(job);
      }
    },
    waiting: () => pending.filter((j) => !j.cancelled).map((j) => j.at - now),
  };
}


/** A supervisor over stand-in children on the hand-driven clock; returns the children it started. */
function superviseFakes(time: ReturnType<typeof manualTime>, options: { name?: string; log?: (line: string) => void; delays?: number[]; stableAfterMs?: number } = {}) {
  const children: ReturnType<typeof fakeChild>[] = [];
  const supervisor = supervise({
    name: options.name ?? 'The worker',
    spawnChild: () => {
      const child = fakeChild();
      children.push(child);
      return child as unknown as ChildProcess;
    },
    log: options.log ?? (() => undefined),
    ...(options.delays ? { delays: options.delays } : {}),
    ...(options.stableAfterMs ? { stableAfterMs: options.stableAfterMs } : {}),
    now: time.now,
    schedule: time.schedule,
    cancel: time.cancel,
  });
  return { supervisor, children };
}

describe('supervise: a dead worker or fake is started again with back-off', () => {
  it('restarts after each unexpected exit with growing pauses, and logs one line each time', () => {
    const time = manualTime();
    const log: string[] = [];
    const { supervisor, children } = superviseFakes(time, { log: (line) => log.push(line), delays: [1000, 2000, 5000], stableAfterMs: 60_000 });
    expect(children).toHaveLength(1);

    children[0].die(1);
    expect(time.waiting()).toEqual([1000]);
    expect(log).toEqual(['The worker stopped unexpectedly (exit code 1); starting it again in 1 s (restart 1).']);
    time.advance(999);
    expect(children).toHaveLength(1);
    time.advance(1);
    expect(children).toHaveLength(2);
    expect(supervisor.child).toBe(children[1]);

    children[1].die(1);
    expect(time.waiting()).toEqual([2000]);
    time.advance(2000);
    children[2].die(137);
    expect(time.waiting()).toEqual([5000]);
    time.advance(5000);
    children[3].die(1);
    // The last pause repeats.
    expect(time.waiting()).toEqual([5000]);
    expect(supervisor.restarts).toBe(4);
    expect(log).toHaveLength(4);
  });

  it('goes back to the shortest pause after the child stayed up for the stable period', () => {
    const time = manualTime();
    const { children } = superviseFakes(time, { name: 'The SMTP fake', delays: [1000, 2000, 5000], stableAfterMs: 60_000 });
    children[0].die(1);
    time.advance(1000);
    children[1].die(1);
    time.advance(2000);
    time.advance(60_000); // up for a minute
    children[2].die(1);
    expect(time.waiting()).toEqual([1000]);
  });

  it('does not restart a child after stop(), nor one whose restart was pending', () => {
    const time = manualTime();
    const { supervisor, children } = superviseFakes(time, { name: 'The Stripe fake', delays: [1000] });
    children[0].die(1);
    expect(supervisor.stop()).toBe(children[0]);
    time.advance(10_000);
    expect(children).toHaveLength(1);

    const second = superviseFakes(time);
    second.supervisor.stop();
    second.children[0].die(0);
    time.advance(120_000);
    expect(second.children).toHaveLength(1);
  });

  it('restarts a real process that keeps dying, with real timers', async () => {
    const log: string[] = [];
    let spawned = 0;
    const supervisor = supervise({
      name: 'A crashing script',
      spawnChild: () => {
        spawned += 1;
        return spawn(process.execPath, ['-e', 'process.exit(3)'], { stdio: 'ignore' });
      },
      log: (line) => log.push(line),
      delays: [20, 40],
    });
    const deadline = Date.now() + 10_000;
    while (spawned < 3 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
    supervisor.stop();
    expect(spawned).toBeGreaterThanOrEqual(3);
    expect(log[0]).toBe('A crashing script stopped unexpectedly (exit code 3); starting it again in 20 ms (restart 1).');
    expect(log[1]).toBe('A crashing script stopped unexpectedly (exit code 3); starting it again in 40 ms (restart 2).');
  });
});
