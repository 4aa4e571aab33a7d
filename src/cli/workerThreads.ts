/**
 * The engine's worker pool on Node's worker_threads: `nodeWorkerPool(size)` starts `size` threads
 * running src/cli/poolWorker.ts (through poolWorker.mjs, which loads the TypeScript sources with
 * tsx as bin/mixwise.mjs does), each serving the engine's jobs (src/engine/pool/jobs.ts).
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { WorkerPool, type PoolEndpoint, type PoolReply } from '../engine/index.ts';

function spawnThread(): PoolEndpoint {
  const worker = new Worker(new URL('./poolWorker.mjs', import.meta.url));
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
