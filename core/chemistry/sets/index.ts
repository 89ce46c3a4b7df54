import type { LigandConstantSet, LigandId } from '../types';
import { deferasiroxSets } from './deferasirox';
import { deferiproneSets } from './deferiprone';
import { deferoxamineSets } from './deferoxamine';
import { dtpaSets } from './dtpa';
import { edtaSets } from './edta';
import { succimerSets } from './succimer';
import { transferrinSets } from './transferrin';

/** Every named constant set, grouped by ligand in a fixed order. */
export const ligandConstantSets: readonly LigandConstantSet[] = [
  ...edtaSets,
  ...dtpaSets,
  ...deferoxamineSets,
  ...deferiproneSets,
  ...deferasiroxSets,
  ...succimerSets,
  ...transferrinSets,
];

const byId = new Map<string, LigandConstantSet>();
for (const set of ligandConstantSets) {
  if (byId.has(set.id)) throw new Error(`Duplicate constant set id ${set.id}`);
  byId.set(set.id, set);
}

/** Ids of every constant set, for choice inputs. */
export const constantSetIds: readonly string[] = ligandConstantSets.map((it) => it.id);

/**
 * The constant set with this id, or undefined.
 * @param id - a constant set id
 * @returns the set, or undefined for an unknown id
 * @example findConstantSet('edta-textbook-25c')?.protonationLogK[0] === 10.37
 */
export function findConstantSet(id: string): LigandConstantSet | undefined {
  return byId.get(id);
}

/**
 * The default set of a ligand (exactly one per ligand; checked by a test).
 * @param ligand - the ligand
 * @returns its default constant set
 * @example defaultSetOf('deferiprone').id === 'deferiprone-remeasured-2019'
 */
export function defaultSetOf(ligand: LigandId): LigandConstantSet {
  const found = ligandConstantSets.find((it) => it.ligand === ligand && it.isDefault);
  if (!found) throw new Error(`No default constant set for ${ligand}`);
  return found;
}
