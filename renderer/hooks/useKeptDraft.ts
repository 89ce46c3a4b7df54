import { useState } from 'react';
import { pageKeptDrafts, type DraftKey, type KeptDrafts } from '../state/keptDrafts';

/**
 * A form's fields kept as they are typed (renderer/state/keptDrafts.ts), so a
 * reload or a refused save loses nothing: on first render the kept fields
 * come back, with when they were kept, until the form is sent or the user
 * discards them.
 */
export function useKeptDraft<Fields>(key: DraftKey, initial: Fields, accept: (value: unknown) => value is Fields, drafts: KeptDrafts = pageKeptDrafts()) {
  const [start] = useState(() => drafts.read(key, accept));
  const [fields, setFieldsState] = useState<Fields>(start?.value ?? initial);
  const [restoredAt, setRestoredAt] = useState<string | null>(start?.keptAt ?? null);
  return {
    fields,
    /** The fields as typed now; kept at once. */
    setFields(next: Fields) {
      setFieldsState(next);
      drafts.keep(key, next);
    },
    /** When the fields on screen were restored from a kept draft, or null. */
    restoredAt,
    /** The form was sent and accepted: nothing to keep. */
    settled() {
      drafts.discard(key);
      setRestoredAt(null);
    },
    /** Back to an empty form. */
    discard() {
      drafts.discard(key);
      setFieldsState(initial);
      setRestoredAt(null);
    },
    dismissNotice() {
      setRestoredAt(null);
    },
  };
}
