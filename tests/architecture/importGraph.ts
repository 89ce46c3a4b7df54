import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import ts from 'typescript';

/** One import: from a project file to a project file (`to`) or to a package (`pkg`). */
export interface ImportEdge {
  readonly from: string;
  readonly to?: string;
  readonly pkg?: string;
}

const sourceExtensions = ['.ts', '.tsx', '.mts', '.cts'];

function sourceFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return name === 'node_modules' ? [] : sourceFiles(path);
    return sourceExtensions.some((ext) => name.endsWith(ext)) && !name.endsWith('.d.ts') ? [path] : [];
  });
}

function resolveRelative(fromFile: string, specifier: string): string | undefined {
  const base = resolve(dirname(fromFile), specifier);
  const candidates = [base, ...sourceExtensions.map((ext) => base + ext), ...sourceExtensions.map((ext) => join(base, `index${ext}`))];
  return candidates.find((it) => existsSync(it) && statSync(it).isFile());
}

/** The package a bare specifier names: `zod`, `@date-fns/utc`, `node:fs`. */
function packageOf(specifier: string): string {
  if (specifier.startsWith('node:')) return specifier;
  const parts = specifier.split('/');
  return specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0]!;
}

/**
 * Every import, export-from, `import type` and dynamic `import()` of the TypeScript
 * files under `folders` (paths relative to `root`), read with the TypeScript
 * compiler's own pre-processor so comments and strings cannot fool it.
 */
export function importGraph(root: string, folders: readonly string[]): ImportEdge[] {
  const edges: ImportEdge[] = [];
  for (const file of folders.flatMap((it) => sourceFiles(join(root, it)))) {
    const from = relative(root, file);
    const { importedFiles } = ts.preProcessFile(readFileSync(file, 'utf8'), true, true);
    for (const { fileName: specifier } of importedFiles) {
      if (specifier.startsWith('.')) {
        const target = resolveRelative(file, specifier);
        edges.push(target === undefined ? { from, pkg: `unresolved:${specifier}` } : { from, to: relative(root, target) });
      } else {
        edges.push({ from, pkg: packageOf(specifier) });
      }
    }
  }
  return edges;
}

/** The area of a core file: `core/iron/bands.ts` → `iron`; a file directly in core/ is its own area (`catalogue`). */
export function coreArea(path: string): string | undefined {
  const parts = path.split('/');
  if (parts[0] !== 'core') return undefined;
  return parts.length === 2 ? parts[1]!.replace(/\.[cm]?tsx?$/, '') : parts[1];
}

/**
 * Packages core may use: pure libraries with no I/O, DOM or clock — the schema and date
 * libraries (design.md §2: "uses zod"), and d3's scales, shapes and arrays for the
 * pure chart builders in core/report (stack-notes.md: "pure and DOM-free"); @date-fns/tz
 * reads the runtime's time-zone rules (no clock) for the course planner's ward clock.
 */
export const corePackages: readonly string[] = ['zod', 'date-fns', '@date-fns/utc', '@date-fns/tz', 'd3-array', 'd3-scale', 'd3-shape'];

/**
 * The directions the project allows (DEVELOPERS.md, "Dependencies"), as messages for
 * each import that breaks them: core imports nothing of app/, renderer/ or tests/ and
 * no package beyond `corePackages` (no node: built-ins, no Electron); renderer imports
 * neither app/ nor Electron; only app/main and app/preload import Electron; and core's
 * areas form no cycle.
 */
export function layerViolations(edges: readonly ImportEdge[]): string[] {
  const problems: string[] = [];
  for (const edge of edges) {
    const layer = edge.from.split('/')[0];
    const target = edge.to ?? edge.pkg!;
    if (edge.pkg?.startsWith('unresolved:')) problems.push(`${edge.from} imports ${edge.pkg.slice(11)}, which does not resolve to a file`);
    if (layer === 'core') {
      if (edge.to !== undefined && !edge.to.startsWith('core/')) problems.push(`${edge.from} imports ${target}: core imports nothing outside core/`);
      if (edge.pkg !== undefined && !edge.pkg.startsWith('unresolved:') && !corePackages.includes(edge.pkg)) {
        problems.push(`${edge.from} imports the package ${edge.pkg}: core uses only ${corePackages.join(', ')}`);
      }
    }
    if (edge.pkg === 'electron' && !/^app\/(main|preload)\//.test(edge.from)) {
      if (layer !== 'renderer') problems.push(`${edge.from} imports electron: only app/main and app/preload may (stack-notes.md: inject it elsewhere)`);
    }
    if (layer === 'renderer') {
      if (edge.to?.startsWith('app/')) problems.push(`${edge.from} imports ${target}: renderer never imports app/`);
      if (edge.pkg === 'electron') problems.push(`${edge.from} imports electron: renderer never imports Electron (it sees only the preload's typed API)`);
    }
  }
  for (const { members, cycle } of areaCycles(edges)) {
    problems.push(`core areas ${members.join(', ')} import each other in a cycle, e.g. ${cycle.join(' → ')} (${cycleWitnesses(edges, cycle).join('; ')})`);
  }
  return problems;
}

/** The edges between core areas, as area → set of areas. */
function areaEdges(edges: readonly ImportEdge[]): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const edge of edges) {
    const from = coreArea(edge.from);
    const to = edge.to === undefined ? undefined : coreArea(edge.to);
    if (from === undefined || to === undefined || from === to) continue;
    if (!graph.has(from)) graph.set(from, new Set());
    graph.get(from)!.add(to);
  }
  return graph;
}

/**
 * Each strongly connected group of core areas with more than one member (found with
 * Tarjan's algorithm) and one closed path through it; empty when the areas form a DAG.
 */
export function areaCycles(edges: readonly ImportEdge[]): { members: string[]; cycle: string[] }[] {
  const graph = areaEdges(edges);
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const groups: string[][] = [];
  let counter = 0;
  const visit = (node: string): void => {
    index.set(node, counter);
    low.set(node, counter);
    counter += 1;
    stack.push(node);
    onStack.add(node);
    for (const next of graph.get(node) ?? []) {
      if (!index.has(next)) {
        visit(next);
        low.set(node, Math.min(low.get(node)!, low.get(next)!));
      } else if (onStack.has(next)) {
        low.set(node, Math.min(low.get(node)!, index.get(next)!));
      }
    }
    if (low.get(node) === index.get(node)) {
      const group: string[] = [];
      let member: string;
      do {
        member = stack.pop()!;
        onStack.delete(member);
        group.push(member);
      } while (member !== node);
      if (group.length > 1) groups.push(group);
    }
  };
  for (const node of [...graph.keys()].sort()) if (!index.has(node)) visit(node);
  return groups.map((group) => ({ members: [...group].sort(), cycle: closedPath(graph, new Set(group)) }));
}

/** A closed path through a strongly connected group, starting from its first name in order. */
function closedPath(graph: Map<string, Set<string>>, group: Set<string>): string[] {
  const start = [...group].sort()[0]!;
  // Breadth-first from start back to start inside the group: the shortest cycle through start.
  const previous = new Map<string, string>();
  const queue = [start];
  while (queue.length > 0) {
    const node = queue.shift()!;
    for (const next of [...(graph.get(node) ?? [])].sort()) {
      if (!group.has(next)) continue;
      if (next === start) {
        const path = [node];
        while (path[0] !== start) path.unshift(previous.get(path[0]!)!);
        return [...path, start];
      }
      if (!previous.has(next)) {
        previous.set(next, node);
        queue.push(next);
      }
    }
  }
  return [start, start];
}

/** For each step of a cycle, one file import that makes it. */
function cycleWitnesses(edges: readonly ImportEdge[], cycle: readonly string[]): string[] {
  return cycle.slice(0, -1).map((from, step) => {
    const to = cycle[step + 1]!;
    const edge = edges.find((it) => coreArea(it.from) === from && it.to !== undefined && coreArea(it.to) === to);
    return edge ? `${edge.from} → ${edge.to}` : `${from} → ${to}`;
  });
}
