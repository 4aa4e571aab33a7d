/**
 * instantiateWasm (src/engine/wasm/instantiate.ts): the exports where the platform compiles the
 * bytes, null where it cannot (the option kernel and the paired convolution then take their
 * TypeScript paths).
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { instantiateWasm } from '../../src/engine/wasm/instantiate.ts';

// The smallest module with one export: (func (export "one") (result i32) i32.const 1).
const ONE = new Uint8Array([
  0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, 0x01, 0x05, 0x01, 0x60, 0x00, 0x01, 0x7f, 0x03, 0x02, 0x01, 0x00,
  0x07, 0x07, 0x01, 0x03, 0x6f, 0x6e, 0x65, 0x00, 0x00, 0x0a, 0x06, 0x01, 0x04, 0x00, 0x41, 0x01, 0x0b,
]);

describe('instantiateWasm', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('gives the exports of a module that compiles', () => {
    const exports = instantiateWasm(ONE);
    expect(exports).not.toBeNull();
    expect((exports?.one as () => number)()).toBe(1);
  });

  it('gives null for bytes that do not compile, and where there is no WebAssembly', () => {
    expect(instantiateWasm(ONE.slice(0, ONE.length - 3))).toBeNull();
    vi.stubGlobal('WebAssembly', undefined);
    expect(instantiateWasm(ONE)).toBeNull();
  });
});
