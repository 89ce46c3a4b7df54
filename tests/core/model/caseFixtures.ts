import { readFileSync } from 'node:fs';

/** The demo case files as plain JSON (a fresh copy per call). */
export function readDemo(name: 'th-0417' | 'th-0093'): Record<string, unknown> {
  return JSON.parse(readFileSync(new URL(`../../../assets/demo/${name}.json`, import.meta.url), 'utf8')) as Record<string, unknown>;
}

/** Marks a field to delete in {@link withChange}. */
export const remove = Symbol('remove');

/**
 * A deep copy of `base` with one value replaced (or removed) at `path`.
 * @example withChange(demo, ['transfusions', 3, 'unitHaematocrit'], 60)
 */
export function withChange(base: unknown, path: readonly (string | number)[], value: unknown): Record<string, unknown> {
  const copy = structuredClone(base) as Record<string, unknown>;
  let node: Record<string | number, unknown> = copy;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  const last = path[path.length - 1]!;
  if (value === remove) delete node[last];
  else node[last] = value;
  return copy;
}

/** Freeze an object and everything inside it, so a test can prove it is not changed. */
export function deepFreeze<Value>(value: Value): Value {
  if (typeof value === 'object' && value !== null) {
    for (const inner of Object.values(value)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}
