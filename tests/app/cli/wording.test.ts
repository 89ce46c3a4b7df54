import { describe, expect, it } from 'vitest';
import { runCli } from '../../../app/cli/main';
import { readCaseFile } from '../../../app/host/caseFiles';
import { forbiddenPhrasings } from '../../core/safety/safetyCases';

// House rule: what the tool prints is descriptive, never an instruction to dose. The
// findings' own test checks every finding sentence; this one checks everything every
// review command prints for the demo cases, with the same list of forbidden phrasings.
const demo = (name: string) => new URL(`../../../assets/demo/${name}.json`, import.meta.url).pathname;

function printed(...argv: string[]): string {
  const out: string[] = [];
  const code = runCli(argv, { out: (text) => out.push(text), err: (text) => out.push(text), readCase: readCaseFile, today: () => '2026-12-01' });
  expect(code, argv.join(' ')).toBe(0);
  return out.join('\n');
}

describe('no imperative dosing wording in any review output', () => {
  const outputs: [string, string][] = [];
  for (const name of ['th-0417', 'th-0093']) {
    outputs.push([`compute ${name}`, printed('compute', demo(name))]);
    outputs.push([`findings ${name}`, printed('findings', demo(name))]);
    outputs.push([`calendar ${name}`, printed('calendar', demo(name))]);
    outputs.push([`explain ${name} intake`, printed('explain', demo(name), 'intake')]);
    outputs.push([`explain ${name} body-iron`, printed('explain', demo(name), 'body-iron')]);
  }
  outputs.push(['binding', printed('binding')]);
  outputs.push(['dose', printed('dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '28', '--weight-kg', '52')]);
  outputs.push(['calc expected-excretion', printed('calc', 'expected-excretion', '--chelator', 'deferasirox-film-coated', '--dose-mg-per-kg-per-dosing-day', '21', '--weight-kg', '52')]);

  for (const [label, text] of outputs) {
    it(`${label}: descriptive, with the decision-support caution`, () => {
      for (const line of text.split('\n')) {
        for (const pattern of forbiddenPhrasings) expect(pattern.test(line), `${label}: "${line.trim()}" matches ${pattern}`).toBe(false);
      }
      expect(text.toLowerCase()).toContain('for review by the prescriber');
    });
  }
});
