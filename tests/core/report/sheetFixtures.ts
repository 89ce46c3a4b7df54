import { computeCase } from '../../../core/ledger/computeCase';
import { parseCase } from '../../../core/model/parseCase';
import { buildSheet, type SheetInput } from '../../../core/report/buildSheet';
import { evaluateFindings } from '../../../core/safety';
import { readDemo } from '../model/caseFixtures';

/** A fixed stand-in for the case file's hash (the host computes the real one; tests of the host check it). */
export const fixedHash = 'a'.repeat(64);

/** The inputs of the demo's sheet on its review date, as the sheet command assembles them. */
export function demoSheetInput(name: 'th-0417' | 'th-0093' = 'th-0417', json: unknown = readDemo(name)): SheetInput {
  const parsed = parseCase(json);
  if (!parsed.ok) throw new Error('demo does not parse');
  const asOf = parsed.value.review.reviewDate ?? '2026-11-20';
  const results = computeCase(parsed.value, asOf);
  if (!results.ok) throw new Error('demo does not compute');
  const findings = evaluateFindings(parsed.value, results.value, asOf, parsed.value.thresholdOverrides);
  if (!findings.ok) throw new Error('findings fail');
  return { caseFile: parsed.value, results: results.value, findings: findings.value, caseFileSha256: fixedHash, toolVersion: 'chelation-ledger 0.1.0', preparedBy: 'Pharmacist AB' };
}

export const demoSheet = (name: 'th-0417' | 'th-0093' = 'th-0417') => buildSheet(demoSheetInput(name));
