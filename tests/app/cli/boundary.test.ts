import { describe, expect, it } from 'vitest';
import { runAtBoundary, unexpectedErrorLine } from '../../../app/cli/boundary';
import { exitCodes } from '../../../app/cli/io';
import { cli, runWith } from './harness';

// House rule 6 (style.md habit 8): no stack trace ever reaches a user. A fault of the tool
// becomes one line naming the command and the file, exit code 3; the trace only under --debug.
function recorder() {
  const err: string[] = [];
  return { io: { out: () => undefined, err: (text: string) => err.push(text) }, err };
}

const failing = () => Promise.reject(new RangeError('Invalid time value'));

describe('the process boundary', () => {
  it('turns an escaped error into one line naming the command and the file, exit 3, no trace', async () => {
    const { io, err } = recorder();
    const code = await runAtBoundary(['compute', 'cases/ab.json', '--as-of', '2026-01-01'], io, failing);
    expect(code).toBe(exitCodes.unexpected);
    expect(code).toBe(3);
    expect(err).toHaveLength(1);
    expect(err[0]).toContain('chelation-ledger compute on cases/ab.json: unexpected internal error (RangeError: Invalid time value)');
    expect(err[0]).toContain('--debug');
    expect(err[0]).not.toMatch(/\n|\bat .*:\d+:\d+/);
  });

  it('adds the trace under --debug, and the command does not see the flag', async () => {
    const { io, err } = recorder();
    let seen: readonly string[] = [];
    const code = await runAtBoundary(['findings', 'x.json', '--debug'], io, (argv) => {
      seen = argv;
      throw new TypeError('boom');
    });
    expect(code).toBe(3);
    expect(seen).toEqual(['findings', 'x.json']);
    expect(err).toHaveLength(2);
    expect(err[1]).toMatch(/TypeError: boom\n\s+at /);
  });

  it('passes the exit code of a command that finishes', async () => {
    const { io, err } = recorder();
    expect(await runAtBoundary(['check'], io, async () => 1)).toBe(1);
    expect(err).toEqual([]);
  });

  it('names a thrown non-error and a command without a file', () => {
    expect(unexpectedErrorLine(['binding', '--sweep'], 'odd')).toContain('chelation-ledger binding: unexpected internal error (odd)');
  });
});

describe('commands may be asynchronous', () => {
  it('runCli returns a promise of the exit code', async () => {
    const pending = runWith(['calc', 'transfusion-iron', '--volume-ml', '300', '--unit-haematocrit', '0.65']);
    expect(pending).toBeInstanceOf(Promise);
    expect((await pending).code).toBe(0);
    expect((await cli('no-such-command')).code).toBe(2);
  });
});
