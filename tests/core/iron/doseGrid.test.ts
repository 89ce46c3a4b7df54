import { describe, expect, it } from 'vitest';
import { doseGridCells, doseGridProfile } from '../../../core/iron/doseGrid';
import { demoSheet } from '../report/sheetFixtures';

// Brittenham GM, Iron-chelating therapy for transfusional iron overload, N Engl J Med 2011;364:146–156,
// Table 2. Its intake bands (< 0.3, 0.3–0.5, > 0.5 mg/kg/day) are confirmed (references.md §1); no cell of
// its dose grid was read from a stored source, so every profile must say plainly that its cell is not available.
describe('the usual-dose grid of Brittenham 2011 Table 2', () => {
  it('puts intakes on both sides of the table’s band edges (0.3 and 0.5 mg/kg/day, both in the middle band)', () => {
    expect([0.29, 0.3, 0.5, 0.51].map((intake) => doseGridProfile(intake, 9, 25).intake.band.id)).toEqual(['low', 'intermediate', 'intermediate', 'high']);
  });

  it('names the values and bands of the profile, and says the cell is not available for every band combination', () => {
    const intakes = [0.2, 0.4, 0.6];
    const lics = [1, 2.5, 5, 10, 20, null];
    const t2Stars = [30, 15, 8, 4, null];
    for (const intake of intakes) {
      for (const lic of lics) {
        for (const t2Star of t2Stars) {
          const profile = doseGridProfile(intake, lic, t2Star);
          expect(profile.cell).toBeNull();
          expect(profile.statement).toContain('the usual-dose cell of the table for this profile is not available in this tool');
          expect(profile.statement).toContain(`intake ${intake} mg/kg/day`);
          expect(profile.statement).toContain(lic === null ? 'no liver iron on record' : `liver iron ${lic} mg/g dry`);
          expect(profile.statement).toContain(t2Star === null ? 'no cardiac T2* on record' : `cardiac T2* ${t2Star} ms`);
        }
      }
    }
  });

  it('encodes no cell without the place in Table 2 it was read from', () => {
    // No row was read (see core/iron/doseGrid.ts); a cell added later must name its row, column or footnote.
    for (const cell of doseGridCells) expect(cell.locator, cell.usualDoses).toMatch(/Table 2/);
    expect(doseGridCells).toHaveLength(0);
  });

  it('is on the review sheet as information, with the patient’s bands (TH-0417)', () => {
    const facts = demoSheet('th-0417')
      .sections.flatMap((section) => section.blocks)
      .flatMap((block) => (block.kind === 'facts' ? block.rows : []));
    const row = facts.find((it) => it.label.startsWith('Published usual-dose grid (Brittenham 2011, Table 2)'));
    expect(row?.value).toMatch(/^Bands of Brittenham 2011 \(N Engl J Med 2011;364:146\) Table 2: intake [\d.]+ mg\/kg\/day, /);
    expect(row?.value).toContain('not available in this tool');
  });
});
