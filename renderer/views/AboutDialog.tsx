import { useEffect, useRef } from 'react';
import { sourceCatalogue } from '../../core/references';
import { useWorkspace, workspaceStore } from '../state/store';
import { sourceLine } from '../viewModels/sources';

/** The about box: version, what the tool is and is not, and every source it cites. */
export function AboutDialog() {
  const open = useWorkspace((state) => state.aboutOpen);
  const hostKind = useWorkspace((state) => state.hostKind);
  const version = useWorkspace((state) => state.version);
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog ref={ref} aria-labelledby="about-title" onClose={() => workspaceStore.getState().setAboutOpen(false)}>
      <div className="dialog-head">
        <h2 id="about-title">About chelation-ledger</h2>
        <button type="button" autoFocus onClick={() => workspaceStore.getState().setAboutOpen(false)}>Close</button>
      </div>
      <p>Version {version}. Host: {hostKind}.</p>
      <p>
        Decision support for clinical pharmacists reviewing chelation therapy: transfusional iron, body iron, chelator removal, projections and
        safety checks. It supports the prescriber's decision and never replaces it; follow local protocols.
      </p>
      <h3>Sources cited</h3>
      <ul className="about-sources">
        {sourceCatalogue.map((source) => {
          const line = sourceLine(source.id);
          return <li key={source.id}>{line.text} <span className="status">[{line.status}]</span></li>;
        })}
      </ul>
      <button type="button" onClick={() => workspaceStore.getState().setAboutOpen(false)}>Close</button>
    </dialog>
  );
}
