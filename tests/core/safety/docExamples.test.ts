import { describe, expect, it } from 'vitest';
import { parseCase } from '../../../core/model/parseCase';
import { applyThreshold, checkThresholdOverrides, continuousRunStart, thresholdText } from '../../../core/safety';
import { capitalised, readableUnit, shown } from '../../../core/safety/wording';
import { period, smallCase } from './safetyCases';

// The @example of each exported helper in core/safety, checked as written.
describe('core/safety doc-comment examples', () => {
  it('wording helpers', () => {
    expect(shown(37.04, 0)).toBe('37');
    expect(shown(0.02286, 4)).toBe('0.0229');
    expect(shown(1.3, 2)).toBe('1.3');
    // UCUM 'mL/min/{1.73_m2}' as written on a laboratory report.
    expect(readableUnit('mL/min/{1.73_m2}')).toBe('mL/min/1.73 m²');
    // The same table as the sheet and the screens (core/units/displayUnit.ts): one spelling of ×10⁹/L.
    expect(readableUnit('10*9/L')).toBe('×10⁹/L');
    expect(capitalised('deferasirox')).toBe('Deferasirox');
  });

  it('thresholds', () => {
    expect(applyThreshold('deferasirox-egfr-lower', {}).value).toBe(40);
    expect(thresholdText(applyThreshold('deferasirox-egfr-lower', {}), 'labelled')).toBe('the labelled threshold of 40');
    expect(checkThresholdOverrides({ 'deferasirox-egfr-lower': { value: 45, reason: 'local renal protocol', by: 'Pharmacist AB' } }).ok).toBe(true);
    expect(checkThresholdOverrides({ 'deferasirox-egfr-lower': { value: 45, reason: ' ', by: 'Pharmacist AB' } }).ok).toBe(false);
  });

  it('continuousRunStart joins a dose change into one run', () => {
    const json = smallCase({
      chelationPeriods: [
        { ...period('deferasirox', 14), id: 'a', startDate: '2025-01-01', endDate: '2025-06-30' },
        { ...period('deferasirox', 21), id: 'b', startDate: '2025-07-01', endDate: null },
      ],
    });
    const parsed = parseCase(json);
    if (!parsed.ok) throw new Error('not ok');
    expect(continuousRunStart(parsed.value.chelationPeriods, 'deferasirox', '2026-01-01')).toBe('2025-01-01');
    expect(continuousRunStart(parsed.value.chelationPeriods, 'deferiprone', '2026-01-01')).toBeNull();
  });
});
