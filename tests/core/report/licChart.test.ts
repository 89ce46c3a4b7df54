import { describe, expect, it } from 'vitest';
import { computeCase } from '../../../core/ledger/computeCase';
import { parseCase } from '../../../core/model/parseCase';
import { licChart } from '../../../core/report/licChart';
import { deepFreeze, readDemo } from '../model/caseFixtures';
import { byAttribute, descendants, expectGreyscale, parseSvg, pathVertices, yOfValueFromTicks } from './svgTestTools';

function demoResults(name: 'th-0417' | 'th-0093' = 'th-0417') {
  const parsed = parseCase(readDemo(name));
  if (!parsed.ok) throw new Error('demo does not parse');
  const results = computeCase(parsed.value, '2026-11-20');
  if (!results.ok) throw new Error('demo does not compute');
  return results.value;
}

// Coordinates are written to 2 decimals (svgMarkup.coordinate): positions agree to 0.01 pt,
// and a value read back through the tick mapping agrees to ±0.02 pt of drawing.
const pt = 0.02;

describe('LIC chart (SVG, structure)', () => {
  const results = demoResults();
  const chart = licChart(results);
  const svg = parseSvg(chart.svg);

  it('is well-formed SVG of the stated size, in the PDF font, greyscale only', () => {
    expect(svg.getAttribute('width')).toBe(String(chart.width));
    expect(svg.getAttribute('height')).toBe(String(chart.height));
    expect(svg.getAttribute('viewBox')).toBe(`0 0 ${chart.width} ${chart.height}`);
    expect(svg.getAttribute('font-family')).toBe('Roboto');
    expect(chart.svg).not.toMatch(/font-family="(?!Roboto")/);
    expectGreyscale(chart.svg);
    expect(descendants(svg, 'title')[0]!.textContent).toBe(chart.title);
  });

  it('has a y axis in mg/g dry with increasing ticks upwards and an x axis with dated ticks left to right', () => {
    const yAxis = byAttribute(svg, 'data-role', 'y-axis')[0]!;
    expect(yAxis.textContent).toContain('LIC, mg/g dry weight');
    const yTicks = byAttribute(yAxis, 'data-tick').map((tick) => ({ value: Number(tick.getAttribute('data-tick')), y: Number(descendants(tick, 'line')[0]!.getAttribute('y1')) }));
    for (let index = 1; index < yTicks.length; index += 1) {
      expect(yTicks[index]!.value).toBeGreaterThan(yTicks[index - 1]!.value);
      expect(yTicks[index]!.y).toBeLessThan(yTicks[index - 1]!.y);
    }
    const xTicks = byAttribute(byAttribute(svg, 'data-role', 'x-axis')[0]!, 'data-tick').map((tick) => ({ date: tick.getAttribute('data-tick')!, x: Number(descendants(tick, 'line')[0]!.getAttribute('x1')) }));
    expect(xTicks.length).toBeGreaterThanOrEqual(4);
    for (let index = 1; index < xTicks.length; index += 1) {
      expect(xTicks[index]!.date > xTicks[index - 1]!.date).toBe(true);
      expect(xTicks[index]!.x).toBeGreaterThan(xTicks[index - 1]!.x);
    }
  });

  it('shades the LIC bands at the published edges 1.8, 3, 7 and 15 mg/g dry', () => {
    // Edges: Olivieri & Brittenham, Blood 1997;89:739 (normal up to about 1.8; ≥ 15 high cardiac risk);
    // Brittenham, N Engl J Med 2011;364:146, Table 2 (target 3–7).
    const yOf = yOfValueFromTicks(svg);
    const bandRect = (id: string) => {
      const rect = byAttribute(svg, 'data-band', id)[0]!;
      const top = Number(rect.getAttribute('y'));
      return { top, bottom: top + Number(rect.getAttribute('height')) };
    };
    expect(bandRect('normal').bottom).toBeCloseTo(yOf(0), 1);
    expect(bandRect('normal').top).toBeCloseTo(yOf(1.8), 1);
    expect(bandRect('above-normal').top).toBeCloseTo(yOf(3), 1);
    expect(bandRect('target-range').bottom).toBeCloseTo(yOf(3), 1);
    expect(bandRect('target-range').top).toBeCloseTo(yOf(7), 1);
    expect(bandRect('raised-risk').top).toBeCloseTo(yOf(15), 1);
    expect(bandRect('high-cardiac-risk').bottom).toBeCloseTo(yOf(15), 1);
  });

  it('draws the measured LIC results of the case file as points in date order at their values', () => {
    // Outside the chart: the case file's own liver-iron entries (two in mg/g dry; one R2* converted by the core).
    const caseFile = readDemo('th-0417') as { results: { kind: string; date: string; measured: { value: number; unit: string } }[] };
    const entries = caseFile.results.filter((it) => it.kind === 'liver-iron');
    const dots = descendants(byAttribute(svg, 'data-series', 'measured')[0]!, 'circle');
    expect(dots.map((dot) => dot.getAttribute('data-at'))).toEqual(entries.map((it) => it.date).sort());
    const xs = dots.map((dot) => Number(dot.getAttribute('cx')));
    expect([...xs].sort((a, b) => a - b)).toEqual(xs);
    const yOf = yOfValueFromTicks(svg);
    for (const entry of entries.filter((it) => it.measured.unit === 'mg/g{dry}')) {
      const dot = dots.find((it) => it.getAttribute('data-at') === entry.date)!;
      expect(Math.abs(Number(dot.getAttribute('cy')) - yOf(entry.measured.value))).toBeLessThan(pt);
    }
  });

  it('draws one projection per scenario whose band contains its central line at every month', () => {
    const scenarios = results.projection!.scenarios;
    expect(scenarios.length).toBe(3);
    for (const scenario of scenarios) {
      const group = byAttribute(svg, 'data-series', `projection:${scenario.id}`)[0]!;
      const paths = descendants(group, 'path');
      const band = pathVertices(paths.find((it) => it.getAttribute('data-role') === 'band')!.getAttribute('d')!);
      const line = pathVertices(paths.find((it) => it.getAttribute('data-role') === 'line')!.getAttribute('d')!);
      expect(line.length).toBe(scenario.months.length);
      // d3-shape's area: the high edge left to right, then the low edge right to left.
      const high = band.slice(0, line.length);
      const low = band.slice(line.length).reverse();
      line.forEach(([x, y], index) => {
        expect(high[index]![0]).toBeCloseTo(x, 2);
        expect(low[index]![0]).toBeCloseTo(x, 2);
        // SVG y grows downwards: the high edge is at or above the line, the low edge at or below.
        expect(high[index]![1]).toBeLessThanOrEqual(y + pt);
        expect(low[index]![1]).toBeGreaterThanOrEqual(y - pt);
      });
      for (let index = 1; index < line.length; index += 1) expect(line[index]![0]).toBeGreaterThan(line[index - 1]![0]);
    }
  });

  it('lists the plotted values, the same numbers the results hold', () => {
    expect(chart.plotted.map((it) => it.id)).toEqual(['measured', 'estimate', ...results.projection!.scenarios.map((it) => `projection:${it.id}`)]);
    const projection = chart.plotted[2]!;
    const scenario = results.projection!.scenarios[0]!;
    expect(projection.points[12]).toEqual({ at: scenario.months[12]!.date, value: scenario.months[12]!.licMgPerGDry, low: scenario.months[12]!.licP10, high: scenario.months[12]!.licP90 });
    for (const point of chart.plotted.flatMap((it) => it.points)) {
      if (point.low !== undefined) expect(point.low).toBeLessThanOrEqual(point.value + 1e-9);
      if (point.high !== undefined) expect(point.high).toBeGreaterThanOrEqual(point.value - 1e-9);
    }
  });

  it('marks label zones hatched, shows only the chosen scenarios, and is pure and repeatable', () => {
    const frozen = deepFreeze(demoResults());
    const zoned = licChart(frozen, { labelZones: [{ id: 'below-3', fromMgPerGDry: 0, toMgPerGDry: 3, label: 'label zone below 3' }], scenarioIds: ['current'], idPrefix: 'x' });
    const zonedSvg = parseSvg(zoned.svg);
    const zone = byAttribute(zonedSvg, 'data-zone', 'below-3')[0]!;
    expect(descendants(zone, 'rect')[0]!.getAttribute('fill')).toBe('url(#x-hatch)');
    expect(zone.textContent).toBe('label zone below 3');
    expect(byAttribute(zonedSvg, 'data-series').map((it) => it.getAttribute('data-series'))).toEqual(['projection:current', 'estimate', 'measured']);
    expect(licChart(frozen, { scenarioIds: ['current'] }).svg).toBe(licChart(frozen, { scenarioIds: ['current'] }).svg);
  });

  it('draws a case without projection (no LIC on record) with axes and no series lines', () => {
    const parsed = parseCase({ ...readDemo('th-0417'), results: [] });
    if (!parsed.ok) throw new Error('does not parse');
    const computed = computeCase(parsed.value, '2026-11-20');
    if (!computed.ok) throw new Error('does not compute');
    const empty = licChart(computed.value);
    const emptySvg = parseSvg(empty.svg);
    expect(byAttribute(emptySvg, 'data-role', 'x-axis')).toHaveLength(1);
    expect(descendants(byAttribute(emptySvg, 'data-series', 'measured')[0]!, 'circle')).toHaveLength(0);
    expect(empty.plotted.map((it) => it.points.length)).toEqual([0, 0]);
  });
});
