/** One worker thread of the engine's pool (workerThreads.ts): serves the engine's jobs on parentPort. */
import { parentPort } from 'node:worker_threads';
import { serveJobs, type PoolReply, type PoolRequest } from '../engine/index.ts';

const port = parentPort;
if (port === null) throw new Error('poolWorker.ts runs only as a worker thread');
serveJobs({
  listen: (onRequest) => port.on('message', (request: PoolRequest) => onRequest(request)),
  post: (reply: PoolReply, transfer) => port.postMessage(reply, transfer),
});
