import { daysBetween, isIsoDate, type IsoDate } from '../dates/isoDate';
import { fail, issue, ok, type Issue, type Result } from '../result';
import type { Days, Fraction, Kilograms, MgPerKgPerDay, MgPerMl, Milligrams, Millilitres } from '../units/quantity';
import { ironIntakeRateMgPerKgPerDay } from './ironIntakeRate';
import { transfusionIronMg } from './transfusionIron';

/** One transfusion of the record, with its date and its own unit haematocrit. */
export interface DatedTransfusion {
  readonly date: IsoDate;
  readonly volumeMl: Millilitres;
  readonly unitHaematocrit: Fraction;
}

/** A window of calendar days; both the first and the last day count. */
export interface DateWindow {
  readonly firstDate: IsoDate;
  readonly lastDate: IsoDate;
}

export interface WindowIron {
  /** Iron brought in by the transfusions dated inside the window, mg. */
  readonly ironMg: Milligrams;
  readonly transfusionCount: number;
  /** Days in the window, both ends counted. */
  readonly windowDays: Days;
  /** ironMg ÷ weight ÷ windowDays. */
  readonly intakeMgPerKgPerDay: MgPerKgPerDay;
}

/**
 * Iron brought in by the transfusions dated inside a window, in total and as
 * mg/kg/day over the window (for the trailing year before a review, pass the
 * window that ends on the review date).
 *
 * iron (mg) = Σ volume × unit haematocrit × iron per mL of pure red cells, over transfusions with firstDate ≤ date ≤ lastDate
 * rate (mg/kg/day) = iron ÷ weight ÷ days in the window (both ends counted)
 *
 * Source: the standard method (references.md §1); bands for the rate in
 * Brittenham, N Engl J Med 2011;364:146, Table 2. Pure: no clock; dates are
 * calendar dates 'YYYY-MM-DD'.
 *
 * @param transfusions - the record (any order; not mutated)
 * @param window - first and last day, 'YYYY-MM-DD', last not before first
 * @param weightKg - body weight over the window, kg (plausible 1–200)
 * @param ironPerMlRedCells - mg iron per mL of pure red cells (about 1.0–1.2)
 * @returns the window's iron, count, days and rate; or 'invalid_date' issues (path into the record) and an 'inconsistent' issue for a reversed window
 * @example transfusionIronOverWindow(
 *   [{ date: '2026-01-10', volumeMl: ml(280), unitHaematocrit: fraction(0.6) },
 *    { date: '2026-01-31', volumeMl: ml(280), unitHaematocrit: fraction(0.6) }],
 *   { firstDate: '2026-01-01', lastDate: '2026-01-31' }, kg(52), mgPerMl(1.08))
 *   → ok({ ironMg: 362.88, transfusionCount: 2, windowDays: 31, intakeMgPerKgPerDay: ≈ 0.2251 })
 */
export function transfusionIronOverWindow(
  transfusions: readonly DatedTransfusion[],
  window: DateWindow,
  weightKg: Kilograms,
  ironPerMlRedCells: MgPerMl,
): Result<WindowIron> {
  const issues: Issue[] = [
    ...dateIssue(window.firstDate, ['window', 'firstDate'], 'first date'),
    ...dateIssue(window.lastDate, ['window', 'lastDate'], 'last date'),
    ...transfusions.flatMap((transfusion, index) => dateIssue(transfusion.date, ['transfusions', index, 'date'], 'transfusion date')),
  ];
  if (issues.length > 0) return fail(...issues);
  // Both ends count: 2026-01-01 to 2026-12-31 is 365 days.
  const windowDays = (daysBetween(window.firstDate, window.lastDate) + 1) as Days;
  if (windowDays < 1) {
    return fail(
      issue('inconsistent', ['window', 'lastDate'], `Last date ${window.lastDate} is before first date ${window.firstDate}; the window must run forward in time.`),
    );
  }
  let ironMg = 0;
  let transfusionCount = 0;
  for (const transfusion of transfusions) {
    // ISO calendar dates compare correctly as strings.
    if (transfusion.date < window.firstDate || transfusion.date > window.lastDate) continue;
    ironMg += transfusionIronMg(transfusion.volumeMl, transfusion.unitHaematocrit, ironPerMlRedCells);
    transfusionCount += 1;
  }
  const totalIronMg = ironMg as Milligrams;
  return ok({
    ironMg: totalIronMg,
    transfusionCount,
    windowDays,
    intakeMgPerKgPerDay: ironIntakeRateMgPerKgPerDay(totalIronMg, weightKg, windowDays),
  });
}

function dateIssue(text: IsoDate, path: readonly (string | number)[], field: string): Issue[] {
  return isIsoDate(text)
    ? []
    : [issue('invalid_date', path, `The ${field} "${text}" is not a calendar date written YYYY-MM-DD (for example 2026-03-14).`)];
}
