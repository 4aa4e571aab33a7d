/**
 * `npm run wasm`: compiles the option kernel and writes src/engine/wasm/optionKernelBinary.ts
 * (scripts/optionKernelBuild.ts). Run it after every change to src/engine/wasm/assembly/.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { compileOptionKernel, KERNEL_MODULE, kernelModuleText } from './optionKernelBuild.ts';

const bytes = await compileOptionKernel();
const target = fileURLToPath(new URL(`../${KERNEL_MODULE}`, import.meta.url));
writeFileSync(target, kernelModuleText(bytes));
console.log(`wrote ${target} (${bytes.length} bytes of WebAssembly)`);
