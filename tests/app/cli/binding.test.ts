import { describe, expect, it } from 'vitest';
import { usage } from '../../../app/cli/main';
import { metalBindingCapacityMgPerG } from '../../../core/chelators/bindingCapacity';
import { findChelator, type ChelatorId } from '../../../core/chelators/catalogue';
import { pmFormula } from '../../../core/chemistry/formulas';
import { runFormula } from '../../../core/formulas/run';
import { cli } from './harness';

const pmOf = (constantSet: string, extra: Record<string, unknown> = {}): number => {
  const result = runFormula(pmFormula, { constantSet, ...extra });
  if (!result.ok) throw new Error(result.issues.map((it) => it.message).join(' '));
  return result.value.outputs.pM;
};

interface JsonRow {
  chelatorId: ChelatorId;
  capacityMgPerG: number;
  metalBoundMg: number;
  doseMg: number;
  pmBasis: string;
  constantSet: string;
  pm: { basis: string; pM: number; setId: string; setStatus: string };
}

const text = await cli('binding', '--weight-kg', '52');

describe('binding: the capacity and pM table', () => {

  it('is listed in the command usage', async () => {
    expect(usage).toContain('binding [--metal Fe3+]');
    expect(usage).toContain('binding --sweep --ligand-set');
  });

  it('names every constant set it used, with status, and says decision support', async () => {
    expect(text.code).toBe(0);
    for (const setId of ['deferoxamine-schwarzenbach-1963', 'deferiprone-remeasured-2019', 'deferasirox-aqueous', 'edta-textbook-25c', 'dtpa-nist46', 'succimer-37c-nacl']) {
      expect(text.out).toContain(`set ${setId}: `);
    }
    expect(text.out).toContain('status memory');
    expect(text.out).toContain('Decision support only: for review by the prescriber');
  });

  it('states the dose each row uses and marks deferasirox pFe as a literature value, not computed', async () => {
    expect(text.out).toContain('midpoint of the published range 20–60 mg/kg/day');
    expect(text.out).toMatch(/deferasirox, dispersible tablets\s+20\s+1040\s+74\.8\s+1\.50\s+77\.8\s+22\.5\s+literature value, not computed/);
    expect(text.out).toContain('Nurchi VM');
  });

  it('explains the calcium competition and cites the plasma calcium and MMWR sources', async () => {
    expect(text.out).toContain('ionized calcium 1.20 mmol/L');
    expect(text.out).toContain('as edetate disodium (no calcium in the dose): free calcium 0.201 mmol/L');
    expect(text.out).toContain('1.11 to 1.40 mmol/L');
    expect(text.out).toContain('MMWR Morb Mortal Wkly Rep 2006;55:204');
    expect(text.out).toContain('succimer: not computed: Constant set succimer-37c-nacl has no constant for Pb2+');
  });

  it('uses descriptive wording only', async () => {
    expect(text.out).not.toMatch(/\b(give|administer|should|must|recommended dose)\b/i);
  });

  it('--json: capacity equals core/chelators, pM equals the pm calculator, pFe order as published', async () => {
    const result = await cli('binding', '--weight-kg', '52', '--json');
    expect(result.code).toBe(0);
    const parsed = JSON.parse(result.out) as { rows: JsonRow[]; lead: { ligand: string; pM?: number; setId: string }[]; caution: string };
    for (const row of parsed.rows) {
      const capacity = metalBindingCapacityMgPerG(findChelator(row.chelatorId).dosedAsFormId, 'Fe');
      expect(capacity.ok && capacity.value).toBe(row.capacityMgPerG);
      if (row.pm.basis === 'computed') expect(row.pm.pM).toBe(pmOf(row.pm.setId));
      expect(row.constantSet.startsWith(`${row.pm.setId}: `)).toBe(true);
    }
    // Published order (Nurchi 2015; Liu & Hider 2001): deferoxamine 26.6 > deferasirox 22.5 > deferiprone 19.4–20.8.
    const pFe = new Map(parsed.rows.map((it) => [it.chelatorId, it.pm.pM]));
    expect(pFe.get('deferoxamine')!).toBeGreaterThan(pFe.get('deferasirox-dispersible')!);
    expect(pFe.get('deferasirox-dispersible')!).toBeGreaterThan(pFe.get('deferiprone')!);
    // Lead rows equal the pm calculator for Pb2+; succimer has none.
    const lead = new Map(parsed.lead.map((it) => [it.ligand, it]));
    expect(lead.get('edta')!.pM).toBe(pmOf('edta-textbook-25c', { metal: 'Pb2+' }));
    expect(lead.get('dtpa')!.pM).toBe(pmOf('dtpa-nist46', { metal: 'Pb2+' }));
    expect(lead.get('succimer')!.pM).toBeUndefined();
    expect(parsed.caution).toContain('Decision support only');
  });

  it('--metal Al3+ fills deferoxamine only and says why the others are empty', async () => {
    const result = await cli('binding', '--metal', 'Al3+');
    expect(result.code).toBe(0);
    expect(result.out).toContain('No body weight given: metal bound per kg only');
    expect(result.out).toContain('Metal Al is not catalogued for deferiprone');
  });

  it('refuses bad input naming the flag, the value and the range or choices', async () => {
    expect(await cli('binding', '--metal', 'Pb2+')).toMatchObject({ code: 1, err: '--metal: "Pb2+" is not one of Fe3+, Al3+.' });
    // The case file's weight ranges (core/ranges/plausibleRanges.ts): possible above 0 to 400 kg, plausible 2–200 kg.
    expect(await cli('binding', '--weight-kg', '0')).toMatchObject({ code: 1, err: '--weight-kg: "0" is not a body weight; enter the weight in kg, above 0 and at most 400 (plausible 2–200).' });
    expect(await cli('binding', '--weight-kg', '401')).toMatchObject({ code: 1, err: '--weight-kg: "401" is not a body weight; enter the weight in kg, above 0 and at most 400 (plausible 2–200).' });
    const heavy = await cli('binding', '--weight-kg', '230');
    expect(heavy.code).toBe(0);
    expect(heavy.out.split('\n')[0]).toBe('Check the weight: 230.0 kg is outside the plausible 2–200 kg (typed in pounds, or a digit too many?).');
    const unknown = await cli('binding', '--dose', '5');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('--dose: not an option of binding');
  });
});

describe('binding --sweep: pM and log K′ against pH', () => {
  it('--json gives pH 2–12 in steps of 1, each pM equal to the pm calculator at that pH', async () => {
    const result = await cli('binding', '--sweep', '--ligand-set', 'deferoxamine-schwarzenbach-1963', '--json');
    expect(result.code).toBe(0);
    const parsed = JSON.parse(result.out) as { constantSet: string; points: { pH: number; pM: number; logConditionalConstant: number }[] };
    expect(parsed.points.map((it) => it.pH)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    // The sweep warm-starts each pH; the calculator solves cold. Same equilibrium: 1e-9 (phSweep.test.ts).
    for (const point of parsed.points) expect(Math.abs(point.pM - pmOf('deferoxamine-schwarzenbach-1963', { ph: point.pH }))).toBeLessThan(1e-9);
    expect(parsed.constantSet).toMatch(/^deferoxamine-schwarzenbach-1963: /);
  });

  it('prints a compact table naming the set, and lists the pH values a conditional set cannot compute', async () => {
    const result = await cli('binding', '--sweep', '--ligand-set', 'transferrin-martin-1987', '--from', '7', '--to', '7.8', '--step', '0.4');
    expect(result.code).toBe(0);
    expect(result.out).toContain('set transferrin-martin-1987: ');
    expect(result.out).toMatch(/^7\.40\s+\d+\.\d\d\s+\d+\.\d\d$/m);
    expect(result.out).toContain('not computed (—) at pH 7, 7.8: Constant set transferrin-martin-1987 holds conditional constants valid only at pH 7.4');
    expect(result.out).toContain('Decision support only');
  });

  it('refuses a missing or unknown set and a reversed range', async () => {
    expect((await cli('binding', '--sweep')).err).toContain('--ligand-set: required with --sweep; one of edta-textbook-25c');
    expect((await cli('binding', '--sweep', '--ligand-set', 'edta-sodium')).code).toBe(1);
    expect((await cli('binding', '--sweep', '--ligand-set', 'edta-textbook-25c', '--from', '9', '--to', '3')).err).toContain('--to: pH 3 is below --from 9');
  });
});
