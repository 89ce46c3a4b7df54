import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli, type CliHostIo } from '../../../app/cli/main';
import { readCaseFile } from '../../../app/host/caseFiles';
import { openCaseStore } from '../../../app/host/caseStore';
import { writeCalendarOutput } from '../../../app/host/icalendar';
import { readTextFile } from '../../../app/host/textFiles';

/** What one run of the command line printed, and its exit code. */
export interface CliRun {
  readonly code: number;
  readonly out: string;
  readonly err: string;
}

/** The review date the tests' "today" returns, and the instant the calendar stamps. */
export const testToday = '2026-12-01';
export const testNow = new Date(Date.UTC(2026, 10, 20, 8, 0, 0));

/**
 * Run the command line in-process with the real host services (case reader, text
 * reader, calendar writer) and a fixed clock; `overrides` swaps any of them for a fake.
 */
export async function runWith(argv: readonly string[], overrides: Partial<CliHostIo> = {}): Promise<CliRun> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliHostIo = {
    out: (text) => out.push(text),
    err: (text) => err.push(text),
    readCase: readCaseFile,
    readText: readTextFile,
    today: () => testToday,
    now: () => testNow,
    writeCalendar: writeCalendarOutput,
    openStore: (folder) => openCaseStore(folder, { now: () => testNow }),
    ...overrides,
  };
  const code = await runCli(argv, io);
  return { code, out: out.join('\n'), err: err.join('\n') };
}

/** `cli('compute', path, '--json')`: one run with the real host services. */
export const cli = (...argv: string[]): Promise<CliRun> => runWith(argv);

/** The path of a demo case in assets/demo (invented patients, scenarios.md). */
export const demoCase = (name: string): string => new URL(`../../../assets/demo/${name}.json`, import.meta.url).pathname;

/** A fresh temporary folder. */
export const tempDir = (prefix = 'cl-test-'): string => mkdtempSync(join(tmpdir(), prefix));

/** Write a value as JSON (or a string as it is) to a new temporary file and return its path. */
export function writeTemp(content: unknown, name = 'case.json'): string {
  const path = join(tempDir(), name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}
