#!/usr/bin/env node
// The `mixwise` command: loads the TypeScript sources through tsx (no build step needed)
// and runs src/cli/main.ts. See `mixwise --help`.
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/esm/api';

register({ tsconfig: fileURLToPath(new URL('../tsconfig.json', import.meta.url)) });
const { runProcess } = await import('../src/cli/main.ts');
runProcess();
