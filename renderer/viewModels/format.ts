import { formatGrouped } from '../../core/numbers/formatNumber';
import { displayUnit } from '../../core/units/displayUnit';

/**
 * How numbers read on screen: grouped thousands, a fixed number of decimals
 * (core/numbers/formatNumber.ts, the one formatter), the unit in its display form,
 * '—' where there is no value. Presentation only; every number comes from core.
 */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return formatGrouped(value, decimals);
}

/** A number with its unit: formatQuantity(11.4, 1, 'mg/g{dry}') === '11.4 mg/g dry weight'. */
export function formatQuantity(value: number | null | undefined, decimals: number, ucumUnit: string): string {
  const shown = displayUnit(ucumUnit);
  const number = formatNumber(value, decimals);
  return shown === '' || number === '—' ? number : `${number} ${shown}`;
}

/** A value as core reports it (a number or a text), with its unit. */
export function formatValue(value: number | string, unit: string): string {
  if (typeof value === 'string') return unit ? `${value} ${displayUnit(unit)}` : value;
  const decimals = Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : Math.abs(value) >= 1 ? 2 : 3;
  return formatQuantity(value, decimals, unit);
}
