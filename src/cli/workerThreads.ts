/**
 * The engine's worker pool on Node's worker_threads: `nodeWorkerPool(size)` starts `size` threads,
 * each serving the engine's jobs (src/engine/pool/jobs.ts) through src/cli/poolWorker.ts.
 *
 * A thread runs poolWorker.ts and everything it imports bundled into one CommonJS script by
 * esbuild, once per process (poolWorkerScript.ts): loading the ~100 TypeScript modules through tsx
 * in each thread instead (poolWorker.mjs, as bin/mixwise.mjs does for the main thread) costs
 * about 0.35 s of CPU per thread before its first task. Where the bundle cannot be made, the
 * threads load the sources through tsx.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { WorkerPool, type PoolEndpoint, type PoolReply } from '../engine/index.ts';
import { poolWorkerScript } from './poolWorkerScript.ts';

function spawnThread(): PoolEndpoint {
  const script = poolWorkerScript();
  const worker = script === null ? new Worker(new URL('./poolWorker.mjs', import.meta.url)) : new Worker(script, { eval: true, name: 'mixwise-pool' });
  return {
    post: (message) => worker.postMessage(message),
    listen(onReply, onCrash) {
      worker.on('message', (reply: PoolReply) => onReply(reply));
      worker.on('error', (err) => onCrash(err.message));
      worker.on('exit', (code) => {
        if (code !== 0) onCrash(`exit code ${code}`);
      });
    },
    terminate: () => void worker.terminate(),
  };
}

/** A pool of `size` worker threads (default: one per core the process may use). */
export function nodeWorkerPool(size = availableParallelism()): WorkerPool {
  return new WorkerPool(spawnThread, size);
}
