import type { Derivation } from '../../core/formulas/derivation';
import { formatNumber, formatQuantity } from './format';
import type { Review } from './review';

/** A number on screen with the derivation behind it (shown on focus or hover). */
export interface ExplainedValue {
  readonly label: string;
  readonly text: string;
  readonly derivation: Derivation | null;
}

export interface IronCourseView {
  readonly summary: readonly ExplainedValue[];
  readonly intervals: readonly {
    readonly key: string;
    readonly period: string;
    readonly licChange: string;
    readonly measured: string;
    readonly expected: string;
    readonly ratio: string;
    readonly effectiveEfficiency: string;
    readonly caveats: string;
    readonly derivation: Derivation;
  }[];
  /** The plotted values, month by month: the chart's text alternative. */
  readonly months: readonly { readonly month: string; readonly inMg: string; readonly outWithBloodMg: string; readonly chelationMg: string; readonly basalMg: string; readonly netMg: string }[];
  readonly notices: readonly { readonly severity: string; readonly text: string }[];
}

/** The Iron course screen of a review: intake, body iron, measured against expected removal per LIC interval, the monthly account. */
export function ironCourseView(review: Review): IronCourseView {
  const { results } = review;
  const intake = results.intake;
  const summary: ExplainedValue[] = [
    {
      label: `Transfusional iron intake, ${intake.windowFrom} to ${results.asOf}`,
      text: `${formatQuantity(intake.mgPerKgPerDay, 2, 'mg/kg/d')} (${intake.band}); net ${formatQuantity(intake.netMg, 0, 'mg')}`,
      derivation: intake.derivation,
    },
    {
      label: 'Last measured liver iron',
      text: results.bodyIron.lastMeasured
        ? `${formatQuantity(results.bodyIron.lastMeasured.licMgPerGDry, 1, 'mg/g{dry}')} on ${results.bodyIron.lastMeasured.date} (${results.bodyIron.lastMeasured.method})`
        : 'none on record',
      derivation: null,
    },
    {
      label: `Estimated LIC and body iron on ${results.asOf}`,
      text:
        results.bodyIron.licMgPerGDry === null
          ? 'needs a liver iron result'
          : `${formatQuantity(results.bodyIron.licMgPerGDry, 1, 'mg/g{dry}')}; body iron ${formatQuantity(results.bodyIron.bodyIronMg, 0, 'mg')}`,
      derivation: results.bodyIron.derivation,
    },
    ...results.currentRegimens.map((regimen) => ({
      label: `Expected removal, ${regimen.label}`,
      text: `${formatQuantity(regimen.expectedRemovalMgPerKgPerDay, 2, 'mg/kg/d')} (${formatQuantity(regimen.expectedRemovalMgPerDay, 0, 'mg/d')})`,
      derivation: regimen.derivation,
    })),
  ];
  return {
    summary,
    intervals: results.responses.map((response) => ({
      key: `${response.fromDate}:${response.toDate}`,
      period: `${response.fromDate} to ${response.toDate}`,
      licChange: `${formatNumber(response.fromLicMgPerGDry, 1)} → ${formatQuantity(response.toLicMgPerGDry, 1, 'mg/g{dry}')}`,
      measured: formatQuantity(response.measuredChelationMgPerKgPerDay, 2, 'mg/kg/d'),
      expected: formatQuantity(response.expectedChelationMgPerKgPerDay, 2, 'mg/kg/d'),
      ratio: response.measuredToExpectedRatio === null ? 'no chelation expected' : `${formatNumber(response.measuredToExpectedRatio, 2)} of expected`,
      effectiveEfficiency: response.effectiveEfficiency
        ? `${response.effectiveEfficiency.drug}: ${formatNumber(response.effectiveEfficiency.effective, 3)} (published ${formatNumber(response.effectiveEfficiency.published, 3)})`
        : '—',
      caveats: response.caveatText.join(' '),
      derivation: response.derivation,
    })),
    months: results.months.map((month) => ({
      month: month.month,
      inMg: formatNumber(month.transfusedInMg, 0),
      outWithBloodMg: formatNumber(month.removedWithBloodMg, 0),
      chelationMg: formatNumber(month.chelationOutMg, 0),
      basalMg: formatNumber(month.basalLossMg, 0),
      netMg: formatNumber(month.netMg, 0),
    })),
    notices: results.notices.map((notice) => ({ severity: notice.severity, text: notice.text })),
  };
}
