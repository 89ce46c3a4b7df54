import { checkNumber } from '../formulas/validate';
import type { NumberInputSpec } from '../formulas/types';
import { bsaMostellerM2 } from '../patient/bodySurfaceArea';
import { ageYearsBounds, heightBounds, inputRange, weightBounds } from '../ranges';
import { fail, issue, ok, type Issue, type Result } from '../result';
import { findSource } from '../references';
import { bloodLeadUmolPerLFromUgPerDl, bloodLeadUgPerDlFromUmolPerL, creatinineMgPerDlFromUmolPerL, urinaryCopperUgPer24hFromUmolPer24h, urinaryCopperUmolPer24hFromUgPer24h } from '../units/concentration';
import type { Centimetres, Kilograms, MicrogramsPer24h, MicrogramsPerDl, UmolPer24h, UmolPerL } from '../units/quantity';
import { courseBindingRow, type CourseBindingRow } from './binding';
import { courseDrug, type CourseDrugId } from './drugs';
import {
  edetateRenalMgPerM2,
  edetateRenalSchedules,
  type CourseRegimen,
  type DoseBasis,
  type DoseOption,
  type MetalId,
  type PhaseSpec,
  type Population,
} from './regimens';
import { checkTrientineStrength, trientineSwitch, type StrengthBasis, type TrientineProductId, type TrientineSwitch } from './trientineBasis';
import { addWallClockDays, offsetChangesBetween, readWallClock, wallClockAt, type OffsetChange, type WallClockInstant } from './wallClock';
import { addDaysIso, daysBetween } from '../dates/isoDate';

/** What the planner is asked: the patient, the regimen's choices, the clinical frame and the start. */
export interface CourseRequest {
  readonly weightKg: number;
  readonly heightCm?: number;
  readonly ageYears?: number;
  /** Local wall-clock start 'YYYY-MM-DDTHH:mm' on the ward's clock. */
  readonly start: string;
  /** IANA time zone of the ward. */
  readonly timeZone: string;
  readonly basis?: DoseBasis;
  /** A per-kg dose inside the regimen's published range (unithiol 3–5 mg/kg). */
  readonly mgPerKg?: number;
  /** A per-administration dose as ordered, mg: checked against the caps, never rewritten. */
  readonly doseMg?: number;
  /** A daily dose as ordered, mg/day (Wilson drugs): checked against the range and the cap. */
  readonly dailyMg?: number;
  readonly administrationsPerDay?: number;
  readonly days?: number;
  readonly courses?: number;
  readonly restDays?: number;
  readonly metal?: string;
  readonly encephalopathy?: boolean;
  readonly bloodLead?: { readonly value: number; readonly unit: 'ug/dL' | 'umol/L' };
  readonly creatinineMgPerDl?: number;
  readonly ancPerUl?: number;
  readonly urinaryCopper?: { readonly value: number; readonly unit: 'ug/(24.h)' | 'umol/(24.h)' };
  /** The planned product's strength as entered, checked against the printed strength (trientine). */
  readonly strength?: { readonly mg: number; readonly basis: StrengthBasis };
  /** The trientine product taken today and its daily dose on that product's printed basis. */
  readonly switchFrom?: { readonly productId: TrientineProductId; readonly dailyMg: number; readonly strength?: { readonly mg: number; readonly basis: StrengthBasis } };
}

export interface PlannedAdministration {
  readonly course: number;
  readonly phaseId: string;
  readonly drug: CourseDrugId;
  /** 1-based number within its phase. */
  readonly number: number;
  readonly doseMg: number;
  readonly at: WallClockInstant;
  /** True when the UTC offset differs from the first administration's (a daylight-saving change lies between). */
  readonly clockShifted: boolean;
}

export interface PhasePlan {
  readonly course: number;
  readonly id: string;
  readonly label: string;
  readonly drug: CourseDrugId;
  readonly drugLabel: string;
  readonly dosedAs: string;
  readonly route: string;
  readonly intervalHours: number;
  readonly administrations: number;
  readonly dosePerAdministrationMg: number;
  /** How the dose was reached, in words (basis, figures, rounding). */
  readonly doseBasis: string;
  readonly basis: DoseBasis | 'entered';
  /** The other published bases, for comparison (succimer: band, mg/kg, mg/m²). */
  readonly alternatives: readonly { readonly basis: DoseBasis; readonly mg: number }[];
  /** The cap that limited the dose, in words; null when none did. */
  readonly capApplied: string | null;
  /** Most the drug may give in any 24 hours, mg; null when the source gives none. */
  readonly maxMgPer24h: number | null;
  readonly first: WallClockInstant;
  readonly last: WallClockInstant;
  readonly totalMg: number;
  readonly administrationNote?: string;
  readonly sourceIds: readonly string[];
}

export interface CourseTotal {
  readonly course: number;
  readonly first: WallClockInstant;
  readonly last: WallClockInstant;
  readonly totalsMg: readonly { readonly drug: CourseDrugId; readonly mg: number; readonly administrations: number }[];
}

export interface MonitoringDue {
  readonly what: string;
  readonly dueDate: string;
  readonly sourceIds: readonly string[];
}

export interface RollingDailyCheck {
  readonly drug: CourseDrugId;
  readonly limitMg: number;
  /** The largest total of any 24 hours of elapsed time in the plan, mg. */
  readonly largestMgIn24h: number;
  readonly withinLimit: boolean;
}

export interface CoursePlan {
  readonly regimenId: string;
  readonly title: string;
  readonly population: string;
  readonly patient: {
    readonly weightKg: number;
    readonly heightCm: number | null;
    readonly ageYears: number | null;
    readonly bsaM2: number | null;
    readonly bsaMethod: string;
  };
  readonly timeZone: string;
  readonly start: WallClockInstant;
  readonly bloodLead: { readonly ugPerDl: number; readonly umolPerL: number } | null;
  readonly urinaryCopper: { readonly ugPer24h: number; readonly umolPer24h: number } | null;
  readonly renalSchedule: string | null;
  readonly phases: readonly PhasePlan[];
  readonly administrations: readonly PlannedAdministration[];
  readonly courses: readonly CourseTotal[];
  readonly restDays: readonly string[];
  readonly totalsMg: readonly { readonly drug: CourseDrugId; readonly mg: number; readonly administrations: number }[];
  readonly dailyChecks: readonly RollingDailyCheck[];
  readonly monitoring: readonly MonitoringDue[];
  readonly offsetChanges: readonly OffsetChange[];
  readonly timeRule: string;
  readonly binding: readonly CourseBindingRow[];
  readonly trientineSwitch: TrientineSwitch | null;
  readonly frame: readonly string[];
  readonly cautions: readonly string[];
  readonly repeatNote: string;
  readonly modellingChoices: readonly string[];
  readonly sourceIds: readonly string[];
  readonly warnings: readonly Issue[];
}

/** Shown on every plan: how the clock is read (wallClock.ts states the same choice). */
export const courseTimeRule =
  'Times are the ward’s local wall-clock time. Intervals under a day are elapsed hours, so after a daylight-saving change the clock times of later doses move by the change; once-daily, 48-hourly and weekly doses keep their clock time. Modelling choice of this project.';

export const courseCaution =
  'Decision support: a planned course for review by the prescriber and a toxicologist; follow local protocols and verify every dose, time and total.';

const hourMs = 3_600_000;
const metalWords: readonly string[] = ['lead', 'mercury', 'arsenic', 'copper', 'iron', 'cadmium', 'selenium', 'gold'];
/** Metals for which dimercaprol forms toxic complexes (dimercaprol references; references.md §7, secondary). */
export const dimercaprolRefusedMetals = ['iron', 'cadmium', 'selenium'] as const;
/** ANC below which succimer is withheld, per µL (succimer label; references.md §9 confirmed). */
export const succimerAncWithholdPerUl = 1200;
/** Blood lead (µg/dL) above which the succimer label's indication begins (label §1: "above 45"). */
export const succimerIndicationBloodLeadUgPerDl = 45;
/** Blood lead (µg/dL) at or above which treatment is an emergency (CDC 2002) and edetate is used with dimercaprol (label: above 70). */
export const emergencyBloodLeadUgPerDl = 70;
/** Serum creatinine (mg/dL) from which the edetate label's nephropathy schedules apply. */
export const edetateNephropathyFromMgPerDl = 2;

/** A short citation for a dose line: the source's title up to its first colon, the year and the status. */
function cite(id: string): string {
  const source = findSource(id);
  if (!source) return id;
  return `${source.title.split(':')[0]!.trim()}${source.year !== null ? `, ${source.year}` : ''} [${source.status}]`;
}

function round(value: number, decimals = 1): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

function matchesPopulation(population: Population, ageYears: number | undefined, weightKg: number): boolean {
  if (population.minAgeYears !== undefined && (ageYears === undefined || ageYears < population.minAgeYears)) return false;
  if (population.belowAgeYears !== undefined && (ageYears === undefined || ageYears >= population.belowAgeYears)) return false;
  if (population.minWeightKg !== undefined && weightKg < population.minWeightKg) return false;
  if (population.belowWeightKg !== undefined && weightKg >= population.belowWeightKg) return false;
  return true;
}

function optionMg(
  option: DoseOption,
  weightKg: number,
  bsaM2: number | null,
  perDay: number,
  dailyMg: number | undefined,
  dailyWhy = 'as entered',
): { mg: number; text: string } | null {
  switch (option.basis) {
    case 'weight-band': {
      const band = option.bands.find((it) => weightKg >= it.minKg && (it.belowKg === null || weightKg < it.belowKg));
      if (!band) return null;
      const range = band.belowKg === null ? `${band.minKg} kg or more` : `${band.minKg}–${band.belowKg - 1} kg`;
      return { mg: band.mg, text: `label weight band ${range}: ${band.mg} mg (${cite(option.sourceIds[0]!)})` };
    }
    case 'mg-per-kg':
      return { mg: option.mgPerKg * weightKg, text: `${option.mgPerKg} mg/kg × ${weightKg} kg (${cite(option.sourceIds[0]!)})` };
    case 'mg-per-m2':
      if (bsaM2 === null) return null;
      return { mg: option.mgPerM2 * bsaM2, text: `${option.mgPerM2} mg/m² × ${round(bsaM2, 3)} m² (Mosteller) (${cite(option.sourceIds[0]!)})` };
    case 'fixed-mg':
      return { mg: option.mg, text: `${option.mg} mg a dose (${cite(option.sourceIds[0]!)})` };
    case 'daily-mg': {
      const daily = dailyMg ?? option.minMgPerDay;
      const why = dailyMg === undefined ? `lower end of ${option.minMgPerDay}–${option.maxMgPerDay} mg/day` : `${round(daily)} mg/day ${dailyWhy} (published ${option.minMgPerDay}–${option.maxMgPerDay} mg/day)`;
      return { mg: daily / perDay, text: `${why} ÷ ${perDay} a day (${cite(option.sourceIds[0]!)})` };
    }
    case 'daily-mg-per-kg-rounded': {
      const raw = option.mgPerKgPerDay * weightKg;
      const daily = dailyMg ?? Math.max(option.roundToMg, Math.round(raw / option.roundToMg) * option.roundToMg);
      return {
        mg: daily / perDay,
        text: dailyMg === undefined
          ? `${option.mgPerKgPerDay} mg/kg/day × ${weightKg} kg = ${round(raw)} mg, to the nearest ${option.roundToMg} mg: ${daily} mg/day ÷ ${perDay} a day (${cite(option.sourceIds[0]!)})`
          : `${round(daily)} mg/day ${dailyWhy} ÷ ${perDay} a day (published ${option.mgPerKgPerDay} mg/kg/day = ${round(raw)} mg/day; ${cite(option.sourceIds[0]!)})`,
      };
    }
  }
}

interface ScheduledPhase {
  readonly spec: PhaseSpec;
  readonly intervalHours: number;
  readonly count: number;
}

/** Administration instants of one phase from its first instant: elapsed hours under a day, wall-clock days otherwise. */
function phaseInstants(firstMs: number, intervalHours: number, count: number, timeZone: string): number[] {
  const instants: number[] = [];
  for (let index = 0; index <= count; index += 1) {
    instants.push(intervalHours < 24 ? firstMs + index * intervalHours * hourMs : addWallClockDays(firstMs, (index * intervalHours) / 24, timeZone));
  }
  return instants; // count + 1 entries: the last is where the next phase begins
}

/** The patient's numbers, with their ranges from the one table (core/ranges), as a case file holds them. */
const patientInputs = {
  weightKg: { kind: 'number', label: 'weight', ...inputRange(weightBounds), meaning: 'body weight, kg' },
  heightCm: { kind: 'number', label: 'height', ...inputRange(heightBounds), meaning: 'height, cm' },
  ageYears: { kind: 'number', label: 'age', ...inputRange(ageYearsBounds), meaning: 'age, years' },
} as const satisfies Readonly<Record<string, NumberInputSpec>>;

/** Refuse a patient number outside its possible range; keep one outside the plausible range with a warning. */
function checkPatientNumber(name: keyof typeof patientInputs, value: number, issues: Issue[], warnings: Issue[]): void {
  const refused = checkNumber(name, value, patientInputs[name], 'record');
  if (refused.length > 0) issues.push(...refused);
  else warnings.push(...checkNumber(name, value, patientInputs[name], 'entered').map((it) => ({ ...it, severity: 'warning' as const })));
}

/**
 * Plan a heavy-metal course: the dose per administration with its basis and
 * any cap applied, every administration dated and timed on the ward's clock
 * through each phase and course, rest days, totals per phase and course,
 * monitoring due dates, the daylight-saving changes in the span, and the
 * stoichiometric ceiling beside pM. Safety rules refuse what must not be
 * planned (edetate disodium is refused earlier, by resolveCourseRegimen).
 *
 * @param regimen - from the catalogue (resolveCourseRegimen)
 * @param request - the patient (weight, height where a dose is per m², age: refused outside the possible range of
 *   core/ranges, kept with a warning outside the plausible one, as in a case file), the start and the choices
 * @returns the plan with warnings; or the issues that refuse it (field, value, range and source named)
 * @example planCourse(succimer-lead, { weightKg: 14, heightCm: 92, ageYears: 3, start: '2026-10-24T22:00', timeZone: 'Europe/London' })
 *   → 15 doses of 100 mg every 8 h, then 28 every 12 h; last 2026-11-12 09:00 (clocks went back on 25 October)
 */
export function planCourse(regimen: CourseRegimen, request: CourseRequest): Result<CoursePlan> {
  const issues: Issue[] = [];
  const warnings: Issue[] = [];
  const { weightKg } = request;
  checkPatientNumber('weightKg', weightKg, issues, warnings);
  if (request.heightCm !== undefined) checkPatientNumber('heightCm', request.heightCm, issues, warnings);
  if (request.ageYears !== undefined) checkPatientNumber('ageYears', request.ageYears, issues, warnings);
  const start = readWallClock(request.start, request.timeZone);
  if (!start.ok) issues.push(...start.issues);
  else if (start.warnings) warnings.push(...start.warnings);
  if (issues.length > 0) return fail(...issues);
  if (!start.ok) return fail(...start.issues);

  // ——— Metal and clinical frame (safety rules) ———
  const drugsInRegimen = new Set(regimen.populations.flatMap((it) => it.phases.map((phase) => phase.drug)));
  let metal: MetalId = regimen.metals[0]!;
  if (request.metal !== undefined) {
    const word = request.metal.toLowerCase();
    if (!metalWords.includes(word)) {
      return fail(issue('unknown_choice', ['metal'], `Metal "${request.metal}" is not one of ${metalWords.join(', ')}.`));
    }
    if (drugsInRegimen.has('dimercaprol') && (dimercaprolRefusedMetals as readonly string[]).includes(word)) {
      return fail(
        issue('not_applicable', ['metal'], `Dimercaprol is not used for ${word} poisoning: it forms toxic complexes with iron, cadmium and selenium (${cite('dimercaprol-cautions')}); for review by a toxicologist.`),
      );
    }
    if (!(regimen.metals as readonly string[]).includes(word)) {
      return fail(issue('not_applicable', ['metal'], `Regimen ${regimen.id} is catalogued for ${regimen.metals.join(', ')}, not for ${word}.`));
    }
    metal = word as MetalId;
  }
  if (request.encephalopathy && drugsInRegimen.has('succimer')) {
    return fail(issue('not_applicable', ['encephalopathy'], `Succimer is not indicated for lead encephalopathy: it does not cross the blood-brain barrier (${cite('succimer-label')}). The emergency regimen is dimercaprol-edetate-encephalopathy.`));
  }
  if (request.encephalopathy && regimen.id === 'edetate-calcium-disodium-lead') {
    return fail(
      issue(
        'not_applicable',
        ['encephalopathy'],
        `In lead encephalopathy calcium disodium edetate is not given alone or first: it starts with the second dimercaprol dose, about 4 hours after the first (${cite('dimercaprol-label')}; ${cite('am-fam-physician-2000-lead')}). Plan dimercaprol-edetate-encephalopathy.`,
      ),
    );
  }
  let bloodLead: CoursePlan['bloodLead'] = null;
  if (request.bloodLead) {
    const { value, unit } = request.bloodLead;
    const ugPerDl = unit === 'ug/dL' ? value : bloodLeadUgPerDlFromUmolPerL(value as UmolPerL);
    bloodLead = { ugPerDl, umolPerL: unit === 'umol/L' ? value : bloodLeadUmolPerLFromUgPerDl(value as MicrogramsPerDl) };
    if (drugsInRegimen.has('succimer') && ugPerDl <= succimerIndicationBloodLeadUgPerDl) {
      warnings.push(issue('out_of_range', ['bloodLead'], `Blood lead ${round(ugPerDl)} µg/dL is not above 45 µg/dL, where the succimer label’s indication begins (${cite('succimer-label')}).`, 'warning'));
    }
    if (ugPerDl >= emergencyBloodLeadUgPerDl && regimen.id !== 'dimercaprol-edetate-encephalopathy') {
      warnings.push(
        issue('out_of_range', ['bloodLead'], `Blood lead ${round(ugPerDl)} µg/dL is 70 µg/dL or more: a medical emergency (${cite('cdc-lead-thresholds')}); the edetate label recommends use with dimercaprol above 70 µg/dL.`, 'warning'),
      );
    }
  }
  let urinaryCopper: CoursePlan['urinaryCopper'] = null;
  if (request.urinaryCopper) {
    const { value, unit } = request.urinaryCopper;
    urinaryCopper =
      unit === 'ug/(24.h)'
        ? { ugPer24h: value, umolPer24h: urinaryCopperUmolPer24hFromUgPer24h(value as MicrogramsPer24h) }
        : { ugPer24h: urinaryCopperUgPer24hFromUmolPer24h(value as UmolPer24h), umolPer24h: value };
  }
  if (request.ancPerUl !== undefined && drugsInRegimen.has('succimer') && request.ancPerUl < succimerAncWithholdPerUl) {
    return fail(
      issue(
        'out_of_range',
        ['ancPerUl'],
        `ANC ${request.ancPerUl}/µL is below 1,200/µL: the succimer label withholds or stops succimer, with close follow-up until the ANC recovers above 1,500/µL or to baseline (${cite('succimer-label')}). No course is planned; for review by the prescriber.`,
      ),
    );
  }

  // ——— Population and body size ———
  const population = regimen.populations.find((it) => matchesPopulation(it, request.ageYears, weightKg));
  const needsAge = regimen.populations.some((it) => it.minAgeYears !== undefined || it.belowAgeYears !== undefined);
  if (!population) {
    if (needsAge && request.ageYears === undefined) {
      return fail(issue('required', ['ageYears'], `Age is required for ${regimen.id}: its doses depend on age (${regimen.populations.map((it) => it.label).join('; ')}).`));
    }
    return fail(
      issue('not_applicable', ['ageYears'], `No dose of ${regimen.id} is published for age ${request.ageYears ?? 'not entered'} years and ${weightKg} kg: the regimen covers ${regimen.populations.map((it) => it.label).join('; ')}.`),
    );
  }
  const bsaM2 = request.heightCm !== undefined ? bsaMostellerM2(request.heightCm as Centimetres, weightKg as Kilograms) : null;

  // ——— Renal schedules of calcium disodium edetate ———
  let phases: readonly PhaseSpec[] = population.phases;
  let renalSchedule: string | null = null;
  if (request.creatinineMgPerDl !== undefined) {
    const creatinine = request.creatinineMgPerDl;
    if (!(creatinine >= 0.1 && creatinine <= 20)) return fail(issue('out_of_range', ['creatinine'], `Serum creatinine ${creatinine} mg/dL is outside the plausible range 0.1–20 mg/dL.`));
    if (regimen.id === 'edetate-calcium-disodium-lead' && creatinine >= edetateNephropathyFromMgPerDl) {
      const row = edetateRenalSchedules.find((it) => creatinine >= it.fromMgPerDl && creatinine < it.belowMgPerDl)!;
      renalSchedule = `lead nephropathy, serum creatinine ${creatinine} mg/dL: 500 mg/m² every ${row.intervalHours === 168 ? 'week' : `${row.intervalHours} h`} × ${row.administrations} (${cite('edetate-calcium-disodium-label')})`;
      const base = population.phases[0]!;
      phases = [
        {
          ...base,
          id: row.id,
          label: `500 mg/m² every ${row.intervalHours === 168 ? 'week' : `${row.intervalHours} hours`}, ${row.administrations} doses (lead nephropathy)`,
          intervalHours: row.intervalHours,
          length: { administrations: row.administrations },
          doseOptions: [{ basis: 'mg-per-m2', mgPerM2: edetateRenalMgPerM2, sourceIds: ['edetate-calcium-disodium-label'] }],
          maxPer24h: { mgPerM2: edetateRenalMgPerM2, sourceIds: ['edetate-calcium-disodium-label'] },
        },
      ];
      if (request.ageYears !== undefined && request.ageYears < 18) {
        warnings.push(issue('not_applicable', ['creatinine'], 'The label states its nephropathy schedules for adults; for a child they are an extrapolation for review by a toxicologist.', 'warning'));
      }
    } else if (creatinine >= edetateNephropathyFromMgPerDl && drugsInRegimen.has('calcium-disodium-edetate')) {
      warnings.push(issue('not_applicable', ['creatinine'], `Serum creatinine ${creatinine} mg/dL: the edetate label gives renal schedules only for edetate alone; the combination’s doses need review by a toxicologist.`, 'warning'));
    }
  }

  // ——— Choices ———
  const singleDrug = drugsInRegimen.size === 1;
  if (request.doseMg !== undefined && !singleDrug) {
    return fail(issue('not_applicable', ['doseMg'], `An entered dose applies to one drug; ${regimen.id} combines ${[...drugsInRegimen].join(' and ')}: leave --dose-mg out and review the planned doses.`));
  }
  const courseCount = request.courses ?? regimen.courses.default;
  if (!(Number.isInteger(courseCount) && courseCount >= regimen.courses.min && courseCount <= regimen.courses.max)) {
    return fail(issue('out_of_range', ['courses'], `Courses ${courseCount} is outside ${regimen.courses.min}–${regimen.courses.max} for ${regimen.id}.`));
  }
  const restDays = regimen.restDays ? request.restDays ?? regimen.restDays.default : 0;
  if (regimen.restDays && !(Number.isInteger(restDays) && restDays >= regimen.restDays.min && restDays <= regimen.restDays.max)) {
    return fail(issue('out_of_range', ['restDays'], `Rest days ${restDays} is outside the label’s ${regimen.restDays.min}–${regimen.restDays.max} days between courses.`));
  }
  if (!regimen.restDays && request.restDays !== undefined) return fail(issue('not_applicable', ['restDays'], `${regimen.id} plans one course: rest days are not part of it (${regimen.repeatNote})`));

  // ——— Trientine basis ———
  let switchPlan: TrientineSwitch | null = null;
  const productId = (['trientine-dihydrochloride', 'trientine-tetrahydrochloride'] as const).find((id) => drugsInRegimen.has(id));
  if (request.strength) {
    if (!productId) return fail(issue('not_applicable', ['strength'], 'A strength with its basis (salt or base) is checked for the trientine products only.'));
    const checked = checkTrientineStrength(productId, request.strength.mg, request.strength.basis);
    if (!checked.ok) return fail(...checked.issues);
  }
  if (request.switchFrom) {
    if (!productId) return fail(issue('not_applicable', ['switchFrom'], 'A switch between products is worked for trientine only.'));
    if (request.switchFrom.strength) {
      const checked = checkTrientineStrength(request.switchFrom.productId, request.switchFrom.strength.mg, request.switchFrom.strength.basis);
      if (!checked.ok) return fail(...checked.issues.map((it) => ({ ...it, path: ['switchFrom', ...it.path] })));
    }
    switchPlan = trientineSwitch(request.switchFrom.productId, request.switchFrom.dailyMg, productId);
  }

  // ——— Doses per phase ———
  interface DosedPhase extends ScheduledPhase {
    readonly doseMg: number;
    readonly basis: DoseBasis | 'entered';
    readonly doseBasis: string;
    readonly alternatives: { basis: DoseBasis; mg: number }[];
    readonly capApplied: string | null;
    readonly maxMgPer24h: number | null;
  }
  const dosed: DosedPhase[] = [];
  for (const spec of phases) {
    const perDay = spec.perDay ? request.administrationsPerDay ?? spec.perDay.default : null;
    if (spec.perDay && perDay !== null && !(Number.isInteger(perDay) && perDay >= spec.perDay.min && perDay <= spec.perDay.max)) {
      return fail(issue('out_of_range', ['administrationsPerDay'], `Administrations per day ${perDay} is outside ${spec.perDay.min}–${spec.perDay.max} for ${courseDrug(spec.drug).label}.`));
    }
    const intervalHours = perDay !== null ? 24 / perDay : spec.intervalHours!;
    let count: number;
    if ('administrations' in spec.length) count = spec.length.administrations;
    else if (typeof spec.length.days === 'number') count = Math.round((spec.length.days * 24) / intervalHours);
    else {
      const range = spec.length.days;
      const days = request.days ?? range.default;
      if (!(Number.isInteger(days) && days >= range.min && days <= range.max)) return fail(issue('out_of_range', ['days'], `Days ${days} is outside ${range.min}–${range.max} for this regimen.`));
      count = Math.round((days * 24) / intervalHours);
    }
    // Dose option: the requested basis where the phase offers it, else the phase's first.
    let option = spec.doseOptions.find((it) => it.basis === request.basis) ?? spec.doseOptions[0]!;
    if (request.basis !== undefined && !spec.doseOptions.some((it) => it.basis === request.basis) && singleDrug) {
      return fail(issue('unknown_choice', ['basis'], `Basis ${request.basis} is not published for ${courseDrug(spec.drug).label} here; choose ${spec.doseOptions.map((it) => it.basis).join(' or ')}.`));
    }
    if (request.mgPerKg !== undefined) {
      const perKg = spec.doseOptions.filter((it): it is Extract<DoseOption, { basis: 'mg-per-kg' }> => it.basis === 'mg-per-kg');
      const low = Math.min(...perKg.map((it) => it.mgPerKg));
      const high = Math.max(...perKg.map((it) => it.mgPerKg));
      if (perKg.length < 2) return fail(issue('not_applicable', ['mgPerKg'], `${courseDrug(spec.drug).label} in ${regimen.id} has one published per-kg dose; --mg-per-kg applies to a published range (unithiol 3–5 mg/kg).`));
      if (!(request.mgPerKg >= low && request.mgPerKg <= high)) return fail(issue('out_of_range', ['mgPerKg'], `${request.mgPerKg} mg/kg is outside the published ${low}–${high} mg/kg (${cite(perKg[0]!.sourceIds[0]!)}).`));
      option = { basis: 'mg-per-kg', mgPerKg: request.mgPerKg, sourceIds: perKg[0]!.sourceIds };
    }
    const dayCount = perDay ?? 1;
    const dailyMg = request.dailyMg ?? (switchPlan ? switchPlan.equivalentDailyMg : undefined);
    if (request.dailyMg !== undefined && option.basis !== 'daily-mg' && option.basis !== 'daily-mg-per-kg-rounded') {
      return fail(issue('not_applicable', ['dailyMg'], `A daily dose applies to the Wilson disease regimens; ${courseDrug(spec.drug).label} here is dosed per administration (--dose-mg).`));
    }
    const computed = optionMg(option, weightKg, bsaM2, dayCount, dailyMg, request.dailyMg === undefined && switchPlan ? 'of trientine base, the base in today’s dose on the current product' : 'as entered');
    if (!computed) {
      if (option.basis === 'mg-per-m2') return fail(issue('required', ['heightCm'], `Height is required: ${courseDrug(spec.drug).label} is dosed per m² of body-surface area (Mosteller) here.`));
      return fail(issue('out_of_range', ['weightKg'], `Weight ${weightKg} kg is below the label table’s first row (8 kg) for ${courseDrug(spec.drug).label}; choose --basis mg-per-kg or mg-per-m2 for review.`));
    }
    const alternatives = spec.doseOptions
      .filter((it) => it !== option)
      .map((it) => ({ basis: it.basis, result: optionMg(it, weightKg, bsaM2, dayCount, undefined) }))
      .filter((it) => it.result !== null)
      .map((it) => ({ basis: it.basis, mg: round(it.result!.mg) }));
    const perWindow = intervalHours < 24 ? Math.round(24 / intervalHours) : 1;
    const maxMgPer24h = spec.maxPer24h ? (spec.maxPer24h.mg ?? (bsaM2 === null ? null : spec.maxPer24h.mgPerM2! * bsaM2)) : null;
    if (spec.maxPer24h?.mgPerM2 !== undefined && bsaM2 === null) {
      return fail(issue('required', ['heightCm'], `Height is required: the daily dose of ${courseDrug(spec.drug).label} is set per m² of body-surface area.`));
    }
    let doseMg = computed.mg;
    let basis: DoseBasis | 'entered' = option.basis;
    let doseBasis = computed.text;
    let capApplied: string | null = null;
    if (request.doseMg !== undefined) {
      const entered = request.doseMg;
      if (!(entered > 0 && entered <= 5000)) return fail(issue('out_of_range', ['doseMg'], `Dose ${entered} mg is outside the plausible range 0–5000 mg per administration.`));
      if (spec.maxMgPerDose !== undefined && entered > spec.maxMgPerDose) {
        return fail(issue('out_of_range', ['doseMg'], `Dose ${entered} mg exceeds the per-dose maximum of ${spec.maxMgPerDose} mg for ${courseDrug(spec.drug).label} (${cite(spec.sourceIds[0]!)}); no plan is made.`));
      }
      if (maxMgPer24h !== null && entered * perWindow > maxMgPer24h + 1e-9) {
        return fail(
          issue(
            'out_of_range',
            ['doseMg'],
            `Dose ${entered} mg × ${perWindow} in 24 hours = ${round(entered * perWindow)} mg exceeds the daily dose of ${round(maxMgPer24h)} mg for ${courseDrug(spec.drug).label}${spec.drug === 'calcium-disodium-edetate' ? ': the label allows no day above the recommended daily dose' : ''} (${cite(spec.maxPer24h!.sourceIds[0]!)}); no plan is made.`,
          ),
        );
      }
      if (Math.abs(entered - computed.mg) > 0.005 * computed.mg) {
        warnings.push(issue('inconsistent', ['doseMg'], `Entered dose ${entered} mg differs from the published ${round(computed.mg)} mg (${computed.text}); the plan uses the entered dose.`, 'warning'));
      }
      doseMg = entered;
      basis = 'entered';
      doseBasis = `${entered} mg as entered; published: ${computed.text}`;
    } else {
      if (spec.maxMgPerDose !== undefined && doseMg > spec.maxMgPerDose) {
        capApplied = `${round(doseMg)} mg capped at the per-dose maximum ${spec.maxMgPerDose} mg (${cite(spec.sourceIds[0]!)})`;
        doseMg = spec.maxMgPerDose;
      }
      if (maxMgPer24h !== null && doseMg * perWindow > maxMgPer24h + 1e-9) {
        if (option.basis === 'daily-mg' && request.dailyMg !== undefined) {
          return fail(issue('out_of_range', ['dailyMg'], `Daily dose ${request.dailyMg} mg exceeds the maximum ${maxMgPer24h} mg/day for ${courseDrug(spec.drug).label} in ${population.label} (${cite(spec.maxPer24h!.sourceIds[0]!)}); no plan is made.`));
        }
        capApplied = `${round(doseMg * perWindow)} mg a day capped at ${round(maxMgPer24h)} mg a day (${cite(spec.maxPer24h!.sourceIds[0]!)})`;
        doseMg = maxMgPer24h / perWindow;
      }
      if (option.basis === 'daily-mg' && request.dailyMg !== undefined && (request.dailyMg < option.minMgPerDay || request.dailyMg > option.maxMgPerDay)) {
        warnings.push(issue('out_of_range', ['dailyMg'], `Daily dose ${request.dailyMg} mg is outside the usual ${option.minMgPerDay}–${option.maxMgPerDay} mg/day for ${population.label} (${cite(option.sourceIds[0]!)}).`, 'warning'));
      }
    }
    dosed.push({ spec, intervalHours, count, doseMg, basis, doseBasis, alternatives, capApplied, maxMgPer24h });
  }

  // ——— Schedule ———
  const tz = request.timeZone;
  const administrations: PlannedAdministration[] = [];
  const phasePlans: PhasePlan[] = [];
  const courseTotals: CourseTotal[] = [];
  const restDayList: string[] = [];
  let courseStartMs = start.value.epochMs;
  // Course length in whole days for the next course's start: the longest track, rounded up to days.
  for (let course = 1; course <= courseCount; course += 1) {
    const tracks = [...new Set(dosed.map((it) => it.spec.track))];
    let courseEndMs = courseStartMs;
    const inCourse: PlannedAdministration[] = [];
    for (const track of tracks) {
      const first = dosed.find((it) => it.spec.track === track)!;
      let phaseStartMs = courseStartMs + (first.spec.trackOffsetHours ?? 0) * hourMs;
      for (const phase of dosed.filter((it) => it.spec.track === track)) {
        const instants = phaseInstants(phaseStartMs, phase.intervalHours, phase.count, tz);
        const planned = instants.slice(0, phase.count).map((epochMs, index) => ({
          course,
          phaseId: phase.spec.id,
          drug: phase.spec.drug,
          number: index + 1,
          doseMg: phase.doseMg,
          at: wallClockAt(epochMs, tz),
          clockShifted: false,
        }));
        inCourse.push(...planned);
        const drug = courseDrug(phase.spec.drug);
        phasePlans.push({
          course,
          id: phase.spec.id,
          label: phase.spec.label,
          drug: phase.spec.drug,
          drugLabel: drug.label,
          dosedAs: drug.dosedAs,
          route: phase.spec.route,
          intervalHours: phase.intervalHours,
          administrations: phase.count,
          dosePerAdministrationMg: phase.doseMg,
          doseBasis: phase.doseBasis,
          basis: phase.basis,
          alternatives: phase.alternatives,
          capApplied: phase.capApplied,
          maxMgPer24h: phase.maxMgPer24h,
          first: planned[0]!.at,
          last: planned[planned.length - 1]!.at,
          totalMg: phase.doseMg * phase.count,
          ...(phase.spec.administrationNote !== undefined ? { administrationNote: phase.spec.administrationNote } : {}),
          sourceIds: phase.spec.sourceIds,
        });
        phaseStartMs = instants[phase.count]!;
        courseEndMs = Math.max(courseEndMs, planned[planned.length - 1]!.at.epochMs);
      }
    }
    inCourse.sort((first, second) => first.at.epochMs - second.at.epochMs);
    administrations.push(...inCourse);
    courseTotals.push({ course, first: inCourse[0]!.at, last: inCourse[inCourse.length - 1]!.at, totalsMg: totalsOf(inCourse) });
    if (course < courseCount) {
      const lastDate = wallClockAt(courseEndMs, tz).localDate;
      const startDate = wallClockAt(courseStartMs, tz).localDate;
      // Next course: rest days whole calendar days after the last treatment day, at the course's clock time.
      const daysToNext = daysBetween(startDate, lastDate) + 1 + restDays;
      for (let day = 1; day <= restDays; day += 1) restDayList.push(addDaysIso(lastDate, day));
      courseStartMs = addWallClockDays(courseStartMs, daysToNext, tz);
    }
  }
  const firstOffset = administrations[0]!.at.utcOffset;
  const marked = administrations.map((it) => ({ ...it, clockShifted: it.at.utcOffset !== firstOffset }));
  const lastMs = marked[marked.length - 1]!.at.epochMs;
  const offsetChanges = offsetChangesBetween(start.value.epochMs, lastMs, tz);

  // ——— Rules on the finished schedule ———
  const dailyChecks = rollingDailyChecks(marked, phasePlans);
  for (const check of dailyChecks) {
    if (!check.withinLimit) {
      return fail(issue('out_of_range', ['schedule'], `${courseDrug(check.drug).label}: ${round(check.largestMgIn24h)} mg within 24 hours exceeds the daily dose ${round(check.limitMg)} mg; no plan is made.`));
    }
  }
  const orderIssues = checkEdetateAfterSecondDimercaprol(marked);
  if (orderIssues.length > 0) return fail(...orderIssues);

  // ——— Monitoring ———
  const firstDate = marked[0]!.at.localDate;
  const lastDate = marked[marked.length - 1]!.at.localDate;
  const monitoring: MonitoringDue[] = [];
  for (const spec of regimen.monitoring) {
    if (spec.when === 'start') monitoring.push({ what: spec.what, dueDate: firstDate, sourceIds: spec.sourceIds });
    else if (spec.when === 'weekly') {
      for (let day = 7; day <= daysBetween(firstDate, lastDate); day += 7) monitoring.push({ what: spec.what, dueDate: addDaysIso(firstDate, day), sourceIds: spec.sourceIds });
    } else monitoring.push({ what: spec.what, dueDate: addDaysIso(lastDate, spec.when.daysAfterEnd), sourceIds: spec.sourceIds });
  }
  monitoring.sort((first, second) => (first.dueDate < second.dueDate ? -1 : first.dueDate > second.dueDate ? 1 : 0));

  const binding = phasePlans
    .filter((it) => it.course === 1)
    .filter((it, index, all) => all.findIndex((other) => other.drug === it.drug) === index)
    .map((it) => courseBindingRow(it.drug, it.dosePerAdministrationMg, metal));
  const cautions = [...new Set([...drugsInRegimen].flatMap((id) => courseDrug(id).cautions))];
  return ok(
    {
      regimenId: regimen.id,
      title: regimen.title,
      population: population.label,
      patient: { weightKg, heightCm: request.heightCm ?? null, ageYears: request.ageYears ?? null, bsaM2, bsaMethod: 'Mosteller (N Engl J Med 1987;317:1098)' },
      timeZone: tz,
      start: start.value,
      bloodLead,
      urinaryCopper,
      renalSchedule,
      phases: phasePlans,
      administrations: marked,
      courses: courseTotals,
      restDays: restDayList,
      totalsMg: totalsOf(marked),
      dailyChecks,
      monitoring,
      offsetChanges,
      timeRule: courseTimeRule,
      binding,
      trientineSwitch: switchPlan,
      frame: regimen.frame,
      cautions,
      repeatNote: regimen.repeatNote,
      modellingChoices: regimen.modellingChoices,
      sourceIds: regimen.sourceIds,
      warnings,
    },
    warnings,
  );
}

function totalsOf(list: readonly PlannedAdministration[]): { drug: CourseDrugId; mg: number; administrations: number }[] {
  const totals = new Map<CourseDrugId, { mg: number; administrations: number }>();
  for (const item of list) {
    const current = totals.get(item.drug) ?? { mg: 0, administrations: 0 };
    totals.set(item.drug, { mg: current.mg + item.doseMg, administrations: current.administrations + 1 });
  }
  return [...totals.entries()].map(([drug, value]) => ({ drug, ...value }));
}

/**
 * The largest amount of each capped drug inside any 24 hours of elapsed time
 * (a window opening at each administration) when it is given more than once a
 * day, or on any one calendar day of the ward when it is given once a day or
 * less often, against its daily limit.
 * @param administrations - the plan's administrations, in time order
 * @param phases - the phase plans (their maxMgPer24h)
 * @returns one check per drug that has a daily limit
 * @example six 4-hourly doses of 250 mg/m² fit 1,500 mg/m²/day; a seventh within 24 h does not
 */
export function rollingDailyChecks(administrations: readonly PlannedAdministration[], phases: readonly PhasePlan[]): RollingDailyCheck[] {
  const checks: RollingDailyCheck[] = [];
  const drugs = [...new Set(phases.filter((it) => it.maxMgPer24h !== null).map((it) => it.drug))];
  for (const drug of drugs) {
    const limitMg = Math.min(...phases.filter((it) => it.drug === drug && it.maxMgPer24h !== null).map((it) => it.maxMgPer24h!));
    const doses = administrations.filter((it) => it.drug === drug);
    // Sub-daily intervals run on elapsed time: any 24 elapsed hours. Daily or longer intervals keep the clock
    // time, so a 23-hour day holds two starts 23 h apart: their "day" is the ward's calendar day.
    const elapsed = phases.some((it) => it.drug === drug && it.intervalHours < 24);
    let largest = 0;
    for (const opening of doses) {
      const total = doses
        .filter((it) => (elapsed ? it.at.epochMs >= opening.at.epochMs && it.at.epochMs < opening.at.epochMs + 24 * hourMs : it.at.localDate === opening.at.localDate))
        .reduce((sum, it) => sum + it.doseMg, 0);
      largest = Math.max(largest, total);
    }
    checks.push({ drug, limitMg, largestMgIn24h: largest, withinLimit: largest <= limitMg * (1 + 1e-9) });
  }
  return checks;
}

/**
 * In the encephalopathy regimen calcium disodium edetate must start with the
 * second dimercaprol dose (about 4 h after the first), never first or with
 * the first (dimercaprol label; Am Fam Physician 2000).
 * @param administrations - a plan's administrations
 * @returns no issue when edetate is absent or starts at the second dimercaprol dose; else one 'inconsistent' issue on ['schedule']
 * @example an edetate dose at the time of the first dimercaprol dose → one issue
 */
export function checkEdetateAfterSecondDimercaprol(administrations: readonly PlannedAdministration[]): Issue[] {
  const dimercaprol = administrations.filter((it) => it.drug === 'dimercaprol').sort((first, second) => first.at.epochMs - second.at.epochMs);
  const edetate = administrations.filter((it) => it.drug === 'calcium-disodium-edetate').sort((first, second) => first.at.epochMs - second.at.epochMs);
  if (dimercaprol.length === 0 || edetate.length === 0) return [];
  const second = dimercaprol[1];
  const firstEdetate = edetate[0]!;
  if (second === undefined || firstEdetate.at.epochMs < second.at.epochMs) {
    return [
      issue(
        'inconsistent',
        ['schedule'],
        `Calcium disodium edetate at ${firstEdetate.at.localDate} ${firstEdetate.at.localTime} comes before the second dimercaprol dose; in encephalopathy edetate starts with the second dimercaprol dose, about 4 hours after the first, never first (${cite('dimercaprol-label')}).`,
      ),
    ];
  }
  return [];
}

/** Serum creatinine entered in µmol/L, in mg/dL for the renal schedules. @example creatinineForSchedule(265.2, 'umol/L') ≈ 3.0 */
export function creatinineForSchedule(value: number, unit: 'mg/dL' | 'umol/L'): number {
  return unit === 'mg/dL' ? value : creatinineMgPerDlFromUmolPerL(value as UmolPerL);
}
