import { basename, dirname, join } from 'node:path';
import { formatIssues } from '../../core/result';
import type { CaseStore, OpenedCase } from '../host/caseStore';
import type { ParsedArgs } from './args';
import type { StoreIo } from './editCommands';
import { exitCodes, type CliIo } from './io';

/**
 * `rename`, `archive` and `recover`: the case store's own operations
 * (app/host/caseStore.ts) on one case file and its journal, as the desktop
 * app's Cases screen does them. Nothing here deletes a file or writes over a
 * case without the store's checks (atomic save, journal line, change on disk).
 */

type FileIo = CliIo & StoreIo;

export const renameUsage = `Usage: chelation-ledger rename <case.json> <new-name.json>
Renames a case file and its journal in the same folder (never over an existing file); the history records the rename.`;

export const archiveUsage = `Usage: chelation-ledger archive <case.json>
Moves a case file and its journal into the archive/ folder beside it (a numbered name if that name is taken there).
Nothing is deleted; the app lists archived cases apart.`;

export const recoverUsage = `Usage: chelation-ledger recover <case.json> [--dry-run] [--as <new-name.json>]
Brings back the latest state the case's journal holds, after a save that was cut off (a crash, a power cut)
or when the file is missing or no longer opens. Shows the recent history, then saves that state through
the case store (atomic, one journal line); --dry-run only shows it. When another program changed the file
after the journal's last change, the file is not written over: --as writes the journal's state to a new file.`;

/** Unknown options and extra words, one line each. */
function extraProblems(args: ParsedArgs, command: string, positionals: number, known: readonly string[], switches: readonly string[]): string[] {
  return [
    ...args.positionals.slice(positionals).map((word) => `Unexpected word "${word}": ${command} takes ${positionals === 1 ? 'one case file' : 'a case file and its new name'}.`),
    ...Object.keys(args.options).filter((flag) => !known.includes(flag)).map((flag) => `${flag}: not an option of ${command}.`),
    ...[...args.switches].filter((flag) => flag !== '--help' && !switches.includes(flag)).map((flag) => `${flag}: not an option of ${command}.`),
    ...args.missingValues.map((flag) => `${flag}: a value is missing after the flag.`),
  ];
}

/** A new name for a case in the same folder: a plain name, or a path into the case's own folder. */
function sameFolderName(path: string, newName: string): string | null {
  return dirname(newName) === '.' || dirname(newName) === dirname(path) ? basename(newName) : null;
}

function refused(io: CliIo, path: string, what: string, issues: Parameters<typeof formatIssues>[0]): number {
  io.err(`${path}: ${what}`);
  io.err(formatIssues(issues));
  return exitCodes.invalidInput;
}

/** `rename <case.json> <new-name.json>`. */
export async function renameCommand(args: ParsedArgs, io: FileIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(renameUsage);
    return exitCodes.ok;
  }
  const [path, newName] = args.positionals;
  const problems = extraProblems(args, 'rename', 2, [], []);
  if (path === undefined || newName === undefined || problems.length > 0) {
    io.err([...problems, renameUsage].join('\n'));
    return exitCodes.usage;
  }
  const newFileName = sameFolderName(path, newName);
  if (newFileName === null) {
    io.err(`${newName}: rename keeps a case in its folder (${dirname(path)}); give the new file name only. archive moves a case to archive/.`);
    return exitCodes.usage;
  }
  const store = io.openStore(dirname(path));
  const renamed = await store.rename(basename(path), newFileName);
  if (!renamed.ok) return refused(io, path, 'not renamed.', renamed.issues);
  io.out(`${path}: renamed to ${join(dirname(path), newFileName)} (${renamed.value.caseFile.patient.label}), with its journal; the history records the rename.`);
  return exitCodes.ok;
}

/** `archive <case.json>`. */
export async function archiveCommand(args: ParsedArgs, io: FileIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(archiveUsage);
    return exitCodes.ok;
  }
  const [path] = args.positionals;
  const problems = extraProblems(args, 'archive', 1, [], []);
  if (path === undefined || problems.length > 0) {
    io.err([...problems, archiveUsage].join('\n'));
    return exitCodes.usage;
  }
  const store = io.openStore(dirname(path));
  const archived = await store.archive(basename(path));
  if (!archived.ok) return refused(io, path, 'not archived.', archived.issues);
  io.out(`${path}: moved to ${join(dirname(path), archived.value.archivedAs)}, with its journal. Nothing was deleted; move both back out of archive/ to use the case again.`);
  return exitCodes.ok;
}

/** How many recent changes recover shows. */
const historyShown = 5;

/** What the file holds now, against the journal's latest state, in words. */
function fileState(opened: Awaited<ReturnType<CaseStore['open']>>): { readonly words: string; readonly changedOutside: boolean; readonly current: boolean } {
  if (!opened.ok) return { words: `the file does not open (${opened.issues.find((it) => it.severity === 'error')?.message.replace(/\.$/, '') ?? 'unreadable'})`, changedOutside: false, current: false };
  const recoverable: OpenedCase['recoverable'] = opened.value.recoverable;
  if (recoverable === null) return { words: 'the file holds that state already', changedOutside: false, current: true };
  if (recoverable.reason === 'interrupted-save') return { words: 'the file holds an earlier state: the save after it was cut off', changedOutside: false, current: false };
  return { words: 'the file was changed by another program after it', changedOutside: true, current: false };
}

/** `recover <case.json> [--dry-run] [--as <new-name.json>]`. */
export async function recoverCommand(args: ParsedArgs, io: FileIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(recoverUsage);
    return exitCodes.ok;
  }
  const [path] = args.positionals;
  const problems = extraProblems(args, 'recover', 1, ['--as'], ['--dry-run']);
  if (path === undefined || problems.length > 0) {
    io.err([...problems, recoverUsage].join('\n'));
    return exitCodes.usage;
  }
  const asName = args.options['--as'];
  const asFileName = asName === undefined ? undefined : sameFolderName(path, asName);
  if (asFileName === null) {
    io.err(`${asName}: recover --as writes beside the case (${dirname(path)}); give the new file name only.`);
    return exitCodes.usage;
  }
  const store = io.openStore(dirname(path));
  const fileName = basename(path);
  const recovered = await store.recover(fileName);
  if (!recovered.ok) return refused(io, path, 'nothing recovered.', recovered.issues);
  const history = await store.history(fileName);
  const entries = history.ok ? history.value.entries : [];
  const latest = entries.at(-1);
  const state = fileState(await store.open(fileName));
  const lines = [`${path} (${recovered.value.caseFile.patient.label}): the journal's latest state was saved at ${latest?.at ?? 'an unknown time'} ("${latest?.change ?? ''}"); ${state.words}.`];
  lines.push(`Recent changes (of ${entries.length}):`, ...entries.slice(-historyShown).map((entry) => `  ${entry.at}  ${entry.change}`));
  if (history.ok && history.value.unreadableLines.length > 0) lines.push(`Journal lines that could not be read (skipped): ${history.value.unreadableLines.join(', ')}.`);
  if (state.current && asFileName === undefined) {
    io.out([...lines, 'Nothing to recover.'].join('\n'));
    return exitCodes.ok;
  }
  if (args.switches.has('--dry-run')) {
    io.out([...lines, `Nothing was written (dry run); run again without --dry-run to save that state${state.changedOutside ? ' with --as <new-name.json>' : ''}.`].join('\n'));
    return exitCodes.ok;
  }
  if (state.changedOutside && asFileName === undefined) {
    io.out(lines.join('\n'));
    io.err(`${path}: not written over, so the other program's change is kept. Run recover again with --as <new-name.json> to save the journal's state beside it, then compare the two.`);
    return exitCodes.invalidInput;
  }
  const change = `recovered the state of ${latest?.at ?? 'the journal'} from the journal`;
  const saved =
    asFileName === undefined
      ? await store.save(fileName, recovered.value.caseFile, { expected: recovered.value.revision, change })
      : await store.saveAs(asFileName, recovered.value.caseFile, `${change} of ${fileName}`);
  io.out(lines.join('\n'));
  if (!saved.ok) return refused(io, path, 'nothing was written.', saved.issues);
  io.out(`Saved ${join(dirname(path), saved.value.fileName)} with the journal's latest state (one journal line); ${saved.value.warnings.length} warning(s).`);
  if (saved.value.warnings.length > 0) io.err(formatIssues(saved.value.warnings));
  return exitCodes.ok;
}
