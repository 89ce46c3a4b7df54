import { describe, expect, it } from 'vitest';
import { closestCombination, smallestCoveringCombination } from '../../../core/dosing/combinationSearch';
import { formatAmount } from '../../../core/numbers/formatNumber';
import { defaultProductCatalogue, findProduct, parseProductCatalogue } from '../../../core/dosing/productCatalogue';
import { findSource } from '../../../core/references';

describe('product catalogue', () => {
  it('ships a catalogue that its own schema accepts, citing known sources marked as memory unless every one was read', () => {
    // Most shipped strengths are recalled, not read (core/references/dosing.ts): such a product
    // cites a source whose status says so, so no screen can present them as checked. A product whose
    // strengths were read (the EU deferiprone film-coated tablets in the SmPC §3, confirmed; the deferasirox
    // oral granules in the US national drug code records, secondary) cites only sources that were read.
    const parsed = parseProductCatalogue(JSON.parse(JSON.stringify(defaultProductCatalogue)));
    expect(parsed.ok).toBe(true);
    for (const product of defaultProductCatalogue) {
      const statuses = product.sourceIds.map((id) => findSource(id)?.status);
      expect(statuses, product.id).not.toContain(undefined);
      const read = statuses.every((it) => it === 'confirmed' || it === 'secondary');
      if (!read) expect(statuses, product.id).toContain('memory');
    }
    const readProducts = defaultProductCatalogue.filter((product) => product.sourceIds.every((id) => ['confirmed', 'secondary'].includes(findSource(id)?.status ?? ''))).map((it) => it.id);
    expect(readProducts).toEqual(['deferasirox-granules', 'deferiprone-tablets']);
  });

  it('holds the strengths the brief lists (deferasirox 90/180/360 and 125/250/500; deferiprone 500/1000 and 100 mg/mL; deferoxamine 500 mg and 2 g)', () => {
    const strengths = Object.fromEntries(
      defaultProductCatalogue.map((it) => [
        it.id,
        it.kind === 'tablets' ? it.strengths.map((s) => s.strengthMg) : it.kind === 'vials' ? it.vialStrengthsMg : [it.concentrationMgPerMl],
      ]),
    );
    expect(strengths).toEqual({
      'deferasirox-film-coated': [90, 180, 360],
      'deferasirox-dispersible': [125, 250, 500],
      // Oral granules, single-dose sachets (US national drug code records; references.md §9).
      'deferasirox-granules': [90, 180, 360],
      'deferiprone-tablets': [500, 1000],
      // The two US 1,000 mg tablets, one for twice- and one for three-times-a-day dosing (US label March 2025 §2.1).
      'deferiprone-tablets-1000-twice-daily': [1000],
      'deferiprone-tablets-1000-three-times-daily': [1000],
      'deferiprone-oral-solution': [100],
      'deferoxamine-vials': [500, 2000],
    });
    const halvable = defaultProductCatalogue.flatMap((it) => (it.kind === 'tablets' ? it.strengths.filter((s) => s.halvable).map((s) => `${it.id} ${s.strengthMg}`) : []));
    // EU deferiprone film-coated tablets, both strengths (SmPC §3); the US three-times-a-day 1,000 mg tablet (US label §2.1).
    expect(halvable).toEqual(['deferiprone-tablets 500', 'deferiprone-tablets 1000', 'deferiprone-tablets-1000-three-times-daily 1000']);
    expect(defaultProductCatalogue.filter((it) => it.administrationsPerDay !== undefined).map((it) => [it.id, it.administrationsPerDay])).toEqual([
      ['deferiprone-tablets-1000-twice-daily', 2],
      ['deferiprone-tablets-1000-three-times-daily', 3],
    ]);
  });

  it('accepts a local formulary and refuses an edited one with the field and value named', () => {
    const local = [{ id: 'deferasirox-film-coated', drug: 'deferasirox', kind: 'tablets', name: 'local', strengths: [{ strengthMg: 90, halvable: false }], sourceIds: ['local-formulary-2026'] }];
    expect(parseProductCatalogue(local).ok).toBe(true);
    const broken = [
      { ...local[0], strengths: [{ strengthMg: 0, halvable: false }] },
      { ...local[0], id: 'deferasirox-film-coated' },
    ];
    const result = parseProductCatalogue(broken);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const messages = result.issues.map((it) => it.message);
    expect(result.issues[0]!.code).toBe('out_of_range');
    expect(result.issues[0]!.path).toEqual(['catalogue', 0, 'strengths', 0, 'strengthMg']);
    expect(messages[0]).toContain('0.strengths.0.strengthMg (value 0)');
    expect(messages.some((it) => it.includes('appears twice'))).toBe(true);
  });

  it('names the products there are when an id is unknown', () => {
    const found = findProduct(defaultProductCatalogue, 'deferasirox-chewable');
    expect(found.ok).toBe(false);
    if (!found.ok) expect(found.issues[0]!.message).toContain('deferasirox-film-coated, deferasirox-dispersible');
  });
});

describe('combination search (worked examples of its doc comments)', () => {
  it('closestCombination: 1,092 mg from 360/180/90 mg is 1,080 as 3 × 360 (hand arithmetic)', () => {
    const found = closestCombination(
      [
        { halfMgUnits: 720, key: '360' },
        { halfMgUnits: 360, key: '180' },
        { halfMgUnits: 180, key: '90' },
      ],
      2184,
      12,
    );
    expect(found).toEqual({ totalHalfMgUnits: 2160, pieceCount: 3, pieces: [{ key: '360', halfMgUnits: 720, count: 3 }] });
  });

  it('smallestCoveringCombination: 920 mg from 2,000/500 mg vials is 2 × 500 (hand arithmetic)', () => {
    const found = smallestCoveringCombination(
      [
        { halfMgUnits: 4000, key: '2000' },
        { halfMgUnits: 1000, key: '500' },
      ],
      1840,
      12,
    );
    expect(found).toEqual({ totalHalfMgUnits: 2000, pieceCount: 2, pieces: [{ key: '500', halfMgUnits: 1000, count: 2 }] });
  });

  it('formatAmount groups thousands and drops trailing zeros', () => {
    expect(formatAmount(1080)).toBe('1,080');
    expect(formatAmount(20.769, 1)).toBe('20.8');
    expect(formatAmount(1.5)).toBe('1.5');
    expect(formatAmount(1234567.891)).toBe('1,234,567.89');
  });
});
