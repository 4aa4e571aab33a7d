/**
 * The committed kernel binary (src/engine/wasm/optionKernelBinary.ts) is what its source
 * compiles to: rebuilt here with the pinned AssemblyScript compiler (scripts/optionKernelBuild.ts).
 * When this fails, run `npm run wasm` and commit the result.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileOptionKernel, KERNEL_MODULE, kernelModuleText } from '../../scripts/optionKernelBuild.ts';

describe('option kernel binary', () => {
  it('is the compiled source (run `npm run wasm` after changing src/engine/wasm/assembly/)', async () => {
    const bytes = await compileOptionKernel();
    expect(readFileSync(KERNEL_MODULE, 'utf8')).toBe(kernelModuleText(bytes));
  }, 60_000);
});
