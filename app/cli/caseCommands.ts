import type { CaseResults } from '../../core/ledger/computeCase';
import { derivationsOf } from '../../core/report/derivationIndex';
import { methodAppendix } from '../../core/report/methodAppendix';
import { citeShort } from '../../core/references';
import type { Case } from '../../core/model/caseFile';
import { formatIssues, type Issue, type Result } from '../../core/result';
import type { Finding } from '../../core/safety';
import { daysPerMonth } from '../../core/units/time';
import type { ParsedArgs } from './args';
import { reviewCase, type CaseIo } from './caseReview';
import { formatFindings } from './findingsCommand';
import { decisionSupportCaution, formatNumber, formatPlain, withUnit } from './format';
import { exitCodes, type CliIo } from './io';
import { choiceWords } from '../../core/words';


function loadCase(args: ParsedArgs, io: CaseIo, command: string): { path: string; result: Result<Case> } | null {
  const path = args.positionals[0];
  if (path === undefined) {
    io.err(`Usage: chelation-ledger ${command} <case.json>`);
    return null;
  }
  return { path, result: io.readCase(path) };
}

function printWarnings(warnings: readonly Issue[] | undefined, io: CliIo): void {
  if (warnings && warnings.length > 0) io.err(formatIssues(warnings));
}

/** `check <case.json>`: validate and list issues; exit 1 on errors. */
export function checkCommand(args: ParsedArgs, io: CaseIo): number {
  const extra = [
    ...args.positionals.slice(1).map((it) => `Unexpected word "${it}": check takes one case file.`),
    ...[...Object.keys(args.options), ...args.missingValues, ...[...args.switches].filter((it) => it !== '--help')].map((it) => `${it}: not an option of check (it takes only the case file).`),
  ];
  if (extra.length > 0) {
    io.err(`${extra.join('\n')}\nUsage: chelation-ledger check <case.json>`);
    return exitCodes.usage;
  }
  const loaded = loadCase(args, io, 'check');
  if (!loaded) return exitCodes.usage;
  const { path, result } = loaded;
  if (!result.ok) {
    io.err(`${path}: ${result.issues.filter((it) => it.severity === 'error').length} error(s)`);
    io.err(formatIssues(result.issues));
    return exitCodes.invalidInput;
  }
  const warnings = result.warnings ?? [];
  io.out(`${path}: valid case file (${result.value.patient.label}), ${warnings.length} warning(s).`);
  printWarnings(warnings, io);
  return exitCodes.ok;
}

/** `compute <case.json> [--as-of DATE] [--horizon-months N] [--seed N] [--json]`. */
export function computeCommand(args: ParsedArgs, io: CaseIo): number {
  const review = reviewCase(args, io, {
    command: 'compute',
    usage: 'Usage: chelation-ledger compute <case.json> [--as-of YYYY-MM-DD] [--horizon-months N] [--seed N] [--model burden-dependent|constant-rate] [--json]',
    integerOptions: {
      '--horizon-months': { min: 1, max: 120, key: 'horizonMonths' },
      '--seed': { min: 0, max: 2 ** 31 - 1, key: 'seed' },
    },
  });
  if (typeof review === 'number') return review;
  printWarnings(review.warnings, io);
  io.out(
    args.switches.has('--json')
      ? JSON.stringify({ caution: decisionSupportCaution, results: review.results, findings: review.findings }, null, 2)
      : formatResults(review.results, review.findings),
  );
  return exitCodes.ok;
}

const fmt = (value: number, decimals = 1) => formatNumber(value, decimals);
/** Two significant figures, for estimates whose band is wide ("estimated now"). */
const sig2 = (value: number) => (value === 0 ? '0' : formatNumber(Number(value.toPrecision(2)), Math.max(0, 1 - Math.floor(Math.log10(Math.abs(value))))));

/** Iron removed per procedure and per month over the trailing year, from the account's months. */
function bloodRemovalOf(results: CaseResults): string[] {
  const removedMg = results.intake.removedWithBloodMg;
  if (!(removedMg > 0)) return [];
  const procedures = results.intake.removalProcedures;
  const perProcedure = procedures > 0 ? `, ${fmt(removedMg / procedures, 0)} mg per procedure (${procedures} procedures)` : '';
  return [`${fmt(removedMg, 0)} mg over the ${results.intake.windowDays} days to ${results.asOf}${perProcedure}, ${fmt((removedMg / results.intake.windowDays) * daysPerMonth, 0)} mg per month`];
}

/** The readable summary of a computed case. */
export function formatResults(results: CaseResults, findings: readonly Finding[] = []): string {
  const lines: string[] = [];
  const age = results.patient.ageYears === null ? 'age unknown' : `${Math.floor(results.patient.ageYears)} years`;
  lines.push(`Iron review for ${results.patient.label} (${age}, ${fmt(results.patient.weightKg, 0)} kg, ${choiceWords(results.patient.diagnosisGroup)}) as of ${results.asOf}`);
  lines.push(`  ${decisionSupportCaution}`);
  lines.push('');
  lines.push('Findings (urgent first; `findings` lists them alone):');
  lines.push(formatFindings(findings, '  '));
  lines.push('');
  const intake = results.intake;
  lines.push(`Transfusional iron, ${intake.windowFrom} to ${results.asOf} (${intake.windowDays} days):`);
  lines.push(`  in ${fmt(intake.transfusedMg, 0)} mg, out with removed blood ${fmt(intake.removedWithBloodMg, 0)} mg, net ${fmt(intake.netMg, 0)} mg`);
  lines.push(`  ${fmt(intake.mgPerKgPerDay, 2)} mg/kg/day — ${intake.band} (Brittenham 2011, Table 2)`);
  lines.push(`  cumulative net since ${intake.cumulativeSince}: ${fmt(intake.cumulativeNetMg / 1000, 1)} g`);
  lines.push('');
  const body = results.bodyIron;
  if (body.lastMeasured && body.bodyIronMg !== null && body.licMgPerGDry !== null) {
    lines.push('Body iron:');
    lines.push(`  last measured LIC ${fmt(body.lastMeasured.licMgPerGDry)} mg/g dry on ${body.lastMeasured.date} (${body.lastMeasured.method})`);
    const band = body.band ? ` (10th–90th percentile ${sig2(body.band.licP10)}–${sig2(body.band.licP90)}, with the LIC's measurement spread of ${fmt((body.anchorRelativeSd ?? 0) * 100, 0)} %)` : '';
    lines.push(`  estimated now: LIC ${sig2(body.licMgPerGDry)} mg/g dry${band}, body iron stores ${sig2(body.bodyIronMg / 1000)} g (Angelucci relation, carried forward by the balance at the ${body.efficiencyBasis} efficiency basis)`);
    lines.push('');
  }
  if (results.currentRegimens.length > 0) {
    lines.push('Current chelation, expected removal at the published efficiency:');
    for (const regimen of results.currentRegimens) {
      lines.push(`  ${regimen.label}: ${fmt(regimen.doseMgPerKgPerDay)} mg/kg/day → ${fmt(regimen.expectedRemovalMgPerDay)} mg/day (${fmt(regimen.expectedRemovalMgPerKgPerDay, 2)} mg/kg/day)`);
    }
    lines.push('');
  }
  if (results.responses.length > 0) {
    lines.push('Measured response between LIC results (balance method):');
    for (const response of results.responses) {
      const ratio = response.measuredToExpectedRatio === null ? 'no chelation expected' : `${fmt(response.measuredToExpectedRatio * 100, 0)} % of expected`;
      lines.push(
        `  ${response.fromDate} → ${response.toDate} (${response.days} days): LIC ${fmt(response.fromLicMgPerGDry)} → ${fmt(response.toLicMgPerGDry)}; intake ${fmt(response.intakeMgPerKgPerDay, 2)} mg/kg/day; chelation removal measured ${fmt(response.measuredChelationMgPerKgPerDay, 2)} vs expected ${fmt(response.expectedChelationMgPerKgPerDay, 2)} mg/kg/day (${ratio})`,
      );
      if (response.effectiveEfficiency) {
        const { drug, published, effective } = response.effectiveEfficiency;
        lines.push(`    effective ${drug} efficiency ${fmt(effective * 100, 0)} % of the dose (published assumption ${fmt(published * 100, 0)} %)`);
      }
      for (const caveat of response.caveatText) lines.push(`    caution: ${caveat}`);
    }
    lines.push('');
  }
  const trend = results.ferritin.trend;
  if (results.ferritin.latest) {
    const trendText = trend
      ? `${trend.direction} ${fmt(Math.abs(trend.changePerYear) * 100, 0)} %/year over ${trend.points} results${trend.doublingDays ? `, doubling in ${fmt(trend.doublingDays / daysPerMonth, 0)} months` : ''}${trend.halvingDays ? `, halving in ${fmt(trend.halvingDays / daysPerMonth, 0)} months` : ''}`
      : 'too few results in the window for a trend';
    lines.push(`Ferritin: latest ${fmt(results.ferritin.latest.valueUgPerL, 0)} µg/L on ${results.ferritin.latest.date}; ${trendText}.`);
    if (results.ferritin.note) lines.push(`  ${results.ferritin.note}`);
    lines.push('');
  }
  if (results.projection) {
    const projection = results.projection;
    const model = projection.model === 'burden-dependent'
      ? `burden-dependent model: removal falls in proportion to the iron above the floor of LIC ${fmt(projection.floorLicMgPerGDry)} mg/g dry, calibrated on today's removal`
      : `constant-rate model: today's removal held until the floor of LIC ${fmt(projection.floorLicMgPerGDry)} mg/g dry`;
    lines.push(`Projected LIC (mg/g dry; ${model}; central, 10th–90th percentile band from ${projection.samples} seeded samples, seed ${projection.seed}; future intake ${fmt(projection.intakeMgPerDay)} mg/day):`);
    lines.push(`  ${projection.basis.statement}`);
    for (const scenario of projection.scenarios) {
      const points = [6, 12, 24, projection.horizonMonths]
        .filter((months, index, all) => months <= projection.horizonMonths && all.indexOf(months) === index)
        .map((months) => {
          const month = scenario.months[months]!;
          return `${months} mo ${fmt(month.licMgPerGDry)} (${fmt(month.licP10)}–${fmt(month.licP90)})`;
        });
      lines.push(`  ${scenario.name} [${scenario.efficiencyBasis} efficiency; net today ${fmt(scenario.netMgPerKgPerDay, 2)} mg/kg/day]: ${points.join('; ')}`);
      for (const crossing of scenario.crossings) {
        if (crossing.thresholdMgPerGDry === 15 && crossing.monthsAhead === null) continue;
        const central = crossing.monthsAhead !== null ? `at about month ${crossing.monthsAhead} (${crossing.date})` : `not within ${projection.horizonMonths} months`;
        const bandText =
          crossing.bandEarliestMonths === null
            ? `band: not within ${projection.horizonMonths} months`
            : `band: month ${crossing.bandEarliestMonths} to ${crossing.bandLatestMonths ?? `beyond ${projection.horizonMonths}`}`;
        lines.push(`    LIC ${crossing.direction} ${crossing.thresholdMgPerGDry}: ${central}; ${bandText}`);
      }
      for (const zone of scenario.labelZones) if (zone.centralMonth !== null || zone.bandMonth !== null) lines.push(`    ${zone.text}`);
    }
    lines.push('');
  }
  const procedures = bloodRemovalOf(results);
  if (procedures.length > 0) {
    lines.push('Iron removed with blood (exchange, venesection; pre-procedure haematocrit):');
    for (const line of procedures) lines.push(`  ${line}`);
    lines.push('');
  }
  if (results.notices.length > 0) {
    lines.push('Notes:');
    for (const notice of results.notices) lines.push(`  ${notice.severity === 'review' ? 'review: ' : ''}${notice.text}`);
    lines.push('');
  }
  lines.push('Methods (the formulas behind the numbers above; `explain` shows each derivation):');
  for (const formula of methodAppendix(derivationsOf(results, findings)).formulas) {
    lines.push(`  ${formula.title} [${formula.formulaId}]: ${formula.expression}`);
    lines.push(`    ${formula.sources.map(citeShort).join('; ')}`);
  }
  lines.push('');
  lines.push('Assumptions used:');
  for (const assumption of results.assumptions) {
    const origin = assumption.origin.overridden ? `overridden: ${assumption.origin.reason}` : 'published default';
    lines.push(`  ${assumption.label}: ${withUnit(formatPlain(assumption.value), assumption.unit)} (${origin})`);
  }
  return lines.join('\n');
}
