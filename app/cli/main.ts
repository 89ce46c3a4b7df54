import { parseArgs } from './args';
import { bindingCommand } from './bindingCommand';
import { calcCommand, calcUsage } from './calcCommand';
import { calendarCommand } from './calendarCommand';
import { checkCommand, computeCommand } from './caseCommands';
import type { CaseIo } from './caseReview';
import { explainCommand } from './explainCommand';
import { doseCommand } from './doseCommand';
import { findingsCommand } from './findingsCommand';
import { decisionSupportCaution } from './format';
import { exitCodes } from './io';

const switches = ['--json', '--list', '--help', '--force'] as const;

export const usage = `chelation-ledger — decision support for chelation therapy reviews.

Commands:
  calc --list [--json]                      every calculator: inputs, units, ranges, sources
  calc <calculator> --<input> <value> ...   run one calculator [--json]
  check <case.json>                         validate a case file and list its issues
  compute <case.json> [--as-of YYYY-MM-DD] [--horizon-months N] [--seed N] [--json]
                                            the iron review: intake, body iron, response, projections
  findings <case.json> [--as-of YYYY-MM-DD] [--json]
                                            the safety findings, urgent first, each with its sources
  explain <case.json> [<result>] [--json]   how one result was computed: inputs, formula, sources
  binding [--metal Fe3+] [--weight-kg N] [--json]
                                            metal bound per dose beside pM at pH 7.4; lead and plasma calcium
  binding --sweep --ligand-set <id> [--metal Fe3+] [--json]
                                            pM and log K′ of one constant set against pH 2–12
  dose --product <id> --target-mg-per-kg-per-day N --weight-kg N [--administrations-per-day N] [--catalogue local.json]
                                            nearest practical regimen from the available strengths (dose --list)
  calendar <case.json> [--as-of YYYY-MM-DD] [-o due.ics] [--force]
                                            monitoring due for the active regimens; -o writes an iCalendar file

${calcUsage}

${decisionSupportCaution}`;

/**
 * Run the command line. Pure apart from the io it is handed, so tests call it
 * directly; app/cli/bin.cjs passes the process streams and exits with the code.
 */
export function runCli(argv: readonly string[], io: CaseIo): number {
  const [command, ...rest] = argv;
  if (command === undefined || command === '--help' || command === 'help') {
    io.out(usage);
    return command === undefined ? exitCodes.usage : exitCodes.ok;
  }
  const args = parseArgs(rest, switches);
  switch (command) {
    case 'calc':
      return calcCommand(args, io);
    case 'dose':
      return doseCommand(args, io);
    case 'calendar':
      return calendarCommand(args, io);
    case 'check':
      return checkCommand(args, io);
    case 'compute':
      return computeCommand(args, io);
    case 'findings':
      return findingsCommand(args, io);
    case 'explain':
      return explainCommand(args, io);
    case 'binding':
      return bindingCommand(rest, io);
    default:
      io.err(`Unknown command "${command}".\n\n${usage}`);
      return exitCodes.usage;
  }
}
