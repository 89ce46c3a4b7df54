import { severities, type Finding, type Severity, type TriggerValue } from '../../core/safety';
import { formatValue } from './format';
import { sourceLine, type SourceLine } from './sources';

export interface FindingCard {
  readonly key: string;
  readonly ruleId: string;
  readonly severity: Severity;
  readonly title: string;
  readonly text: string;
  readonly values: readonly string[];
  readonly thresholds: readonly { readonly id: string; readonly text: string; readonly overridden: boolean }[];
  readonly sources: readonly SourceLine[];
  readonly sourceUncertain: boolean;
}

/**
 * A value behind a finding as one line: its name, value and unit, its date
 * and the entry it comes from, each date written once. A value that is itself
 * a date (the last test of a monitoring item) is not dated again, and an
 * entry reference that names the date already shown ('results[21] 2026-10-13')
 * keeps only its position.
 */
export function triggerText(trigger: TriggerValue): string {
  const dateShown = trigger.date !== null && trigger.value !== trigger.date ? trigger.date : null;
  const dateSuffix = trigger.date === null ? null : ` ${trigger.date}`;
  const ref = trigger.ref !== null && dateSuffix !== null && trigger.ref.endsWith(dateSuffix) ? trigger.ref.slice(0, trigger.ref.length - dateSuffix.length) : trigger.ref;
  return `${trigger.name}: ${formatValue(trigger.value, trigger.unit)}${dateShown ? ` (${dateShown})` : ''}${ref ? ` — ${ref}` : ''}`;
}

/** Findings grouped by severity (urgent first); every finding is shown. */
export function findingGroups(findings: readonly Finding[]): { readonly severity: Severity; readonly cards: readonly FindingCard[] }[] {
  return severities
    .map((severity) => ({
      severity,
      cards: findings
        .filter((finding) => finding.severity === severity)
        .map((finding, index) => ({
          key: `${finding.ruleId}:${index}`,
          ruleId: finding.ruleId,
          severity,
          title: finding.title,
          text: finding.text,
          values: finding.triggers.map(triggerText),
          thresholds: finding.thresholds.map((threshold) => ({
            id: threshold.id,
            overridden: threshold.overridden,
            text: `${threshold.label}: ${formatValue(threshold.value, threshold.unit)}${threshold.overridden ? ` (local protocol; published ${formatValue(threshold.publishedValue, threshold.unit)}; ${threshold.reason ?? ''})` : ''}`,
          })),
          sources: finding.sourceIds.map(sourceLine),
          sourceUncertain: finding.sourceUncertain,
        })),
    }))
    .filter((group) => group.cards.length > 0);
}

/**
 * The case's local-protocol thresholds with one more: the value as typed
 * (a number when it reads as one, the text otherwise so core's schema names
 * it), the reason, who recorded it and when. core/safety checks the range.
 */
export function withThresholdOverride(
  overrides: Readonly<Record<string, unknown>>,
  typed: { readonly id: string; readonly value: string; readonly reason: string; readonly by: string },
  atDate: string,
): Record<string, unknown> {
  const trimmed = typed.value.trim();
  const value = trimmed === '' ? trimmed : Number.isFinite(Number(trimmed)) ? Number(trimmed) : trimmed;
  return { ...overrides, [typed.id]: { value, reason: typed.reason.trim(), by: typed.by.trim(), at: atDate } };
}
