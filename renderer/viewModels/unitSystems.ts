import type { GPerDl, GPerL, MgPerDl, MgPerGDry, MicrogramsPerDl, UmolPerGDry, UmolPerL } from '../../core/units/quantity';
import {
  bloodLeadUgPerDlFromUmolPerL,
  bloodLeadUmolPerLFromUgPerDl,
  creatinineMgPerDlFromUmolPerL,
  creatinineUmolPerLFromMgPerDl,
  gPerDlFromGPerL,
  gPerLFromGPerDl,
} from '../../core/units/concentration';
import { licMgPerGDryFromUmolPerGDry, licUmolPerGDryFromMgPerGDry } from '../../core/units/liverIron';
import { formatQuantity } from './format';
import type { Cells } from './recordTables';

export type UnitSystemName = 'si' | 'conventional';

/**
 * The unit each system shows for a result kind, and core's conversion between
 * them (core/units owns every factor; this table only pairs them). A result
 * keeps the unit it was entered in; the other system's value is shown beside it.
 * SI: substance concentration where a lab reports one (µmol/L, g/L);
 * conventional: mass concentration (mg/dL, µg/dL, g/dL), common practice in US reporting.
 */
const pairs: Readonly<Record<string, { readonly si: string; readonly conventional: string; readonly toSI: (value: number) => number; readonly toConventional: (value: number) => number; readonly decimals: { readonly si: number; readonly conventional: number } }>> = {
  creatinine: {
    si: 'umol/L', conventional: 'mg/dL',
    toSI: (value) => creatinineUmolPerLFromMgPerDl(value as MgPerDl), toConventional: (value) => creatinineMgPerDlFromUmolPerL(value as UmolPerL),
    decimals: { si: 0, conventional: 2 },
  },
  haemoglobin: {
    si: 'g/L', conventional: 'g/dL',
    toSI: (value) => gPerLFromGPerDl(value as GPerDl), toConventional: (value) => gPerDlFromGPerL(value as GPerL),
    decimals: { si: 0, conventional: 1 },
  },
  'blood-lead': {
    si: 'umol/L', conventional: 'ug/dL',
    toSI: (value) => bloodLeadUmolPerLFromUgPerDl(value as MicrogramsPerDl), toConventional: (value) => bloodLeadUgPerDlFromUmolPerL(value as UmolPerL),
    decimals: { si: 2, conventional: 1 },
  },
  'liver-iron': {
    si: 'umol/g{dry}', conventional: 'mg/g{dry}',
    toSI: (value) => licUmolPerGDryFromMgPerGDry(value as MgPerGDry), toConventional: (value) => licMgPerGDryFromUmolPerGDry(value as UmolPerGDry),
    decimals: { si: 0, conventional: 1 },
  },
};

/** The unit a new result of `kind` starts in under `system`, when the system names one. */
export function preferredUnit(system: UnitSystemName, kind: string): string | undefined {
  return pairs[kind]?.[system];
}

/**
 * A result row's value in the chosen system, when it was entered in the other
 * one: '97 µmol/L' for 1.1 mg/dL under SI ('si'). Empty when nothing to convert.
 */
export function convertedText(system: UnitSystemName, cells: Cells): string {
  const pair = pairs[cells.kind ?? ''];
  const value = Number((cells.value ?? '').trim());
  if (!pair || (cells.value ?? '').trim() === '' || !Number.isFinite(value)) return '';
  if (cells.kind === 'liver-iron' && !['biopsy', 'mri'].includes(cells.method ?? '')) return '';
  if (cells.unit === pair[system]) return '';
  const other: UnitSystemName = system === 'si' ? 'conventional' : 'si';
  if (cells.unit !== pair[other]) return '';
  const converted = system === 'si' ? pair.toSI(value) : pair.toConventional(value);
  return formatQuantity(converted, pair.decimals[system], pair[system]);
}
