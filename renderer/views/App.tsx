import { useEffect, useRef } from 'react';
import { useReviewWarmUp } from '../hooks/useReview';
import { screens, useWorkspace, workspaceStore, type Screen } from '../state/store';
import { AssumptionsView } from './AssumptionsView';
import { CasesView } from './CasesView';
import { FindingsView } from './FindingsView';
import { ImportView } from './ImportView';
import { IronCourseView } from './IronCourseView';
import { RecordView } from './RecordView';
import { RegimensView } from './RegimensView';
import { SheetView } from './SheetView';
import { AboutDialog } from './AboutDialog';
import { cautionText } from './cautionText';
import { RestoredNotice } from './RestoredNotice';
import { busyBar, busyText } from '../viewModels/busy';

const screenTitles: Readonly<Record<Screen, string>> = {
  cases: 'Cases',
  record: 'Record',
  import: 'Import',
  iron: 'Iron course',
  regimens: 'Regimens',
  findings: 'Findings',
  sheet: 'Sheet',
  assumptions: 'Assumptions',
};

const saveStateText = {
  saved: 'All changes saved',
  saving: 'Saving…',
  'unsaved-errors': 'Not saved: correct the fields marked below (what you typed is kept)',
  failed: 'Not saved: the store refused the write (what you typed is kept)',
  'unsaved-restored': 'Not saved: a restored entry; the stored case changed since it was typed (edit to save it, or discard it)',
} as const;

/** The workspace shell: header with the open case and its saved state, navigation, the caution line, the screen. */
export function App() {
  const screen = useWorkspace((state) => state.screen);
  const openId = useWorkspace((state) => state.openId);
  const label = useWorkspace((state) => state.accepted?.patient.label ?? state.openId);
  const reviewDate = useWorkspace((state) => state.accepted?.review.reviewDate ?? null);
  const saveState = useWorkspace((state) => state.saveState);
  const message = useWorkspace((state) => state.message);
  const canUndo = useWorkspace((state) => state.past.length > 0);
  const canRedo = useWorkspace((state) => state.future.length > 0);
  const { showScreen, undo, redo, setAboutOpen, dismissMessage, closeCase } = workspaceStore.getState();
  const mainRef = useRef<HTMLElement>(null);
  useReviewWarmUp();

  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey)) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) {
        event.preventDefault();
        workspaceStore.getState().undo();
      } else if (key === 'y' || (key === 'z' && event.shiftKey)) {
        event.preventDefault();
        workspaceStore.getState().redo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  useEffect(() => {
    mainRef.current?.focus({ preventScroll: true });
    document.title = `${screenTitles[screen]}${label ? ` — ${label}` : ''} — chelation-ledger`;
  }, [screen, label]);

  return (
    <div className="shell">
      <a className="skip-link" href="#main">Skip to the screen</a>
      <header className="top">
        <div className="brand">chelation-ledger</div>
        {openId ? (
          <div className="open-case" aria-live="polite">
            <span className="case-label">{label}</span>
            <span>review date {reviewDate ?? 'today'}</span>
            <span className={`save-state save-${saveState}`} role="status">{saveStateText[saveState]}</span>
            <span className="case-actions">
              <button type="button" onClick={undo} disabled={!canUndo} aria-keyshortcuts="Control+Z">Undo</button>
              <button type="button" onClick={redo} disabled={!canRedo} aria-keyshortcuts="Control+Y">Redo</button>
              <button type="button" onClick={closeCase}>Close case</button>
            </span>
          </div>
        ) : null}
        <button type="button" className="about-button" onClick={() => setAboutOpen(true)}>About</button>
      </header>
      <p className="caution" role="note"><strong>Caution.</strong> {cautionText}</p>
      <nav aria-label="Screens">
        <ul>
          {screens.map((id) => (
            <li key={id}>
              <button type="button" aria-current={screen === id ? 'page' : undefined} disabled={id !== 'cases' && id !== 'assumptions' && id !== 'import' && !openId} onClick={() => (id === 'import' ? workspaceStore.getState().openImport() : showScreen(id))}>
                {screenTitles[id]}
              </button>
            </li>
          ))}
        </ul>
      </nav>
      <BusyLine />
      {message ? (
        <div className="message" role="alert">
          {message} <button type="button" onClick={dismissMessage}>Dismiss</button>
        </div>
      ) : null}
      <main id="main" ref={mainRef} tabIndex={-1} aria-label={screenTitles[screen]}>
        <h1>{screenTitles[screen]}</h1>
        <RestoredNotice />
        {screen === 'cases' ? <CasesView /> : null}
        {screen === 'record' ? <RecordView /> : null}
        {screen === 'import' ? <ImportView /> : null}
        {screen === 'iron' ? <IronCourseView /> : null}
        {screen === 'regimens' ? <RegimensView /> : null}
        {screen === 'findings' ? <FindingsView /> : null}
        {screen === 'sheet' ? <SheetView /> : null}
        {screen === 'assumptions' ? <AssumptionsView /> : null}
      </main>
      <footer><p className="caution-footer">{cautionText}</p></footer>
      <AboutDialog />
    </div>
  );
}

/** Long work in progress, how far it got, and a way to cancel it. */
function BusyLine() {
  const busy = useWorkspace((state) => state.busy);
  if (!busy) return null;
  const bar = busyBar(busy);
  return (
    <div className="busy" role="status">
      {bar.max === null ? <progress aria-label={bar.label} /> : <progress max={bar.max} value={bar.value ?? 0} aria-label={bar.label} />} {busyText(busy)}{' '}
      <button type="button" onClick={() => workspaceStore.getState().cancelBusy()}>Cancel</button>
    </div>
  );
}
