import { describe, expect, it } from 'vitest';
import { buildSheet } from '../../../core/report/buildSheet';
import { derivationsOf } from '../../../core/report/derivationIndex';
import { methodAppendix } from '../../../core/report/methodAppendix';
import type { SheetBlock } from '../../../core/report/sheet';
import { deepFreeze } from '../model/caseFixtures';
import { forbiddenPhrasings } from '../safety/safetyCases';
import { demoSheet, demoSheetInput } from './sheetFixtures';

const tableOf = (blocks: readonly SheetBlock[], id: string) => {
  const found = blocks.find((block) => block.kind === 'table' && block.id === id);
  if (!found || found.kind !== 'table') throw new Error(`no table ${id}`);
  return found;
};

/** Every string of the sheet (what the PDF prints), SVG text included. */
function strings(value: unknown): string[] {
  if (typeof value === 'string') return [value];
  if (Array.isArray(value)) return value.flatMap(strings);
  if (typeof value === 'object' && value !== null) return Object.values(value).flatMap(strings);
  return [];
}

describe('review sheet model (core/report buildSheet)', () => {
  const sheet = demoSheet();
  const all = sheet.sections.flatMap((section) => section.blocks);

  it('heads the sheet with the case, review date, author, tool version and content hash', () => {
    expect(sheet.header).toMatchInlineSnapshot(`
      {
        "caseFileSha256": "aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa",
        "caseLabel": "TH-0417",
        "patientLine": "TH-0417, 15 years, 52 kg, thalassaemia-major",
        "preparedBy": "Pharmacist AB",
        "reviewDate": "2026-11-20",
        "title": "Chelation review sheet",
        "toolVersion": "chelation-ledger 0.1.0",
      }
    `);
    expect(sheet.caution).toMatch(/decision support only/i);
    expect(sheet.caution).toMatch(/estimate with stated uncertainty/);
    expect(sheet.caution).toMatch(/prescriber and local protocols decide/);
    expect(sheet.caution).toMatch(/verify/i);
  });

  it('orders the sections summary, charts, tables, appendix, with page breaks before all but the first', () => {
    expect(sheet.sections.map((section) => [section.id, section.startsOnNewPage])).toEqual([
      ['summary', false],
      ['charts', true],
      ['tables', true],
      ['method-appendix', true],
    ]);
  });

  it('states the current regimen per administration and as a mean per day', () => {
    // TH-0417 (scenarios.md): deferasirox film-coated 21 mg/kg once daily, 7 days a week → 21 mg/kg/day both ways.
    expect(tableOf(all, 'current-regimen').rows).toMatchInlineSnapshot(`
      [
        [
          "deferasirox film-coated-tablet",
          "21 mg/kg × 1/day, 7 days/week",
          "21.0",
          "21.0",
          "31.5",
          "0.606",
        ],
      ]
    `);
  });

  it('gives the projections at 6, 12 and 24 months with their bands, for the current and proposed regimens', () => {
    const projection = tableOf(all, 'projection');
    expect(projection.columns.map((column) => column.title)).toEqual(['regimen', 'net, mg/kg/day', '6 months', '12 months', '24 months']);
    const results = demoSheetInput().results;
    expect(projection.rows.map((row) => row[0])).toEqual(results.projection!.scenarios.map((scenario) => `${scenario.name} (${scenario.efficiencyBasis} efficiency)`));
    // Each cell is "central (p10–p90)" and the band contains the central value.
    for (const row of projection.rows) {
      for (const cell of row.slice(2)) {
        const [central, low, high] = /^(-?[\d.]+) \((-?[\d.]+)–(-?[\d.]+)\)$/.exec(cell)!.slice(1).map(Number) as [number, number, number];
        expect(low).toBeLessThanOrEqual(central);
        expect(high).toBeGreaterThanOrEqual(central);
      }
    }
  });

  it('prints every finding the core returns, most urgent first, each with its sources', () => {
    const input = demoSheetInput();
    const block = all.find((it) => it.kind === 'findings');
    if (!block || block.kind !== 'findings') throw new Error('no findings block');
    expect(block.items).toHaveLength(input.findings.length);
    const order = ['URGENT', 'REVIEW', 'INFORMATION'];
    const ranks = block.items.map((item) => order.indexOf(item.severity));
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    for (const item of block.items) expect(item.sources.length).toBeGreaterThan(0);
  });

  it('totals the transfusion table by month: the totals row is the sum of the rows', () => {
    const table = tableOf(all, 'transfusions-by-month');
    expect(table.rows).toHaveLength(12);
    const column = (index: number) => table.rows.reduce((sum, row) => sum + Number(row[index]), 0);
    // Rows are rounded to whole mg, the totals are sums of the unrounded months: ±0.5 mg per row.
    for (const index of [1, 2, 4, 6]) expect(Math.abs(column(index) - Number(table.totals![index]))).toBeLessThanOrEqual(0.5 * table.rows.length);
  });

  it('lists the record tables: results, chelation periods, practical doses, monitoring', () => {
    const tables = sheet.sections.find((section) => section.id === 'tables')!.blocks;
    expect(tables.map((block) => (block.kind === 'table' ? block.id : block.kind))).toEqual(['transfusions-by-month', 'results', 'chelation-periods', 'practical-doses', 'monitoring']);
    // Practical doses: 21 mg/kg/day at 52 kg is 1,092 mg; the 90/180/360 mg strengths give 3 × 360 = 1,080 mg
    // (core/dosing example, strengths from memory of the labels, flagged in the catalogue).
    expect(tableOf(tables, 'practical-doses').rows[0]).toEqual(['current', 'deferasirox film-coated tablets', '1092 mg', '3 × 360 mg', '1080 mg (20.77 mg/kg/day)', '-1.1 %']);
    expect(tableOf(tables, 'chelation-periods').rows.map((row) => row[0])).toEqual(demoSheetInput().caseFile.chelationPeriods.map((period) => period.id));
  });

  it('prints exactly the formulas and assumptions of the method appendix, each derivation once', () => {
    const input = demoSheetInput();
    const expected = methodAppendix(derivationsOf(input.results, input.findings));
    const appendix = sheet.sections.find((section) => section.id === 'method-appendix')!.blocks;
    const text = strings(appendix).join('\n');
    for (const formula of expected.formulas) {
      expect(text).toContain(`[${formula.formulaId}]: ${formula.expression}`);
      for (const source of formula.sources) expect(text).toContain(source.title);
    }
    expect(tableOf(appendix, 'assumptions').rows.map((row) => row[0])).toEqual(expected.assumptions.map((it) => expect.stringContaining(`[${it.assumptionId}]`)));
    const derivationTables = appendix.filter((block) => block.kind === 'table' && block.id.startsWith('derivation-'));
    const captions = derivationTables.map((block) => (block.kind === 'table' ? block.caption : ''));
    expect(new Set(captions).size).toBe(captions.length);
    expect(captions[0]).toMatch(/^D1\. /);
  });

  it('leaves the sign-off open for the prescriber and carries the review notes', () => {
    expect(sheet.signOff).toMatchObject({ reviewedBy: null, date: null, comments: null, prescriberFields: ['Prescriber (name)', 'Signature', 'Date', 'Decision and comments'] });
    expect(sheet.signOff.notes[0]).toMatch(/^2026-11-20, Pharmacist AB: /);
  });

  it('uses no imperative dosing wording anywhere (the findings tests\' list)', () => {
    for (const text of strings(sheet)) {
      for (const pattern of forbiddenPhrasings) expect(pattern.test(text), `"${text.slice(0, 120)}" matches ${pattern}`).toBe(false);
    }
  });

  it('is pure: a frozen input gives the same sheet twice', () => {
    const input = deepFreeze(demoSheetInput());
    expect(JSON.stringify(buildSheet(input))).toBe(JSON.stringify(buildSheet(input)));
  });

  it('builds a sheet for the second demo case and one without any LIC result', () => {
    expect(demoSheet('th-0093').sections).toHaveLength(4);
    const input = demoSheetInput('th-0417');
    const withoutLic = demoSheetInput('th-0417', { ...(JSON.parse(JSON.stringify(input.caseFile)) as object), results: [] });
    const sheetWithoutLic = buildSheet(withoutLic);
    const summary = sheetWithoutLic.sections[0]!.blocks;
    expect(strings(summary).join(' ')).toContain('no liver iron result on record');
    expect(summary.some((block) => block.kind === 'table' && block.id === 'projection')).toBe(false);
  });
});
