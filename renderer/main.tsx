import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import demoTh0093 from '../assets/demo/th-0093.json';
import demoTh0417 from '../assets/demo/th-0417.json';
import { createMemoryHost } from './fakeHost/memoryHost';
import type { WorkspaceHost } from './hostPort';
import { workspaceStore } from './state/store';
import { App } from './views/App';
import './styles.css';

/**
 * Composition: the one place that picks the host. A desktop or preview host
 * puts its client on `window.chelationLedgerHost` (renderer/host, issue 14);
 * without one the page keeps its cases itself (invented demo cases to start).
 */
declare global {
  interface Window {
    chelationLedgerHost?: WorkspaceHost;
  }
}

const host: WorkspaceHost =
  window.chelationLedgerHost ??
  createMemoryHost(
    [
      { id: 'th-0417', json: demoTh0417 },
      { id: 'th-0093', json: demoTh0093 },
    ],
    window.localStorage,
  );

void workspaceStore.getState().connect(host);
createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
