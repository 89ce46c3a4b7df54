import { copyFileSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCsvImport, type CsvKind } from '../../../app/host/imports/csvImport';
import { previewImport } from '../../../app/host/imports/importCase';
import { parseCase } from '../../../core/model/parseCase';
import type { Case } from '../../../core/model/caseFile';
import { readDemo } from '../../core/model/caseFixtures';
import { cli, demoCase, tempDir } from '../cli/harness';

// CSV imports of red-cell exchanges and venesections, on CSV files written for
// these tests (tests/app/host/fixtures, invented rows). Outside references:
// - UCUM (the Unified Code for Units of Measure, Regenstrief): l is the cubic
//   decimetre, so 1 L = 1000 mL exactly; % is 10^-2, so 58 % = 0.58 exactly.
//   Conversions go through ucum-lhc (NLM), so these are equalities, not
//   tolerances;
// - RFC 4180 for the quoted product cell; line numbers are counted by hand in
//   each fixture (header on line 1);
// - the case model's own refusals (the same messages as `check`) for values it
//   cannot accept, checked by message, not re-derived here.

const fixture = (name: string) => readFileSync(new URL(`./fixtures/${name}`, import.meta.url), 'utf8');

function demo(): Case {
  const parsed = parseCase(readDemo('th-0417'));
  if (!parsed.ok) throw new Error('demo case invalid');
  return parsed.value;
}

describe('CSV import of red-cell exchanges', () => {
  const plan = readCsvImport(fixture('exchanges-apheresis.csv'), null);

  it('guesses the kind and every column from the headers and says so, with the units it converts', () => {
    if (!plan.ok) throw new Error(plan.issues[0]!.message);
    expect(plan.value.understood).toEqual([
      'kind: exchanges (guessed from the headers)',
      'date ← column "Procedure date" (guessed)',
      'method ← column "Method" (guessed)',
      'volumeIn ← column "Volume in (L)" (guessed)',
      'haematocrit ← column "Unit Hct (%)" (guessed)',
      'units ← column "Units" (guessed)',
      'volumeRemoved ← column "Volume removed (mL)" (guessed)',
      'patientHaematocrit ← column "Pre Hct (%)" (guessed)',
      'product ← column "Product" (guessed)',
      'volumeIn in L, converted to mL',
      'volumeRemoved in mL',
      'haematocrit in %, converted to a fraction',
      'patientHaematocrit in %, converted to a fraction',
    ]);
  });

  it('converts litres and percentages through UCUM (1 L = 1000 mL, 1 % = 0.01), an empty units haematocrit to the product default', () => {
    if (!plan.ok) throw new Error('not read');
    expect(plan.value.entries.map((it) => [it.where, it.entry])).toEqual([
      [
        'line 2',
        { date: '2026-09-07', kind: 'exchange', method: 'automated', volumeIn: { value: 2100, unit: 'mL' }, unitHaematocrit: 0.58, unitCount: 8, volumeRemoved: { value: 2300, unit: 'mL' }, patientHaematocrit: 0.27, note: 'product: red cells, HbS negative' },
      ],
      ['line 3', { date: '2026-10-05', kind: 'exchange', method: 'manual', volumeIn: { value: 1500, unit: 'mL' }, unitHaematocrit: null, unitCount: 6, volumeRemoved: { value: 1400, unit: 'mL' }, patientHaematocrit: 0.29 }],
    ]);
  });

  it('rejects each bad row with its line, its column and the reason; an ambiguous date asks for the date order', () => {
    if (!plan.ok) throw new Error('not read');
    expect(plan.value.rejected).toEqual([
      { where: 'line 4', reason: 'column "Procedure date": date "05/11/2026" could be day-first or month-first; choose the date order (day first or month first)', choice: 'dateOrder' },
      { where: 'line 5', reason: 'column "Method": method "semi-automatic" is neither manual nor automated (apheresis)' },
      { where: 'line 6', reason: 'column "Volume in (L)": volume in "" is not a number' },
    ]);
    const dayFirst = readCsvImport(fixture('exchanges-apheresis.csv'), null, { dateOrder: 'day-first' });
    expect(dayFirst.ok && dayFirst.value.entries.map((it) => it.entry['date'])).toEqual(['2026-09-07', '2026-10-05', '2026-11-05']);
  });

  it('does not guess a plain "hct" column in an exchange (units or patient?), says why, and reads it once mapped', () => {
    const text = fixture('exchanges-plain-hct.csv');
    const unmapped = readCsvImport(text, null);
    expect(unmapped.ok).toBe(false);
    if (unmapped.ok) return;
    expect(unmapped.issues[0]!.path).toEqual(['columnMapping', 'haematocrit']);
    expect(unmapped.issues[0]!.message).toBe(
      'The column "hct" could hold the units\' or the patient\'s haematocrit, so it is not guessed; choose the field it holds (haematocrit for the units\', patientHaematocrit for the patient\'s before the exchange).',
    );
    // Without the "pre hct" column the patient's haematocrit is missing, and the message says why "hct" was not taken.
    const withoutPre = readCsvImport(text.replace(',pre hct', '').replace(/,0\.27$/m, ''), null);
    expect(!withoutPre.ok && withoutPre.issues[0]!.message).toBe(
      'The header row (line 1) has no column for patient haematocrit (the column "hct" could hold the units\' or the patient\'s haematocrit, so it is not guessed); choose the column that holds it.',
    );
    // "pre hct" is the patient's; mapping the plain column to the units' haematocrit settles the file.
    const mapped = readCsvImport(text, null, { mapping: { haematocrit: 'hct' } });
    expect(mapped.ok && mapped.value.entries.map((it) => it.entry)).toEqual([
      { date: '2026-09-07', kind: 'exchange', method: 'automated', volumeIn: { value: 2100, unit: 'mL' }, unitHaematocrit: 0.58, unitCount: 8, volumeRemoved: { value: 2300, unit: 'mL' }, patientHaematocrit: 0.27 },
    ]);
  });
});

describe('CSV import of venesections', () => {
  it('reads day-first dates the file implies, refuses a percentage without (%), and names the column of a case-model refusal', () => {
    const preview = previewImport({ name: 'venesections.csv', text: fixture('venesections-day-first.csv') }, demo());
    if (!preview.ok) throw new Error(preview.issues[0]!.message);
    expect(preview.value.understood).toEqual(
      expect.arrayContaining(['kind: venesections (guessed from the headers)', 'patientHaematocrit ← column "Hct" (guessed)', 'dates: day-first (some dates can only be read that way)']),
    );
    expect(preview.value.entries.map((it) => [it.where, it.entry])).toEqual([
      ['line 2', { date: '2026-01-14', kind: 'venesection', volumeRemoved: { value: 450, unit: 'mL' }, patientHaematocrit: 0.42 }],
      ['line 5', { date: '2026-04-08', kind: 'venesection', volumeRemoved: { value: 400, unit: 'mL' }, patientHaematocrit: 0.39 }],
    ]);
    expect(preview.value.rejected.map((it) => it.where)).toEqual(['line 3', 'line 4']);
    expect(preview.value.rejected[0]!.reason).toBe('column "Hct": patient haematocrit 41 looks like a percentage; write the column header with (%) or enter it as a fraction');
    // 4500 mL is beyond what one venesection can remove (the case model's possible range; the same message as check).
    expect(preview.value.rejected[1]!.reason).toMatch(/^column "Volume removed": transfusions\[\d+\]\.volumeRemoved\.value 4500 mL is not possible/);
    expect(preview.value.counts).toMatchObject({ venesections: 2, transfusions: 0, exchanges: 0 });
  });
});

describe('import command with exchanges and venesections', () => {
  it('adds exchanges through the case store with one journal line, and --kind venesections reads a file the guess would not', async () => {
    const folder = tempDir();
    const casePath = join(folder, 'th-0417.json');
    copyFileSync(demoCase('th-0417'), casePath);
    const csvPath = join(folder, 'exchanges.csv');
    copyFileSync(new URL('./fixtures/exchanges-apheresis.csv', import.meta.url), csvPath);
    const run = await cli('import', csvPath, '--into', casePath, '--date-order', 'day-first');
    expect(run.code, run.err).toBe(0);
    expect(run.out).toContain('line 2: 2026-09-07 automated exchange 2100 mL in (unit haematocrit 0.58), 2300 mL out, patient haematocrit 0.27');
    expect(run.out).toContain('line 5: column "Method": method "semi-automatic" is neither manual nor automated (apheresis)');
    // Counted as what they are: the three rows are exchanges, not transfusions (they share the record's list).
    expect(run.out).toContain('Adding: 0 transfusion(s), 3 red-cell exchange(s), 0 result(s), 0 weight(s), 0 height(s).');
    const saved = JSON.parse(readFileSync(casePath, 'utf8'));
    expect(saved.transfusions.filter((it: { kind: string }) => it.kind === 'exchange')).toHaveLength(3);
    const journal = readFileSync(join(folder, 'th-0417.journal.jsonl'), 'utf8').trim().split('\n');
    expect(JSON.parse(journal.at(-1)!).change).toBe('imported 3 entries from exchanges.csv');

    const plainPath = join(folder, 'removed.csv');
    copyFileSync(new URL('./fixtures/venesections-day-first.csv', import.meta.url), plainPath);
    const wrongKind = await cli('import', plainPath, '--into', casePath, '--kind', 'exchanges', '--dry-run');
    expect(wrongKind.code).toBe(1);
    expect(wrongKind.err).toContain('has no column for method, volume in, units, patient haematocrit');
    expect(wrongKind.err).toContain('On the command line: --map method=<header>.');
    const unknownKind = await cli('import', plainPath, '--into', casePath, '--kind', 'phlebotomy');
    expect(unknownKind.code).toBe(2);
    expect(unknownKind.err).toContain('--kind: "phlebotomy" is not one of: transfusions, exchanges, venesections, results.');
  });
});

describe('fuzzing the exchange and venesection paths', () => {
  // Property: whatever the rows hold, reading and screening answer with a plan, never throw, and every
  // rejection names its line and (for a cell) its column. Inputs are fast-check's, seeds fixed.
  const headersByKind: Readonly<Record<'exchanges' | 'venesections', readonly string[]>> = {
    exchanges: ['Date', 'Method', 'Volume in (L)', 'Unit Hct (%)', 'Units', 'Volume removed (mL)', 'Pre Hct (%)', 'Product'],
    venesections: ['Date', 'Volume removed', 'Hct'],
  };
  const cell = fc.oneof(
    fc.string({ maxLength: 10 }),
    fc.constantFrom('2026-01-05', '05/01/2026', '13/01/2026', '01/13/2026', 'manual', 'automated', 'Apheresis', '2.1', '2300', '0.42', '42', '-1', '1e9', 'NaN', '', '"', ','),
  );
  const csv = (kind: 'exchanges' | 'venesections') =>
    fc.array(fc.array(cell, { minLength: 0, maxLength: headersByKind[kind].length + 1 }), { maxLength: 10 }).map((rows) => [headersByKind[kind].join(','), ...rows.map((row) => row.join(','))].join('\n'));
  const headerSet = new Set([...headersByKind.exchanges, ...headersByKind.venesections].map((it) => `column "${it}"`));
  const namesColumn = (reason: string) => [...headerSet].some((it) => reason.startsWith(it)) || /^the row has \d+ of \d+ columns/.test(reason) || reason.startsWith('the CSV cannot be read here');

  for (const [kind, seed] of [['exchanges', 21], ['venesections', 22]] as const) {
    it(`reads 2,000 ${kind} files without a throw, every rejection naming line and column`, () => {
      fc.assert(
        fc.property(csv(kind), fc.boolean(), (text, giveKind) => {
          const read = readCsvImport(text, null, giveKind ? { kind: kind as CsvKind } : {});
          if (!read.ok) {
            // A file-wide refusal names the choice that settles it (a date order, a column).
            for (const found of read.issues) expect(['dateOrder', 'columnMapping', 'kind', 'line 1']).toContain(found.path[0]);
            return;
          }
          for (const row of read.value.rejected) {
            expect(row.where).toMatch(/^line \d+$/);
            expect(namesColumn(row.reason), row.reason).toBe(true);
          }
        }),
        { seed, numRuns: 2000 },
      );
    }, 120_000);
  }

  it('screens 300 exchange and venesection files against a case without a throw; the model refusals name the column', () => {
    const caseFile = demo();
    fc.assert(
      fc.property(fc.oneof(csv('exchanges'), csv('venesections')), (text) => {
        const preview = previewImport({ name: 'fuzz.csv', text }, caseFile, { dateOrder: 'day-first' });
        if (!preview.ok) return;
        expect(preview.value.caseProblems).toEqual([]);
        for (const row of preview.value.rejected) {
          expect(row.where).toMatch(/^line \d+$/);
          expect(namesColumn(row.reason), row.reason).toBe(true);
        }
      }),
      { seed: 23, numRuns: 300 },
    );
  }, 240_000);
});
