// The number formatters live in core/numbers/formatNumber.ts (and withUnit in core/units/displayUnit.ts),
// shared with the review sheet, the findings and the screens; the command line only re-exports them.
export { formatNumber, formatPlain, formatReadable } from '../../core/numbers/formatNumber';
export { withUnit } from '../../core/units/displayUnit';

export const decisionSupportCaution =
  'Decision support only: for review by the prescriber; follow local protocols and verify every value.';
