/** Where the command line writes; tests pass a recorder, the binary passes the process streams. */
export interface CliIo {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
}

/** Exit codes: 0 done; 1 the input was checked and has errors; 2 the command was used wrongly. */
export const exitCodes = { ok: 0, invalidInput: 1, usage: 2 } as const;
