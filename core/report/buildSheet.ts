import type { IsoDate } from '../dates/isoDate';
import { addMonthsIso, monthKey } from '../dates/isoDate';
import { defaultProductCatalogue, proposePracticalDose, type ProductCatalogue } from '../dosing';
import type { Derivation } from '../formulas/derivation';
import { doseGridProfile } from '../iron/doseGrid';
import { licBand } from '../iron/licBand';
import type { CaseResults } from '../ledger/computeCase';
import type { Case, ChelationPeriod } from '../model/caseFile';
import { monitoringCalendar } from '../monitoring';
import { citeShort, findSource, type Source } from '../references';
import { severities, type Finding } from '../safety/types';
import type { Kilograms, MgPerGDry } from '../units/quantity';
import { displayUnit } from '../units/displayUnit';
import { derivationsOf } from './derivationIndex';
import { describeOrigin } from './describeOrigin';
import { formatNumber, formatPlain, formatReadable } from '../numbers/formatNumber';
import { withUnit } from '../units/displayUnit';
import { ironFlowChart } from './ironFlowChart';
import { licChart, type LicLabelZone } from './licChart';
import { methodAppendix } from './methodAppendix';
import { sheetCaution, type Sheet, type SheetBlock, type SheetColumn, type SheetSection } from './sheet';

export interface SheetInput {
  readonly caseFile: Case;
  /** computeCase(caseFile, asOf) */
  readonly results: CaseResults;
  /** evaluateFindings(caseFile, results, asOf, …): printed as the core returns them, by severity. */
  readonly findings: readonly Finding[];
  /** SHA-256 of the case file's bytes (hex), computed by the host that read the file. */
  readonly caseFileSha256: string;
  /** 'chelation-ledger 0.1.0'. */
  readonly toolVersion: string;
  readonly preparedBy?: string | null;
  /** The local formulary's strengths (default: the catalogue shipped with the tool). */
  readonly productCatalogue?: ProductCatalogue;
  /** Label zones to mark on the LIC chart. */
  readonly labelZones?: readonly LicLabelZone[];
}

/** Width of the charts on the sheet, points: fits A4 and Letter inside 40 pt margins. */
export const sheetChartWidthPt = 500;
/** Months of the account in the iron in/out chart and the transfusion table. */
const flowChartMonths = 36;
const tableMonths = 12;

const fmt = (value: number, decimals = 1) => formatNumber(value, decimals);
const column = (title: string, align: SheetColumn['align'] = 'left', width?: '*'): SheetColumn => ({ title, align, ...(width ? { width } : {}) });

const severityHeading: Readonly<Record<(typeof severities)[number], string>> = {
  urgent: 'URGENT',
  review: 'REVIEW',
  information: 'INFORMATION',
};

const resultKindLabel: Readonly<Record<string, string>> = {
  ferritin: 'ferritin',
  'liver-iron': 'liver iron',
  'cardiac-t2star': 'cardiac T2*',
  creatinine: 'serum creatinine',
  alt: 'ALT',
  neutrophils: 'absolute neutrophil count',
  haemoglobin: 'haemoglobin',
  'blood-lead': 'blood lead',
  'urinary-copper': 'urinary copper',
  platelets: 'platelets',
  ast: 'AST',
  bilirubin: 'bilirubin',
  'urine-protein-creatinine-ratio': 'urine protein-to-creatinine ratio',
  zinc: 'zinc',
  audiology: 'audiology',
  'eye-examination': 'eye examination',
};

function sourceText(ids: readonly string[]): string[] {
  return ids.map((id) => {
    const source = findSource(id);
    return source ? citeShort(source) : id;
  });
}

/** Dose per administration as entered, e.g. '21 mg/kg × 1/day, 7 days/week'. */
function scheduleText(period: ChelationPeriod): string {
  return `${formatPlain(period.dose.value)} ${displayUnit(period.dose.unit)} × ${period.administrationsPerDay}/day, ${period.daysPerWeek} days/week`;
}

/** The catalogue product a period's drug and formulation is given as. */
function productIdOf(period: ChelationPeriod): string {
  switch (period.drug) {
    case 'deferasirox':
      return period.formulation === 'film-coated-tablet' ? 'deferasirox-film-coated' : 'deferasirox-dispersible';
    case 'deferiprone':
      return period.formulation === 'oral-solution' ? 'deferiprone-oral-solution' : 'deferiprone-tablets';
    case 'deferoxamine':
      return 'deferoxamine-vials';
  }
}

function headerOf(input: SheetInput): Sheet['header'] {
  const { results } = input;
  const age = results.patient.ageYears === null ? 'age unknown' : `${Math.floor(results.patient.ageYears)} years`;
  return {
    title: 'Chelation review sheet',
    caseLabel: results.patient.label,
    reviewDate: results.asOf,
    preparedBy: input.preparedBy ?? null,
    toolVersion: input.toolVersion,
    caseFileSha256: input.caseFileSha256,
    patientLine: `${results.patient.label}, ${age}, ${fmt(results.patient.weightKg, 0)} kg, ${results.patient.diagnosisGroup}`,
  };
}

function findingsBlock(findings: readonly Finding[]): SheetBlock {
  const ordered = severities.flatMap((severity) => findings.filter((finding) => finding.severity === severity));
  return {
    kind: 'findings',
    items: ordered.map((finding) => ({
      severity: severityHeading[finding.severity],
      title: finding.title,
      text: finding.text,
      sources: sourceText(finding.sourceIds),
      sourceUncertain: finding.sourceUncertain,
    })),
    emptyText: 'No finding on the review date.',
  };
}

function summarySection(input: SheetInput): SheetSection {
  const { results, caseFile } = input;
  const blocks: SheetBlock[] = [];
  blocks.push({ kind: 'paragraph', style: 'body', text: 'Findings, most urgent first (each with its sources; descriptive, for review by the prescriber):' });
  blocks.push(findingsBlock(input.findings));

  const periodOf = (id: string) => caseFile.chelationPeriods.find((period) => period.id === id);
  const regimenRows = results.currentRegimens.map((regimen) => {
    const period = periodOf(regimen.periodId);
    const meanMgPerKgPerDay = period ? (regimen.doseMgPerKgPerDay * period.daysPerWeek) / 7 : regimen.doseMgPerKgPerDay;
    return [
      period ? `${period.drug} ${period.formulation}` : regimen.label,
      period ? scheduleText(period) : regimen.label,
      fmt(regimen.doseMgPerKgPerDay),
      fmt(meanMgPerKgPerDay),
      fmt(regimen.expectedRemovalMgPerDay),
      fmt(regimen.expectedRemovalMgPerKgPerDay, 2),
    ];
  });
  blocks.push({
    kind: 'table',
    id: 'current-regimen',
    caption: 'Current chelation regimen and its expected removal at the published efficiency',
    columns: [column('drug'), column('dose per administration, schedule'), column('mg/kg per dosing day', 'right'), column('mean mg/kg/day', 'right'), column('expected removal, mg/day', 'right'), column('expected removal, mg/kg/day', 'right')],
    rows: regimenRows,
    emptyText: 'No chelation regimen runs on the review date.',
  });

  const intake = results.intake;
  const body = results.bodyIron;
  const facts: { label: string; value: string }[] = [
    {
      label: `Transfusional iron intake, ${intake.windowFrom} to ${results.asOf} (${intake.windowDays} days)`,
      value: `${fmt(intake.mgPerKgPerDay, 2)} mg/kg/day — ${intake.band} (Brittenham 2011, Table 2); in ${fmt(intake.transfusedMg, 0)} mg, out with removed blood ${fmt(intake.removedWithBloodMg, 0)} mg, net ${fmt(intake.netMg, 0)} mg`,
    },
    { label: `Cumulative net transfusional iron since ${intake.cumulativeSince}`, value: `${fmt(intake.cumulativeNetMg / 1000, 1)} g` },
  ];
  if (body.lastMeasured && body.bodyIronMg !== null && body.licMgPerGDry !== null) {
    facts.push({ label: 'Last measured LIC', value: `${fmt(body.lastMeasured.licMgPerGDry)} mg/g dry on ${body.lastMeasured.date} (${body.lastMeasured.method})` });
    facts.push({
      label: `Estimated LIC on ${results.asOf}`,
      value: `${fmt(body.licMgPerGDry)} mg/g dry — ${licBand(Math.max(0, body.licMgPerGDry) as MgPerGDry).label}; body iron stores ${fmt(body.bodyIronMg / 1000, 2)} g (Angelucci relation, carried forward by the balance)`,
    });
  } else {
    facts.push({ label: 'Body iron and LIC', value: 'no liver iron result on record: no estimate and no projection' });
  }
  const lastT2Star = caseFile.results.filter((it) => it.kind === 'cardiac-t2star' && it.date <= results.asOf).sort((a, b) => a.date.localeCompare(b.date)).at(-1);
  facts.push({
    label: 'Published usual-dose grid (Brittenham 2011, Table 2), as information',
    value: doseGridProfile(intake.mgPerKgPerDay, body.lastMeasured?.licMgPerGDry ?? null, lastT2Star && 'measured' in lastT2Star ? lastT2Star.measured.value : null).statement,
  });
  if (results.ferritin.latest) {
    const trend = results.ferritin.trend;
    facts.push({
      label: 'Ferritin',
      value: `latest ${fmt(results.ferritin.latest.valueUgPerL, 0)} µg/L on ${results.ferritin.latest.date}${trend ? `; ${trend.direction} ${fmt(Math.abs(trend.changePerYear) * 100, 0)} %/year over ${trend.points} results` : ''}${results.ferritin.note ? `. ${results.ferritin.note}` : ''}`,
    });
  }
  blocks.push({ kind: 'facts', rows: facts });

  const caveats = results.responses.flatMap((response) => response.caveatText.map((caveat) => `${response.fromDate} to ${response.toDate}: ${caveat}`));
  blocks.push({
    kind: 'table',
    id: 'measured-response',
    caption: 'Measured against expected chelation removal between LIC results (balance method)',
    columns: [column('interval'), column('LIC, mg/g dry', 'right'), column('intake, mg/kg/day', 'right'), column('removal measured, mg/kg/day', 'right'), column('expected, mg/kg/day', 'right'), column('measured ÷ expected', 'right')],
    rows: results.responses.map((response) => [
      `${response.fromDate} to ${response.toDate} (${response.days} days)`,
      `${fmt(response.fromLicMgPerGDry)} to ${fmt(response.toLicMgPerGDry)}`,
      fmt(response.intakeMgPerKgPerDay, 2),
      fmt(response.measuredChelationMgPerKgPerDay, 2),
      fmt(response.expectedChelationMgPerKgPerDay, 2),
      response.measuredToExpectedRatio === null ? 'no chelation expected' : `${fmt(response.measuredToExpectedRatio * 100, 0)} %`,
    ]),
    emptyText: 'Fewer than two LIC results on record: no measured response.',
    ...(caveats.length > 0 ? { note: caveats.join(' ') } : {}),
  });

  const projection = results.projection;
  if (projection) {
    const milestones = [6, 12, 24].filter((months) => months <= projection.horizonMonths);
    blocks.push({
      kind: 'table',
      id: 'projection',
      caption: `Projected LIC, mg/g dry: central (10th–90th percentile band, ${projection.samples} seeded samples, seed ${projection.seed}); future intake ${fmt(projection.intakeMgPerDay)} mg/day`,
      columns: [column('regimen', 'left', '*'), column('net, mg/kg/day', 'right'), ...milestones.map((months) => ({ ...column(`${months} months`, 'right'), noWrap: true }))],
      rows: projection.scenarios.map((scenario) => [
        `${scenario.name} (${scenario.efficiencyBasis} efficiency)`,
        fmt(scenario.netMgPerKgPerDay, 2),
        ...milestones.map((months) => {
          const month = scenario.months[months]!;
          return `${fmt(month.licMgPerGDry)} (${fmt(month.licP10)}–${fmt(month.licP90)})`;
        }),
      ]),
      emptyText: '',
    });
    const crossings = projection.scenarios.flatMap((scenario) =>
      scenario.crossings
        .filter((crossing) => crossing.monthsAhead !== null)
        .map(
          (crossing) =>
            `${scenario.name}: the projected LIC ${crossing.direction} ${crossing.thresholdMgPerGDry} mg/g dry at about ${crossing.monthsAhead} months (${crossing.date}); band ${crossing.bandEarliestMonths ?? '–'} to ${crossing.bandLatestMonths ?? `beyond ${projection.horizonMonths}`} months.`,
        ),
    );
    blocks.push({
      kind: 'paragraph',
      style: 'note',
      text: crossings.length > 0 ? `Crossings of the LIC thresholds 15, 7 and 3 mg/g dry: ${crossings.join(' ')}` : `No regimen's central projection crosses 15, 7 or 3 mg/g dry within ${projection.horizonMonths} months.`,
    });
    // The label zones each scenario's projection enters, in the projection's own words (core/ledger/projection.ts).
    const zones = projection.scenarios.flatMap((scenario) => scenario.labelZones.map((zone) => `${scenario.name}: ${zone.text}`));
    if (zones.length > 0) blocks.push({ kind: 'paragraph', style: 'note', text: `Label zones: ${zones.join(' ')}` });
  }
  if (results.notices.length > 0) {
    blocks.push({ kind: 'paragraph', style: 'note', text: `Notes: ${results.notices.map((notice) => `${notice.severity === 'review' ? 'review: ' : ''}${notice.text}`).join(' ')}` });
  }
  return { id: 'summary', title: 'Summary', startsOnNewPage: false, blocks };
}

function chartsSection(input: SheetInput): SheetSection {
  const lic = licChart(input.results, { width: sheetChartWidthPt, ...(input.labelZones ? { labelZones: input.labelZones } : {}) });
  const flow = ironFlowChart(input.results, { width: sheetChartWidthPt, lastMonths: flowChartMonths });
  return {
    id: 'charts',
    title: 'Charts',
    startsOnNewPage: true,
    blocks: [
      { kind: 'chart', chart: lic, caption: `${lic.title}. ${lic.description} The plotted values are in the tables and the appendix.` },
      { kind: 'chart', chart: flow, caption: `${flow.title} (the last ${flowChartMonths} months of the account). ${flow.description}` },
    ],
  };
}

function tablesSection(input: SheetInput): SheetSection {
  const { caseFile, results } = input;
  const months = results.months.slice(-tableMonths);
  const countsOf = (month: string) => {
    const entries = caseFile.transfusions.filter((entry) => monthKey(entry.date) === month);
    const volumeIn = entries.reduce((sum, entry) => sum + (entry.kind === 'simple' ? entry.volume.value : entry.kind === 'exchange' ? entry.volumeIn.value : 0), 0);
    const volumeOut = entries.reduce((sum, entry) => sum + (entry.kind === 'simple' ? 0 : entry.volumeRemoved.value), 0);
    return { count: entries.length, volumeIn, volumeOut };
  };
  const monthRows = months.map((month) => ({ month, ...countsOf(month.month) }));
  const sum = (pick: (row: (typeof monthRows)[number]) => number) => monthRows.reduce((total, row) => total + pick(row), 0);
  const blocks: SheetBlock[] = [
    {
      kind: 'table',
      id: 'transfusions-by-month',
      caption: `Transfusions by month, the last ${months.length} months of the account (iron at the unit haematocrit recorded, 1.08 mg per mL of red cells unless overridden)`,
      columns: [column('month'), column('records', 'right'), column('volume in, mL', 'right'), column('volume removed, mL', 'right'), column('iron in, mg', 'right'), column('iron removed with blood, mg', 'right'), column('chelation expected, mg', 'right'), column('net, mg', 'right')],
      rows: monthRows.map((row) => [
        row.month.month,
        String(row.count),
        fmt(row.volumeIn, 0),
        fmt(row.volumeOut, 0),
        fmt(row.month.transfusedInMg, 0),
        fmt(row.month.removedWithBloodMg, 0),
        fmt(row.month.chelationOutMg, 0),
        fmt(row.month.netMg, 0),
      ]),
      totals: [
        'total',
        String(sum((row) => row.count)),
        fmt(sum((row) => row.volumeIn), 0),
        fmt(sum((row) => row.volumeOut), 0),
        fmt(sum((row) => row.month.transfusedInMg), 0),
        fmt(sum((row) => row.month.removedWithBloodMg), 0),
        fmt(sum((row) => row.month.chelationOutMg), 0),
        fmt(sum((row) => row.month.netMg), 0),
      ],
      emptyText: 'No month in the account.',
      note: 'Net = iron in − removed with blood − expected chelation − basal loss.',
    },
  ];

  const since: IsoDate = addMonthsIso(results.asOf, -12);
  const shownResults = caseFile.results
    .filter((entry) => entry.date <= results.asOf && (entry.date > since || entry.kind === 'liver-iron' || entry.kind === 'cardiac-t2star'))
    .slice()
    .sort((a, b) => a.date.localeCompare(b.date) || a.kind.localeCompare(b.kind));
  blocks.push({
    kind: 'table',
    id: 'results',
    caption: `Results: every liver iron and cardiac T2* result, and the others of the 12 months to ${results.asOf}, as entered`,
    columns: [column('date'), column('result'), column('value as entered', 'right'), column('details', 'left', '*')],
    rows: shownResults.map((entry) => [
      entry.date,
      resultKindLabel[entry.kind] ?? entry.kind,
      'measured' in entry
        ? entry.measured.unitAsTyped !== undefined
          ? `${formatPlain(entry.measured.value)} ${entry.measured.unitAsTyped}`
          : withUnit(formatPlain(entry.measured.value), entry.measured.unit)
        : entry.outcome,
      [
        'method' in entry ? `method ${entry.method}` : '',
        'fieldStrengthT' in entry ? `${entry.fieldStrengthT} T` : '',
        'calibrationId' in entry ? `calibration ${entry.calibrationId}` : '',
      ]
        .filter((it) => it !== '')
        .join(', '),
    ]),
    emptyText: 'No result on record.',
  });

  blocks.push({
    kind: 'table',
    id: 'chelation-periods',
    caption: 'Chelation periods on record',
    columns: [column('period'), column('drug, formulation, route'), column('dose, schedule'), column('from'), column('to'), column('adherence', 'right')],
    rows: caseFile.chelationPeriods.map((period) => [
      period.id,
      `${period.drug} ${period.formulation}, ${period.route}`,
      scheduleText(period),
      period.startDate,
      period.endDate ?? 'ongoing',
      formatPlain(period.adherence),
    ]),
    emptyText: 'No chelation period on record.',
  });

  const catalogue = input.productCatalogue ?? defaultProductCatalogue;
  const doseRows: string[][] = [];
  const notes: string[] = [];
  const regimens: { name: string; periods: readonly ChelationPeriod[] }[] = [
    { name: 'current', periods: caseFile.chelationPeriods.filter((period) => results.currentRegimens.some((regimen) => regimen.periodId === period.id)) },
    ...caseFile.proposedRegimens.map((regimen) => ({ name: regimen.name, periods: regimen.periods })),
  ];
  for (const regimen of regimens) {
    for (const period of regimen.periods) {
      const product = catalogue.find((it) => it.id === productIdOf(period));
      if (!product) {
        notes.push(`${regimen.name}: no product ${productIdOf(period)} in the catalogue.`);
        continue;
      }
      const proposal = proposePracticalDose({
        product,
        target:
          period.dose.unit === 'mg/kg'
            ? period.drug === 'deferoxamine'
              ? { kind: 'per-kg-per-administration', mgPerKgPerAdministration: period.dose.value }
              : { kind: 'per-kg-per-day', mgPerKgPerDay: period.dose.value * period.administrationsPerDay }
            : { kind: 'per-kg-per-day', mgPerKgPerDay: (period.dose.value * period.administrationsPerDay) / results.patient.weightKg },
        weightKg: results.patient.weightKg as Kilograms,
        administrationsPerDay: period.administrationsPerDay,
      });
      if (!proposal.ok) {
        notes.push(`${regimen.name}, ${period.drug}: ${proposal.issues.map((it) => it.message).join(' ')}`);
        continue;
      }
      const value = proposal.value;
      doseRows.push([
        regimen.name,
        value.productName,
        `${fmt(value.intendedMgPerAdministration, 0)} mg`,
        value.combinationText,
        `${fmt(value.proposedMgPerAdministration, 0)} mg (${fmt(value.proposedMgPerKgPerDay, 2)} mg/kg/day)`,
        `${value.differencePercent >= 0 ? '+' : ''}${fmt(value.differencePercent, 1)} %`,
      ]);
      for (const sourceNote of sourceText(value.sourceIds)) if (!notes.includes(sourceNote)) notes.push(sourceNote);
    }
  }
  blocks.push({
    kind: 'table',
    id: 'practical-doses',
    caption: `Nearest practical amounts per administration from the shelf strengths, at ${fmt(results.patient.weightKg, 0)} kg (for review by the prescriber; strengths to be checked against the local formulary)`,
    columns: [column('regimen'), column('product'), column('intended', 'right'), column('from the strengths'), column('amount (mg/kg/day)', 'right'), column('difference', 'right')],
    rows: doseRows,
    emptyText: 'No regimen to express in shelf strengths.',
    ...(notes.length > 0 ? { note: `Strengths: ${notes.join('; ')}` } : {}),
  });

  const monitoring = monitoringCalendar(caseFile, results.asOf);
  blocks.push({
    kind: 'table',
    id: 'monitoring',
    caption: `Monitoring due as of ${results.asOf} for the regimens on record`,
    columns: [column('what'), column('interval'), column('last on record'), column('due'), column('status'), column('source', 'left', '*')],
    rows: monitoring.ok
      ? monitoring.value.items.map((item) => [
          item.what,
          item.intervalText,
          item.lastDate ?? 'none on record',
          item.dueDate,
          item.status === 'overdue' ? `OVERDUE (${item.daysOverdue} days)` : item.status === 'due-now' ? 'due now' : 'upcoming',
          sourceText(item.sourceIds).join('; '),
        ])
      : [],
    emptyText: monitoring.ok ? 'No monitoring rule applies on the review date.' : monitoring.issues.map((it) => it.message).join(' '),
    ...(monitoring.ok && monitoring.value.notApplicable.length > 0
      ? { note: `Not applicable on this date: ${monitoring.value.notApplicable.map((it) => `${it.what} (${it.reason})`).join('; ')}.` }
      : {}),
  });
  return { id: 'tables', title: 'Record tables', startsOnNewPage: true, blocks };
}

function valueText(entry: { readonly value: number | string; readonly unit: string }): string {
  return withUnit(typeof entry.value === 'number' ? formatReadable(entry.value) : entry.value, entry.unit);
}

/** 'intake, body-iron, projection (9), response (2)': result ids grouped by their kind, so a long list stays short. */
function usedByText(ids: readonly string[]): string {
  const counts = new Map<string, number>();
  for (const id of ids) {
    const kind = id.split(':')[0]!;
    counts.set(kind, (counts.get(kind) ?? 0) + 1);
  }
  return [...counts.entries()].map(([kind, count]) => (count === 1 ? ids.find((id) => id.split(':')[0] === kind)! : `${kind} (${count})`)).join(', ');
}

function fullCitation(source: Source): string {
  const year = source.year === null ? '' : ` (${source.year})`;
  return `${citeShort(source)}. ${source.title}${year}.`;
}

function appendixSection(input: SheetInput): SheetSection {
  const named = derivationsOf(input.results, input.findings);
  const appendix = methodAppendix(named);
  const blocks: SheetBlock[] = [
    {
      kind: 'paragraph',
      style: 'body',
      text: 'Every formula behind the numbers of this sheet, with its expression and sources, then the inputs each result used for this case, then every published assumption with its value and whether it was overridden. A reader can recompute each result by hand from these lines.',
    },
  ];
  for (const formula of appendix.formulas) {
    blocks.push({ kind: 'paragraph', style: 'body', text: `${formula.title} [${formula.formulaId}]: ${formula.expression}` });
    blocks.push({
      kind: 'paragraph',
      style: 'small',
      text: [...formula.notes, `Sources: ${formula.sources.map(fullCitation).join(' ')}`, `Used by: ${usedByText(formula.usedBy)}.`].join(' '),
    });
  }
  // Each distinct derivation is printed once, numbered D1, D2, …; a result that reuses one
  // (every projection starts from the same body iron) refers to its number.
  const numbers = new Map<string, string>();
  const derivationTables: SheetBlock[] = [];
  const number = (derivation: Derivation, usedFor: string): string => {
    const key = JSON.stringify(derivation);
    const known = numbers.get(key);
    if (known) return known;
    const computedInputs = derivation.inputs.map((input) => (input.origin.kind === 'computed' ? number(input.origin.derivation, usedFor) : null));
    const id = `D${numbers.size + 1}`;
    numbers.set(key, id);
    derivationTables.push({
      kind: 'table',
      id: `derivation-${id}`,
      caption: `${id}. ${derivation.title} [${derivation.formulaId}], for ${usedFor}`,
      columns: [column('quantity'), column('value', 'right'), column('origin', 'left', '*')],
      rows: [
        ...derivation.inputs.map((input, index) => [input.label, valueText(input), computedInputs[index] ? `computed: ${computedInputs[index]}` : describeOrigin(input.origin)]),
        ...derivation.outputs.map((output) => [`result: ${output.label}`, valueText(output), `${derivation.formulaId}`]),
      ],
      emptyText: '',
    });
    return id;
  };
  for (const { label, derivation } of named) number(derivation, label);
  blocks.push({
    kind: 'paragraph',
    style: 'body',
    text: `Inputs and results of each formula for this case, six significant figures; ${numbers.size} distinct derivations, each printed once and referred to by its number.`,
  });
  blocks.push(...derivationTables);
  const assumptionLabel = new Map(input.results.assumptions.map((it) => [it.id, it]));
  blocks.push({
    kind: 'table',
    id: 'assumptions',
    caption: 'Assumptions used, with their values',
    columns: [column('assumption', 'left', '*'), column('value', 'right'), column('status'), column('used by')],
    rows: appendix.assumptions.map((use) => {
      const resolved = assumptionLabel.get(use.assumptionId);
      return [
        resolved ? `${resolved.label} [${use.assumptionId}]` : use.assumptionId,
        resolved ? withUnit(formatPlain(use.value), resolved.unit) : formatPlain(use.value),
        use.overridden ? `OVERRIDDEN${use.by ? ` by ${use.by}` : ''}: ${use.reason ?? 'no reason given'}` : 'published default',
        usedByText(use.usedBy),
      ];
    }),
    emptyText: 'No assumption was used.',
  });
  return { id: 'method-appendix', title: 'Method appendix', startsOnNewPage: true, blocks };
}

/**
 * The review sheet of one case as pure data: header (case label, review date,
 * prepared by, tool version, the case file's content hash), the caution for
 * every page, the summary (findings, regimen, intake, body iron and LIC,
 * measured against expected removal, projections with bands and crossings),
 * the charts, the record tables (transfusions by month, results, chelation
 * periods, practical doses, monitoring due), the method appendix and the
 * sign-off block. Every number is written with the formatter `compute`
 * prints with, so the sheet and the command line agree digit for digit.
 *
 * @param input - the case, its results and findings on one review date, the content hash and tool version
 * @returns the sheet; the same input gives the same sheet
 * @example buildSheet({ caseFile, results, findings, caseFileSha256, toolVersion: 'chelation-ledger 0.1.0' }).sections[0].id === 'summary'
 */
export function buildSheet(input: SheetInput): Sheet {
  const signOff = input.caseFile.review.signOff;
  return {
    header: headerOf(input),
    caution: sheetCaution,
    sections: [summarySection(input), chartsSection(input), tablesSection(input), appendixSection(input)],
    signOff: {
      reviewedBy: signOff?.reviewer ?? null,
      date: signOff?.date ?? null,
      comments: signOff?.text ?? null,
      notes: input.caseFile.review.notes.map((note) => `${note.date}, ${note.by}: ${note.text}`),
      prescriberFields: ['Prescriber (name)', 'Signature', 'Date', 'Decision and comments'],
    },
  };
}
