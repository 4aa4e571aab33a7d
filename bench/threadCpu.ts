/**
 * CPU time per thread of this process, from Linux's /proc/self/task/<tid>/stat (utime + stime,
 * 10 ms ticks): lets the bench split a pool's CPU into this (the main) thread, the worker threads
 * and V8's helper threads (concurrent compiler, garbage collector), which run beside any of them.
 * Elsewhere `threadCpu()` returns null and the bench prints totals only.
 */
import { readdirSync, readFileSync } from 'node:fs';

/** CPU milliseconds by thread id, or null where /proc is missing. */
export function threadCpu(): Map<number, number> | null {
  try {
    const byThread = new Map<number, number>();
    for (const tid of readdirSync('/proc/self/task')) {
      try {
        const stat = readFileSync(`/proc/self/task/${tid}/stat`, 'utf8');
        const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
        byThread.set(Number(tid), (Number(fields[11]) + Number(fields[12])) * 10);
      } catch {
        // the thread ended between the listing and the read
      }
    }
    return byThread;
  } catch {
    return null;
  }
}

/** Milliseconds of CPU between two readings, split into `main` (this thread), the threads in `workers`, and the rest. */
export function cpuSplit(before: Map<number, number>, after: Map<number, number>, workers: ReadonlySet<number>): { main: number; workers: number; helpers: number } {
  const split = { main: 0, workers: 0, helpers: 0 };
  for (const [tid, ms] of after) {
    const spent = ms - (before.get(tid) ?? 0);
    if (tid === process.pid) split.main += spent;
    else if (workers.has(tid)) split.workers += spent;
    else split.helpers += spent;
  }
  return split;
}
