import { basename, dirname } from 'node:path';
import { caseFileFormat, currentCaseFileVersion, type Case } from '../../core/model/caseFile';
import { formatIssues, type Issue } from '../../core/result';
import type { CaseStore } from '../host/caseStore';
import type { ParsedArgs } from './args';
import { exitCodes, type CliIo } from './io';

/** Opening a workspace folder as a case store: the binary passes the real store, tests may pass one on a faulty disk. */
export interface StoreIo {
  readonly openStore: (folder: string) => CaseStore;
  /** Today's date 'YYYY-MM-DD' (the default date of the first weight). */
  readonly today: () => string;
}

type EditIo = CliIo & StoreIo;

/** A number as typed, or the text itself so that the case model's message names what was typed. */
function numberOrText(raw: string | undefined): number | string | undefined {
  if (raw === undefined) return undefined;
  const value = Number(raw);
  return raw.trim() !== '' && Number.isFinite(value) ? value : raw;
}

/** Unknown flags and flags without a value, as one line each. */
function flagProblems(args: ParsedArgs, known: readonly string[], command: string): string[] {
  const problems = Object.keys(args.options)
    .filter((flag) => !known.includes(flag))
    .map((flag) => `${flag}: not an option of ${command} (${known.join(', ')}).`);
  for (const flag of args.missingValues) problems.push(`${flag}: a value is missing after the flag.`);
  return problems;
}

function storeAndName(io: EditIo, path: string): { store: CaseStore; fileName: string } {
  return { store: io.openStore(dirname(path)), fileName: basename(path) };
}

/** An id not yet used in the case: '<prefix>-<date>', then '-2', '-3'. */
function freshId(caseFile: Case, prefix: string, date: unknown): string {
  const used = new Set<string>([
    ...caseFile.transfusions.map((it) => it.id),
    ...caseFile.results.map((it) => it.id),
    ...caseFile.chelationPeriods.map((it) => it.id),
    ...caseFile.coMedications.map((it) => it.id),
  ]);
  const stem = `${prefix}-${typeof date === 'string' && date.length <= 10 ? date : 'entry'}`;
  let id = stem;
  for (let n = 2; used.has(id); n += 1) id = `${stem}-${n}`;
  return id;
}

function printFailure(io: CliIo, path: string, issues: readonly Issue[], kept: unknown): void {
  io.err(`${path}: nothing was saved.`);
  io.err(formatIssues(issues));
  // Nothing the user typed is lost: the entry is shown so it can be entered again or saved by hand.
  io.err(`What was typed: ${JSON.stringify(kept)}`);
}

export const newUsage = `Usage:
  chelation-ledger new <case.json> --label CODE (--birth-date YYYY-MM-DD | --age-years N --age-on YYYY-MM-DD)
      --sex-at-birth female|male --diagnosis-group GROUP --weight-kg N [--weight-date YYYY-MM-DD] [--height-cm N]
Creates a new case file (never over an existing one), with its journal. The label is a code, not a name.`;

const newFlags = ['--label', '--birth-date', '--age-years', '--age-on', '--sex-at-birth', '--diagnosis-group', '--weight-kg', '--weight-date', '--height-cm'];

/** `new <case.json> --label … --birth-date … --sex-at-birth … --diagnosis-group … --weight-kg …`. */
export async function newCommand(args: ParsedArgs, io: EditIo): Promise<number> {
  const path = args.positionals[0];
  if (args.switches.has('--help')) {
    io.out(newUsage);
    return exitCodes.ok;
  }
  if (path === undefined || args.positionals.length > 1) {
    io.err(newUsage);
    return exitCodes.usage;
  }
  const problems = flagProblems(args, newFlags, 'new');
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.usage;
  }
  const option = (flag: string) => args.options[flag];
  const weightDate = option('--weight-date') ?? io.today();
  const age =
    option('--birth-date') !== undefined || option('--age-years') === undefined
      ? { kind: 'birth-date', birthDate: option('--birth-date') }
      : { kind: 'years-on-date', years: numberOrText(option('--age-years')), onDate: option('--age-on') ?? weightDate };
  const caseFile = {
    format: caseFileFormat,
    version: currentCaseFileVersion,
    patient: {
      label: option('--label'),
      age,
      sexAtBirth: option('--sex-at-birth'),
      diagnosisGroup: option('--diagnosis-group'),
      pregnancy: { status: 'not-pregnant', recordedOn: null },
      weights: [{ date: weightDate, weight: { value: numberOrText(option('--weight-kg')), unit: 'kg' } }],
      heights: option('--height-cm') === undefined ? [] : [{ date: weightDate, height: { value: numberOrText(option('--height-cm')), unit: 'cm' } }],
    },
  };
  const { store, fileName } = storeAndName(io, path);
  const created = await store.create(fileName, caseFile, 'created');
  if (!created.ok) {
    printFailure(io, path, created.issues, caseFile);
    return exitCodes.invalidInput;
  }
  io.out(`${path}: new case ${created.value.caseFile.patient.label} created (version ${created.value.caseFile.version}), ${created.value.warnings.length} warning(s).`);
  if (created.value.warnings.length > 0) io.err(formatIssues(created.value.warnings));
  io.out('Pregnancy status was recorded as not pregnant; edit patient.pregnancy if that is not so.');
  return exitCodes.ok;
}

interface AddKind {
  readonly list: 'transfusions' | 'results' | 'chelationPeriods' | 'coMedications';
  readonly idPrefix: string;
  readonly flags: readonly string[];
  readonly usage: string;
  /** The entry from the flags (values as typed; the case model checks them). */
  readonly build: (option: (flag: string) => string | undefined) => Record<string, unknown>;
  readonly describe: (entry: Record<string, unknown>) => string;
}

const volume = (raw: string | undefined) => (raw === undefined ? undefined : { value: numberOrText(raw), unit: 'mL' });
const defined = (entry: Record<string, unknown>) => Object.fromEntries(Object.entries(entry).filter(([, value]) => value !== undefined));

const addKinds: Readonly<Record<string, AddKind>> = {
  transfusion: {
    list: 'transfusions',
    idPrefix: 't',
    flags: ['--date', '--kind', '--volume-ml', '--unit-haematocrit', '--units', '--method', '--volume-removed-ml', '--patient-haematocrit', '--note'],
    usage: `  chelation-ledger add transfusion <case.json> --date YYYY-MM-DD --volume-ml N [--unit-haematocrit 0.60] [--units N] [--note TEXT]
  chelation-ledger add transfusion <case.json> --kind exchange --method manual|automated --date … --volume-ml N --volume-removed-ml N --patient-haematocrit 0.30 [--unit-haematocrit 0.60] [--units N]
  chelation-ledger add transfusion <case.json> --kind venesection --date … --volume-removed-ml N --patient-haematocrit 0.40
    Without --unit-haematocrit the product default applies and is shown as assumed.`,
    build: (option) => {
      const kind = option('--kind') ?? 'simple';
      const unitHaematocrit = option('--unit-haematocrit') === undefined ? null : numberOrText(option('--unit-haematocrit'));
      const units = numberOrText(option('--units') ?? '1');
      const common = { date: option('--date'), kind, note: option('--note') };
      if (kind === 'exchange') {
        return defined({ ...common, method: option('--method'), volumeIn: volume(option('--volume-ml')), unitHaematocrit, unitCount: units, volumeRemoved: volume(option('--volume-removed-ml')), patientHaematocrit: numberOrText(option('--patient-haematocrit')) });
      }
      if (kind === 'venesection') {
        return defined({ ...common, volumeRemoved: volume(option('--volume-removed-ml')), patientHaematocrit: numberOrText(option('--patient-haematocrit')) });
      }
      return defined({ ...common, volume: volume(option('--volume-ml')), unitHaematocrit, unitCount: units });
    },
    describe: (entry) => `${String(entry['kind'])} transfusion on ${String(entry['date'])}`,
  },
  result: {
    list: 'results',
    idPrefix: 'r',
    flags: ['--date', '--kind', '--value', '--unit', '--method', '--field-strength-t', '--calibration', '--note'],
    usage: `  chelation-ledger add result <case.json> --date YYYY-MM-DD --kind ferritin --value N --unit ug/L [--note TEXT]
  chelation-ledger add result <case.json> --date … --kind liver-iron --method mri --value N --unit mg/g{dry} --field-strength-t 1.5 --calibration ID
    Kinds and units are those of the case file (docs/case-file.md); units are UCUM codes.`,
    build: (option) =>
      defined({
        date: option('--date'),
        kind: option('--kind'),
        method: option('--method'),
        measured: { value: numberOrText(option('--value')), unit: option('--unit') },
        fieldStrengthT: numberOrText(option('--field-strength-t')),
        calibrationId: option('--calibration'),
        note: option('--note'),
      }),
    describe: (entry) => `${String(entry['kind'])} result on ${String(entry['date'])}`,
  },
  period: {
    list: 'chelationPeriods',
    idPrefix: 'p',
    flags: ['--drug', '--formulation', '--route', '--dose', '--dose-unit', '--administrations-per-day', '--days-per-week', '--start', '--end', '--adherence', '--infusion-hours', '--note'],
    usage: `  chelation-ledger add period <case.json> --drug deferasirox --formulation film-coated-tablet --dose N --dose-unit mg/kg
      --administrations-per-day N --days-per-week N --start YYYY-MM-DD [--end YYYY-MM-DD] [--adherence 0.9] [--route R] [--infusion-hours N]
    The dose is per administration as prescribed; oral drugs take route oral by default.`,
    build: (option) => {
      const drug = option('--drug');
      return defined({
        drug,
        formulation: option('--formulation'),
        route: option('--route') ?? (drug === 'deferiprone' || drug === 'deferasirox' ? 'oral' : undefined),
        dose: { value: numberOrText(option('--dose')), unit: option('--dose-unit') ?? 'mg/kg' },
        administrationsPerDay: numberOrText(option('--administrations-per-day')),
        daysPerWeek: numberOrText(option('--days-per-week')),
        startDate: option('--start'),
        endDate: option('--end') ?? null,
        adherence: numberOrText(option('--adherence')),
        infusionHours: numberOrText(option('--infusion-hours')),
        note: option('--note'),
      });
    },
    describe: (entry) => `${String(entry['drug'])} period from ${String(entry['startDate'])}`,
  },
  comedication: {
    list: 'coMedications',
    idPrefix: 'm',
    flags: ['--name', '--dose', '--dose-unit', '--timing', '--start', '--end', '--note'],
    usage: `  chelation-ledger add comedication <case.json> --name "ascorbic acid" --start YYYY-MM-DD [--end YYYY-MM-DD] [--dose N --dose-unit mg] [--timing daily]
    The name is the generic name.`,
    build: (option) =>
      defined({
        name: option('--name'),
        dose: option('--dose') === undefined ? undefined : { value: numberOrText(option('--dose')), unit: option('--dose-unit') ?? 'mg' },
        timing: option('--timing'),
        startDate: option('--start'),
        endDate: option('--end') ?? null,
        note: option('--note'),
      }),
    describe: (entry) => `co-medication ${String(entry['name'])} from ${String(entry['startDate'])}`,
  },
};

export const addUsage = `Usage:
${Object.values(addKinds)
  .map((kind) => kind.usage)
  .join('\n')}
Each entry is checked with the same messages as check, then saved atomically with a line in the case's journal.`;

/** `add transfusion|result|period|comedication <case.json> --…`: one entry, validated, saved through the case store. */
export async function addCommand(args: ParsedArgs, io: EditIo): Promise<number> {
  if (args.switches.has('--help')) {
    io.out(addUsage);
    return exitCodes.ok;
  }
  const [what, path, ...extra] = args.positionals;
  const kind = what === undefined ? undefined : addKinds[what];
  if (kind === undefined || path === undefined || extra.length > 0) {
    if (what !== undefined && kind === undefined) io.err(`"${what}" is not something add records (transfusion, result, period, comedication).`);
    io.err(addUsage);
    return exitCodes.usage;
  }
  const problems = flagProblems(args, kind.flags, `add ${what}`);
  if (problems.length > 0) {
    io.err(problems.join('\n'));
    return exitCodes.usage;
  }
  const { store, fileName } = storeAndName(io, path);
  const opened = await store.open(fileName);
  const typed = kind.build((flag) => args.options[flag]);
  if (!opened.ok) {
    printFailure(io, path, opened.issues, typed);
    return exitCodes.invalidInput;
  }
  const caseFile = opened.value.caseFile;
  const id = freshId(caseFile, kind.idPrefix, typed['date'] ?? typed['startDate']);
  const entry: Record<string, unknown> = { id, ...typed };
  const updated = { ...caseFile, [kind.list]: [...caseFile[kind.list], entry] };
  const description = `added ${kind.describe(entry)}`;
  const saved = await store.save(fileName, updated, { expected: opened.value.revision, change: description });
  if (!saved.ok) {
    printFailure(io, path, saved.issues, entry);
    return exitCodes.invalidInput;
  }
  const migrated = opened.value.migratedFromVersion === null ? '' : ` (the file was version ${opened.value.migratedFromVersion}; it is now saved as version ${saved.value.caseFile.version})`;
  io.out(`${path}: ${description} as ${id}${migrated}; ${saved.value.warnings.length} warning(s).`);
  if (saved.value.warnings.length > 0) io.err(formatIssues(saved.value.warnings));
  if (kind.list === 'transfusions' && entry['unitHaematocrit'] === null) {
    io.out('No unit haematocrit was given: the product default applies and is shown as assumed in every review.');
  }
  return exitCodes.ok;
}
