// Entry of a pool worker thread where the bundled script (poolWorkerScript.ts) cannot be made:
// load the TypeScript sources through tsx (as bin/mixwise.mjs does), then serve the engine's jobs
// (poolWorker.ts).
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)) });
await import('./poolWorker.ts');
