/**
 * One engine worker of the app's pool (engineClient.ts): serves the engine's jobs
 * (src/engine/pool/jobs.ts) to the renderer, transferring result buffers rather than copying them.
 */
import { serveJobs, type PoolReply, type PoolRequest } from '../../engine/index.ts';

const scope = self as unknown as Worker;
serveJobs({
  listen: (onRequest) => scope.addEventListener('message', (event: MessageEvent<PoolRequest>) => onRequest(event.data)),
  post: (reply: PoolReply, transfer) => scope.postMessage(reply, transfer),
});
