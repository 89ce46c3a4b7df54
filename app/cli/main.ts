import { parseArgs } from './args';
import { calcCommand, calcUsage } from './calcCommand';
import { decisionSupportCaution } from './format';
import { exitCodes, type CliIo } from './io';

const switches = ['--json', '--list', '--help'] as const;

export const usage = `chelation-ledger — decision support for chelation therapy reviews.

Commands:
  calc --list [--json]                      every calculator: inputs, units, ranges, sources
  calc <calculator> --<input> <value> ...   run one calculator [--json]

${calcUsage}

${decisionSupportCaution}`;

/**
 * Run the command line. Pure apart from the io it is handed, so tests call it
 * directly; app/cli/bin.cjs passes the process streams and exits with the code.
 */
export function runCli(argv: readonly string[], io: CliIo): number {
  const [command, ...rest] = argv;
  if (command === undefined || command === '--help' || command === 'help') {
    io.out(usage);
    return command === undefined ? exitCodes.usage : exitCodes.ok;
  }
  const args = parseArgs(rest, switches);
  switch (command) {
    case 'calc':
      return calcCommand(args, io);
    default:
      io.err(`Unknown command "${command}".\n\n${usage}`);
      return exitCodes.usage;
  }
}
