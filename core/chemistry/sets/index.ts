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

/** The constant set with this id, or undefined. */
export function findConstantSet(id: string): LigandConstantSet | undefined {
  return byId.get(id);
}

/** The default set of a ligand (exactly one per ligand; checked by a test). */
export function defaultSetOf(ligand: LigandId): LigandConstantSet {
  const found = ligandConstantSets.find((it) => it.ligand === ligand && it.isDefault);
  if (!found) throw new Error(`No default constant set for ${ligand}`);
  return found;
}
