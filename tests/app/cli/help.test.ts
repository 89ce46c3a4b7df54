import { describe, expect, it } from 'vitest';
import { usage } from '../../../app/cli/main';
import { cli } from './harness';

// Outside reference: the GNU Coding Standards, §4.8.2 "--help": the option prints brief
// documentation of how to invoke the program on standard output, then exits successfully.

const commands = [...usage.matchAll(/^ {2}([a-z]+) /gm)].map((match) => match[1]!);

describe('every subcommand answers --help', () => {
  it('lists the commands from the overview (at least the ones this version has)', () => {
    expect(commands).toEqual(expect.arrayContaining(['calc', 'check', 'compute', 'findings', 'explain', 'binding', 'dose', 'calendar', 'preview']));
  });

  it.each([...new Set(commands)])('%s --help prints its usage on stdout and exits 0', async (command) => {
    const run = await cli(command, '--help');
    expect(run.code).toBe(0);
    expect(run.err).toBe('');
    expect(run.out).toMatch(new RegExp(`^Usage:\\s+chelation-ledger ${command}\\b`));
    expect(run.out).toContain('for review by the prescriber');
  });

  it('--help wins over other arguments, so it never runs the command', async () => {
    const run = await cli('calendar', 'missing.json', '-o', 'out.ics', '--help');
    expect(run.code).toBe(0);
    expect(run.out).toMatch(/^Usage:/);
  });
});
