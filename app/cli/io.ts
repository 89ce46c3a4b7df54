import type { Result } from '../../core/result';

/** Where the command line writes; tests pass a recorder, the binary passes the process streams. */
export interface CliIo {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
}

/**
 * Reading a text file the user named (a product catalogue, an import): the binary
 * reads the disk (app/host/textFiles.ts), tests pass a fake. `what` names the file
 * in messages ("product catalogue"); `field` is the flag the issue carries.
 */
export interface TextIo {
  readonly readText: (path: string, what: string, field?: readonly string[]) => Result<string>;
}

/**
 * Exit codes: 0 done; 1 the input was checked and has errors; 2 the command was used wrongly;
 * 3 an unexpected fault of the tool itself (caught at the process boundary, app/cli/boundary.ts).
 */
export const exitCodes = { ok: 0, invalidInput: 1, usage: 2, unexpected: 3 } as const;
