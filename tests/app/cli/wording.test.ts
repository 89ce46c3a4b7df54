import { describe, expect, it } from 'vitest';
import { forbiddenPhrasings } from '../../core/safety/safetyCases';
import { cli, demoCase as demo } from './harness';

// House rule: what the tool prints is descriptive, never an instruction to dose. The
// findings' own test checks every finding sentence; this one checks everything every
// review command prints for the demo cases, with the same list of forbidden phrasings.

/** Everything one run printed, on either stream; the run must succeed. */
async function printed(...argv: string[]): Promise<string> {
  const { code, out, err } = await cli(...argv);
  expect(code, argv.join(' ')).toBe(0);
  return [out, err].filter((it) => it !== '').join('\n');
}

const outputs: [string, string][] = [];
for (const name of ['th-0417', 'th-0093']) {
  outputs.push([`compute ${name}`, await printed('compute', demo(name))]);
  outputs.push([`findings ${name}`, await printed('findings', demo(name))]);
  outputs.push([`calendar ${name}`, await printed('calendar', demo(name))]);
  outputs.push([`explain ${name} intake`, await printed('explain', demo(name), 'intake')]);
  outputs.push([`explain ${name} body-iron`, await printed('explain', demo(name), 'body-iron')]);
}
outputs.push(['binding', await printed('binding')]);
outputs.push(['dose', await printed('dose', '--product', 'deferasirox-film-coated', '--target-mg-per-kg-per-day', '28', '--weight-kg', '52')]);
outputs.push(['calc expected-excretion', await printed('calc', 'expected-excretion', '--chelator', 'deferasirox-film-coated', '--dose-mg-per-kg-per-dosing-day', '21', '--weight-kg', '52')]);

describe('no imperative dosing wording in any review output', () => {
  for (const [label, text] of outputs) {
    it(`${label}: descriptive, with the decision-support caution`, () => {
      for (const line of text.split('\n')) {
        for (const pattern of forbiddenPhrasings) expect(pattern.test(line), `${label}: "${line.trim()}" matches ${pattern}`).toBe(false);
      }
      expect(text.toLowerCase()).toContain('for review by the prescriber');
    });
  }
});
