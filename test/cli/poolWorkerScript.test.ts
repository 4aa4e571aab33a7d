/**
 * The pool threads' bundled script (src/cli/poolWorkerScript.ts): made without warnings, so
 * `nodeWorkerPool` starts its threads from it rather than falling back to loading the sources
 * through tsx in every thread. (test/engine/pool.test.ts compares the results of threads started
 * from it with one thread's, byte for byte.)
 */
import { describe, expect, it } from 'vitest';
import { poolWorkerScript } from '../../src/cli/poolWorkerScript.ts';

describe('pool worker script', () => {
  it('bundles poolWorker.ts and the engine into one script, once per process', () => {
    const script = poolWorkerScript();
    expect(script).not.toBeNull();
    expect(script).toContain('function serveJobs(');
    expect(poolWorkerScript()).toBe(script);
  });
});
