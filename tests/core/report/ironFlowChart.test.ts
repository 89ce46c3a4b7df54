import { describe, expect, it } from 'vitest';
import { computeCase } from '../../../core/ledger/computeCase';
import { parseCase } from '../../../core/model/parseCase';
import { ironFlowChart } from '../../../core/report/ironFlowChart';
import { readDemo } from '../model/caseFixtures';
import { byAttribute, descendants, expectGreyscale, parseSvg, yOfValueFromTicks } from './svgTestTools';

function demoResults() {
  const parsed = parseCase(readDemo('th-0417'));
  if (!parsed.ok) throw new Error('demo does not parse');
  const results = computeCase(parsed.value, '2026-11-20');
  if (!results.ok) throw new Error('demo does not compute');
  return results.value;
}

describe('iron in against iron out chart (SVG, structure)', () => {
  const results = demoResults();
  const chart = ironFlowChart(results);
  const svg = parseSvg(chart.svg);

  it('is well-formed greyscale SVG in the PDF font, one bar group per month in calendar order', () => {
    expect(svg.getAttribute('font-family')).toBe('Roboto');
    expectGreyscale(chart.svg);
    const groups = byAttribute(svg, 'data-month');
    expect(groups.map((it) => it.getAttribute('data-month'))).toEqual(results.months.map((it) => it.month));
    const xs = groups.map((group) => Number(descendants(group, 'rect')[0]!.getAttribute('x')));
    for (let index = 1; index < xs.length; index += 1) expect(xs[index]!).toBeGreaterThan(xs[index - 1]!);
  });

  it('draws iron in above zero and the stacked iron out below, to the y axis scale', () => {
    // Outside the chart: the transfusion record itself. For a month with transfusions, the bar's
    // height is Σ volume × haematocrit × 1.08 mg/mL (Cohen et al., Blood 2008;111:583) as the
    // ledger totals it; here we read the ledger's month and check the drawing against the axis.
    const yOf = yOfValueFromTicks(svg);
    const tolerancePt = 0.03; // coordinates to 2 decimals at each end of a bar
    for (const month of results.months) {
      const group = byAttribute(svg, 'data-month', month.month)[0]!;
      const part = (id: string) => byAttribute(group, 'data-series', id)[0];
      const inBar = part('iron-in');
      if (month.transfusedInMg > 0) {
        expect(Math.abs(Number(inBar!.getAttribute('y')) - yOf(month.transfusedInMg))).toBeLessThan(tolerancePt);
        expect(Math.abs(Number(inBar!.getAttribute('y')) + Number(inBar!.getAttribute('height')) - yOf(0))).toBeLessThan(tolerancePt);
      } else {
        expect(inBar).toBeUndefined();
      }
      const outTotal = month.chelationOutMg + month.removedWithBloodMg + month.basalLossMg;
      const outRects = ['chelation-out', 'blood-out', 'basal-out'].map(part).filter((it) => it !== undefined);
      const lowest = Math.max(...outRects.map((it) => Number(it!.getAttribute('y')) + Number(it!.getAttribute('height'))));
      expect(Math.abs(lowest - yOf(-outTotal))).toBeLessThan(tolerancePt * outRects.length);
    }
  });

  it('lists the plotted values month by month, and the net is in − out', () => {
    expect(chart.plotted.map((it) => it.id)).toEqual(['iron-in', 'chelation-out', 'blood-out', 'basal-out', 'net']);
    const [ironIn, chelation, blood, basal, net] = chart.plotted;
    net!.points.forEach((point, index) => {
      const expected = ironIn!.points[index]!.value - chelation!.points[index]!.value - blood!.points[index]!.value - basal!.points[index]!.value;
      expect(point.value).toBeCloseTo(expected, 6);
    });
    // Σ in − Σ removed with blood over every month is the cumulative net the results report since the first record.
    const sum = (series: typeof ironIn) => series!.points.reduce((total, point) => total + point.value, 0);
    expect(sum(ironIn) - sum(blood)).toBeCloseTo(results.intake.cumulativeNetMg, 6);
  });

  it('keeps only the last months when asked, labelling each month', () => {
    const last = ironFlowChart(results, { lastMonths: 12 });
    const lastSvg = parseSvg(last.svg);
    expect(byAttribute(lastSvg, 'data-month')).toHaveLength(12);
    expect(byAttribute(byAttribute(lastSvg, 'data-role', 'x-axis')[0]!, 'data-tick')).toHaveLength(12);
    expect(last.svg).toBe(ironFlowChart(results, { lastMonths: 12 }).svg);
  });
});
