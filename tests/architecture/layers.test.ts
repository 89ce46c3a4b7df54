import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { areaCycles, importGraph, layerViolations, type ImportEdge } from './importGraph';

// The directions of DEVELOPERS.md ("Dependencies") and design.md §2, kept by a test:
// app/ and renderer/ import core/; core/ imports neither (nor node: built-ins, nor
// Electron); renderer/ never imports app/ or Electron; core's areas form no cycle.
// The outside reference for the graph is the TypeScript compiler's own import
// pre-processor (ts.preProcessFile), not a reading of ours.
const root = fileURLToPath(new URL('../..', import.meta.url));
const graph = importGraph(root, ['core', 'app', 'renderer']);

describe('the import graph of core, app and renderer', () => {
  it('reads the imports of the tree (every core area appears, and app imports core)', () => {
    expect(graph.some((it) => it.from === 'app/cli/calcCommand.ts' && it.to === 'core/catalogue.ts')).toBe(true);
    expect(graph.some((it) => it.from === 'core/model/consistency.ts' && it.to === 'core/thresholds/index.ts')).toBe(true);
    expect(graph.some((it) => it.from === 'core/model/caseFile.ts' && it.pkg === 'zod')).toBe(true);
  });

  it('keeps every allowed direction and has no cycle between core areas', () => {
    expect(layerViolations(graph)).toEqual([]);
  });

  it('keeps core/formulas a leaf of the areas that define formulas: it imports none of them', () => {
    const formulaAreas = ['iron', 'ledger', 'chelators', 'patient', 'units', 'chemistry', 'dosing'];
    const fromFormulas = graph.filter((it) => it.from.startsWith('core/formulas/') && it.to !== undefined).map((it) => it.to!.split('/')[1]);
    for (const area of formulaAreas) expect(fromFormulas).not.toContain(area);
  });
});

// A rule that can never fail keeps nothing: each planted bad import must be caught.
describe('the rules catch a planted bad import', () => {
  const planted = (edge: ImportEdge) => layerViolations([...graph, edge]);

  it.each([
    [{ from: 'core/iron/bodyIron.ts', to: 'app/cli/format.ts' }, 'core imports nothing outside core/'],
    [{ from: 'core/model/caseFile.ts', to: 'renderer/README.md' }, 'core imports nothing outside core/'],
    [{ from: 'core/ledger/computeCase.ts', pkg: 'node:fs' }, 'core uses only zod'],
    [{ from: 'core/report/methodAppendix.ts', pkg: 'electron' }, 'core uses only zod'],
    [{ from: 'renderer/view.tsx', to: 'app/host/caseFiles.ts' }, 'renderer never imports app/'],
    [{ from: 'renderer/view.tsx', pkg: 'electron' }, 'renderer never imports Electron'],
    [{ from: 'app/host/caseFiles.ts', pkg: 'electron' }, 'only app/main and app/preload may'],
    [{ from: 'core/formulas/run.ts', to: 'core/iron/formulas.ts' }, 'import each other in a cycle'],
    [{ from: 'core/model/consistency.ts', to: 'core/safety/index.ts' }, 'import each other in a cycle'],
  ] as [ImportEdge, string][])('%j', (edge, message) => {
    const problems = planted(edge);
    expect(problems.length).toBeGreaterThan(0);
    expect(problems.join('\n')).toContain(message);
  });

  it('names the areas of a cycle and one import for each step', () => {
    const cycles = areaCycles([...graph, { from: 'core/units/quantity.ts', to: 'core/ledger/ironAccount.ts' }]);
    expect(cycles).toHaveLength(1);
    expect(cycles[0]!.members).toContain('units');
    expect(cycles[0]!.members).toContain('ledger');
    expect(cycles[0]!.cycle[0]).toBe(cycles[0]!.cycle.at(-1));
  });
});
