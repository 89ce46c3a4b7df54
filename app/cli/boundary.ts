import { exitCodes, type CliIo } from './io';

/**
 * The one line a user reads when the tool itself fails (a bug, never a bad input):
 * the command, the file or calculator it was working on, the error's own message,
 * and where to find the trace. No stack trace unless `--debug` was given.
 */
export function unexpectedErrorLine(argv: readonly string[], error: unknown): string {
  const [command = '(none)', target] = argv.filter((it) => !it.startsWith('-'));
  const message = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
  const on = target === undefined ? '' : ` on ${target}`;
  return `chelation-ledger ${command}${on}: unexpected internal error (${message.split('\n')[0]}). This is a fault of the tool, not of your input; nothing was written. Run again with --debug to see the trace, and report it.`;
}

/**
 * The process boundary: run the command line and turn any error that escapes it
 * into one line on stderr and exit code 3. `--debug` (anywhere in argv) is taken
 * out before the command sees it and adds the trace.
 */
export async function runAtBoundary(
  argv: readonly string[],
  io: CliIo,
  run: (argv: readonly string[]) => Promise<number>,
): Promise<number> {
  const debug = argv.includes('--debug');
  const rest = argv.filter((it) => it !== '--debug');
  try {
    return await run(rest);
  } catch (error) {
    io.err(unexpectedErrorLine(rest, error));
    if (debug) io.err(error instanceof Error && error.stack ? error.stack : String(error));
    return exitCodes.unexpected;
  }
}
