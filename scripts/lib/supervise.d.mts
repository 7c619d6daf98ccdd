import type { ChildProcess } from 'node:child_process';

export declare const RESTART_DELAYS_MS: number[];
export declare const STABLE_AFTER_MS: number;
export interface Supervisor {
  readonly name: string;
  readonly child: ChildProcess;
  readonly restarts: number;
  stop(): ChildProcess;
}
export declare function supervise(options: {
  name: string;
  spawnChild: () => ChildProcess;
  log: (line: string) => void;
  delays?: number[];
  stableAfterMs?: number;
  now?: () => number;
  schedule?: (fn: () => void, ms: number) => unknown;
  cancel?: (handle: unknown) => void;
}): Supervisor;
