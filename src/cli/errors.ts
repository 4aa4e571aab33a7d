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
