import type { CourseDrugId, CourseRoute } from './drugs';

/**
 * The heavy-metal course catalogue: each regimen as data, with its sources.
 * Every dose value has its source beside it (references.md §7 and §9, read
 * again in the label texts named in core/references/courses.ts). Modelling
 * choices of this project are listed in `modellingChoices` and printed.
 */

export type MetalId = 'lead' | 'mercury' | 'arsenic' | 'copper';

/** One way of reaching the dose of one administration. */
export type DoseOption =
  | {
      readonly basis: 'weight-band';
      /** minKg ≤ weight < belowKg (belowKg null: no upper end). */
      readonly bands: readonly { readonly minKg: number; readonly belowKg: number | null; readonly mg: number }[];
      readonly sourceIds: readonly string[];
    }
  | { readonly basis: 'mg-per-kg'; readonly mgPerKg: number; readonly sourceIds: readonly string[] }
  | { readonly basis: 'mg-per-m2'; readonly mgPerM2: number; readonly sourceIds: readonly string[] }
  | { readonly basis: 'fixed-mg'; readonly mg: number; readonly sourceIds: readonly string[] }
  | {
      /** A daily dose in mg chosen inside a published range, divided equally over the day's administrations. */
      readonly basis: 'daily-mg';
      readonly minMgPerDay: number;
      readonly maxMgPerDay: number;
      readonly sourceIds: readonly string[];
    }
  | {
      /** mg/kg/day rounded to a step (penicillamine: to the nearest 250 mg), divided over the day. */
      readonly basis: 'daily-mg-per-kg-rounded';
      readonly mgPerKgPerDay: number;
      readonly roundToMg: number;
      readonly sourceIds: readonly string[];
    };

export type DoseBasis = DoseOption['basis'];

export interface PhaseSpec {
  readonly id: string;
  readonly label: string;
  readonly drug: CourseDrugId;
  readonly route: CourseRoute;
  /** Phases on one track follow each other; tracks run side by side (a combination). */
  readonly track: number;
  /** Hours from the course start to this track's first administration (0 unless stated). */
  readonly trackOffsetHours?: number;
  /** Administrations per day: a fixed count, or a choice inside a range (Wilson drugs). */
  readonly perDay: { readonly default: number; readonly min: number; readonly max: number } | null;
  /** Interval between administrations when perDay is null, hours (4, 6, 8, 12, 24, 48, 168). */
  readonly intervalHours?: number;
  /** Number of administrations, or days (then count = days × per day). */
  readonly length:
    | { readonly administrations: number }
    | { readonly days: number }
    | { readonly days: { readonly default: number; readonly min: number; readonly max: number }; readonly why: string };
  /** The dose options; the first is the default. */
  readonly doseOptions: readonly DoseOption[];
  readonly maxMgPerDose?: number;
  /** The most a rolling 24 hours may hold: in mg, or in mg/m² (calcium disodium edetate's daily dose). */
  readonly maxPer24h?: { readonly mg?: number; readonly mgPerM2?: number; readonly sourceIds: readonly string[] };
  readonly administrationNote?: string;
  readonly sourceIds: readonly string[];
}

/** A group of patients a regimen's phases apply to (first match wins). */
export interface Population {
  readonly id: string;
  readonly label: string;
  readonly minAgeYears?: number;
  readonly belowAgeYears?: number;
  readonly minWeightKg?: number;
  readonly belowWeightKg?: number;
  readonly phases: readonly PhaseSpec[];
}

export interface MonitoringSpec {
  readonly what: string;
  /** 'start': on the first day; 'weekly': every 7 days from the start to the last day; number: days after the last administration. */
  readonly when: 'start' | 'weekly' | { readonly daysAfterEnd: number };
  readonly sourceIds: readonly string[];
}

export interface CourseRegimen {
  readonly id: string;
  readonly title: string;
  readonly metals: readonly MetalId[];
  /** The blood-level or clinical frame the regimen belongs to, descriptive. */
  readonly frame: readonly string[];
  readonly populations: readonly Population[];
  /** Courses planned (default, range) and the rest between them. */
  readonly courses: { readonly default: number; readonly min: number; readonly max: number };
  readonly restDays: { readonly default: number; readonly min: number; readonly max: number } | null;
  /** What the source says about further courses (printed; not planned). */
  readonly repeatNote: string;
  readonly monitoring: readonly MonitoringSpec[];
  readonly modellingChoices: readonly string[];
  readonly sourceIds: readonly string[];
}

// ——— Succimer (succimer label: dosage table; references.md §9 confirmed) ———
const succimerDoseOptions: readonly DoseOption[] = [
  {
    basis: 'weight-band',
    // Label table: 8–15 kg 100 mg, 16–23 kg 200 mg, 24–34 kg 300 mg, 35–44 kg 400 mg, ≥ 45 kg 500 mg per dose.
    // The table prints whole kilograms; a weight between two rows (15.5 kg) is read with the lower row
    // (band up to the next row's first kilogram): modelling choice, stated in the regimen.
    bands: [
      { minKg: 8, belowKg: 16, mg: 100 },
      { minKg: 16, belowKg: 24, mg: 200 },
      { minKg: 24, belowKg: 35, mg: 300 },
      { minKg: 35, belowKg: 45, mg: 400 },
      { minKg: 45, belowKg: null, mg: 500 },
    ],
    sourceIds: ['succimer-label'],
  },
  { basis: 'mg-per-kg', mgPerKg: 10, sourceIds: ['succimer-label'] }, // 10 mg/kg per dose (label)
  { basis: 'mg-per-m2', mgPerM2: 350, sourceIds: ['succimer-label'] }, // 350 mg/m² per dose (label)
];

const succimer: CourseRegimen = {
  id: 'succimer-lead',
  title: 'Succimer for lead poisoning (children 1 year and older), 19 days',
  metals: ['lead'],
  frame: [
    'Label indication: children aged 1 year and older with blood lead above 45 µg/dL (succimer label §1).',
    'Not for lead encephalopathy (succimer label §1).',
    'Blood lead 70 µg/dL or more, or encephalopathy: a medical emergency treated in hospital (CDC 2002; AAP 2005).',
  ],
  populations: [
    {
      id: 'child-or-adult',
      label: 'from 1 year of age',
      minAgeYears: 1,
      phases: [
        {
          id: 'every-8-h',
          label: 'every 8 hours for 5 days',
          drug: 'succimer',
          route: 'oral',
          track: 0,
          perDay: null,
          intervalHours: 8, // label: every 8 hours for five days
          length: { days: 5 },
          doseOptions: succimerDoseOptions,
          maxMgPerDose: 500, // label table's top row; references.md §7 "at most 500 mg a dose"
          administrationNote: 'Capsules may be opened and the beads sprinkled on soft food (label).',
          sourceIds: ['succimer-label'],
        },
        {
          id: 'every-12-h',
          label: 'every 12 hours for 14 days',
          drug: 'succimer',
          route: 'oral',
          track: 0,
          perDay: null,
          intervalHours: 12, // label: then every 12 hours for 14 days (two weeks)
          length: { days: 14 },
          doseOptions: succimerDoseOptions,
          maxMgPerDose: 500,
          sourceIds: ['succimer-label'],
        },
      ],
    },
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'A further course only as weekly blood lead indicates, at least two weeks after the end of this one (succimer label).',
  monitoring: [
    { what: 'complete blood count with differential and platelets (ANC: withheld below 1,200/µL)', when: 'start', sourceIds: ['succimer-label'] },
    { what: 'complete blood count with differential and platelets', when: 'weekly', sourceIds: ['succimer-label'] },
    { what: 'blood lead (decides any further course)', when: 'weekly', sourceIds: ['succimer-label'] },
    { what: 'blood lead after the course', when: { daysAfterEnd: 7 }, sourceIds: ['succimer-label'] },
  ],
  modellingChoices: [
    'A weight between two rows of the label table (e.g. 15.5 kg) takes the lower row: the rows run up to the next row’s first kilogram.',
    'Three bases are shown side by side; the label table is the default, mg/kg or mg/m² on request.',
  ],
  sourceIds: ['succimer-label', 'am-fam-physician-2000-lead', 'cdc-lead-thresholds'],
};

// ——— Calcium disodium edetate (US label, May 2024; references.md §9 confirmed) ———
const edetate: CourseRegimen = {
  id: 'edetate-calcium-disodium-lead',
  title: 'Calcium disodium edetate for lead poisoning, 5 days then 2–4 days off, two courses',
  metals: ['lead'],
  frame: [
    'Blood lead 20–70 µg/dL without encephalopathy: 1,000 mg/m²/day (label).',
    'Above 70 µg/dL or with symptoms: the label recommends use with dimercaprol (regimen dimercaprol-edetate-encephalopathy).',
    'Serum creatinine 2 mg/dL or more (lead nephropathy): the label’s renal schedules replace this one.',
  ],
  populations: [
    {
      id: 'any-age',
      label: 'children and adults',
      phases: [
        {
          id: 'daily-5-days',
          label: 'once daily for 5 days (intravenous infusion over 8–12 h, or intramuscular in divided doses)',
          drug: 'calcium-disodium-edetate',
          route: 'intravenous or intramuscular',
          track: 0,
          perDay: null,
          intervalHours: 24,
          length: { days: 5 }, // label: therapy is continued over a period of five days
          doseOptions: [{ basis: 'mg-per-m2', mgPerM2: 1000, sourceIds: ['edetate-calcium-disodium-label'] }], // 1,000 mg/m²/day
          maxPer24h: { mgPerM2: 1000, sourceIds: ['edetate-calcium-disodium-label'] }, // "at no time should the recommended daily dose be exceeded"
          administrationNote: 'Vial 1,000 mg/5 mL (200 mg/mL).',
          sourceIds: ['edetate-calcium-disodium-label'],
        },
      ],
    },
  ],
  courses: { default: 2, min: 1, max: 2 }, // label: two courses are usually employed
  restDays: { default: 2, min: 2, max: 4 }, // label: interrupted for 2 to 4 days
  repeatNote: 'Two courses usually; further courses depend on the blood lead and the patient’s tolerance (label).',
  monitoring: [
    { what: 'serum creatinine and urinalysis (renal function), from memory of the label’s warnings', when: 'start', sourceIds: ['edetate-calcium-disodium-label'] },
    { what: 'blood lead before the second course', when: { daysAfterEnd: 0 }, sourceIds: ['edetate-calcium-disodium-label'] },
  ],
  modellingChoices: ['The daily dose is planned as one administration a day at the same clock time; an intramuscular order divides it (every 8–12 h) within the same daily total.'],
  sourceIds: ['edetate-calcium-disodium-label', 'mmwr-2006-edetate-disodium'],
};

/** The label's lead-nephropathy schedules, picked by serum creatinine (mg/dL); ranges are [from, below). */
export const edetateRenalSchedules = [
  // 500 mg/m² every 24 h for 5 days at creatinine 2–3 mg/dL (label)
  { id: 'creatinine-2-to-3', fromMgPerDl: 2, belowMgPerDl: 3, intervalHours: 24, administrations: 5 },
  // every 48 h for 3 doses at 3–4 mg/dL (label); 3.0 itself is read with this row (modelling choice)
  { id: 'creatinine-3-to-4', fromMgPerDl: 3, belowMgPerDl: 4.0000001, intervalHours: 48, administrations: 3 },
  // once weekly above 4 mg/dL (label); the label gives no count: four weekly doses (one month) as a modelling choice
  { id: 'creatinine-above-4', fromMgPerDl: 4.0000001, belowMgPerDl: Infinity, intervalHours: 168, administrations: 4 },
] as const;
export const edetateRenalMgPerM2 = 500; // label: 500 mg/m² per administration in lead nephropathy

// ——— Dimercaprol with calcium disodium edetate in encephalopathy ———
const encephalopathy: CourseRegimen = {
  id: 'dimercaprol-edetate-encephalopathy',
  title: 'Dimercaprol then calcium disodium edetate from the second dimercaprol dose: lead encephalopathy or blood lead above 70 µg/dL, 5 days',
  metals: ['lead'],
  frame: [
    'Lead encephalopathy, or blood lead 70 µg/dL or more in a child: a medical emergency (CDC 2002; AAP 2005).',
    'Dimercaprol alone as the first dose; calcium disodium edetate starts with the second dimercaprol dose, about 4 hours later, never first (dimercaprol label; Am Fam Physician 2000).',
    'Intramuscular route for overt encephalopathy (calcium disodium edetate label).',
  ],
  populations: [
    {
      id: 'any-age',
      label: 'children and adults',
      phases: [
        {
          id: 'dimercaprol-every-4-h',
          label: 'dimercaprol every 4 hours for 5 days (deep IM)',
          drug: 'dimercaprol',
          route: 'intramuscular',
          track: 0,
          perDay: null,
          intervalHours: 4, // label: 4 mg/kg … thereafter at four-hour intervals
          length: { days: 5 }, // label 2–7 days by response; combination protocols 5 days (references.md §7)
          doseOptions: [
            { basis: 'mg-per-kg', mgPerKg: 4, sourceIds: ['dimercaprol-label'] }, // 4 mg/kg (label)
            { basis: 'mg-per-m2', mgPerM2: 75, sourceIds: ['dimercaprol-cautions'] }, // 75 mg/m² (references.md §7, secondary)
          ],
          sourceIds: ['dimercaprol-label', 'dimercaprol-cautions'],
        },
        {
          id: 'edetate-every-4-h',
          label: 'calcium disodium edetate every 4 hours for 5 days (IM, separate site), from the second dimercaprol dose',
          drug: 'calcium-disodium-edetate',
          route: 'intramuscular',
          track: 1,
          trackOffsetHours: 4, // starts with the second dimercaprol dose (about 4 h)
          perDay: null,
          intervalHours: 4,
          length: { days: 5 },
          doseOptions: [{ basis: 'mg-per-m2', mgPerM2: 250, sourceIds: ['edetate-encephalopathy-dose'] }], // 250 mg/m² every 4 h
          maxPer24h: { mgPerM2: 1500, sourceIds: ['edetate-encephalopathy-dose', 'edetate-calcium-disodium-label'] }, // 1,500 mg/m²/day
          sourceIds: ['edetate-encephalopathy-dose', 'edetate-calcium-disodium-label'],
        },
      ],
    },
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'At least 2 days before deciding on a repeat (clinical references); succimer may follow once the child is well (CDC 2002).',
  monitoring: [
    { what: 'blood lead, serum creatinine, urinalysis and calcium before the first dose', when: 'start', sourceIds: ['edetate-calcium-disodium-label'] },
    { what: 'blood lead after the course (decides any repeat)', when: { daysAfterEnd: 2 }, sourceIds: ['edetate-encephalopathy-dose'] },
  ],
  modellingChoices: [
    'Five days for both drugs, the combination protocols’ length inside the label’s 2–7 days for dimercaprol.',
    'Calcium disodium edetate’s 24-hour total is checked over every rolling 24 hours of elapsed time, so a 25-hour calendar day at a daylight-saving change may show seven 4-hourly doses without exceeding the daily dose.',
  ],
  sourceIds: ['dimercaprol-label', 'edetate-encephalopathy-dose', 'am-fam-physician-2000-lead', 'cdc-lead-thresholds'],
};

// ——— Dimercaprol alone: severe arsenic and mercury (label text as reproduced; secondary) ———
const dimercaprolArsenic: CourseRegimen = {
  id: 'dimercaprol-arsenic',
  title: 'Dimercaprol for severe arsenic poisoning: every 4 h for 2 days, four times on day 3, twice daily for 10 days',
  metals: ['arsenic'],
  frame: ['Severe arsenic poisoning (dimercaprol label).'],
  populations: [
    {
      id: 'any-age',
      label: 'children and adults',
      phases: [
        { id: 'every-4-h', label: 'every 4 hours for 2 days', drug: 'dimercaprol', route: 'intramuscular', track: 0, perDay: null, intervalHours: 4, length: { days: 2 }, doseOptions: [{ basis: 'mg-per-kg', mgPerKg: 3, sourceIds: ['dimercaprol-label'] }], sourceIds: ['dimercaprol-label'] },
        { id: 'every-6-h', label: 'four times on day 3', drug: 'dimercaprol', route: 'intramuscular', track: 0, perDay: null, intervalHours: 6, length: { days: 1 }, doseOptions: [{ basis: 'mg-per-kg', mgPerKg: 3, sourceIds: ['dimercaprol-label'] }], sourceIds: ['dimercaprol-label'] },
        { id: 'every-12-h', label: 'twice daily for 10 days', drug: 'dimercaprol', route: 'intramuscular', track: 0, perDay: null, intervalHours: 12, length: { days: 10 }, doseOptions: [{ basis: 'mg-per-kg', mgPerKg: 3, sourceIds: ['dimercaprol-label'] }], sourceIds: ['dimercaprol-label'] },
      ],
    },
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'Change to an oral chelator as the patient improves (toxicology references).',
  monitoring: [{ what: 'urinary arsenic, renal function and blood pressure', when: 'start', sourceIds: ['dimercaprol-label'] }],
  modellingChoices: ['"Four times on the third day" is planned as every 6 hours; "twice daily" as every 12 hours.'],
  sourceIds: ['dimercaprol-label', 'dimercaprol-cautions'],
};

const dimercaprolMercury: CourseRegimen = {
  id: 'dimercaprol-mercury',
  title: 'Dimercaprol for inorganic mercury poisoning: 5 mg/kg, then 2.5 mg/kg twice daily for 10 days',
  metals: ['mercury'],
  frame: ['Inorganic mercury poisoning; of most value when begun within 1–2 hours (dimercaprol references). Not for organic mercury.'],
  populations: [
    {
      id: 'any-age',
      label: 'children and adults',
      phases: [
        { id: 'first-dose', label: 'first dose', drug: 'dimercaprol', route: 'intramuscular', track: 0, perDay: null, intervalHours: 12, length: { administrations: 1 }, doseOptions: [{ basis: 'mg-per-kg', mgPerKg: 5, sourceIds: ['dimercaprol-label'] }], sourceIds: ['dimercaprol-label'] },
        { id: 'every-12-h', label: 'twice daily for 10 days', drug: 'dimercaprol', route: 'intramuscular', track: 0, perDay: null, intervalHours: 12, length: { days: 10 }, doseOptions: [{ basis: 'mg-per-kg', mgPerKg: 2.5, sourceIds: ['dimercaprol-label'] }], sourceIds: ['dimercaprol-label'] },
      ],
    },
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'Unithiol or succimer may follow (toxicology references).',
  monitoring: [{ what: 'urinary mercury and renal function', when: 'start', sourceIds: ['dimercaprol-label'] }],
  modellingChoices: ['"One or two times daily" is planned as twice daily (every 12 hours), the second dose 12 hours after the first.'],
  sourceIds: ['dimercaprol-label', 'dimercaprol-cautions'],
};

// ——— Unithiol intravenous (textbook chapter; secondary) ———
const unithiol: CourseRegimen = {
  id: 'unithiol-iv',
  title: 'Unithiol by slow intravenous infusion every 4 hours (mercury, arsenic)',
  metals: ['mercury', 'arsenic'],
  frame: ['Severe acute inorganic mercury or arsenic poisoning; change to oral after a few days of stabilisation (pharmacology chapter).'],
  populations: [
    {
      id: 'any-age',
      label: 'children and adults',
      phases: [
        {
          id: 'every-4-h',
          label: 'every 4 hours by slow intravenous infusion over 20 minutes',
          drug: 'unithiol',
          route: 'intravenous',
          track: 0,
          perDay: null,
          intervalHours: 4, // 3–5 mg/kg every 4 hours (chapter)
          length: { days: { default: 3, min: 1, max: 7 }, why: 'the chapter says "a few days"; 3 days is a modelling choice (change with --days)' },
          doseOptions: [
            { basis: 'mg-per-kg', mgPerKg: 5, sourceIds: ['unithiol-pharmacology-chapter'] }, // upper end of 3–5 mg/kg
            { basis: 'mg-per-kg', mgPerKg: 3, sourceIds: ['unithiol-pharmacology-chapter'] }, // lower end
          ],
          sourceIds: ['unithiol-pharmacology-chapter'],
        },
      ],
    },
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'Oral 4–8 mg/kg every 6–8 hours once stable (pharmacology chapter).',
  monitoring: [{ what: 'urinary mercury or arsenic, renal function', when: 'start', sourceIds: ['unithiol-pharmacology-chapter'] }],
  modellingChoices: ['Planned for 3 days by default ("a few days").', 'The default dose is the upper end of 3–5 mg/kg for severe poisoning; the lower end on request (--mg-per-kg 3).'],
  sourceIds: ['unithiol-pharmacology-chapter'],
};

// ——— Wilson disease ———
const wilsonDays = { default: 14, min: 1, max: 90 };
const wilsonDaysWhy = 'a maintenance drug has no fixed end: the plan lists the first days only (14 by default, a modelling choice; change with --days)';

const penicillaminePhase = (perDay: { readonly default: number; readonly min: number; readonly max: number }, dose: DoseOption): PhaseSpec => ({
  id: 'maintenance',
  label: 'in divided doses through the day',
  drug: 'penicillamine',
  route: 'oral',
  track: 0,
  perDay,
  length: { days: wilsonDays, why: wilsonDaysWhy },
  doseOptions: [dose],
  maxPer24h: { mg: 2000, sourceIds: ['penicillamine-wilson'] }, // seldom above 2 g/day
  sourceIds: ['penicillamine-wilson'],
});

const penicillamine: CourseRegimen = {
  id: 'penicillamine-wilson',
  title: 'Penicillamine for Wilson disease (copper)',
  metals: ['copper'],
  frame: ['Wilson disease; dose adjusted to 24-hour urinary copper and non-caeruloplasmin copper (EASL 2012).'],
  populations: [
    { id: 'child', label: 'children (under 18 years)', belowAgeYears: 18, phases: [penicillaminePhase({ default: 2, min: 2, max: 3 }, { basis: 'daily-mg-per-kg-rounded', mgPerKgPerDay: 20, roundToMg: 250, sourceIds: ['penicillamine-wilson'] })] }, // 20 mg/kg/day to the nearest 250 mg
    { id: 'adult', label: 'adults', minAgeYears: 18, phases: [penicillaminePhase({ default: 3, min: 2, max: 3 }, { basis: 'daily-mg', minMgPerDay: 750, maxMgPerDay: 1500, sourceIds: ['penicillamine-wilson'] })] }, // 750–1,500 mg/day
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'Continued for life in some form; maintenance doses are set by copper studies (EASL 2012).',
  monitoring: [
    { what: '24-hour urinary copper (on chelation about 200–500 µg/24 h, 3–8 µmol/24 h), blood count and urinalysis', when: 'start', sourceIds: ['wilson-urinary-copper-target'] },
  ],
  modellingChoices: ['Adults: the lower end of the daily range unless a daily dose is entered.', 'Children: under 18 years.'],
  sourceIds: ['penicillamine-wilson', 'wilson-urinary-copper-target'],
};

function trientineRegimen(
  id: string,
  drug: 'trientine-dihydrochloride' | 'trientine-tetrahydrochloride',
  title: string,
  child: { readonly minAgeYears?: number; readonly belowAgeYears: number; readonly min: number; readonly max: number; readonly cap: number; readonly sourceIds: readonly string[] },
  adult: { readonly min: number; readonly max: number; readonly cap: number; readonly sourceIds: readonly string[] },
  frame: readonly string[],
): CourseRegimen {
  const phase = (range: { readonly min: number; readonly max: number; readonly cap: number; readonly sourceIds: readonly string[] }): PhaseSpec => ({
    id: 'maintenance',
    label: 'in two to four divided doses a day',
    drug,
    route: 'oral',
    track: 0,
    perDay: { default: 2, min: 2, max: 4 },
    length: { days: wilsonDays, why: wilsonDaysWhy },
    doseOptions: [{ basis: 'daily-mg', minMgPerDay: range.min, maxMgPerDay: range.max, sourceIds: range.sourceIds }],
    maxPer24h: { mg: range.cap, sourceIds: range.sourceIds },
    administrationNote: 'On an empty stomach, at least 1 hour before or 2 hours after meals and apart from other medicines.',
    sourceIds: range.sourceIds,
  });
  return {
    id,
    title,
    metals: ['copper'],
    frame,
    populations: [
      { id: 'child', label: `children (${child.minAgeYears ?? 0}–${child.belowAgeYears - 1} years)`, ...(child.minAgeYears !== undefined ? { minAgeYears: child.minAgeYears } : {}), belowAgeYears: child.belowAgeYears, phases: [phase(child)] },
      { id: 'adult', label: `from ${child.belowAgeYears} years`, minAgeYears: child.belowAgeYears, phases: [phase(adult)] },
    ],
    courses: { default: 1, min: 1, max: 1 },
    restDays: null,
    repeatNote: 'Maintenance; the daily dose is set by copper studies every 6–12 months (label).',
    monitoring: [
      { what: '24-hour urinary copper (on chelation about 200–500 µg/24 h, 3–8 µmol/24 h) and non-caeruloplasmin copper', when: { daysAfterEnd: 0 }, sourceIds: ['wilson-urinary-copper-target'] },
    ],
    modellingChoices: [
      'The lower end of the daily range unless a daily dose is entered; twice daily unless a count is entered.',
      'The copper studies are listed at the end of the planned days; on maintenance the label sets the dose at 6–12-month intervals, and the interval after a product change is set locally.',
    ],
    sourceIds: [...new Set([...child.sourceIds, ...adult.sourceIds, 'wilson-urinary-copper-target'])],
  };
}

const trientineDihydrochloride = trientineRegimen(
  'trientine-dihydrochloride-wilson',
  'trientine-dihydrochloride',
  'Trientine dihydrochloride (dosed as the salt) for Wilson disease',
  // Children 12 years or under: 500–750 mg/day, at most 1,500 mg/day (US label)
  { belowAgeYears: 13, min: 500, max: 750, cap: 1500, sourceIds: ['trientine-dihydrochloride-label'] },
  // Adults: 750–1,250 mg/day, at most 2,000 mg/day (US label)
  { min: 750, max: 1250, cap: 2000, sourceIds: ['trientine-dihydrochloride-label'] },
  ['Wilson disease in patients intolerant of penicillamine; every mg is a mg of the dihydrochloride salt (US label).'],
);

const trientineTetrahydrochloride = trientineRegimen(
  'trientine-tetrahydrochloride-wilson',
  'trientine-tetrahydrochloride',
  'Trientine tetrahydrochloride (dosed as trientine base) for Wilson disease',
  // Children 5 years and older: 225–600 mg base/day (SmPC as reproduced; secondary); no separate maximum printed
  { minAgeYears: 5, belowAgeYears: 18, min: 225, max: 600, cap: 600, sourceIds: ['trientine-tetrahydrochloride-smpc'] },
  // Adults: 450–975 mg base/day in 2 to 4 divided doses (SmPC §4.2)
  { min: 450, max: 975, cap: 975, sourceIds: ['trientine-tetrahydrochloride-smpc'] },
  ['Wilson disease from 5 years of age; every mg is a mg of trientine base, not of the salt (EU SmPC §2, §4.2).'],
);

// ——— Zinc (elemental; EASL/AASLD confirmed for adults, children's bands secondary) ———
const zincPhase = (mg: number, perDay: number): PhaseSpec => ({
  id: 'maintenance',
  label: perDay === 3 ? 'three times a day' : 'twice a day',
  drug: 'zinc',
  route: 'oral',
  track: 0,
  perDay: { default: perDay, min: perDay, max: perDay },
  length: { days: wilsonDays, why: wilsonDaysWhy },
  doseOptions: [{ basis: 'fixed-mg', mg, sourceIds: ['zinc-wilson'] }],
  maxMgPerDose: mg,
  administrationNote: 'On an empty stomach; at least 1 hour apart from a chelator when the two overlap.',
  sourceIds: ['zinc-wilson'],
});

const zinc: CourseRegimen = {
  id: 'zinc-wilson',
  title: 'Zinc (elemental) for Wilson disease maintenance',
  metals: ['copper'],
  frame: ['Maintenance after chelation, or first treatment of presymptomatic patients (zinc references).'],
  populations: [
    { id: 'from-16-years', label: '16 years and older', minAgeYears: 16, phases: [zincPhase(50, 3)] }, // 50 mg three times daily
    { id: 'from-57-kg', label: '57 kg and heavier', minAgeYears: 1, minWeightKg: 57, phases: [zincPhase(50, 3)] },
    { id: '6-to-15-years', label: '6–15 years, under 57 kg', minAgeYears: 6, belowAgeYears: 16, belowWeightKg: 57, phases: [zincPhase(25, 3)] }, // 25 mg three times daily
    { id: '1-to-5-years', label: '1–5 years', minAgeYears: 1, belowAgeYears: 6, phases: [zincPhase(25, 2)] }, // 25 mg twice daily; under 1 year contraindicated
  ],
  courses: { default: 1, min: 1, max: 1 },
  restDays: null,
  repeatNote: 'Maintenance; urinary zinc shows adherence (zinc references).',
  monitoring: [{ what: '24-hour urinary copper and urinary zinc', when: { daysAfterEnd: 0 }, sourceIds: ['zinc-wilson', 'wilson-urinary-copper-target'] }],
  modellingChoices: ['The children’s rows are read as printed: the first row that fits age and weight.'],
  sourceIds: ['zinc-wilson'],
};

/** Every regimen, in the order `course --list` shows them. */
export const courseRegimens: readonly CourseRegimen[] = [
  succimer,
  edetate,
  encephalopathy,
  dimercaprolArsenic,
  dimercaprolMercury,
  unithiol,
  penicillamine,
  trientineDihydrochloride,
  trientineTetrahydrochloride,
  zinc,
];

export const courseRegimenIds: readonly string[] = courseRegimens.map((regimen) => regimen.id);

/**
 * The regimen with this id, or undefined.
 * @example findCourseRegimen('succimer-lead')?.populations[0]?.phases.length === 2
 */
export function findCourseRegimen(id: string): CourseRegimen | undefined {
  return courseRegimens.find((regimen) => regimen.id === id);
}
