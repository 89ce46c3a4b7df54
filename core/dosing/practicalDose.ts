import { fail, issue, ok, type Issue, type Result } from '../result';
import { weightBounds } from '../ranges';
import type { Kilograms, MgPerKgPerDay, Milligrams, Millilitres } from '../units/quantity';
import { closestCombination, halfMgUnitsFromMg, smallestCoveringCombination, type Piece } from './combinationSearch';
import { formatAmount } from '../numbers/formatNumber';
import type { Product, SolutionProduct, TabletProduct, VialProduct } from './productCatalogue';

/** The intended dose: per kg per day, or per kg per administration (a deferoxamine infusion). */
export type DoseTarget =
  | { readonly kind: 'per-kg-per-day'; readonly mgPerKgPerDay: number }
  | { readonly kind: 'per-kg-per-administration'; readonly mgPerKgPerAdministration: number };

export interface PracticalDoseRequest {
  readonly product: Product;
  readonly target: DoseTarget;
  readonly weightKg: Kilograms;
  /** Administrations on a day of treatment, 1–6 (deferiprone 3; deferasirox and deferoxamine 1). */
  readonly administrationsPerDay: number;
  /** Step an oral syringe measures, mL (0.01–5; default 0.1, common practice). Solutions only. */
  readonly measurableStepMl?: number;
  /** Most tablets (a half counts as one piece) or vials in one administration, 1–40; default 12. */
  readonly maxPiecesPerAdministration?: number;
}

export interface TabletCount {
  readonly strengthMg: number;
  /** Tablets of this strength per administration; 1.5 is one whole and one half. */
  readonly tablets: number;
}

export interface VialCount {
  readonly strengthMg: number;
  readonly vials: number;
}

export type PracticalForm =
  | { readonly kind: 'tablets'; readonly tablets: readonly TabletCount[]; readonly pieceCount: number }
  | { readonly kind: 'oral-solution'; readonly volumeMl: Millilitres; readonly concentrationMgPerMl: number; readonly stepMl: number }
  | {
      readonly kind: 'vials';
      readonly vials: readonly VialCount[];
      readonly openedMg: Milligrams;
      /** Left in the opened single-use vials after the dose is drawn, mg. */
      readonly wasteMg: Milligrams;
    };

export interface PracticalDoseProposal {
  readonly productId: string;
  readonly productName: string;
  readonly drug: Product['drug'];
  readonly weightKg: Kilograms;
  readonly administrationsPerDay: number;
  readonly intendedMgPerAdministration: Milligrams;
  readonly intendedMgPerKgPerDay: MgPerKgPerDay;
  readonly proposedMgPerAdministration: Milligrams;
  readonly proposedMgPerKgPerDay: MgPerKgPerDay;
  /** Proposed minus intended, mg per administration (negative: below). */
  readonly differenceMgPerAdministration: number;
  /** Proposed minus intended, mg per day. */
  readonly differenceMgPerDay: number;
  /** (proposed − intended) ÷ intended × 100. */
  readonly differencePercent: number;
  readonly form: PracticalForm;
  /** "3 × 360 mg", "5.6 mL of 100 mg/mL", "2 × 500 mg vials". */
  readonly combinationText: string;
  /** The descriptive sentence; never an instruction. */
  readonly description: string;
  /** What the proposal rests on, in words (rounding step, tie rule, halves). */
  readonly assumptions: readonly string[];
  readonly sourceIds: readonly string[];
}

/** Plausible ranges of the request, inclusive (common practice: wide enough for every chelator and age). */
export const practicalDoseRanges = {
  weightKg: weightBounds.plausible,
  mgPerKgPerDay: { min: 0.5, max: 200 },
  mgPerKgPerAdministration: { min: 0.5, max: 200 },
  administrationsPerDay: { min: 1, max: 6 },
  measurableStepMl: { min: 0.01, max: 5 },
  maxPiecesPerAdministration: { min: 1, max: 40 },
} as const;

export const defaultMeasurableStepMl = 0.1;
export const defaultMaxPiecesPerAdministration = 12;

const reviewNote = 'For review by the prescriber; follow local protocols.';

function rangeIssue(field: string, label: string, value: number, range: { min: number; max: number }, integer = false): Issue | undefined {
  if (!Number.isFinite(value)) return issue('not_a_number', [field], `${label} ${String(value)} is not a number; enter a value in ${range.min}–${range.max}.`);
  if (value < range.min || value > range.max) return issue('out_of_range', [field], `${label} ${value} is outside the plausible range ${range.min}–${range.max}.`);
  if (integer && !Number.isInteger(value)) return issue('not_an_integer', [field], `${label} ${value} is not a whole number; enter one in ${range.min}–${range.max}.`);
  return undefined;
}

function checkRequest(request: PracticalDoseRequest): Issue[] {
  const problems: (Issue | undefined)[] = [
    rangeIssue('weightKg', 'Body weight (kg)', request.weightKg, practicalDoseRanges.weightKg),
    request.target.kind === 'per-kg-per-day'
      ? rangeIssue('targetMgPerKgPerDay', 'Intended dose (mg/kg/day)', request.target.mgPerKgPerDay, practicalDoseRanges.mgPerKgPerDay)
      : rangeIssue('targetMgPerKgPerAdministration', 'Intended dose (mg/kg per administration)', request.target.mgPerKgPerAdministration, practicalDoseRanges.mgPerKgPerAdministration),
    rangeIssue('administrationsPerDay', 'Administrations per day', request.administrationsPerDay, practicalDoseRanges.administrationsPerDay, true),
    request.measurableStepMl === undefined ? undefined : rangeIssue('measurableStepMl', 'Measurable volume step (mL)', request.measurableStepMl, practicalDoseRanges.measurableStepMl),
    request.maxPiecesPerAdministration === undefined
      ? undefined
      : rangeIssue('maxPiecesPerAdministration', 'Most tablets or vials per administration', request.maxPiecesPerAdministration, practicalDoseRanges.maxPiecesPerAdministration, true),
  ];
  return problems.filter((it): it is Issue => it !== undefined);
}

function tabletPieces(product: TabletProduct): Piece[] {
  const byStrength = [...product.strengths].sort((first, second) => second.strengthMg - first.strengthMg);
  // Preference on equal piece counts: whole tablets before halves, larger strengths first.
  return [
    ...byStrength.map((it) => ({ halfMgUnits: halfMgUnitsFromMg(it.strengthMg), key: `whole:${it.strengthMg}` })),
    ...byStrength.filter((it) => it.halvable).map((it) => ({ halfMgUnits: halfMgUnitsFromMg(it.strengthMg) / 2, key: `half:${it.strengthMg}` })),
  ];
}

function tabletsText(tablets: readonly TabletCount[]): string {
  return tablets.map((it) => `${formatAmount(it.tablets)} × ${formatAmount(it.strengthMg)} mg`).join(' + ');
}

interface FormOutcome {
  readonly proposedMg: number;
  readonly form: PracticalForm;
  readonly combinationText: string;
  readonly assumptions: readonly string[];
}

function proposeTablets(product: TabletProduct, intendedMg: number, maxPieces: number): FormOutcome | Issue {
  const found = closestCombination(tabletPieces(product), intendedMg * 2, maxPieces);
  if (!found) throw new Error(`Product ${product.id} has no strengths`); // the schema requires one: a bug
  const tabletsByStrength = new Map<number, number>();
  for (const piece of found.pieces) {
    const [portion, strength] = piece.key.split(':') as [string, string];
    const strengthMg = Number(strength);
    tabletsByStrength.set(strengthMg, (tabletsByStrength.get(strengthMg) ?? 0) + piece.count * (portion === 'half' ? 0.5 : 1));
  }
  const tablets = [...tabletsByStrength.entries()].sort(([first], [second]) => second - first).map(([strengthMg, count]) => ({ strengthMg, tablets: count }));
  const halvable = product.strengths.filter((it) => it.halvable).map((it) => `${formatAmount(it.strengthMg)} mg`);
  const pieces = product.unit === 'sachet' ? 'sachets' : 'tablets';
  return {
    proposedMg: found.totalHalfMgUnits / 2,
    form: { kind: 'tablets', tablets, pieceCount: found.pieceCount },
    combinationText: tabletsText(tablets),
    assumptions: [
      `Strengths available: ${product.strengths.map((it) => `${formatAmount(it.strengthMg)} mg`).join(', ')} (${product.name}).`,
      halvable.length > 0 ? `Halves counted only for the tablets the catalogue marks as breakable: ${halvable.join(', ')}.` : `Whole ${pieces} only: no strength is marked as breakable.`,
      `The closest amount with at most ${maxPieces} ${pieces}${halvable.length > 0 ? ' (a half counts as one)' : ''} per administration; on a tie the lower amount, then the fewest ${pieces}.`,
    ],
  };
}

function proposeSolution(product: SolutionProduct, intendedMg: number, stepMl: number): FormOutcome {
  const mgPerStep = product.concentrationMgPerMl * stepMl;
  const steps = intendedMg / mgPerStep;
  const lower = Math.max(1, Math.floor(steps + 1e-9));
  const upper = Math.max(1, Math.ceil(steps - 1e-9));
  // Closest measurable volume; the lower one on a tie; never less than one step.
  const chosen = steps - lower <= upper - steps ? lower : upper;
  const volumeMl = Number((chosen * stepMl).toFixed(6)) as Millilitres;
  return {
    proposedMg: Number((chosen * mgPerStep).toFixed(6)),
    form: { kind: 'oral-solution', volumeMl, concentrationMgPerMl: product.concentrationMgPerMl, stepMl },
    combinationText: `${formatAmount(volumeMl)} mL of ${formatAmount(product.concentrationMgPerMl)} mg/mL`,
    assumptions: [
      `Concentration ${formatAmount(product.concentrationMgPerMl)} mg/mL (${product.name}).`,
      `Volume rounded to the nearest ${formatAmount(stepMl)} mL, the step assumed measurable with an oral syringe (common practice; a local input); on a tie the lower volume.`,
    ],
  };
}

function proposeVials(product: VialProduct, intendedMg: number, maxPieces: number): FormOutcome | Issue {
  const pieces = [...product.vialStrengthsMg]
    .sort((first, second) => second - first)
    .map((strengthMg) => ({ halfMgUnits: halfMgUnitsFromMg(strengthMg), key: String(strengthMg) }));
  const found = smallestCoveringCombination(pieces, intendedMg * 2, maxPieces);
  if (!found) {
    return issue(
      'out_of_range',
      ['maxPiecesPerAdministration'],
      `A dose of ${formatAmount(intendedMg)} mg needs more than ${maxPieces} vials of ${product.vialStrengthsMg.map((it) => `${formatAmount(it)} mg`).join(' or ')}; raise the most vials per administration (up to 40) or check the dose.`,
    );
  }
  const vials = found.pieces.map((it) => ({ strengthMg: it.halfMgUnits / 2, vials: it.count }));
  const openedMg = (found.totalHalfMgUnits / 2) as Milligrams;
  return {
    proposedMg: intendedMg,
    form: { kind: 'vials', vials, openedMg, wasteMg: (openedMg - intendedMg) as Milligrams },
    combinationText: `${vials.map((it) => `${it.vials} × ${formatAmount(it.strengthMg)} mg`).join(' + ')} vial${found.pieceCount === 1 ? '' : 's'}`,
    assumptions: [
      `Vial sizes available: ${product.vialStrengthsMg.map((it) => `${formatAmount(it)} mg`).join(', ')} (${product.name}), single use.`,
      'The dose drawn is taken as the intended dose: the reconstituted volume depends on the local reconstitution and is not rounded here.',
      'The vials opened are the combination with the least left over; on a tie the fewest vials.',
    ],
  };
}

function sentence(request: PracticalDoseRequest, proposal: Omit<PracticalDoseProposal, 'description'>): string {
  const perDay = proposal.administrationsPerDay === 1 ? ':' : `; at ${proposal.administrationsPerDay} administrations a day,`;
  const direction =
    proposal.differencePercent === 0
      ? 'the same as the intended'
      : `${formatAmount(Math.abs(proposal.differenceMgPerDay))} mg a day (${formatAmount(Math.abs(proposal.differencePercent), 1)} %) ${proposal.differencePercent < 0 ? 'below' : 'above'} the intended`;
  const intended =
    request.target.kind === 'per-kg-per-day'
      ? `${formatAmount(request.target.mgPerKgPerDay)} mg/kg/day`
      : `${formatAmount(request.target.mgPerKgPerAdministration)} mg/kg per administration`;
  const opening =
    proposal.form.kind === 'vials'
      ? `For ${formatAmount(proposal.proposedMgPerAdministration)} mg per administration, ${proposal.combinationText} would be opened (${formatAmount(proposal.form.openedMg)} mg, ${formatAmount(proposal.form.wasteMg)} mg left over)`
      : `A ${proposal.form.kind === 'tablets' ? 'combination' : 'measurable volume'} that gives ${formatAmount(proposal.proposedMgPerAdministration)} mg per administration is ${proposal.combinationText}`;
  return `${opening}${perDay} ${formatAmount(proposal.proposedMgPerKgPerDay, 1)} mg/kg/day at ${formatAmount(request.weightKg)} kg, ${direction} ${intended} (${formatAmount(proposal.intendedMgPerAdministration)} mg per administration). ${reviewNote}`;
}

/**
 * The nearest practical regimen for an intended dose with one product: a
 * combination of tablet strengths (halves only where the product allows), a
 * measurable volume of oral solution, or the vials to open for a dose drawn
 * from them; and how far the result is from the intended dose. Descriptive,
 * never an instruction.
 *
 * intended per administration (mg) = target (mg/kg/day) × weight (kg) ÷ administrations per day
 * (or target (mg/kg per administration) × weight); proposed mg/kg/day =
 * proposed mg per administration × administrations per day ÷ weight.
 *
 * Sources: product strengths from the catalogue (core/references/dosing.ts;
 * the shipped strengths are from memory of the labels); the measurable volume
 * step is common practice.
 *
 * @param request - product; target (0.5–200 mg/kg/day or mg/kg per administration);
 *   weight (1–200 kg); administrations per day (1–6, whole); measurable step
 *   (0.01–5 mL, default 0.1); most pieces per administration (1–40, default 12)
 * @returns the proposal (mg, mg/kg/day, difference in mg and %), or issues naming the field, value and range
 * @example proposePracticalDose({ product: deferasirox film-coated (90/180/360 mg),
 *   target: { kind: 'per-kg-per-day', mgPerKgPerDay: 21 }, weightKg: kg(52), administrationsPerDay: 1 })
 *   → 1,080 mg as 3 × 360 mg: 20.77 mg/kg/day, 12 mg (1.1 %) below the intended 1,092 mg
 */
export function proposePracticalDose(request: PracticalDoseRequest): Result<PracticalDoseProposal> {
  const problems = checkRequest(request);
  if (problems.length > 0) return fail(...problems);
  const { product, weightKg, administrationsPerDay } = request;
  const intendedMgPerAdministration =
    request.target.kind === 'per-kg-per-day'
      ? (request.target.mgPerKgPerDay * weightKg) / administrationsPerDay
      : request.target.mgPerKgPerAdministration * weightKg;
  const maxPieces = request.maxPiecesPerAdministration ?? defaultMaxPiecesPerAdministration;
  const outcome =
    product.kind === 'tablets'
      ? proposeTablets(product, intendedMgPerAdministration, maxPieces)
      : product.kind === 'oral-solution'
        ? proposeSolution(product, intendedMgPerAdministration, request.measurableStepMl ?? defaultMeasurableStepMl)
        : proposeVials(product, intendedMgPerAdministration, maxPieces);
  if ('code' in outcome) return fail(outcome);
  const differenceMgPerAdministration = outcome.proposedMg - intendedMgPerAdministration;
  const withoutSentence: Omit<PracticalDoseProposal, 'description'> = {
    productId: product.id,
    productName: product.name,
    drug: product.drug,
    weightKg,
    administrationsPerDay,
    intendedMgPerAdministration: intendedMgPerAdministration as Milligrams,
    intendedMgPerKgPerDay: ((intendedMgPerAdministration * administrationsPerDay) / weightKg) as MgPerKgPerDay,
    proposedMgPerAdministration: outcome.proposedMg as Milligrams,
    proposedMgPerKgPerDay: ((outcome.proposedMg * administrationsPerDay) / weightKg) as MgPerKgPerDay,
    differenceMgPerAdministration,
    differenceMgPerDay: differenceMgPerAdministration * administrationsPerDay,
    differencePercent: (differenceMgPerAdministration / intendedMgPerAdministration) * 100,
    form: outcome.form,
    combinationText: outcome.combinationText,
    assumptions: [
      ...outcome.assumptions,
      product.kind === 'vials' ? 'mg/kg/day is per day of treatment (infusion days), not averaged over the week.' : 'mg/kg/day counts every administration of the day.',
    ],
    sourceIds: product.sourceIds,
  };
  return ok({ ...withoutSentence, description: sentence(request, withoutSentence) });
}
