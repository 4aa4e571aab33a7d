/**
 * Entry point of the `mixwise` command line (started by bin/mixwise.mjs).
 * `main` never throws: every fault becomes one line on stderr and an exit code.
 */
import packageJson from '../../package.json' with { type: 'json' };
import { parseArgs } from './args.ts';
import { checkCommand, mergeCommand, runCommand, runCommandOnThreads, type Output } from './commands.ts';
import { EXIT_CODES, reportFault, type ExitCode } from './errors.ts';
import { fitCommand } from './fit.ts';
import { HELP_TEXT } from './help.ts';
import { ordersCommand } from './orders.ts';
import { reportCommand } from './report.ts';

function execute(argv: readonly string[], io: Output): ExitCode {
  // `fit` parses its own options (src/cli/fit.ts).
  if (argv[0] === 'fit') return fitCommand(io, argv.slice(1));
  const command = parseArgs(argv);
  switch (command.kind) {
    case 'help':
      io.out(HELP_TEXT);
      return EXIT_CODES.ok;
    case 'version':
      io.out(`mixwise ${packageJson.version}\n`);
      return EXIT_CODES.ok;
    case 'run':
      return runCommand(io, command.file, command.format, command.out, command.draws);
    case 'merge':
      return mergeCommand(io, command.files, command.format, command.out);
    case 'check':
      return checkCommand(io, command.file);
  }
}

/** Runs the command line with `argv` (without node and script) and returns the exit code. */
export function main(argv: readonly string[], io: Output): ExitCode {
  try {
    return execute(argv, io);
  } catch (err) {
    return reportFault(err, (text) => io.err(text));
  }
}

/**
 * As `main`, and also the commands that must wait for something (`report`: Web Crypto for the
 * fingerprint, Chromium for a PDF; `orders`: the order search). Never rejects.
 */
export async function mainAsync(argv: readonly string[], io: Output): Promise<ExitCode> {
  const wantsHelp = argv.includes('--help') || argv.includes('-h');
  if (argv[0] === 'report' && !wantsHelp) return reportCommand(io, argv.slice(1));
  if (argv[0] === 'orders' && !wantsHelp) return ordersCommand(io, argv.slice(1));
  if (argv[0] === 'run' && !wantsHelp) {
    try {
      const command = parseArgs(argv);
      if (command.kind === 'run') return await runCommandOnThreads(io, command.file, command.format, command.out, command.workers, command.draws);
    } catch (err) {
      return reportFault(err, (text) => io.err(text));
    }
  }
  return main(argv, io);
}

/** The process's own streams; a closed pipe (e.g. `mixwise run x | head`) ends quietly. */
export const processOutput: Output = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
  errIsTerminal: process.stderr.isTTY === true,
};

export function runProcess(): void {
  process.stdout.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  });
  void mainAsync(process.argv.slice(2), processOutput).then((code) => {
    process.exitCode = code;
  });
}
