import { courseCaution, courseDrug, type CoursePlan } from '../courses';
import { citeShort, findSource } from '../references';
import { formatNumber } from '../numbers/formatNumber';
import { sheetCaution, type Sheet, type SheetBlock } from './sheet';

/** What the host adds to a planned course to print it. */
export interface CourseSheetInput {
  readonly plan: CoursePlan;
  /** The patient's code as the ward writes it (PB-2204). */
  readonly label: string;
  readonly toolVersion: string;
  readonly preparedBy: string | null;
  /** SHA-256 of the plan as printed by `course --json`, computed by the host (core has no hashing). */
  readonly planSha256: string;
}

const mgText = (value: number) => `${formatNumber(value, 1)} mg`;
const when = (at: { readonly localDate: string; readonly localTime: string; readonly utcOffset: string }) => `${at.localDate} ${at.localTime} (UTC${at.utcOffset})`;
const cite = (id: string) => {
  const source = findSource(id);
  return source ? citeShort(source) : id;
};

/**
 * A planned heavy-metal course as a sheet (the review sheet's data model, so the
 * one PDF writer prints it): summary, phases with dose basis and caps, totals,
 * the timed schedule on the ward's clock, monitoring, the stoichiometric ceiling
 * beside pM, frame, cautions, modelling choices, sources and a sign-off for the
 * prescriber, the toxicologist and the pharmacist. The course caution is printed
 * with the sheet's caution on every page.
 *
 * @param input - the plan (core/courses planCourse), the patient's code, tool version, author, the plan's hash
 * @returns the sheet; the same input gives the same sheet
 * @example buildCourseSheet({ plan: PB-2204's succimer plan, label: 'PB-2204', … }).sections.map((it) => it.id)
 *   → ['course', 'phases', 'schedule', 'monitoring', 'binding', 'notes']
 */
export function buildCourseSheet(input: CourseSheetInput): Sheet {
  const { plan } = input;
  const patient = plan.patient;
  const patientLine = [
    input.label,
    patient.ageYears !== null ? `${patient.ageYears} years` : null,
    `${patient.weightKg} kg`,
    patient.heightCm !== null ? `${patient.heightCm} cm` : null,
    patient.bsaM2 !== null ? `BSA ${formatNumber(patient.bsaM2, 3)} m² (Mosteller)` : null,
  ]
    .filter((it) => it !== null)
    .join(' · ');
  const facts = [
    { label: 'Regimen', value: `${plan.regimenId}: ${plan.title}` },
    { label: 'Dose group', value: plan.population },
    { label: 'First administration', value: `${when(plan.start)}, ${plan.timeZone}` },
    ...(plan.bloodLead ? [{ label: 'Blood lead', value: `${formatNumber(plan.bloodLead.ugPerDl, 1)} µg/dL = ${formatNumber(plan.bloodLead.umolPerL, 2)} µmol/L` }] : []),
    ...(plan.urinaryCopper ? [{ label: '24-hour urinary copper', value: `${formatNumber(plan.urinaryCopper.ugPer24h, 0)} µg/24 h = ${formatNumber(plan.urinaryCopper.umolPer24h, 2)} µmol/24 h` }] : []),
    ...(plan.renalSchedule ? [{ label: 'Renal schedule', value: plan.renalSchedule }] : []),
    ...plan.courses.map((course) => ({
      label: `Course ${course.course}`,
      value: `${when(course.first)} to ${when(course.last)}: ${course.totalsMg.map((it) => `${courseDrug(it.drug).label} ${mgText(it.mg)} in ${it.administrations} administrations`).join('; ')}`,
    })),
    ...(plan.restDays.length > 0 ? [{ label: 'Rest days', value: plan.restDays.join(', ') }] : []),
    ...plan.dailyChecks.map((check) => ({
      label: 'Daily dose check',
      value: `${courseDrug(check.drug).label}: at most ${mgText(check.largestMgIn24h)} in any 24 hours against ${mgText(check.limitMg)} (${check.withinLimit ? 'within' : 'EXCEEDED'})`,
    })),
    {
      label: 'Clock',
      value:
        plan.offsetChanges.length === 0
          ? 'no daylight-saving change during the plan'
          : plan.offsetChanges.map((it) => `${it.localDate}: UTC${it.offsetBefore} to UTC${it.offsetAfter}`).join('; '),
    },
  ];
  const summary: SheetBlock[] = [
    { kind: 'paragraph', style: 'caution', text: courseCaution },
    { kind: 'facts', rows: facts },
    { kind: 'paragraph', style: 'note', text: plan.timeRule },
    ...(plan.trientineSwitch
      ? [
          {
            kind: 'paragraph' as const,
            style: 'body' as const,
            text: `Trientine switch: today ${plan.trientineSwitch.currentDailyMg} mg/day of ${plan.trientineSwitch.fromProductId} (${plan.trientineSwitch.currentDailyBasis}) = ${formatNumber(plan.trientineSwitch.currentDailyBaseMg, 1)} mg trientine base/day; on ${plan.trientineSwitch.toProductId} (${plan.trientineSwitch.equivalentDailyBasis}) ${formatNumber(plan.trientineSwitch.equivalentDailyMg, 1)} mg/day. ${plan.trientineSwitch.notes.join(' ')}`,
          },
        ]
      : []),
    ...plan.warnings.map((it) => ({ kind: 'paragraph' as const, style: 'caution' as const, text: it.message })),
  ];
  const phaseRows = plan.phases.map((phase) => [
    String(phase.course),
    `${phase.drugLabel}, ${phase.route}`,
    phase.label,
    mgText(phase.dosePerAdministrationMg),
    String(phase.administrations),
    when(phase.first),
    when(phase.last),
    mgText(phase.totalMg),
  ]);
  const basisNotes = plan.phases.map(
    (phase) =>
      `Course ${phase.course}, ${phase.drugLabel} (${phase.label}): ${phase.doseBasis}; dosed as ${phase.dosedAs}${phase.capApplied ? `; cap applied: ${phase.capApplied}` : ''}${phase.alternatives.length > 0 ? `; other published bases: ${phase.alternatives.map((it) => `${it.basis} ${mgText(it.mg)}`).join(', ')}` : ''}${phase.maxMgPer24h !== null ? `; at most ${mgText(phase.maxMgPer24h)} in 24 h` : ''}.`,
  );
  return {
    header: {
      title: 'Heavy-metal course plan',
      caseLabel: input.label,
      reviewDate: plan.start.localDate,
      dateLabel: 'First day',
      preparedBy: input.preparedBy,
      toolVersion: input.toolVersion,
      caseFileSha256: input.planSha256,
      hashLabel: 'plan SHA-256',
      patientLine,
    },
    caution: sheetCaution,
    sections: [
      { id: 'course', title: 'Course', startsOnNewPage: false, blocks: summary },
      {
        id: 'phases',
        title: 'Phases: dose per administration, count, first and last',
        startsOnNewPage: false,
        blocks: [
          {
            kind: 'table',
            id: 'phases',
            caption: 'Each phase of each course',
            columns: [
              { title: 'Course', align: 'right' },
              { title: 'Drug, route', align: 'left' },
              { title: 'Schedule', align: 'left', width: '*' },
              { title: 'Dose', align: 'right', noWrap: true },
              { title: 'Count', align: 'right' },
              { title: 'First', align: 'left', noWrap: true },
              { title: 'Last', align: 'left', noWrap: true },
              { title: 'Total', align: 'right', noWrap: true },
            ],
            rows: phaseRows,
            emptyText: 'No phase.',
          },
          ...basisNotes.map((text) => ({ kind: 'paragraph' as const, style: 'small' as const, text })),
        ],
      },
      {
        id: 'schedule',
        title: 'Schedule on the ward clock',
        startsOnNewPage: true,
        blocks: [
          {
            kind: 'table',
            id: 'schedule',
            caption: `Every planned administration, ${plan.timeZone}`,
            columns: [
              { title: 'Date', align: 'left', noWrap: true },
              { title: 'Time', align: 'left', noWrap: true },
              { title: 'UTC offset', align: 'left', noWrap: true },
              { title: 'Course', align: 'right' },
              { title: 'Drug', align: 'left', width: '*' },
              { title: 'Dose', align: 'right', noWrap: true },
              { title: 'Phase, number', align: 'left' },
            ],
            rows: plan.administrations.map((item) => [item.at.localDate, item.at.localTime, item.at.utcOffset, String(item.course), courseDrug(item.drug).label, mgText(item.doseMg), `${item.phaseId} ${item.number}`]),
            totals: ['', '', '', '', 'all', plan.totalsMg.map((it) => mgText(it.mg)).join(' + '), `${plan.administrations.length} administrations`],
            emptyText: 'No administration.',
          },
        ],
      },
      {
        id: 'monitoring',
        title: 'Monitoring due',
        startsOnNewPage: false,
        blocks: [
          {
            kind: 'table',
            id: 'monitoring',
            caption: 'Due dates from the plan',
            columns: [
              { title: 'Due', align: 'left', noWrap: true },
              { title: 'What', align: 'left', width: '*' },
              { title: 'Source', align: 'left' },
            ],
            rows: plan.monitoring.map((it) => [it.dueDate, it.what, it.sourceIds.map((id) => findSource(id)?.title.split(':')[0] ?? id).join('; ')]),
            emptyText: 'No monitoring listed.',
          },
        ],
      },
      {
        id: 'binding',
        title: 'Metal bound per administration beside pM',
        startsOnNewPage: false,
        blocks: [
          {
            kind: 'table',
            id: 'binding',
            caption: 'Stoichiometric ceiling (an upper bound, never the expected removal) and pM at pH 7.4 where constants exist',
            columns: [
              { title: 'Drug', align: 'left' },
              { title: 'Dose', align: 'right', noWrap: true },
              { title: 'Metal at most', align: 'right', noWrap: true },
              { title: 'pM', align: 'left', width: '*' },
            ],
            rows: plan.binding.map((row) => [
              row.drugLabel,
              mgText(row.doseMg),
              row.stoichiometricCeilingMg === null ? '—' : `${mgText(row.stoichiometricCeilingMg)} ${row.metal}`,
              row.pm && row.pm.pM !== undefined ? `${formatNumber(row.pm.pM, 1)} (${row.pm.basis}, ${row.pm.setId})` : row.pmNote,
            ]),
            emptyText: 'No chelator in the plan.',
            note: 'Ratios of chelator to metal are from memory; see the sources.',
          },
        ],
      },
      {
        id: 'notes',
        title: 'Frame, cautions, modelling choices and sources',
        startsOnNewPage: false,
        blocks: [
          ...plan.frame.map((text) => ({ kind: 'paragraph' as const, style: 'body' as const, text })),
          ...plan.cautions.map((text) => ({ kind: 'paragraph' as const, style: 'caution' as const, text })),
          { kind: 'paragraph', style: 'body', text: `Further courses: ${plan.repeatNote}` },
          ...plan.modellingChoices.map((text) => ({ kind: 'paragraph' as const, style: 'note' as const, text: `Modelling choice: ${text}` })),
          ...plan.sourceIds.map((id) => ({ kind: 'paragraph' as const, style: 'small' as const, text: cite(id) })),
        ],
      },
    ],
    signOff: {
      reviewedBy: null,
      date: null,
      comments: null,
      notes: [],
      prescriberFields: ['Prescriber', 'Toxicologist', 'Pharmacist'],
    },
  };
}
