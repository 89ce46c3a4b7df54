import { parseArgs, repeatedOptionProblems, type ParsedArgs } from './args';
import { bindingCommand } from './bindingCommand';
import { calcCommand, calcUsage } from './calcCommand';
import { calendarCommand, type CalendarHostIo } from './calendarCommand';
import { commandHelp } from './commandHelp';
import { checkCommand, computeCommand } from './caseCommands';
import { courseCommand, type CourseHostIo } from './courseCommand';
import type { CaseIo } from './caseReview';
import { explainCommand } from './explainCommand';
import { doseCommand } from './doseCommand';
import { addCommand, newCommand, type StoreIo } from './editCommands';
import { archiveCommand, recoverCommand, renameCommand } from './caseFileCommands';
import { panelCommand, type PanelIo } from './panelCommand';
import { importCommand } from './importCommand';
import { findingsCommand } from './findingsCommand';
import { previewCommand, type PreviewHostIo } from './previewCommand';
import { sheetCommand, type SheetHostIo } from './sheetCommand';
import { decisionSupportCaution } from './format';
import { exitCodes, type TextIo } from './io';

const switches = ['--json', '--list', '--help', '--force', '--dry-run'] as const;

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
  preview [--port N] [--workspace DIR]      the app in a browser on this computer only; prints its address
  course --list [--json] | course <regimen> --weight-kg N [--height-cm N] [--age-years N] --start YYYY-MM-DDTHH:mm [-o course.ics]
                                            a heavy-metal course planned to the dose, the day and the salt (course --help)
  sheet <case.json> -o review.pdf [--paper a4|letter] [--as-of YYYY-MM-DD] [--prepared-by NAME] [--force]
                                            the review sheet as a PDF, with the caution on every page
  new <case.json> --label CODE --birth-date D --sex-at-birth S --diagnosis-group G --weight-kg N
                                            a new case file, with its journal (new --help for all options)
  add transfusion|result|period|comedication <case.json> --date D ...
                                            one entry, checked like check, saved atomically (add --help)
  import <file.csv|bundle.json> --into <case.json> [--dry-run]
                                            transfusions and results from CSV or a FHIR R4 Bundle (import --help)
  panel <folder> [--as-of YYYY-MM-DD] [--json]
                                            every case in a folder reviewed and ranked by urgency
  rename <case.json> <new-name.json>        rename a case file with its journal (never over another file)
  archive <case.json>                       move a case and its journal to archive/ (nothing is deleted)
  recover <case.json> [--dry-run] [--as <new-name.json>]
                                            bring back the journal's latest state after a save was cut off

${calcUsage}

${decisionSupportCaution}`;

/** Everything the host hands the command line: streams, the case reader, the clock, file reading and writing. */
export type CliHostIo = CaseIo & CalendarHostIo & TextIo & PreviewHostIo & CourseHostIo & Partial<SheetHostIo> & StoreIo & PanelIo;

/** A subcommand: parsed arguments and the host io in, the exit code out (it may be async). */
export type Command = (args: ParsedArgs, io: CliHostIo) => number | Promise<number>;

/** The subcommands, one line each (add yours here). */
const commands: Readonly<Record<string, Command>> = {
  calc: calcCommand,
  dose: doseCommand,
  calendar: calendarCommand,
  check: checkCommand,
  compute: computeCommand,
  findings: findingsCommand,
  explain: explainCommand,
  preview: previewCommand,
  sheet: sheetCommand,
  new: newCommand,
  add: addCommand,
  panel: panelCommand,
  import: importCommand,
  rename: renameCommand,
  archive: archiveCommand,
  recover: recoverCommand,
};

/**
 * Run the command line. Pure apart from the io it is handed, so tests call it
 * directly; app/cli/entry.ts passes the process streams and sets the exit code.
 * A thrown error is a fault of the tool: the process boundary (app/cli/boundary.ts)
 * turns it into one line and exit code 3.
 */
export async function runCli(argv: readonly string[], io: CliHostIo): Promise<number> {
  const [command, ...rest] = argv;
  if (command === undefined || command === '--help' || command === 'help') {
    io.out(usage);
    return command === undefined ? exitCodes.usage : exitCodes.ok;
  }
  // Every command answers --help with its usage and exit 0.
  const help = rest.includes('--help') ? commandHelp(command, usage) : undefined;
  if (help !== undefined) {
    io.out(help);
    return exitCodes.ok;
  }
  // binding parses its own arguments (it has a --sweep switch).
  if (command === 'binding') return bindingCommand(rest, io);
  // course parses its own arguments (it has an --encephalopathy switch).
  if (command === 'course') return courseCommand(rest, io);
  const run = Object.hasOwn(commands, command) ? commands[command] : undefined;
  if (run === undefined) {
    io.err(`Unknown command "${command}".\n\n${usage}`);
    return exitCodes.usage;
  }
  const args = parseArgs(rest, switches);
  const repeated = repeatedOptionProblems(args);
  if (repeated.length > 0) {
    io.err(repeated.join('\n'));
    return exitCodes.usage;
  }
  return run(args, io);
}
