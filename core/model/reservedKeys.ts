import { z } from 'zod';
import type { CustomIssueParams } from './bounds';

/**
 * Keys a JSON object may hold that a JavaScript record cannot keep: zod's record (like
 * any plain object) drops `__proto__` silently, so a local protocol keyed by it would
 * vanish without a word. Refused instead, naming the key.
 */
const reservedKeys: readonly string[] = ['__proto__'];

/**
 * A schema step, before a record schema, refusing keys that would be dropped silently.
 *
 * @param what - what a key of this record names, for the message ("a threshold id")
 * @example refuseReservedKeys('a threshold id').safeParse(JSON.parse('{"__proto__": {}}')).success === false
 */
export function refuseReservedKeys(what: string) {
  return z.unknown().superRefine((raw, ctx) => {
    if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return;
    for (const key of Object.keys(raw)) {
      if (!reservedKeys.includes(key)) continue;
      ctx.addIssue({ code: 'custom', path: [key], message: `is a reserved name, not ${what}; nothing under it could be kept.`, params: { code: 'unknown_option' } satisfies CustomIssueParams });
    }
  });
}
