import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { Script } from 'node:vm';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../../app/cli/args';
import { formulaCatalogue } from '../../../core/catalogue';
import { describeFormula, flagForInput } from '../../../core/formulas/describe';
// @ts-expect-error plain ESM build script without type declarations
import { buildCli, cliBundleFile, cliCodeCacheFile } from '../../../app/build/build-cli.mjs';
import { cli } from './harness';

const projectRoot = fileURLToPath(new URL('../../..', import.meta.url));
mkdirSync(join(projectRoot, 'dist'), { recursive: true });


describe('argument parsing', () => {
  it('reads --flag value, --flag=value, switches and negative numbers', async () => {
    const parsed = parseArgs(['x', '--a', '1', '--b=2', '--json', '--c', '-3', '--d'], ['--json']);
    expect(parsed.positionals).toEqual(['x']);
    expect(parsed.options).toEqual({ '--a': '1', '--b': '2', '--c': '-3' });
    expect([...parsed.switches]).toEqual(['--json']);
    expect(parsed.missingValues).toEqual(['--d']);
  });

  it('turns input names into kebab-case flags', async () => {
    expect(flagForInput('volumeMl')).toBe('--volume-ml');
    expect(flagForInput('ironPerMlRedCellsMg')).toBe('--iron-per-ml-red-cells-mg');
    expect(flagForInput('r2StarPerS')).toBe('--r2-star-per-s');
  });
});

describe('calc --list', () => {
  it('lists every calculator of the catalogue, generated from the same definitions', async () => {
    const { code, out } = await cli('calc', '--list', '--json');
    expect(code).toBe(0);
    const listed = JSON.parse(out) as { id: string; inputs: { flag: string }[] }[];
    expect(listed.map((it) => it.id)).toEqual(formulaCatalogue.map((it) => it.id));
    for (const formula of formulaCatalogue) {
      const entry = listed.find((it) => it.id === formula.id)!;
      expect(entry.inputs.map((it) => it.flag)).toEqual(Object.keys(formula.inputs).map(flagForInput));
    }
  });

  it('prints a readable list naming units, ranges and sources', async () => {
    const { code, out } = await cli('calc', '--list');
    expect(code).toBe(0);
    for (const formula of formulaCatalogue) expect(out).toContain(`${formula.id} — ${formula.title}`);
    expect(out).toContain('--unit-haematocrit <fraction, 0.4–0.85>');
    expect(out).toContain('source: Cohen AR, Glimm E, Porter JB');
  });
});

describe('calc --list states the ranges the calculators enforce', () => {
  // The outside check is each calculator's own refusal, run through `calc`: every listed end is accepted,
  // a value just beyond it is refused naming the flag, an excluded end is refused, and an input marked
  // "whole number" refuses a half. "Just beyond" is a thousandth of the range (1 for whole numbers).
  type Listed = { id: string; inputs: { name: string; flag: string; kind: string; min?: number; max?: number; range?: string; integer?: boolean; rangesByUnit?: Record<string, { min: number; max: number }> }[] };
  const flagProblem = (err: string, flag: string) => err.split('\n').some((line) => line.startsWith(`${flag}: `) && !line.includes('required'));
  it('every number input of every calculator, at both ends and just beyond', async () => {
    const listed = JSON.parse((await cli('calc', '--list', '--json')).out) as Listed[];
    for (const entry of listed) {
      for (const input of entry.inputs.filter((it) => it.kind === 'number' && it.rangesByUnit === undefined)) {
        const spec = formulaCatalogue.find((it) => it.id === entry.id)!.inputs[input.name]!;
        const enabling = spec.kind === 'number' && spec.usedWhen ? [flagForInput(spec.usedWhen.input), spec.usedWhen.oneOf[0]!] : [];
        const run = async (value: number) => (await cli('calc', entry.id, ...enabling, input.flag, String(value))).err;
        const step = input.integer ? 1 : (input.max! - input.min!) / 1000;
        const lowerExcluded = input.range!.includes(`above ${input.min}`);
        const upperExcluded = input.range!.includes(`below ${input.max}`);
        const where = `${entry.id} ${input.flag} (${input.range})`;
        expect(flagProblem(await run(lowerExcluded ? input.min! + step : input.min!), input.flag), `${where} at its lower end`).toBe(false);
        expect(flagProblem(await run(upperExcluded ? input.max! - step : input.max!), input.flag), `${where} at its upper end`).toBe(false);
        expect(flagProblem(await run(lowerExcluded ? input.min! : input.min! - step), input.flag), `${where} below`).toBe(true);
        expect(flagProblem(await run(upperExcluded ? input.max! : input.max! + step), input.flag), `${where} above`).toBe(true);
        if (input.integer) expect(flagProblem(await run(input.min! + 0.5), input.flag), `${where} a half`).toBe(true);
      }
    }
  }, 120_000);

  it('creatinine per unit, as the calculators check it in the unit chosen', async () => {
    const listed = JSON.parse((await cli('calc', '--list', '--json')).out) as Listed[];
    const creatinine = listed.find((it) => it.id === 'creatinine-units')!.inputs.find((it) => it.flag === '--serum-creatinine')!;
    expect(Object.keys(creatinine.rangesByUnit!)).toEqual(['mg/dL', 'umol/L']);
    // Every calculator taking a creatinine lists the same ranges per unit.
    for (const entry of listed) for (const input of entry.inputs.filter((it) => it.flag === '--serum-creatinine')) expect(input.rangesByUnit, entry.id).toEqual(creatinine.rangesByUnit);
    for (const [unit, range] of Object.entries(creatinine.rangesByUnit!)) {
      const run = (value: number) => cli('calc', 'creatinine-units', '--serum-creatinine', String(value), '--creatinine-unit', unit);
      const step = (range.max - range.min) / 1000;
      expect((await run(range.min)).code, `${unit} ${range.min}`).toBe(0);
      expect((await run(range.max)).code, `${unit} ${range.max}`).toBe(0);
      for (const beyond of [range.min - step, range.max + step]) {
        const refused = await run(beyond);
        expect(refused.code, `${unit} ${beyond}`).toBe(1);
        expect(refused.out).toBe('');
        expect(refused.err).toContain(`${range.min}–${range.max} ${unit}`);
      }
    }
    const text = (await cli('calc', '--list')).out;
    expect(text).toContain('--serum-creatinine <mg/dL 0.1–20 or umol/L 8–1770>');
    // Ages as enforced: Cockcroft–Gault and CKD-EPI 18–120, bedside Schwartz from 1 to below 18.
    expect(listed.find((it) => it.id === 'crcl-cockcroft-gault')!.inputs.find((it) => it.flag === '--age-years')).toMatchObject({ min: 18, max: 120 });
    expect(listed.find((it) => it.id === 'egfr-ckd-epi-2021')!.inputs.find((it) => it.flag === '--age-years')).toMatchObject({ min: 18, max: 120 });
    expect(listed.find((it) => it.id === 'egfr-schwartz-bedside')!.inputs.find((it) => it.flag === '--age-years')!.range).toBe('1–18 a (below 18)');
    expect(text).toContain('--administrations-per-day <count, 1–6, whole number>');
  });
});

describe('calc <calculator>', () => {
  it('prints a readable line with units, inputs and their origins (280 mL × 0.60 × 1.08 = 181.44 mg)', async () => {
    const { code, out } = await cli('calc', 'transfusion-iron', '--volume-ml', '280', '--unit-haematocrit', '0.6');
    expect(code).toBe(0);
    expect(out.split('\n')[0]).toBe('transfusion-iron: iron 181.4 mg');
    expect(out).toContain('iron per mL of pure red cells 1.08 mg/mL (assumption iron-per-ml-red-cells, published default)');
    expect(out).toContain('for review by the prescriber');
  });

  it('gives machine-readable JSON with units beside each value', async () => {
    const { code, out } = await cli('calc', 'transfusion-iron', '--volume-ml=280', '--unit-haematocrit=0.6', '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(out);
    expect(parsed.outputs.ironMg.unit).toBe('mg');
    expect(parsed.outputs.ironMg.value).toBeCloseTo(181.44, 9);
    expect(parsed.derivation.formulaId).toBe('transfusion-iron');
  });

  it('still accepts a former calculator id, and names the current one (dfo-therapeutic-index → deferoxamine-therapeutic-index)', async () => {
    // Porter et al. 1989: 40 mg/kg × 5 infusions a week ÷ 7 = 28.6 mg/kg/d; ÷ 1250 µg/L = 0.0229.
    const flags = ['--dose-per-infusion-mg-per-kg', '40', '--infusions-per-week', '5', '--ferritin-ug-per-l', '1250'];
    const former = await cli('calc', 'dfo-therapeutic-index', ...flags);
    const current = await cli('calc', 'deferoxamine-therapeutic-index', ...flags);
    expect(former.code).toBe(0);
    expect(former.out).toBe(current.out);
    expect(former.out.split('\n')[0]).toMatch(/^deferoxamine-therapeutic-index: mean daily dose 28\.6 mg\/kg\/day; therapeutic index 0\.0229/);
  });

  it('still accepts an input flag from before a rename (--days → --period-days), refusing both together', async () => {
    // Hunt et al. 2009 basal loss 1 mg/day: 1000 − 200 − 1 × 30 = 770 mg.
    const flags = ['--transfusional-net-mg', '1000', '--chelation-removal-mg', '200'];
    const former = await cli('calc', 'net-iron-balance', ...flags, '--days', '30');
    const current = await cli('calc', 'net-iron-balance', ...flags, '--period-days', '30');
    expect(former.code).toBe(0);
    expect(former.out).toBe(current.out);
    expect(current.out.split('\n')[0]).toBe('net-iron-balance: net iron balance 770 mg');
    const both = await cli('calc', 'net-iron-balance', ...flags, '--period-days', '30', '--days', '30');
    expect(both.code).toBe(1);
    expect(both.out).toBe('');
    expect(both.err).toContain('--period-days is given as well');
  });

  it('refuses an unknown calculator, an unknown flag and a missing value, printing no number', async () => {
    const unknown = await cli('calc', 'iron-magic');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('Unknown calculator "iron-magic"');
    const badFlag = await cli('calc', 'transfusion-iron', '--volume', '280');
    expect(badFlag.code).toBe(1);
    expect(badFlag.err).toContain('--volume: not an input of transfusion-iron');
    expect(badFlag.out).toBe('');
    const missing = await cli('calc', 'transfusion-iron', '--volume-ml');
    expect(missing.code).toBe(1);
    expect(missing.err).toContain('--volume-ml: a value is missing');
  });

  // For every calculator in the catalogue: a value far outside the plausible range of any
  // number input is refused with a message that names the flag, the value and the range,
  // and nothing is printed on stdout.
  for (const formula of formulaCatalogue) {
    for (const input of describeFormula(formula).inputs.filter((it) => it.kind === 'number')) {
      it(`${formula.id} refuses ${input.flag} above its range`, async () => {
        const tooHigh = input.max! * 10 + 1000;
        // A conditional input is only read when its choice enables it: pass that choice.
        const spec = formula.inputs[input.name];
        const enabling = spec?.kind === 'number' && spec.usedWhen ? [flagForInput(spec.usedWhen.input), spec.usedWhen.oneOf[0]!] : [];
        const { code, out, err } = await cli('calc', formula.id, ...enabling, input.flag, String(tooHigh));
        expect(code).toBe(1);
        expect(out).toBe('');
        expect(err).toContain(`${input.flag}: `);
        expect(err).toContain(String(tooHigh));
        // A number entered with a chosen unit states the range of each unit, as compute checks it.
        if (input.rangesByUnit) for (const [unit, range] of Object.entries(input.rangesByUnit)) expect(err).toContain(`${range.min}–${range.max} ${unit}`);
        else expect(err).toContain(`${input.min}–${input.max}`);
      });
    }
    for (const input of describeFormula(formula).inputs.filter((it) => it.kind === 'choice')) {
      it(`${formula.id} refuses an unknown choice for ${input.flag}`, async () => {
        const { code, out, err } = await cli('calc', formula.id, input.flag, 'no-such-choice');
        expect(code).toBe(1);
        expect(out).toBe('');
        expect(err).toContain(`${input.flag}: `);
        expect(err).toContain('"no-such-choice" is not one of');
      });
    }
  }
});

describe('the built command line', () => {
  it('runs from the bundle that npm install builds, with its code cache, without it, or with one V8 refuses', async () => {
    // Inside the project, so the bundle finds its external runtime dependencies in node_modules.
    const outfile = join(mkdtempSync(join(projectRoot, 'dist', 'test-cli-')), 'cli.cjs');
    await buildCli(outfile);
    const run = spawnSync(process.execPath, [outfile, 'calc', 'transfusion-iron', '--volume-ml', '300', '--unit-haematocrit', '0.65'], {
      encoding: 'utf8',
    });
    expect(run.status).toBe(0);
    // 300 × 0.65 × 1.08 = 210.6 mg, inside the 200–250 mg per unit of Hoffbrand 2012.
    expect(run.stdout.split('\n')[0]).toBe('transfusion-iron: iron 210.6 mg');
    const bad = spawnSync(process.execPath, [outfile, 'calc', 'transfusion-iron', '--volume-ml', '-5', '--unit-haematocrit', '0.6'], {
      encoding: 'utf8',
    });
    expect(bad.status).toBe(1);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toContain('--volume-ml: Volume transfused -5 mL is outside the plausible range 1–10000 mL.');

    // The code cache the build made is one this Node's V8 accepts for this bundle (V8's own check:
    // cachedDataRejected), wrapped as app/build/cliLoader.cjs wraps it.
    const folder = dirname(outfile);
    const bundlePath = join(folder, cliBundleFile);
    const cachePath = join(folder, cliCodeCacheFile);
    const wrapped = `(function (exports, require, module, __filename, __dirname) {${readFileSync(bundlePath, 'utf8')}\n})`;
    expect(new Script(wrapped, { filename: bundlePath, cachedData: readFileSync(cachePath) }).cachedDataRejected).toBe(false);
    // Without the cache, or with one V8 refuses, the command gives the same output.
    const withCache = spawnSync(process.execPath, [outfile, 'findings', `${projectRoot}assets/demo/th-0417.json`, '--json'], { encoding: 'utf8' });
    expect(withCache.status).toBe(0);
    writeFileSync(cachePath, Buffer.from('not a code cache'));
    const refused = spawnSync(process.execPath, [outfile, 'findings', `${projectRoot}assets/demo/th-0417.json`, '--json'], { encoding: 'utf8' });
    rmSync(cachePath);
    const without = spawnSync(process.execPath, [outfile, 'findings', `${projectRoot}assets/demo/th-0417.json`, '--json'], { encoding: 'utf8' });
    expect([refused.status, without.status]).toEqual([0, 0]);
    expect(refused.stdout).toBe(withCache.stdout);
    expect(without.stdout).toBe(withCache.stdout);
    rmSync(folder, { recursive: true, force: true });
    // A build and two processes: a ceiling for a loaded shared machine, not a speed check.
  }, 60_000);
});
