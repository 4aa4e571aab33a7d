/**
 * The pool thread's code as one script: src/cli/poolWorker.ts and everything it imports (the
 * engine, zod, ml-matrix), bundled by esbuild into CommonJS on first use and kept for the
 * process, so every worker thread started later parses one script (workerThreads.ts).
 *
 * null (the threads then load the sources through tsx) when esbuild fails or warns: a warning
 * means the bundle may differ from the sources, e.g. `import.meta`, which CommonJS lacks.
 */
import { buildSync } from 'esbuild';

let script: string | null | undefined;

/** The bundled worker script, or null where it cannot be made. */
export function poolWorkerScript(): string | null {
  if (script === undefined) script = bundle();
  return script;
}

function bundle(): string | null {
  try {
    const result = buildSync({
      entryPoints: [new URL('./poolWorker.ts', import.meta.url).pathname],
      bundle: true,
      platform: 'node',
      format: 'cjs',
      target: `node${process.versions.node}`,
      write: false,
      logLevel: 'silent',
    });
    const [file] = result.outputFiles;
    return result.warnings.length === 0 && file !== undefined ? file.text : null;
  } catch {
    return null;
  }
}
