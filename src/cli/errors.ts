/**
 * Exit codes of the command line and the one error type commands throw.
 * A `CliError` is always shown as a single line, never as a stack trace.
 */
export const EXIT_CODES = {
  ok: 0,
  /** Unknown command or option, missing or extra argument. */
  usage: 1,
  /** The scenario is not valid JSON or breaks a rule of the format. */
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
 * Turns anything a command threw into one line on `writeErr` and an exit code: a `CliError` with
 * its own message and code, any other fault as an internal error (first line of its message).
 */
export function reportFault(err: unknown, writeErr: (text: string) => void): ExitCode {
  if (err instanceof CliError) {
    writeErr(`mixwise: ${err.message}\n`);
    return err.exitCode;
  }
  const message = err instanceof Error ? err.message : String(err);
  writeErr(`mixwise: internal error: ${message.split('\n')[0]}\n`);
  return EXIT_CODES.internal;
}
