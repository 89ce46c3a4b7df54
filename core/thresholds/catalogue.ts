import { chelatorCatalogue, type ChelatorId } from '../chelators/catalogue';
import { findSource } from '../references';
import { fail, issue, ok, type Issue, type Result } from '../result';

/**
 * A number a safety rule compares against: its published value, unit and
 * source. A local protocol may set it differently (see {@link ThresholdOverride}).
 */
export interface Threshold {
  /** Stable kebab-case id; the key of an override. */
  readonly id: string;
  readonly label: string;
  readonly value: number;
  /** UCUM code, or '%', 'd', 'mo'. */
  readonly unit: string;
  readonly sourceIds: readonly string[];
  /** Plausible range of an override, inclusive: a local protocol outside it is a typing error. */
  readonly overrideMin: number;
  readonly overrideMax: number;
}

/** A local protocol's value for a threshold, with who set it and why. */
export interface ThresholdOverride {
  readonly value: number;
  readonly reason: string;
  readonly by: string;
}

export type ThresholdOverrides = Readonly<Record<string, ThresholdOverride>>;

/** A threshold as a finding used it: the value applied, the published value, and the override if any. */
export interface AppliedThreshold {
  readonly id: string;
  readonly label: string;
  readonly value: number;
  readonly unit: string;
  readonly publishedValue: number;
  readonly overridden: boolean;
  readonly reason?: string;
  readonly by?: string;
  readonly sourceIds: readonly string[];
}

// Fixed thresholds, each beside its source (references.md §2–§4).
const fixedThresholds = [
  // US deferasirox label: contraindicated below eGFR 40 mL/min/1.73 m² (references.md §4, secondary).
  { id: 'deferasirox-egfr-lower', label: 'deferasirox eGFR threshold (US label)', value: 40, unit: 'mL/min/{1.73_m2}', sourceIds: ['deferasirox-label-us'], overrideMin: 10, overrideMax: 90 },
  // US deferasirox label: starting dose halved at eGFR 40–60 (references.md §4, secondary).
  { id: 'deferasirox-egfr-reduced-band-upper', label: 'upper end of the deferasirox reduced-start eGFR band (US label)', value: 60, unit: 'mL/min/{1.73_m2}', sourceIds: ['deferasirox-label-us'], overrideMin: 20, overrideMax: 120 },
  // EU deferasirox text: CrCl < 60 mL/min (references.md §4, from memory).
  { id: 'deferasirox-crcl-lower', label: 'deferasirox creatinine clearance threshold (EU, from memory)', value: 60, unit: 'mL/min', sourceIds: ['deferasirox-smpc-eu'], overrideMin: 10, overrideMax: 120 },
  // US deferasirox label: creatinine more than 33 % above baseline on two consecutive results (references.md §4, secondary).
  { id: 'deferasirox-creatinine-rise', label: 'creatinine rise over baseline on deferasirox', value: 33, unit: '%', sourceIds: ['deferasirox-label-us', 'deferasirox-creatinine-baseline'], overrideMin: 5, overrideMax: 200 },
  // Transaminase upper limit of normal when the result carries no laboratory range: an assumption (laboratories differ), from memory.
  { id: 'alt-upper-limit-of-normal', label: 'transaminase upper limit of normal when the laboratory gives none (assumed)', value: 40, unit: 'U/L', sourceIds: ['alt-uln-memory'], overrideMin: 10, overrideMax: 100 },
  // 5 × ULN is a study protocol's cut-off, not a label value (references.md §9): a local-protocol option only.
  { id: 'alt-multiple-of-uln', label: 'local-protocol multiple of the upper limit of normal (a study protocol’s cut-off; the labels give none)', value: 5, unit: '1', sourceIds: ['alt-uln-memory', 'deferasirox-label-us'], overrideMin: 1, overrideMax: 20 },
  // Ferritin consistently below 500 µg/L on deferasirox or deferiprone (labels, references.md §4, secondary).
  { id: 'ferritin-low', label: 'low ferritin on deferasirox or deferiprone', value: 500, unit: 'ug/L', sourceIds: ['low-iron-interruption-labels'], overrideMin: 50, overrideMax: 2000 },
  // LIC below 3 mg/g dry (US deferasirox label; LIC bands of Olivieri & Brittenham 1997 put 3–7 as the target).
  { id: 'lic-low', label: 'low liver iron on deferasirox or deferiprone', value: 3, unit: 'mg/g{dry}', sourceIds: ['low-iron-interruption-labels', 'olivieri-brittenham-1997'], overrideMin: 0.5, overrideMax: 7 },
  // Deferiprone ANC bands, US label 2025 (references.md §4, confirmed).
  { id: 'deferiprone-anc-neutropenia', label: 'deferiprone ANC interruption threshold (neutropenia below)', value: 1.5, unit: '10*9/L', sourceIds: ['deferiprone-label-us-2025'], overrideMin: 0.5, overrideMax: 3 },
  { id: 'deferiprone-anc-severe', label: 'severe neutropenia below', value: 0.5, unit: '10*9/L', sourceIds: ['deferiprone-label-us-2025'], overrideMin: 0.1, overrideMax: 1.5 },
  { id: 'deferiprone-anc-agranulocytosis', label: 'agranulocytosis below (US label 2025; older and EU texts 0.5)', value: 0.2, unit: '10*9/L', sourceIds: ['deferiprone-label-us-2025'], overrideMin: 0.05, overrideMax: 0.5 },
  // A local protocol's fixed ANC interval on deferiprone ("weekly throughout", the older texts). Not applied unless
  // overridden: by default the 2025 US label's schedule by time on the drug applies (core/monitoring, references.md §9).
  { id: 'deferiprone-anc-interval', label: 'local-protocol fixed interval of ANC checks on deferiprone (weekly throughout in the older texts)', value: 7, unit: 'd', sourceIds: ['deferiprone-label-us-2025'], overrideMin: 1, overrideMax: 92 },
  // Deferasirox: creatinine (and ALT) monthly (references.md §4); a calendar month is at most 31 days.
  { id: 'deferasirox-monthly-test-interval', label: 'days since the last creatinine or ALT on deferasirox', value: 31, unit: 'd', sourceIds: ['deferasirox-label-us'], overrideMin: 7, overrideMax: 184 },
  // Liver iron about yearly on chelation (from memory).
  { id: 'lic-interval', label: 'months since the last liver iron result', value: 12, unit: 'mo', sourceIds: ['mri-monitoring-interval-memory'], overrideMin: 3, overrideMax: 60 },
  // Cardiac T2* every 12–24 months in thalassaemia major (from memory).
  { id: 'cardiac-t2star-interval-short', label: 'months since the last cardiac T2* (information)', value: 12, unit: 'mo', sourceIds: ['mri-monitoring-interval-memory'], overrideMin: 3, overrideMax: 60 },
  { id: 'cardiac-t2star-interval-long', label: 'months since the last cardiac T2* (review)', value: 24, unit: 'mo', sourceIds: ['mri-monitoring-interval-memory'], overrideMin: 6, overrideMax: 120 },
  // Cardiac T2* bands at 1.5 T: < 10 ms severe (Kirk 2009), ≤ 20 ms heart iron (Anderson 2001); references.md §2, confirmed.
  { id: 'cardiac-t2star-severe', label: 'cardiac T2* severe heart iron below', value: 10, unit: 'ms', sourceIds: ['kirk-2009'], overrideMin: 4, overrideMax: 20 },
  { id: 'cardiac-t2star-iron', label: 'cardiac T2* heart iron at or below', value: 20, unit: 'ms', sourceIds: ['anderson-2001'], overrideMin: 10, overrideMax: 40 },
  // Porter et al., Br J Haematol 1989;73:403: a therapeutic index greater than 0.025 (confirmed).
  { id: 'deferoxamine-therapeutic-index', label: 'deferoxamine therapeutic index', value: 0.025, unit: '(mg/kg/d)/(ug/L)', sourceIds: ['porter-1989', 'common-practice'], overrideMin: 0.005, overrideMax: 0.1 },
  // Under 18 years is treated as growing: common practice.
  { id: 'growing-until-age', label: 'age until which a child is treated as growing', value: 18, unit: 'a', sourceIds: ['deferoxamine-label', 'common-practice'], overrideMin: 10, overrideMax: 25 },
  // Ascorbic acid with deferoxamine: up to 200 mg/day in adults (older US deferoxamine label, references.md §9, confirmed).
  { id: 'ascorbic-acid-daily-cap', label: 'ascorbic acid daily cap, adults', value: 200, unit: 'mg/d', sourceIds: ['deferoxamine-label-interactions'], overrideMin: 25, overrideMax: 1000 },
  // Older US deferoxamine label, vitamin C: about 50 mg/day under 10 years, 100 mg/day in older children (references.md §9, confirmed).
  { id: 'ascorbic-acid-daily-cap-under-10', label: 'ascorbic acid daily amount, children under 10 years', value: 50, unit: 'mg/d', sourceIds: ['deferoxamine-label-interactions'], overrideMin: 10, overrideMax: 500 },
  { id: 'ascorbic-acid-daily-cap-older-child', label: 'ascorbic acid daily amount, older children', value: 100, unit: 'mg/d', sourceIds: ['deferoxamine-label-interactions'], overrideMin: 10, overrideMax: 500 },
  // A daily dose more than this multiple of the labelled daily maximum is urgent: likely a daily dose typed per
  // administration (75 mg/kg three times a day). A modelling choice of ours (dose-far-above-maximum-choice).
  { id: 'dose-far-above-maximum-multiple', label: 'multiple of the labelled daily maximum above which a dose is urgent', value: 1.5, unit: '1', sourceIds: ['dose-far-above-maximum-choice'], overrideMin: 1.05, overrideMax: 5 },
] as const satisfies readonly Threshold[];

/** Dose-range thresholds from the chelator catalogue (core/chelators/catalogue.ts carries their sources). */
function doseThresholds(): Threshold[] {
  return chelatorCatalogue.flatMap((entry) => {
    const dose = entry.dose;
    const list: Threshold[] = [];
    if (dose.minMgPerKgPerDay !== null) {
      list.push({ id: `dose-min-${entry.id}`, label: `${entry.label}: lower end of the published range`, value: dose.minMgPerKgPerDay, unit: 'mg/kg/d', sourceIds: dose.sourceIds, overrideMin: 1, overrideMax: 200 });
    }
    list.push({ id: `dose-max-${entry.id}`, label: `${entry.label}: upper end of the published range`, value: dose.maxMgPerKgPerDay, unit: 'mg/kg/d', sourceIds: dose.sourceIds, overrideMin: 1, overrideMax: 200 });
    if ('growingMaxMgPerKgPerDay' in dose) {
      list.push({ id: `dose-growing-max-${entry.id}`, label: `${entry.label}: limit while growing`, value: dose.growingMaxMgPerKgPerDay, unit: 'mg/kg/d', sourceIds: dose.sourceIds, overrideMin: 1, overrideMax: 200 });
    }
    if ('intravenousMaxMgPerKgPerHour' in dose) {
      list.push({ id: `dose-iv-rate-max-${entry.id}`, label: `${entry.label}: intravenous rate limit`, value: dose.intravenousMaxMgPerKgPerHour, unit: 'mg/kg/h', sourceIds: dose.sourceIds, overrideMin: 1, overrideMax: 50 });
    }
    return list;
  });
}

/** Every threshold the safety rules use, by id. */
export const thresholdCatalogue: readonly Threshold[] = [...fixedThresholds, ...doseThresholds()];

export type FixedThresholdId = (typeof fixedThresholds)[number]['id'];
export type DoseThresholdKind = 'dose-min' | 'dose-max' | 'dose-growing-max' | 'dose-iv-rate-max';

const byId = new Map(thresholdCatalogue.map((threshold) => [threshold.id, threshold]));

/** The dose threshold of one kind for a catalogued product, or undefined where the source gives none. */
export function doseThresholdId(kind: DoseThresholdKind, chelatorId: ChelatorId): string | undefined {
  const id = `${kind}-${chelatorId}`;
  return byId.has(id) ? id : undefined;
}

/**
 * Check a local protocol's overrides: each id must name a catalogued
 * threshold, the value must be a number in the threshold's plausible range,
 * and the reason and the person must be given.
 *
 * @param overrides - by threshold id; not changed
 * @returns the same overrides, or an issue per problem naming the id, the value and the accepted range
 * @example checkThresholdOverrides({ 'deferasirox-egfr-lower': { value: 45, reason: 'local renal protocol', by: 'Pharmacist AB' } }).ok === true
 */
export function checkThresholdOverrides(overrides: ThresholdOverrides): Result<ThresholdOverrides> {
  const issues: Issue[] = [];
  for (const [id, override] of Object.entries(overrides)) {
    const threshold = byId.get(id);
    if (!threshold) {
      issues.push(issue('unknown_option', ['thresholds', id], `Threshold "${id}" is not catalogued; the safety thresholds are ${[...byId.keys()].join(', ')}.`));
      continue;
    }
    if (typeof override.value !== 'number' || !Number.isFinite(override.value) || override.value < threshold.overrideMin || override.value > threshold.overrideMax) {
      issues.push(issue('out_of_range', ['thresholds', id, 'value'], `Override of ${threshold.label} ${String(override.value)} ${threshold.unit} is outside the plausible range ${threshold.overrideMin}–${threshold.overrideMax} ${threshold.unit}.`));
    }
    if (override.reason.trim() === '') issues.push(issue('required', ['thresholds', id, 'reason'], `Override of ${threshold.label}: give the reason (the local protocol).`));
    if (override.by.trim() === '') issues.push(issue('required', ['thresholds', id, 'by'], `Override of ${threshold.label}: give who set it.`));
  }
  return issues.length > 0 ? fail(...issues) : ok(overrides);
}

/**
 * The threshold a rule applies: the published value, or the local protocol's
 * override with its reason and author.
 *
 * @param id - a catalogued threshold id
 * @param overrides - checked overrides (see {@link checkThresholdOverrides})
 * @returns the applied threshold, in the threshold's unit
 * @example applyThreshold('deferasirox-egfr-lower', {}).value === 40
 */
export function applyThreshold(id: string, overrides: ThresholdOverrides): AppliedThreshold {
  const threshold = byId.get(id);
  if (!threshold) throw new Error(`Unknown safety threshold ${id}`);
  const override = overrides[id];
  const base = { id, label: threshold.label, unit: threshold.unit, publishedValue: threshold.value, sourceIds: threshold.sourceIds };
  return override
    ? { ...base, value: override.value, overridden: true, reason: override.reason, by: override.by }
    : { ...base, value: threshold.value, overridden: false };
}

/**
 * The threshold as a sentence fragment: "the labelled threshold of 40", or,
 * when a local protocol overrides it, "the local threshold of 45 (published 40;
 * local renal protocol, Pharmacist AB)".
 *
 * @param threshold - as applied
 * @param published - how the published value is described ('labelled', 'published')
 * @example thresholdText(applyThreshold('deferasirox-egfr-lower', {}), 'labelled') === 'the labelled threshold of 40'
 */
export function thresholdText(threshold: AppliedThreshold, published: string): string {
  if (!threshold.overridden) return `the ${published} threshold of ${threshold.value}`;
  return `the local threshold of ${threshold.value} (overriding the ${published} ${threshold.publishedValue}; ${threshold.reason}, ${threshold.by})`;
}

/** Whether any source of a list is from memory or unsure (status memory). */
export function anySourceUncertain(sourceIds: readonly string[]): boolean {
  return sourceIds.some((id) => {
    const status = findSource(id)?.status;
    return status === undefined || status === 'memory';
  });
}
