#!/usr/bin/env node
// Fuzz the command line (issue 17): generated case files, calculator flags and command
// options, run in-process through the same runCli the binary runs. Reports:
//   - stack traces: an error escaping runCli (exit 3 at the process boundary) or a trace in the output;
//   - numbers printed for invalid input: an input the generator made invalid on purpose
//     (a refused value, a malformed flag, a review date outside the record's window) that
//     ended with exit 0 and a number on stdout.
// Not part of `npm test` (it takes minutes on a shared machine). Usage:
//   node scripts/fuzz-cli.mjs [--inputs 10000] [--seed 17] [--root <tree to run>] [--show 5]
// --root lets the same generated inputs run against another checkout (e.g. an older commit).
import { build } from 'esbuild';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = fileURLToPath(new URL('..', import.meta.url));
const argv = process.argv.slice(2);
const option = (flag, fallback) => {
  const index = argv.indexOf(flag);
  return index >= 0 ? argv[index + 1] : fallback;
};
const total = Number(option('--inputs', '10000'));
const seed = Number(option('--seed', '17'));
const root = resolve(option('--root', here));
const show = Number(option('--show', '5'));
const work = mkdtempSync(join(tmpdir(), 'cl-fuzz-'));

// ── The tree under test: runCli and the host services it is handed, bundled once ──
async function bundle(entryText, name, resolveDir) {
  const outfile = join(work, `${name}.mjs`);
  await build({
    stdin: { contents: entryText, resolveDir, loader: 'ts' },
    bundle: true,
    platform: 'node',
    format: 'esm',
    outfile,
    logLevel: 'error',
    // Runtime packages resolve from the tree's own node_modules.
    nodePaths: [join(resolveDir, 'node_modules'), join(here, 'node_modules')],
    banner: { js: "import { createRequire } from 'node:module'; const require = createRequire(import.meta.url);" },
  });
  return import(pathToFileURL(outfile).href);
}
const has = (path) => existsSync(join(root, path));
const target = await bundle(
  [
    "export { runCli } from './app/cli/main';",
    "export { readCaseFile } from './app/host/caseFiles';",
    has('app/host/textFiles.ts') ? "export { readTextFile } from './app/host/textFiles';" : 'export const readTextFile = undefined;',
    has('app/host/icalendar.ts') ? "export { writeCalendarFile } from './app/host/icalendar';" : 'export const writeCalendarFile = undefined;',
  ].join('\n'),
  'target',
  root,
);
// The generator reads the calculators from this tree (their ids and flags are the same in older trees).
const generator = await bundle(
  [
    has('core/catalogue.ts') || existsSync(join(here, 'core/catalogue.ts')) ? "export { formulaCatalogue } from './core/catalogue';" : '',
    "export { describeFormula } from './core/formulas/describe';",
  ].join('\n'),
  'generator',
  here,
);

// ── A seeded generator (mulberry32) ──
let state = seed >>> 0;
const random = () => {
  state = (state + 0x6d2b79f5) >>> 0;
  let t = state;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
};
const pick = (list) => list[Math.floor(random() * list.length)];
const chance = (p) => random() < p;

const demo = (name) => JSON.parse(readFileSync(join(here, 'assets/demo', `${name}.json`), 'utf8'));
const demos = ['th-0417', 'th-0093'].filter((name) => existsSync(join(here, 'assets/demo', `${name}.json`))).map(demo);

/** Every [container, key] of a JSON value whose value is a number or a date string. */
function leaves(value, out = { numbers: [], dates: [] }) {
  if (Array.isArray(value)) value.forEach((it, index) => visit(value, index, it, out));
  else if (value && typeof value === 'object') for (const key of Object.keys(value)) visit(value, key, value[key], out);
  return out;
}
function visit(container, key, value, out) {
  if (typeof value === 'number') out.numbers.push([container, key]);
  else if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value)) out.dates.push([container, key]);
  else if (value && typeof value === 'object') leaves(value, out);
}

// Values the case model must refuse wherever a number or a date stands.
const badNumbers = [-1, -0.5, -1e6, '52', 'abc', true];
const badDates = ['2023-02-29', '2026-13-01', '2026-1-1', '0219-05-01', '3019-01-01', '2026-01-01garbage', '', 20260101];
// Values inside the model's possible ranges but far from usual (valid: a review or a clear message, never a trace).
const edgeNumbers = [0, 1e-9, 1e-320, 0.000001, 399.9, 1999, 9999, 19999];
const edgeDates = ['1900-01-01', '2100-12-31', '2024-02-29', '2000-02-29'];

function caseInput() {
  const json = structuredClone(pick(demos));
  const { numbers, dates } = leaves(json);
  let invalid = false;
  let text;
  let what = 'edge values';
  const kind = random();
  if (kind < 0.3) {
    const [container, key] = pick(numbers);
    container[key] = pick(badNumbers);
    what = `${key} = ${JSON.stringify(container[key])}`;
    invalid = true;
  } else if (kind < 0.45) {
    const [container, key] = pick(dates);
    container[key] = pick(badDates);
    what = `${key} = ${JSON.stringify(container[key])}`;
    invalid = true;
  } else if (kind < 0.7) {
    for (let count = 1 + Math.floor(random() * 3); count > 0; count -= 1) {
      const [container, key] = pick(numbers);
      if (key === 'version') continue;
      container[key] = pick(edgeNumbers);
    }
  } else if (kind < 0.8) {
    const [container, key] = pick(dates);
    container[key] = pick(edgeDates);
  } else if (kind < 0.86 && json.transfusions?.length > 0) {
    // A huge record: one transfusion repeated, each with its own id and date.
    const base = json.transfusions[0];
    const copies = 200 + Math.floor(random() * 800);
    for (let index = 0; index < copies; index += 1) json.transfusions.push({ ...base, id: `fuzz-${index}`, date: base.date });
  } else if (kind < 0.9) {
    text = JSON.stringify(json).slice(0, Math.floor(random() * 2000));
    what = 'truncated JSON';
    invalid = true;
  } else if (kind < 0.94) {
    json.thresholdOverrides = JSON.parse('{"__proto__": {"value": 1, "reason": "x", "by": "y", "at": "2026-01-01"}}');
    what = '__proto__ threshold override';
    invalid = true;
  } else if (kind < 0.97) {
    text = `\ufeff${JSON.stringify(json)}`; // a byte-order mark: accepted
  } else {
    text = JSON.stringify(json).replace('"label":"', '"label":"\udc80'); // a lone surrogate → invalid UTF-8 once written
    what = 'invalid UTF-8 in the label';
    invalid = true;
  }
  const path = join(work, `case-${Math.floor(random() * 1e9)}.json`);
  const bytes = text ?? JSON.stringify(json);
  writeFileSync(path, bytes.includes('\udc80') ? Buffer.concat([Buffer.from(bytes.split('\udc80')[0]), Buffer.from([0xc3, 0x28]), Buffer.from(bytes.split('\udc80')[1])]) : bytes);
  const command = pick(['check', 'compute', 'findings', 'explain', 'calendar']);
  return { argv: [command, path], invalid, label: `case ${command}`, what };
}

const badFlagValues = ['0x10', '', ' ', '12abc', 'NaN', 'Infinity', '-Infinity', '1e400', '1,5', '--', 'abc'];
function calcInput() {
  const formula = pick(generator.formulaCatalogue);
  const inputs = generator.describeFormula(formula).inputs;
  const args = ['calc', formula.id];
  let invalid = false;
  for (const input of inputs) {
    if (!input.required && chance(0.5)) continue;
    if (input.usedWhen) continue;
    let value;
    if (input.kind === 'choice') value = pick(input.choices);
    else {
      const span = input.max - input.min;
      value = String(input.integer ? Math.round(input.min + random() * span) : input.min + random() * span);
    }
    args.push(input.flag, value);
  }
  const corruption = random();
  const numberFlags = inputs.filter((it) => it.kind === 'number' && !it.usedWhen);
  if (corruption < 0.35 && numberFlags.length > 0) {
    const target = pick(numberFlags);
    const at = args.indexOf(target.flag);
    const bad = chance(0.5) ? pick(badFlagValues) : String(target.max * 10 + 1000);
    if (at >= 0) args[at + 1] = bad;
    else args.push(target.flag, bad);
    invalid = true;
  } else if (corruption < 0.45 && args.length > 3) {
    args.push(args[2], args[3]); // a repeated flag
    invalid = true;
  } else if (corruption < 0.5) {
    args.push('--no-such-input', '1');
    invalid = true;
  } else if (corruption < 0.55) {
    args.push('extra-word');
    invalid = true;
  }
  return { argv: args, invalid, label: `calc ${formula.id}` };
}

const reviewDates = [
  ['2026-11-20', false],
  ['2026-01-01', false],
  ['2024-06-30', false],
  ['2034-12-31', true],
  ['2100-12-31', true],
  ['9999-12-31', true],
  ['0100-01-01', true],
  ['1899-12-31', true],
  ['2026-02-30', true],
  ['2026-01-01garbage', true],
  ['', true],
  ['20261120', true],
];
function optionInput() {
  const demoPath = join(here, 'assets/demo', `${pick(['th-0417', 'th-0093'])}.json`);
  const command = pick(['compute', 'findings', 'explain', 'calendar', 'binding', 'dose', 'course']);
  let invalid = false;
  const args = [command];
  if (command === 'binding') {
    const weight = pick([['52', false], ['0', true], ['300', true], ['0x10', true], ['', true], ['abc', true]]);
    args.push('--weight-kg', weight[0]);
    invalid ||= weight[1];
  } else if (command === 'dose') {
    const target = pick([['28', false], ['0x1C', true], ['', true], ['-5', true], ['1e400', true], ['28abc', true]]);
    const weight = pick([['52', false], ['0', true], ['5200', true], ['', true]]);
    args.push('--product', pick(['deferasirox-film-coated', 'deferoxamine-vials']), '--target-mg-per-kg-per-day', target[0], '--weight-kg', weight[0]);
    invalid ||= target[1] || weight[1];
  } else if (command === 'course') {
    // A heavy-metal course: the patient's numbers as typed (strict decimals, ranges from core/ranges).
    const weight = pick([['14', false], ['230', false], ['0x10', true], ['14abc', true], ['0', true], ['401', true], ['1e400', true], ['-3', true]]);
    const age = pick([['3', false], ['0x3', true], ['130', true], ['3.5', false]]);
    const height = pick([['92', false], ['300', true], ['9.2e1', false], ['Infinity', true]]);
    args.push('succimer-lead', '--weight-kg', weight[0], '--age-years', age[0], '--height-cm', height[0], '--start', pick(['2026-10-24T22:00', '2026-10-24T25:00']), '--time-zone', 'Europe/London');
    invalid ||= weight[1] || age[1] || height[1] || args.includes('2026-10-24T25:00');
  } else {
    args.push(demoPath);
    if (chance(0.7)) {
      const [date, bad] = pick(reviewDates);
      args.push('--as-of', date);
      invalid ||= bad;
    }
    if (command === 'compute' && chance(0.5)) {
      const [value, bad] = pick([['12', false], ['120', false], ['0', true], ['121', true], ['1.5', true], ['0x10', true], ['', true], ['100000', true]]);
      args.push('--horizon-months', value);
      invalid ||= bad;
    }
    if (command === 'compute' && chance(0.4)) {
      const [value, bad] = pick([['1', false], ['2147483647', false], ['1.5', true], ['-1', true], ['2147483648', true], ['0x10', true]]);
      args.push('--seed', value);
      invalid ||= bad;
    }
    if (command === 'explain' && chance(0.5)) args.push(pick(['intake', 'body-iron', 'no-such-result']));
    if (command === 'calendar' && chance(0.3)) {
      const [value, bad] = pick([['7', false], ['0', true], ['91', true], ['7.5', true], ['0x7', true]]);
      args.push('--anc-interval-days', value);
      invalid ||= bad;
    }
  }
  const extra = random();
  if (extra < 0.08) {
    args.push('--colour', 'red');
    invalid = true;
  } else if (extra < 0.16 && args.length > 3) {
    args.push(args[args.length - 2], args[args.length - 1]); // repeat the last flag
    invalid = true;
  } else if (extra < 0.2) {
    args.push('another.json');
    invalid = true;
  }
  if (chance(0.2) && command !== 'binding' && command !== 'dose') args.push('--json');
  if (command === 'course' && (args.includes('--colour') || args.includes('another.json'))) invalid = true;
  return { argv: args, invalid, label: `option ${command}` };
}

// ── Run ──
const io = (out, err) => ({
  out: (text) => out.push(text),
  err: (text) => err.push(text),
  readCase: target.readCaseFile,
  ...(target.readTextFile ? { readText: target.readTextFile } : {}),
  today: () => '2026-12-01',
  now: () => new Date(Date.UTC(2026, 10, 20, 8)),
  ...(target.writeCalendarFile ? { writeCalendar: target.writeCalendarFile } : {}),
});
const trace = /^\s+at .+(:\d+:\d+\)?|\(native\))$/m;
const tally = { inputs: 0, invalid: 0, stackTraces: 0, numbersForInvalid: 0, byKind: {} };
const examples = { stackTraces: [], numbersForInvalid: [] };
const started = Date.now();
for (let index = 0; index < total; index += 1) {
  const share = index / total;
  const input = share < 0.4 ? caseInput() : share < 0.7 ? calcInput() : optionInput();
  const out = [];
  const err = [];
  let code;
  let thrown;
  try {
    code = await target.runCli(input.argv, io(out, err));
  } catch (error) {
    thrown = error;
    code = 3;
  }
  const stdout = out.join('\n');
  const stderr = err.join('\n');
  tally.inputs += 1;
  if (input.invalid) tally.invalid += 1;
  const kind = input.label.split(' ')[0];
  tally.byKind[kind] ??= { inputs: 0, stackTraces: 0, numbersForInvalid: 0 };
  tally.byKind[kind].inputs += 1;
  if (thrown !== undefined || code === 3 || trace.test(stdout) || trace.test(stderr)) {
    tally.stackTraces += 1;
    tally.byKind[kind].stackTraces += 1;
    if (examples.stackTraces.length < show) examples.stackTraces.push({ argv: input.argv, ...(input.what ? { what: input.what } : {}), message: String(thrown?.message ?? stderr).split('\n')[0] });
  } else if (input.invalid && code === 0 && /\d/.test(stdout)) {
    tally.numbersForInvalid += 1;
    tally.byKind[kind].numbersForInvalid += 1;
    if (examples.numbersForInvalid.length < show) examples.numbersForInvalid.push({ argv: input.argv, ...(input.what ? { what: input.what } : {}), first: stdout.split('\n')[0] });
  }
}
rmSync(work, { recursive: true, force: true });
console.log(JSON.stringify({ root, seed, seconds: Math.round((Date.now() - started) / 1000), ...tally, examples }, null, 2));
