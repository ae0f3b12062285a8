import os from "node:os";
import { Piscina } from "piscina";

export type WorkerPool<Task, Result> = {
  run(task: Task): Promise<Result>;
  /** True when the queue is at its bound: callers answer 503 instead of queueing more. */
  isFull(): boolean;
  stats(): { running: number; queued: number };
  close(): Promise<void>;
};

/** A bounded pool of worker threads running a TypeScript module through tsx. */
export function createWorkerPool<Task, Result>(opts: {
  filename: string;
  maxThreads?: number;
  maxQueue?: number;
}): WorkerPool<Task, Result> {
  const maxThreads = opts.maxThreads ?? Math.max(1, Math.min(4, os.availableParallelism() - 1 || 1));
  const maxQueue = opts.maxQueue ?? 16;
  const pool = new Piscina({
    filename: opts.filename,
    execArgv: ["--import", "tsx"],
    minThreads: 0,
    maxThreads,
    maxQueue,
    // A fresh thread runs its first few uploads 2–3× slower while V8 optimises the analysis
    // (scripts/bench-analyze.ts prints the warm-up): keep warmed threads through a quiet spell,
    // but still let them go (and their memory) when nobody posts for a while.
    idleTimeout: 10 * 60_000,
  });
  return {
    run: (task) => pool.run(task) as Promise<Result>,
    isFull: () => pool.queueSize >= maxQueue,
    stats: () => ({ running: pool.utilization > 0 ? pool.threads.length : 0, queued: pool.queueSize }),
    close: () => pool.destroy(),
  };
}
