// The number and unit formatters live in core/report, shared with the review sheet.
export { formatNumber, formatPlain, formatReadable, withUnit } from '../../core/report/formatNumber';

export const decisionSupportCaution =
  'Decision support only: for review by the prescriber; follow local protocols and verify every value.';
