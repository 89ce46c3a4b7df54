import type { Result } from '../../core/result';
import { caseFileArgument, type CaseFileRequest, type OpenRequests } from '../host/openRequests';

/** The part of Electron's `app` that delivers files to open (a fake in tests). */
export interface CaseFileSource {
  on(event: 'open-file', listener: (event: { preventDefault(): void }, path: string) => void): unknown;
  on(event: 'second-instance', listener: (event: unknown, argv: string[], workingDirectory: string) => void): unknown;
}

/** What the main process does with each file asked for: tell the page (or show the refusal), bring the window forward. */
export interface CaseFileActions {
  readonly requested: (request: Result<CaseFileRequest>) => void;
  /** A second start of the app, with or without a file: the one window comes forward. */
  readonly focus: () => void;
}

/**
 * Where the operating system hands the app a case file (the file association
 * in electron-builder.yml): on Windows and Linux on the command line — the
 * first start's `process.argv`, a later start's arguments in the single
 * instance's `second-instance` event (the second process then quits, see
 * main.ts) — and on macOS in `open-file`, which can come before the app is
 * ready, so the request waits in `requests` until the page takes it.
 *
 * @param argv - this process's arguments (the first start)
 * @param workingDirectory - this process's working directory
 */
export function listenForCaseFiles(source: CaseFileSource, requests: OpenRequests, argv: readonly string[], workingDirectory: string, actions: CaseFileActions): void {
  const offer = (path: string) => actions.requested(requests.offer(path));
  const first = caseFileArgument(argv, workingDirectory);
  if (first !== null) offer(first);
  source.on('open-file', (event, path) => {
    event.preventDefault();
    offer(path);
  });
  source.on('second-instance', (_event, secondArgv, secondDirectory) => {
    actions.focus();
    const path = caseFileArgument(secondArgv, secondDirectory);
    if (path !== null) offer(path);
  });
}
