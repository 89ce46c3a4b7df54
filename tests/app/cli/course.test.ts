import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { runWith } from './harness';
import { forbiddenPhrasings } from '../../core/safety/safetyCases';

// Scenarios 7 (PB-2204, PB-2205) and 8 (WD-0610) of ../shared/scenarios.md, end to end through the
// command line. Expected figures: the label doses (succimer label table; calcium disodium edetate label;
// dimercaprol label; trientine labels) × the invented patients' sizes by hand arithmetic, Mosteller BSA,
// and the UK clock rule (Summer Time Order 2002: clocks back on 2026-10-25 at 01:00 GMT).

// The ward's zone is fixed so no test depends on this machine's; the shared harness fixes the clock.
const cli = (...argv: string[]) => runWith(argv, { timeZone: () => 'Europe/London' });

const tempFile = () => join(mkdtempSync(join(tmpdir(), 'cl-course-')), 'course.ics');
const pb2204 = ['succimer-lead', '--label', 'PB-2204', '--weight-kg', '14', '--height-cm', '92', '--age-years', '3', '--blood-lead', '58', '--blood-lead-unit', 'ug/dL', '--start', '2026-10-24T22:00'];
const pb2205 = [
  'dimercaprol-edetate-encephalopathy',
  '--label',
  'PB-2205',
  '--weight-kg',
  '16',
  '--height-cm',
  '101',
  '--age-years',
  '4',
  '--blood-lead',
  '78',
  '--blood-lead-unit',
  'ug/dL',
  '--encephalopathy',
  '--basis',
  'mg-per-m2',
  '--start',
  '2026-10-24T20:00',
];
const wd0610 = [
  'trientine-tetrahydrochloride-wilson',
  '--label',
  'WD-0610',
  '--weight-kg',
  '66',
  '--age-years',
  '34',
  '--switch-from',
  'trientine-dihydrochloride',
  '--current-daily-mg',
  '1000',
  '--current-strength-mg',
  '250',
  '--current-strength-basis',
  'salt',
  '--strength-mg',
  '150',
  '--strength-basis',
  'base',
  '--urinary-copper',
  '450',
  '--urinary-copper-unit',
  'ug/24h',
  '--start',
  '2026-11-16T08:00',
];

interface JsonPhase {
  drug: string;
  dosePerAdministrationMg: number;
  administrations: number;
  first: { localDate: string; localTime: string };
  last: { localDate: string; localTime: string };
  totalMg: number;
}

describe('scenario 7, PB-2204: succimer for a 3-year-old, 14 kg, 92 cm, blood lead 58 µg/dL', async () => {
  it('plans 100 mg (label band 8–15 kg) every 8 h × 15 then every 12 h × 28, 4,300 mg, last dose 2026-11-12 09:00 after the clock change', async () => {
    const { code, out } = await cli('course', ...pb2204, '--json');
    expect(code).toBe(0);
    const plan = JSON.parse(out) as { phases: JsonPhase[]; totalsMg: { mg: number; administrations: number }[]; bloodLead: { umolPerL: number }; monitoring: { what: string; dueDate: string }[]; caution: string };
    expect(plan.phases.map((it) => [it.dosePerAdministrationMg, it.administrations, `${it.first.localDate} ${it.first.localTime}`, `${it.last.localDate} ${it.last.localTime}`, it.totalMg])).toEqual([
      [100, 15, '2026-10-24 22:00', '2026-10-29 13:00', 1500],
      [100, 28, '2026-10-29 21:00', '2026-11-12 09:00', 2800],
    ]);
    expect(plan.totalsMg[0]).toMatchObject({ mg: 4300, administrations: 43 });
    expect(plan.bloodLead.umolPerL).toBeCloseTo((58 * 10) / 207.2, 6); // 2.80 µmol/L
    expect(plan.monitoring.filter((it) => it.what.startsWith('blood lead')).map((it) => it.dueDate)).toEqual(['2026-10-31', '2026-11-07', '2026-11-19']);
    expect(plan.caution).toContain('for review by the prescriber and a toxicologist');
  });

  it('prints the three bases side by side, the cap rule, the clock change and the repeat blood lead', async () => {
    const { code, out } = await cli('course', ...pb2204);
    expect(code).toBe(0);
    expect(out).toContain('100.0 mg per administration × 15');
    expect(out).toContain('other published bases: mg-per-kg 140.0 mg; mg-per-m2 209.4 mg');
    expect(out).toContain('body-surface area 0.598 m²');
    expect(out).toContain('Blood lead: 58.0 µg/dL = 2.80 µmol/L');
    expect(out).toContain("on 2026-10-25 the ward's clock changes from UTC+01:00 to UTC+00:00 (back 60 min)");
    expect(out).toContain('2026-10-25 05:00 UTC+00:00  course 1  succimer 100.0 mg  (every-8-h 2)  ← clock changed');
    expect(out).toContain('- 2026-11-19: blood lead after the course');
  });

  it('by weight (10 mg/kg → 140 mg) and by body-surface area (350 mg/m² → 209.4 mg) on request', async () => {
    const perKg = JSON.parse((await cli('course', ...pb2204, '--basis', 'mg-per-kg', '--json')).out) as { phases: JsonPhase[] };
    expect(perKg.phases[0]!.dosePerAdministrationMg).toBeCloseTo(140, 6);
    const perM2 = JSON.parse((await cli('course', ...pb2204, '--basis', 'mg-per-m2', '--json')).out) as { phases: JsonPhase[] };
    expect(perM2.phases[0]!.dosePerAdministrationMg).toBeCloseTo(350 * Math.sqrt((92 * 14) / 3600), 6);
  });

  it('writes an .ics file that ical.js reads back: 43 timed doses at the planned UTC instants plus the monitoring days', async () => {
    const path = tempFile();
    const { code, out } = await cli('course', ...pb2204, '-o', path);
    expect(code).toBe(0);
    expect(out).toContain(`to ${path} (iCalendar)`);
    const root = new ICAL.Component(ICAL.parse(readFileSync(path, 'utf8')));
    const events = root.getAllSubcomponents('vevent').map((it) => new ICAL.Event(it));
    const timed = events.filter((it) => !it.startDate.isDate);
    expect(timed).toHaveLength(43);
    expect(timed[0]!.startDate.toJSDate().toISOString()).toBe('2026-10-24T21:00:00.000Z'); // 22:00 BST
    expect(timed[1]!.startDate.toJSDate().toISOString()).toBe('2026-10-25T05:00:00.000Z'); // 8 h later, 05:00 GMT
    expect(timed[42]!.startDate.toJSDate().toISOString()).toBe('2026-11-12T09:00:00.000Z');
    expect(timed[0]!.summary).toBe('PB-2204: succimer 100 mg oral (planned, 1 of 15)');
    expect(timed[0]!.description).toContain('for review by the prescriber and a toxicologist');
    expect(events.filter((it) => it.startDate.isDate).map((it) => it.startDate.toString())).toContain('2026-11-19');
    expect(new Set(events.map((it) => it.uid)).size).toBe(events.length);
    // An existing file is not replaced without --force.
    const again = await cli('course', ...pb2204, '-o', path);
    expect(again.code).toBe(1);
    expect(again.err).toContain('already exists');
    expect((await cli('course', ...pb2204, '-o', path, '--force')).code).toBe(0);
  });
});

describe('scenario 7, PB-2205: dimercaprol first, calcium disodium edetate from the second dose, 16 kg, 101 cm, 78 µg/dL with encephalopathy', async () => {
  it('doses by body-surface area (0.670 m²): dimercaprol 50.2 mg and edetate 167.5 mg every 4 h × 30; edetate at most 1,005 mg in any 24 h', async () => {
    const { code, out } = await cli('course', ...pb2205, '--json');
    expect(code).toBe(0);
    const plan = JSON.parse(out) as { phases: JsonPhase[]; dailyChecks: { largestMgIn24h: number; limitMg: number; withinLimit: boolean }[]; administrations: { drug: string; at: { localDate: string; localTime: string } }[] };
    const bsa = Math.sqrt((101 * 16) / 3600);
    expect(plan.phases.map((it) => it.drug)).toEqual(['dimercaprol', 'calcium-disodium-edetate']);
    expect(plan.phases[0]!.dosePerAdministrationMg).toBeCloseTo(75 * bsa, 6); // 50.25 mg
    expect(plan.phases[1]!.dosePerAdministrationMg).toBeCloseTo(250 * bsa, 6); // 167.5 mg
    expect(plan.phases.map((it) => it.administrations)).toEqual([30, 30]);
    expect(plan.administrations[0]!.drug).toBe('dimercaprol');
    expect(plan.administrations.slice(1, 3).map((it) => it.drug).sort()).toEqual(['calcium-disodium-edetate', 'dimercaprol']); // both at 00:00
    expect(plan.phases[1]!.first).toMatchObject({ localDate: '2026-10-25', localTime: '00:00' });
    expect(plan.phases[0]!.last).toMatchObject({ localDate: '2026-10-29', localTime: '15:00' });
    expect(plan.phases[1]!.last).toMatchObject({ localDate: '2026-10-29', localTime: '19:00' });
    expect(plan.dailyChecks[0]!.limitMg).toBeCloseTo(1500 * bsa, 6);
    expect(plan.dailyChecks[0]!.withinLimit).toBe(true);
  });

  it('says dimercaprol is in peanut oil and that edetate is not edetate disodium', async () => {
    const { out } = await cli('course', ...pb2205);
    expect(out).toContain('peanut oil');
    expect(out).toContain('Not edetate disodium');
    expect(out).toContain('pM 16.0 (computed, edta-textbook-25c)');
  });

  it('refuses an order typed as "edetate disodium", with the reason and the drug meant', async () => {
    const { code, err } = await cli('course', 'edetate', 'disodium', '--weight-kg', '16', '--height-cm', '101', '--start', '2026-10-24T20:00');
    expect(code).toBe(1);
    expect(err).toContain('"edetate disodium" is edetate disodium, which is not a treatment for lead poisoning');
    expect(err).toContain('MMWR 2006;55:204');
    expect(err).toContain('calcium disodium edetate');
  });

  it('refuses succimer in encephalopathy and dimercaprol for iron', async () => {
    expect((await cli('course', 'succimer-lead', '--weight-kg', '16', '--age-years', '4', '--encephalopathy', '--start', '2026-10-24T20:00')).err).toContain('blood-brain barrier');
    const iron = await cli('course', ...pb2205, '--metal', 'iron');
    expect(iron.code).toBe(1);
    expect(iron.err).toContain('--metal: Dimercaprol is not used for iron poisoning');
  });
});

describe('scenario 8, WD-0610: trientine salt or base, 34 years, 66 kg', async () => {
  it('today 1,000 mg/day of the dihydrochloride = 667.3 mg base; the tetrahydrochloride plan carries the same base, 333.6 mg twice a day', async () => {
    const { code, out } = await cli('course', ...wd0610, '--json');
    expect(code).toBe(0);
    const plan = JSON.parse(out) as { trientineSwitch: { currentDailyBaseMg: number; equivalentDailyMg: number; equivalentUnitsPerDay: number }; phases: JsonPhase[]; urinaryCopper: { umolPer24h: number }; monitoring: { what: string }[] };
    const baseMg = (1000 * 146.238) / 219.154; // C6H18N4 / C6H18N4·2HCl with CIAAW weights
    expect(plan.trientineSwitch.currentDailyBaseMg).toBeCloseTo(baseMg, 1);
    expect(plan.trientineSwitch.equivalentDailyMg).toBeCloseTo(baseMg, 1);
    expect(plan.trientineSwitch.equivalentUnitsPerDay).toBeCloseTo(baseMg / 150, 2); // 4.45 tablets of 150 mg base
    expect(plan.phases[0]!.dosePerAdministrationMg).toBeCloseTo(baseMg / 2, 1);
    expect(plan.phases[0]!.administrations).toBe(28); // 14 days twice daily
    expect(plan.urinaryCopper.umolPer24h).toBeCloseTo(450 / 63.546, 6);
    expect(plan.monitoring[0]!.what).toContain('24-hour urinary copper');
  });

  it('prints the nearest half tablets beside the exact base: 2 (600 mg/day) or 2½ (750 mg/day)', async () => {
    const { out } = await cli('course', ...wd0610);
    expect(out).toContain('today 1000 mg/day of trientine-dihydrochloride (salt) = 667.3 mg trientine base/day');
    expect(out).toContain('per administration (2 a day): 333.6 mg; nearest half tablets: 2 (300.0 mg, 600.0 mg/day) or 2.5 (375.0 mg, 750.0 mg/day).');
    expect(out).toContain('not interchangeable mg for mg');
  });

  it('catches the new strength entered as salt (150 mg is base): both figures shown, nothing planned', async () => {
    const wrong = wd0610.map((word, index) => (wd0610[index - 1] === '--strength-basis' ? 'salt' : word));
    const { code, err } = await cli('course', ...wrong);
    expect(code).toBe(1);
    expect(err).toContain('--strength-mg: Strength 150 mg entered as trientine tetrahydrochloride (salt)');
    expect(err).toContain('299.6 mg of trientine tetrahydrochloride');
    expect(err).toContain('75.1 mg base');
  });

  it('catches the current capsule entered as base (250 mg is the salt)', async () => {
    const wrong = wd0610.map((word, index) => (wd0610[index - 1] === '--current-strength-basis' ? 'base' : word));
    const { code, err } = await cli('course', ...wrong);
    expect(code).toBe(1);
    expect(err).toContain('--switch-from.--strength-mg');
    expect(err).toContain('166.8 mg trientine base');
  });
});

describe('course --list and bad input', async () => {
  it('lists every regimen with its sources, readable and as JSON', async () => {
    const { code, out } = await cli('course', '--list');
    expect(code).toBe(0);
    expect(out).toContain('succimer-lead — Succimer for lead poisoning');
    expect(out).toContain('MMWR Morb Mortal Wkly Rep 2006;55(8):204-207');
    const json = JSON.parse((await cli('course', '--list', '--json')).out) as { regimens: { id: string; sources: { citation: string }[] }[] };
    expect(json.regimens.map((it) => it.id)).toContain('trientine-tetrahydrochloride-wilson');
    expect(json.regimens.every((it) => it.sources.length > 0)).toBe(true);
  });

  it('reads numbers strictly and refuses a flag given twice, printing no plan (as the other commands do)', async () => {
    // Number('0x10') is 16 and Number('1e400') is Infinity: a weight typed so must not become a dose (an empty value is 'missing').
    for (const typed of ['0x10', '14abc', 'Infinity', '1e400']) {
      const run = await cli('course', ...pb2204.map((it, index) => (pb2204[index - 1] === '--weight-kg' ? typed : it)));
      expect(run.code, typed).toBe(1);
      expect(run.out, typed).toBe('');
      expect(run.err, typed).toContain(`--weight-kg: "${typed}" is not a number; enter the weight, kg, 2–200.`);
    }
    const twice = await cli('course', ...pb2204, '--weight-kg', '20');
    expect(twice.code).toBe(1);
    expect(twice.out).toBe('');
    expect(twice.err).toContain('--weight-kg: given 2 times ("14", "20"); give it once.');
  });

  it('names the field, the value and the range; never assumes a unit', async () => {
    const weight = await cli('course', 'succimer-lead', '--weight-kg', 'fourteen', '--age-years', '3', '--start', '2026-10-24T22:00');
    expect(weight.code).toBe(1);
    expect(weight.err).toContain('--weight-kg: "fourteen" is not a number; enter the weight, kg, 2–200.');
    const unit = await cli('course', ...pb2204.filter((it) => it !== '--blood-lead-unit' && it !== 'ug/dL'));
    expect(unit.err).toContain('--blood-lead-unit: required with --blood-lead (ug/dL or umol/L); a unit is never assumed.');
    const gap = await cli('course', 'succimer-lead', '--weight-kg', '14', '--age-years', '3', '--start', '2026-03-29T01:30');
    expect(gap.err).toContain('does not exist on the clock in Europe/London');
    const zone = await cli('course', ...pb2204, '--time-zone', 'Mars/Base');
    expect(zone.err).toContain('--time-zone: "Mars/Base" is not an IANA time zone name');
    expect((await cli('course', 'no-such-regimen', '--weight-kg', '14', '--start', '2026-10-24T22:00')).err).toContain('not in the course catalogue');
    expect((await cli('course')).code).toBe(2);
  });

  it('prints descriptive wording only (no instruction to dose), with the caution', async () => {
    for (const argv of [pb2204, pb2205, wd0610, ['--list']]) {
      const { out } = await cli('course', ...argv);
      for (const line of out.split('\n')) for (const pattern of forbiddenPhrasings) expect(pattern.test(line), `"${line.trim()}" matches ${pattern}`).toBe(false);
      expect(out).toContain('for review by the prescriber and a toxicologist');
      // What a user reads cites publications, never a file of this project.
      expect(out).not.toMatch(/references\.md|\bcore\/|\.ts\b/);
    }
  });
});

describe('course --sheet: the planned course printed through the review sheet', () => {
  // A PDF render under a shared, loaded CPU can take seconds; the ceiling is generous and is not a speed target.
  const renderCeilingMs = 60_000;

  it('builds the sheet as data: sections, the schedule row by row, the caution and a sign-off for prescriber and toxicologist', async () => {
    let captured: import('../../../core/report/sheet').Sheet | undefined;
    const { code, out } = await runWith(['course', ...pb2204, '--sheet', join(mkdtempSync(join(tmpdir(), 'cl-course-')), 'plan.pdf')], {
      timeZone: () => 'Europe/London',
      renderSheet: async (sheet) => {
        captured = sheet;
        return Buffer.from('%PDF-fake');
      },
    });
    expect(code).toBe(0);
    expect(out).toContain('Wrote the course sheet (A4)');
    const sheet = captured!;
    expect(sheet.sections.map((it) => it.id)).toEqual(['course', 'phases', 'schedule', 'monitoring', 'binding', 'notes']);
    expect(sheet.header).toMatchObject({ caseLabel: 'PB-2204', reviewDate: '2026-10-24', dateLabel: 'First day', hashLabel: 'plan SHA-256' });
    expect(sheet.header.caseFileSha256).toMatch(/^[0-9a-f]{64}$/);
    const schedule = sheet.sections[2]!.blocks[0]!;
    expect(schedule.kind === 'table' && schedule.rows.length).toBe(43);
    expect(schedule.kind === 'table' && schedule.rows[42]).toEqual(['2026-11-12', '09:00', '+00:00', '1', 'succimer', '100.0 mg', 'every-12-h 28']);
    expect(sheet.signOff.prescriberFields).toEqual(['Prescriber', 'Toxicologist', 'Pharmacist']);
    const texts = sheet.sections.flatMap((section) => section.blocks.flatMap((block) => (block.kind === 'paragraph' ? [block.text] : block.kind === 'table' ? block.rows.flat() : block.kind === 'facts' ? block.rows.map((it) => it.value) : [])));
    for (const text of texts) for (const pattern of forbiddenPhrasings) expect(pattern.test(text), `"${text}" matches ${pattern}`).toBe(false);
  });

  it('writes a real PDF whose text (pdftotext, poppler) carries the doses, the last dose and the caution on every page', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'cl-course-')), 'PB-2205.pdf');
    const { code } = await cli('course', ...pb2205, '--sheet', path);
    expect(code).toBe(0);
    const { execFileSync } = await import('node:child_process');
    const text = execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' });
    const pages = text.split('\f').filter((it) => it.trim() !== '');
    expect(pages.length).toBeGreaterThan(1);
    for (const page of pages) expect(page).toContain('Decision support only, not a prescription');
    expect(text).toContain('Heavy-metal course plan — PB-2205');
    expect(text).toContain('50.2 mg');
    expect(text).toContain('167.5 mg');
    expect(text).toMatch(/2026-10-29\s+19:00\s+\+00:00/); // the last edetate dose
    expect(text).toContain('Toxicologist');
    expect(text).not.toContain('[U+');
    // An existing PDF is left alone without --force.
    expect((await cli('course', ...pb2205, '--sheet', path)).code).toBe(1);
  }, renderCeilingMs);
});
