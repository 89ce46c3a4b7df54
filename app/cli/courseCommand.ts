import {
  courseCaution,
  courseDrug,
  courseRegimens,
  creatinineForSchedule,
  isTimeZone,
  planCourse,
  resolveCourseRegimen,
  type CoursePlan,
  type CourseRequest,
  type DoseBasis,
  type StrengthBasis,
  type TrientineProductId,
  unitsAround,
} from '../../core/courses';
import { citeShort, findSource } from '../../core/references';
import { formatIssues, type Result } from '../../core/result';
import { ageYearsBounds, heightBounds, weightBounds, type Bounds } from '../../core/ranges';
import { bloodLead, checkLabValue, serumCreatinine, urinaryCopper, type UrinaryCopperUnit } from '../../core/units/formulas';
import { createHash } from 'node:crypto';
import { buildCourseSheet } from '../../core/report/courseSheet';
import { sheetPapers, type Sheet, type SheetPaper } from '../../core/report/sheet';
import { writeFileAtomic } from '../host/atomicWrite';
import { courseIcs } from '../host/courseCalendar';
import type { SheetPdfOptions } from '../host/sheetPdf';
import { toolVersion } from '../host/toolVersion';
import { writeCalendarOutput } from '../host/icalendar';
import { parseArgs, repeatedOptionProblems, splitOutput } from './args';
import { parseDecimal } from '../../core/numbers/parseDecimal';
import { formatNumber } from './format';
import { exitCodes, type CliIo } from './io';

export const courseUsage = `Usage:
  chelation-ledger course --list [--json]
  chelation-ledger course <regimen> --weight-kg N [--height-cm N] [--age-years N] --start YYYY-MM-DDTHH:mm
                          [--time-zone Area/City] [--label PB-2204] [--basis weight-band|mg-per-kg|mg-per-m2]
                          [--mg-per-kg N] [--dose-mg N] [--daily-mg N] [--administrations-per-day N] [--days N]
                          [--courses N] [--rest-days N] [--metal lead|mercury|arsenic|copper|iron|cadmium|selenium]
                          [--encephalopathy] [--blood-lead N --blood-lead-unit ug/dL|umol/L]
                          [--creatinine N --creatinine-unit mg/dL|umol/L] [--anc-per-ul N]
                          [--urinary-copper N --urinary-copper-unit ug/24h|umol/24h]
                          [--strength-mg N --strength-basis salt|base]
                          [--switch-from trientine-dihydrochloride|trientine-tetrahydrochloride --current-daily-mg N
                           [--current-strength-mg N --current-strength-basis salt|base]]
                          [--json] [-o schedule.ics] [--sheet course.pdf [--paper a4|letter] [--prepared-by NAME]] [--force]
Plans a heavy-metal course: dose per administration with its basis and caps, every administration dated and timed
on the ward's clock (--time-zone, default this computer's zone), rest days, totals, monitoring due dates.
For review by the prescriber and a toxicologist; follow local protocols.`;

/** What the course command needs from the host: the clock for DTSTAMP, the ward's zone, a file writer. Tests pass fakes. */
export interface CourseHostIo {
  readonly now?: () => Date;
  readonly timeZone?: () => string;
  readonly writeCalendar?: (path: string, text: string, options: { readonly overwrite: boolean; readonly inputs?: readonly string[] }) => Promise<Result<void>>;
  /** The sheet's PDF writer and an atomic file writer (the sheet command's services). */
  readonly renderSheet?: (sheet: Sheet, options: SheetPdfOptions) => Promise<Buffer>;
  readonly writeSheet?: (path: string, bytes: Uint8Array, options: { readonly overwrite: boolean }) => Promise<Result<void>>;
}

const switches = ['--json', '--list', '--force', '--encephalopathy', '--help'] as const;
/**
 * The patient's numbers take their ranges from core/ranges: the flag is refused outside the possible
 * range, and planCourse warns outside the plausible one (`shown`), as a case file does.
 */
const patientOption = (key: string, bounds: Bounds, label: string) =>
  ({ key, min: bounds.possible.min, max: bounds.possible.max, label, shown: `${bounds.plausible.min}–${bounds.plausible.max}` }) as const;
const numberOptions: Readonly<Record<string, { key: string; min: number; max: number; label: string; shown?: string }>> = {
  '--weight-kg': patientOption('weightKg', weightBounds, 'weight, kg'),
  '--height-cm': patientOption('heightCm', heightBounds, 'height, cm'),
  '--age-years': patientOption('ageYears', ageYearsBounds, 'age, years'),
  '--mg-per-kg': { key: 'mgPerKg', min: 0.1, max: 100, label: 'dose, mg/kg' },
  '--dose-mg': { key: 'doseMg', min: 0.1, max: 5000, label: 'dose per administration, mg' },
  '--daily-mg': { key: 'dailyMg', min: 1, max: 5000, label: 'daily dose, mg/day' },
  '--administrations-per-day': { key: 'administrationsPerDay', min: 1, max: 6, label: 'administrations per day' },
  '--days': { key: 'days', min: 1, max: 90, label: 'days' },
  '--courses': { key: 'courses', min: 1, max: 4, label: 'courses' },
  '--rest-days': { key: 'restDays', min: 0, max: 60, label: 'rest days between courses' },
  '--anc-per-ul': { key: 'ancPerUl', min: 0, max: 50000, label: 'absolute neutrophil count, /µL' },
  '--blood-lead': { key: 'bloodLead', min: 0, max: 1000, label: 'blood lead' },
  '--creatinine': { key: 'creatinine', min: 0, max: 2000, label: 'serum creatinine' },
  '--urinary-copper': { key: 'urinaryCopper', min: 0, max: 20000, label: '24-hour urinary copper' },
  '--strength-mg': { key: 'strengthMg', min: 1, max: 2000, label: 'strength, mg' },
  '--current-daily-mg': { key: 'currentDailyMg', min: 1, max: 5000, label: 'current daily dose, mg/day' },
  '--current-strength-mg': { key: 'currentStrengthMg', min: 1, max: 2000, label: 'current strength, mg' },
};
const textOptions = [
  '--start',
  '--time-zone',
  '--label',
  '--basis',
  '--metal',
  '--blood-lead-unit',
  '--creatinine-unit',
  '--urinary-copper-unit',
  '--strength-basis',
  '--switch-from',
  '--current-strength-basis',
  '--output',
  '--sheet',
  '--paper',
  '--prepared-by',
];
const bases: readonly DoseBasis[] = ['weight-band', 'mg-per-kg', 'mg-per-m2', 'fixed-mg', 'daily-mg', 'daily-mg-per-kg-rounded'];
const trientineProducts: readonly TrientineProductId[] = ['trientine-dihydrochloride', 'trientine-tetrahydrochloride'];

function cite(id: string): string {
  const source = findSource(id);
  return source ? citeShort(source) : id;
}

/** `course --list`: every regimen with its metals, phases and sources. */
function listRegimens(json: boolean, io: CliIo): number {
  if (json) {
    io.out(
      JSON.stringify(
        {
          regimens: courseRegimens.map((regimen) => ({
            id: regimen.id,
            title: regimen.title,
            metals: regimen.metals,
            populations: regimen.populations.map((population) => ({
              id: population.id,
              label: population.label,
              phases: population.phases.map((phase) => ({ id: phase.id, label: phase.label, drug: phase.drug, route: phase.route, doseOptions: phase.doseOptions })),
            })),
            sources: regimen.sourceIds.map((id) => ({ id, citation: cite(id) })),
          })),
          caution: courseCaution,
        },
        null,
        2,
      ),
    );
    return exitCodes.ok;
  }
  const lines = courseRegimens.flatMap((regimen) => [
    `${regimen.id} — ${regimen.title} [${regimen.metals.join(', ')}]`,
    ...regimen.populations.flatMap((population) => population.phases.map((phase) => `    ${population.label}: ${courseDrug(phase.drug).label}, ${phase.label}`)),
    `    sources: ${regimen.sourceIds.map(cite).join('; ')}`,
  ]);
  io.out([...lines, courseCaution].join('\n'));
  return exitCodes.ok;
}

const mg = (value: number) => `${formatNumber(value, 1)} mg`;
const when = (at: { localDate: string; localTime: string; utcOffset: string }) => `${at.localDate} ${at.localTime} (UTC${at.utcOffset})`;

/** The plan as a pharmacist reads it: summary, phases with basis and caps, totals, clock changes, schedule, monitoring, binding, sources. */
export function formatCoursePlan(plan: CoursePlan, label: string | undefined): string {
  const patient = plan.patient;
  const size = [
    `${patient.weightKg} kg`,
    patient.heightCm !== null ? `${patient.heightCm} cm` : null,
    patient.ageYears !== null ? `${patient.ageYears} years` : null,
    patient.bsaM2 !== null ? `body-surface area ${formatNumber(patient.bsaM2, 3)} m² (${patient.bsaMethod})` : null,
  ].filter((it) => it !== null);
  const lines: string[] = [
    `Planned course${label ? ` ${label}` : ''}: ${plan.regimenId} — ${plan.title}`,
    `Patient: ${size.join(', ')}; dose group: ${plan.population}.`,
  ];
  if (plan.bloodLead) lines.push(`Blood lead: ${formatNumber(plan.bloodLead.ugPerDl, 1)} µg/dL = ${formatNumber(plan.bloodLead.umolPerL, 2)} µmol/L (× 10 / Ar(Pb) 207.2).`);
  if (plan.urinaryCopper) lines.push(`24-hour urinary copper: ${formatNumber(plan.urinaryCopper.ugPer24h, 0)} µg/24 h = ${formatNumber(plan.urinaryCopper.umolPer24h, 2)} µmol/24 h (÷ Ar(Cu) 63.546).`);
  if (plan.renalSchedule) lines.push(`Renal schedule: ${plan.renalSchedule}.`);
  lines.push(`First administration: ${when(plan.start)}, ${plan.timeZone}.`, '', 'Phases:');
  for (const phase of plan.phases) {
    lines.push(
      `- course ${phase.course}, ${phase.drugLabel} ${phase.route}, ${phase.label}: ${mg(phase.dosePerAdministrationMg)} per administration × ${phase.administrations}, first ${when(phase.first)}, last ${when(phase.last)}; total ${mg(phase.totalMg)}`,
      `    basis: ${phase.doseBasis} (dosed as ${phase.dosedAs})`,
    );
    if (phase.alternatives.length > 0) lines.push(`    other published bases: ${phase.alternatives.map((it) => `${it.basis} ${mg(it.mg)}`).join('; ')}`);
    if (phase.capApplied) lines.push(`    cap applied: ${phase.capApplied}`);
    if (phase.maxMgPer24h !== null) lines.push(`    daily maximum: ${mg(phase.maxMgPer24h)} in 24 hours`);
    if (phase.administrationNote) lines.push(`    note: ${phase.administrationNote}`);
  }
  lines.push('', 'Totals:');
  for (const course of plan.courses) {
    lines.push(`- course ${course.course} (${when(course.first)} to ${when(course.last)}): ${course.totalsMg.map((it) => `${courseDrug(it.drug).label} ${mg(it.mg)} in ${it.administrations} administrations`).join('; ')}`);
  }
  if (plan.courses.length > 1) lines.push(`- all courses: ${plan.totalsMg.map((it) => `${courseDrug(it.drug).label} ${mg(it.mg)} in ${it.administrations} administrations`).join('; ')}`);
  if (plan.restDays.length > 0) lines.push(`Rest days (no administration): ${plan.restDays.join(', ')}.`);
  for (const check of plan.dailyChecks) {
    lines.push(`Daily dose check, ${courseDrug(check.drug).label}: at most ${mg(check.largestMgIn24h)} in any 24 hours against ${mg(check.limitMg)} (${check.withinLimit ? 'within' : 'EXCEEDED'}).`);
  }
  lines.push(
    plan.offsetChanges.length === 0
      ? 'Clock: no daylight-saving change during the plan.'
      : `Clock: ${plan.offsetChanges.map((it) => `on ${it.localDate} the ward's clock changes from UTC${it.offsetBefore} to UTC${it.offsetAfter} (${it.shiftMinutes > 0 ? 'forward' : 'back'} ${Math.abs(it.shiftMinutes)} min)`).join('; ')}; ${plan.administrations.filter((it) => it.clockShifted).length} administrations fall after a change.`,
    `    ${plan.timeRule}`,
  );
  if (plan.trientineSwitch) {
    const change = plan.trientineSwitch;
    lines.push(
      '',
      `Trientine switch: today ${formatNumber(change.currentDailyMg, 0)} mg/day of ${change.fromProductId} (${change.currentDailyBasis}) = ${formatNumber(change.currentDailyBaseMg, 1)} mg trientine base/day;`,
      `    on ${change.toProductId} (dosed as ${change.equivalentDailyBasis}): ${formatNumber(change.equivalentDailyMg, 1)} mg/day ≈ ${formatNumber(change.equivalentUnitsPerDay, 2)} ${change.unitName}s a day.`,
      ...plan.phases
        .filter((phase) => phase.drug === change.toProductId)
        .slice(0, 1)
        .map(
          (phase) =>
            `    per administration (${formatNumber(24 / phase.intervalHours, 0)} a day): ${mg(phase.dosePerAdministrationMg)}; nearest ${change.smallestUnit < 1 ? 'half ' : 'whole '}${change.unitName}s: ${unitsAround(change.toProductId, phase.dosePerAdministrationMg)
              .map((it) => `${formatNumber(it.units, 1)} (${mg(it.mg)}, ${mg((it.mg * 24) / phase.intervalHours)}/day)`)
              .join(' or ')}.`,
        ),
      ...change.notes.map((it) => `    ${it}`),
    );
  }
  lines.push('', 'Schedule (ward clock):');
  plan.administrations.forEach((item, index) => {
    const previous = plan.administrations[index - 1];
    const changed = previous !== undefined && previous.at.utcOffset !== item.at.utcOffset ? `  ← clock changed (UTC${previous.at.utcOffset} → UTC${item.at.utcOffset})` : '';
    lines.push(`  ${item.at.localDate} ${item.at.localTime} UTC${item.at.utcOffset}  course ${item.course}  ${courseDrug(item.drug).label} ${mg(item.doseMg)}  (${item.phaseId} ${item.number})${changed}`);
  });
  lines.push('', 'Monitoring due:', ...plan.monitoring.map((it) => `- ${it.dueDate}: ${it.what} (${it.sourceIds.map(cite).join('; ')})`));
  lines.push('', 'Metal bound per administration (stoichiometric ceiling) beside pM:');
  for (const row of plan.binding) {
    const ceiling = row.stoichiometricCeilingMg === null ? row.ceilingLabel : `${mg(row.stoichiometricCeilingMg)} of ${row.metal} at most — ${row.ceilingLabel}`;
    const pm = row.pm && row.pm.pM !== undefined ? `pM ${formatNumber(row.pm.pM, 1)} (${row.pm.basis}, ${row.pm.setId})` : row.pmNote;
    lines.push(`- ${row.drugLabel} ${mg(row.doseMg)}: ${ceiling}; ${pm}`);
  }
  lines.push('', 'Frame:', ...plan.frame.map((it) => `- ${it}`), 'Cautions:', ...plan.cautions.map((it) => `- ${it}`));
  lines.push(`Further courses: ${plan.repeatNote}`, 'Modelling choices:', ...plan.modellingChoices.map((it) => `- ${it}`));
  lines.push('Sources:', ...plan.sourceIds.map((id) => `- ${cite(id)}`));
  if (plan.warnings.length > 0) lines.push('Warnings:', formatIssues(plan.warnings));
  lines.push(courseCaution);
  return lines.join('\n');
}


/** Each issue path of the planner, as the flag the user typed. */
const flagOfPath: Readonly<Record<string, string>> = {
  weightKg: '--weight-kg',
  heightCm: '--height-cm',
  ageYears: '--age-years',
  start: '--start',
  basis: '--basis',
  mgPerKg: '--mg-per-kg',
  doseMg: '--dose-mg',
  dailyMg: '--daily-mg',
  administrationsPerDay: '--administrations-per-day',
  days: '--days',
  courses: '--courses',
  restDays: '--rest-days',
  metal: '--metal',
  encephalopathy: '--encephalopathy',
  bloodLead: '--blood-lead',
  creatinine: '--creatinine',
  ancPerUl: '--anc-per-ul',
  strength: '--strength-mg',
  switchFrom: '--switch-from',
  regimen: 'regimen',
};

/**
 * `course <regimen> --weight-kg … --start … [options]` and `course --list`:
 * plan a heavy-metal course, print it (or --json), and with -o write it as an iCalendar file.
 * Exit 0 planned; 1 refused or bad input (the field, the value and the range named); 2 used wrongly.
 */
export async function courseCommand(argv: readonly string[], io: CliIo & CourseHostIo): Promise<number> {
  const args = parseArgs(argv, switches);
  const problems: string[] = [...repeatedOptionProblems(args)];
  const { rest, output: shortOutput } = splitOutput(args.positionals, problems);
  if (args.switches.has('--help')) {
    io.out(courseUsage);
    return exitCodes.ok;
  }
  if (args.switches.has('--list')) return listRegimens(args.switches.has('--json'), io);
  const typed = rest.join(' ').trim();
  if (typed === '') {
    io.err(courseUsage);
    return exitCodes.usage;
  }
  const regimen = resolveCourseRegimen(typed);
  if (!regimen.ok) {
    io.err(formatIssues(regimen.issues));
    return exitCodes.invalidInput;
  }
  for (const flag of Object.keys(args.options)) {
    if (!(flag in numberOptions) && !textOptions.includes(flag)) problems.push(`${flag}: not an option of course (course --help lists them).`);
  }
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  const numbers: Record<string, number> = {};
  for (const [flag, spec] of Object.entries(numberOptions)) {
    const raw = args.options[flag];
    if (raw === undefined) continue;
    // Strict decimals (core/numbers): '0x10' is not 16 kg, an empty value is not 0.
    const value = parseDecimal(raw);
    if (value === undefined) problems.push(`${flag}: "${raw}" is not a number; enter the ${spec.label}, ${spec.shown ?? `${spec.min}–${spec.max}`}.`);
    else if (value < spec.min || value > spec.max) problems.push(`${flag}: ${raw} is outside the ${spec.shown ? 'possible' : 'plausible'} range ${spec.min}–${spec.max} (${spec.label}).`);
    else numbers[spec.key] = value;
  }
  const start = args.options['--start'];
  if (start === undefined) problems.push('--start: required, the first administration on the ward clock as YYYY-MM-DDTHH:mm.');
  if (numbers['weightKg'] === undefined && args.options['--weight-kg'] === undefined) problems.push(`--weight-kg: required, body weight in kg (${numberOptions['--weight-kg']!.shown}).`);
  const timeZone = args.options['--time-zone'] ?? io.timeZone?.() ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  if (!isTimeZone(timeZone)) problems.push(`--time-zone: "${timeZone}" is not an IANA time zone name (e.g. Europe/London, America/Chicago).`);
  const basis = args.options['--basis'];
  if (basis !== undefined && !(bases as readonly string[]).includes(basis)) problems.push(`--basis: "${basis}" is not one of ${bases.join(', ')}.`);

  const pairedUnit = (valueFlag: string, unitFlag: string, units: readonly string[]): string | undefined => {
    const unit = args.options[unitFlag];
    if (args.options[valueFlag] !== undefined && unit === undefined) problems.push(`${unitFlag}: required with ${valueFlag} (${units.join(' or ')}); a unit is never assumed.`);
    if (unit !== undefined && !units.includes(unit)) problems.push(`${unitFlag}: "${unit}" is not one of ${units.join(', ')}.`);
    return unit;
  };
  const leadUnit = pairedUnit('--blood-lead', '--blood-lead-unit', ['ug/dL', 'umol/L']);
  const creatinineUnit = pairedUnit('--creatinine', '--creatinine-unit', ['mg/dL', 'umol/L']);
  const copperUnitTyped = pairedUnit('--urinary-copper', '--urinary-copper-unit', ['ug/24h', 'umol/24h', 'ug/(24.h)', 'umol/(24.h)']);
  const copperUnit: UrinaryCopperUnit | undefined = copperUnitTyped === undefined ? undefined : copperUnitTyped.startsWith('ug') ? 'ug/(24.h)' : 'umol/(24.h)';
  const strengthBasis = pairedUnit('--strength-mg', '--strength-basis', ['salt', 'base']);
  const currentStrengthBasis = pairedUnit('--current-strength-mg', '--current-strength-basis', ['salt', 'base']);
  const switchFrom = args.options['--switch-from'];
  if (switchFrom !== undefined && !(trientineProducts as readonly string[]).includes(switchFrom)) problems.push(`--switch-from: "${switchFrom}" is not one of ${trientineProducts.join(', ')}.`);
  if (switchFrom !== undefined && numbers['currentDailyMg'] === undefined) problems.push('--current-daily-mg: required with --switch-from (today’s daily dose on the current product’s printed basis).');
  if (numbers['bloodLead'] !== undefined && leadUnit !== undefined) {
    problems.push(...checkLabValue(bloodLead, numbers['bloodLead'], leadUnit as 'ug/dL' | 'umol/L').map((it) => `--blood-lead: ${it.message}`));
  }
  if (numbers['creatinine'] !== undefined && creatinineUnit !== undefined) {
    problems.push(...checkLabValue(serumCreatinine, numbers['creatinine'], creatinineUnit as 'mg/dL' | 'umol/L').map((it) => `--creatinine: ${it.message}`));
  }
  if (numbers['urinaryCopper'] !== undefined && copperUnit !== undefined) {
    problems.push(...checkLabValue(urinaryCopper, numbers['urinaryCopper'], copperUnit).map((it) => `--urinary-copper: ${it.message}`));
  }
  const output = shortOutput ?? args.options['--output'];
  const sheetPath = args.options['--sheet'];
  const paper = args.options['--paper'] ?? 'a4';
  const preparedBy = args.options['--prepared-by'];
  if (sheetPath !== undefined && !/\.pdf$/i.test(sheetPath)) problems.push(`--sheet: "${sheetPath}" does not end in .pdf; the sheet is written as a PDF.`);
  if (!(sheetPapers as readonly string[]).includes(paper)) problems.push(`--paper: "${paper}" is not a paper size of the sheet (a4 or letter).`);
  if (preparedBy !== undefined && (preparedBy.trim() === '' || preparedBy.length > 100 || /[\u0000-\u001f]/.test(preparedBy))) {
    problems.push(`--prepared-by: "${preparedBy}" is not a name of 1–100 printable characters.`);
  }
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.invalidInput;
  }
  const request: CourseRequest = {
    weightKg: numbers['weightKg']!,
    start: start!,
    timeZone,
    ...(numbers['heightCm'] !== undefined ? { heightCm: numbers['heightCm'] } : {}),
    ...(numbers['ageYears'] !== undefined ? { ageYears: numbers['ageYears'] } : {}),
    ...(basis !== undefined ? { basis: basis as DoseBasis } : {}),
    ...(numbers['mgPerKg'] !== undefined ? { mgPerKg: numbers['mgPerKg'] } : {}),
    ...(numbers['doseMg'] !== undefined ? { doseMg: numbers['doseMg'] } : {}),
    ...(numbers['dailyMg'] !== undefined ? { dailyMg: numbers['dailyMg'] } : {}),
    ...(numbers['administrationsPerDay'] !== undefined ? { administrationsPerDay: numbers['administrationsPerDay'] } : {}),
    ...(numbers['days'] !== undefined ? { days: numbers['days'] } : {}),
    ...(numbers['courses'] !== undefined ? { courses: numbers['courses'] } : {}),
    ...(numbers['restDays'] !== undefined ? { restDays: numbers['restDays'] } : {}),
    ...(numbers['ancPerUl'] !== undefined ? { ancPerUl: numbers['ancPerUl'] } : {}),
    ...(args.options['--metal'] !== undefined ? { metal: args.options['--metal'] } : {}),
    ...(args.switches.has('--encephalopathy') ? { encephalopathy: true } : {}),
    ...(numbers['bloodLead'] !== undefined ? { bloodLead: { value: numbers['bloodLead'], unit: leadUnit as 'ug/dL' | 'umol/L' } } : {}),
    ...(numbers['creatinine'] !== undefined ? { creatinineMgPerDl: creatinineForSchedule(numbers['creatinine'], creatinineUnit as 'mg/dL' | 'umol/L') } : {}),
    ...(numbers['urinaryCopper'] !== undefined && copperUnit !== undefined ? { urinaryCopper: { value: numbers['urinaryCopper'], unit: copperUnit } } : {}),
    ...(numbers['strengthMg'] !== undefined ? { strength: { mg: numbers['strengthMg'], basis: strengthBasis as StrengthBasis } } : {}),
    ...(switchFrom !== undefined
      ? {
          switchFrom: {
            productId: switchFrom as TrientineProductId,
            dailyMg: numbers['currentDailyMg']!,
            ...(numbers['currentStrengthMg'] !== undefined ? { strength: { mg: numbers['currentStrengthMg'], basis: currentStrengthBasis as StrengthBasis } } : {}),
          },
        }
      : {}),
  };
  const plan = planCourse(regimen.value, request);
  if (!plan.ok) {
    io.err(`${regimen.value.id}: no course was planned.`);
    io.err(formatIssues(plan.issues.map((it) => ({ ...it, path: it.path.map((part) => (typeof part === 'string' ? flagOfPath[part] ?? part : part)) }))));
    return exitCodes.invalidInput;
  }
  const label = args.options['--label'];
  if (output !== undefined) {
    const now = io.now ?? (() => new Date()); // the host's clock: DTSTAMP only
    const write = io.writeCalendar ?? writeCalendarOutput;
    const written = await write(output, courseIcs(plan.value, label ?? 'course', now()), { overwrite: args.switches.has('--force') });
    if (!written.ok) {
      io.err(formatIssues(written.issues));
      return exitCodes.invalidInput;
    }
  }
  if (sheetPath !== undefined) {
    const planJson = JSON.stringify(plan.value);
    const sheet = buildCourseSheet({
      plan: plan.value,
      label: label ?? 'course',
      toolVersion,
      preparedBy: preparedBy?.trim() ?? null,
      planSha256: createHash('sha256').update(planJson, 'utf8').digest('hex'),
    });
    // The PDF library loads only when a sheet is written, as for the review sheet.
    const render = io.renderSheet ?? (await import('../host/sheetPdf')).writeSheetPdf;
    const bytes = await render(sheet, { paper: paper as SheetPaper });
    const written = await (io.writeSheet ?? ((path, data, options) => writeFileAtomic(path, data, options)))(sheetPath, bytes, { overwrite: args.switches.has('--force') });
    if (!written.ok) {
      io.err(formatIssues(written.issues));
      return exitCodes.invalidInput;
    }
  }
  if (args.switches.has('--json')) {
    io.out(JSON.stringify({ ...(label !== undefined ? { label } : {}), ...plan.value, ...(output !== undefined ? { written: output } : {}), ...(sheetPath !== undefined ? { sheet: sheetPath } : {}), caution: courseCaution }, null, 2));
  } else {
    io.out(formatCoursePlan(plan.value, label));
    if (output !== undefined) io.out(`Wrote ${plan.value.administrations.length + plan.value.monitoring.length} event(s) to ${output} (iCalendar).`);
    if (sheetPath !== undefined) io.out(`Wrote the course sheet (${paper === 'a4' ? 'A4' : 'Letter'}) to ${sheetPath}.`);
  }
  return exitCodes.ok;
}
