import type { Case } from '../../../../core/model/caseFile';

// A small invented case (scenarios.md style: a code, not a name); state n adds
// one review note "save n". Small on purpose: the child is started hundreds of
// times, and what is tested is the write path, not the size of the file.
const base = {
  format: 'chelation-ledger.case',
  version: 1,
  patient: {
    label: 'KT-0001',
    age: { kind: 'birth-date', birthDate: '2012-03-04' },
    sexAtBirth: 'female',
    diagnosisGroup: 'thalassaemia-major',
    pregnancy: { status: 'not-pregnant', recordedOn: null },
    weights: [{ date: '2026-01-05', weight: { value: 41, unit: 'kg' } }],
  },
  transfusions: [
    { id: 't1', date: '2026-01-05', kind: 'simple', volume: { value: 560, unit: 'mL' }, unitHaematocrit: 0.6, unitCount: 2 },
    { id: 't2', date: '2026-02-02', kind: 'simple', volume: { value: 540, unit: 'mL' }, unitHaematocrit: null, unitCount: 2 },
  ],
  results: [{ id: 'r1', date: '2026-02-02', kind: 'ferritin', measured: { value: 1850, unit: 'ug/L' } }],
} as const;

/** The case after n saves. */
export function stateAt(n: number): Record<string, unknown> {
  return { ...base, review: { reviewDate: '2026-11-20', notes: [{ date: '2026-11-20', by: 'kill test', text: `save ${n}` }], signOff: null } };
}

/** Which state a case is: the n of its "save n" note. */
export function stateIndexOf(caseFile: Case): number {
  const match = /^save (\d+)$/.exec(caseFile.review.notes[0]?.text ?? '');
  if (!match) throw new Error('not a kill-test state');
  return Number(match[1]);
}
