import { useWorkspace, workspaceStore } from '../state/store';
import { KeptEntryNotice } from './KeptEntryNotice';

const whatText = { record: 'record entry', import: 'import (file and choices)' } as const;

/** The store's restored entry (a record's rows, an import), on the screen it belongs to. */
export function RestoredNotice() {
  const restored = useWorkspace((state) => state.restored);
  const screen = useWorkspace((state) => state.screen);
  if (!restored || (restored.what === 'record' ? screen !== 'record' : screen !== 'import')) return null;
  const { discardRestored, dismissRestored } = workspaceStore.getState();
  return (
    <KeptEntryNotice
      what={whatText[restored.what]}
      keptAt={restored.keptAt}
      {...(restored.storedChanged ? { extra: 'The stored case has changed since: check the rows before you edit, which saves them over it.' } : {})}
      onKeep={dismissRestored}
      onDiscard={discardRestored}
    />
  );
}
