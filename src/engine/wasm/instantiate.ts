/**
 * A WebAssembly module compiled and instantiated synchronously, or null where the platform cannot:
 * no WebAssembly (node --jitless), no SIMD, or a Content Security Policy without
 * 'wasm-unsafe-eval'. The engine's callers then take their TypeScript path (same numbers).
 */

/**
 * The part of the WebAssembly JavaScript interface used here, declared here: the engine's
 * TypeScript settings carry no host (browser or Node) declarations.
 */
interface WebAssemblyApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports?: object) => { exports: unknown };
}

/** The exports of `bytes` instantiated with `imports`, or null where it cannot compile here. */
export function instantiateWasm(bytes: Uint8Array, imports: object = {}): Record<string, unknown> | null {
  const api = (globalThis as { WebAssembly?: WebAssemblyApi }).WebAssembly;
  if (api === undefined) return null;
  try {
    return new api.Instance(new api.Module(bytes), imports).exports as Record<string, unknown>;
  } catch {
    return null;
  }
}
