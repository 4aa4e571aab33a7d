/**
 * Exit codes of the command line and the one error type commands throw.
 * A `CliError` is always shown as a single line, never as a stack trace.
 */
import { RunRefused } from '../engine/index.ts';

export const EXIT_CODES = {
  ok: 0,
  /** Unknown command or option, missing or extra argument. */
  usage: 1,
  /** The scenario is not valid JSON or breaks a rule of the format, or its run was refused for its numbers (engine RunRefused). */
  invalidScenario: 2,
  /** A file cannot be read or written. */
  fileError: 3,
  /** A fault in the program itself (please report it). */
  internal: 4,
  /** Stopped by Ctrl-C (SIGINT) before the end; nothing written (128 + signal 2, the shells' convention). */
  cancelled: 130,
} as const;

export type ExitCode = (typeof EXIT_CODES)[keyof typeof EXIT_CODES];

export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode: ExitCode,
  ) {
    super(message);
    this.name = 'CliError';
  }
}

/**
 * `err` as thrown on, with a run the engine refused (RunRefused: a next-generation matrix whose R
 * cannot be pinned down mid-run) turned into the invalid-scenario CliError `FILE: path rule`, the
 * form of the problems `check` lists. For `catch (err) { throw inFile(err, file); }`.
 */
export function inFile(err: unknown, file: string): unknown {
  return err instanceof RunRefused ? new CliError(`${file}: ${err.message}`, EXIT_CODES.invalidScenario) : err;
}

/**
 * Turns anything a command threw into one line on `writeErr` and an exit code: a `CliError` with
 * its own message and code, a refused run as an invalid scenario, any other fault as an internal
 * error (first line of its message).
 */
export function reportFault(err: unknown, writeErr: (text: string) => void): ExitCode {
  if (err instanceof CliError) {
    writeErr(`mixwise: ${err.message}\n`);
    return err.exitCode;
  }
  if (err instanceof RunRefused) {
    writeErr(`mixwise: ${err.message}\n`);
    return EXIT_CODES.invalidScenario;
  }
  const message = err instanceof Error ? err.message : String(err);
  writeErr(`mixwise: internal error: ${message.split('\n')[0]}\n`);
  return EXIT_CODES.internal;
}
