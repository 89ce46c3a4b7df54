import { bindingUsage } from './bindingCommand';
import { calcUsage } from './calcCommand';
import { calendarUsage } from './calendarCommand';
import { courseUsage } from './courseCommand';
import { archiveUsage, recoverUsage, renameUsage } from './caseFileCommands';
import { doseUsage } from './doseCommand';
import { addUsage, newUsage } from './editCommands';
import { explainUsage } from './explainCommand';
import { importUsage } from './importCommand';
import { panelUsage } from './panelCommand';
import { decisionSupportCaution } from './format';
import { previewUsage } from './previewCommand';
import { sheetUsage } from './sheetCommand';

/** The commands that keep a detailed usage of their own. */
const detailedUsages: Readonly<Record<string, string>> = {
  binding: bindingUsage,
  calc: calcUsage,
  calendar: calendarUsage,
  course: courseUsage,
  dose: doseUsage,
  new: newUsage,
  add: addUsage,
  import: importUsage,
  panel: panelUsage,
  sheet: sheetUsage,
  explain: explainUsage,
  preview: previewUsage,
  rename: renameUsage,
  archive: archiveUsage,
  recover: recoverUsage,
};

/**
 * What `chelation-ledger <command> --help` prints: the command's own usage
 * where it has one, else its lines of the overview (the one place each
 * command is described in a line), then the caution. Undefined for a word
 * that is not a command.
 *
 * @param command - the first word of the command line
 * @param overview - the overview usage (app/cli/main.ts), whose "Commands:" lines start with two spaces and the command
 * @example commandHelp('check', usage)?.startsWith('Usage: chelation-ledger check <case.json>')
 */
export function commandHelp(command: string, overview: string): string | undefined {
  const detailed = Object.hasOwn(detailedUsages, command) ? detailedUsages[command] : undefined;
  if (detailed !== undefined) return `${detailed}\n\n${decisionSupportCaution}`;
  const lines = overview.split('\n');
  const found: string[] = [];
  for (let index = 0; index < lines.length; index += 1) {
    const line = lines[index]!;
    if (!line.startsWith(`  ${command} `) && line !== `  ${command}`) continue;
    // The synopsis and, after a run of spaces, its description (or the description on the next, deeper-indented line).
    const [synopsis, description] = line.trim().split(/\s{2,}/);
    found.push(`Usage: chelation-ledger ${synopsis}`);
    let next = index + 1;
    const descriptions = description ? [description] : [];
    while (next < lines.length && /^ {6,}\S/.test(lines[next]!)) descriptions.push(lines[next++]!.trim());
    if (descriptions.length > 0) found.push(`  ${descriptions.join(' ')}`);
  }
  return found.length > 0 ? `${found.join('\n')}\n\n${decisionSupportCaution}` : undefined;
}
