/**
 * The one module that imports d3 (d3-scale, d3-shape, d3-array): scales,
 * ticks and path strings for the report's charts. Pure and DOM-free; the
 * charts never hand-write tick or path arithmetic.
 */
import { extent, max, min } from 'd3-array';
import { scaleBand, scaleLinear, scaleUtc, type ScaleBand, type ScaleLinear, type ScaleTime } from 'd3-scale';
import { area, line } from 'd3-shape';
import { epochDayFromIso, isoFromEpochDay, type IsoDate } from '../dates/isoDate';

export type { ScaleBand, ScaleLinear, ScaleTime };

const millisecondsInDay = 86_400_000;

/** A calendar date as the UTC midnight instant d3's time scale works on (no clock is read). */
export function instantOfIso(date: IsoDate): Date {
  return new Date(epochDayFromIso(date) * millisecondsInDay);
}

/** The calendar date of a UTC instant from the time scale's ticks. */
export function isoOfInstant(instant: Date): IsoDate {
  return isoFromEpochDay(Math.floor(instant.getTime() / millisecondsInDay));
}

/** A UTC time scale over calendar dates, to a pixel range. */
export function dateScale(domain: readonly [IsoDate, IsoDate], range: readonly [number, number]): ScaleTime<number, number> {
  return scaleUtc().domain([instantOfIso(domain[0]), instantOfIso(domain[1])]).range([range[0], range[1]]);
}

/** A linear scale, extended to nice round ends. */
export function valueScale(domain: readonly [number, number], range: readonly [number, number]): ScaleLinear<number, number> {
  return scaleLinear().domain([domain[0], domain[1]]).nice().range([range[0], range[1]]);
}

/** A band scale for one bar group per category (months). */
export function categoryScale(categories: readonly string[], range: readonly [number, number], paddingInner = 0.2): ScaleBand<string> {
  return scaleBand<string>().domain(categories).range([range[0], range[1]]).paddingInner(paddingInner).paddingOuter(0.1);
}

/** SVG path of a polyline through the points, coordinates to 2 decimals so output is stable. */
export function linePath(points: readonly (readonly [number, number])[]): string {
  return line().digits(2)(points as [number, number][]) ?? '';
}

/** SVG path of the region between a low and a high edge over the same x values. */
export function bandPath(points: readonly { readonly x: number; readonly low: number; readonly high: number }[]): string {
  return (
    area<{ readonly x: number; readonly low: number; readonly high: number }>()
      .digits(2)
      .x((point) => point.x)
      .y0((point) => point.low)
      .y1((point) => point.high)(points as { x: number; low: number; high: number }[]) ?? ''
  );
}

export { extent, max, min };
