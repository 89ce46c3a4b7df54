import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import demoTh0093 from '../assets/demo/th-0093.json';
import demoTh0417 from '../assets/demo/th-0417.json';
import { createMemoryHost } from './fakeHost/memoryHost';
import { host } from './host';
import { workspaceHostOver } from './hostPort';
import { workspaceStore } from './state/store';
import { App } from './views/App';
import './styles.css';

/**
 * Composition: the one place that picks the host. The desktop app's preload
 * or the preview server answers through renderer/host's client; a page
 * opened on its own (the built folder served statically, the end-to-end
 * tests) keeps its cases in the browser, starting from the invented demo cases.
 */
async function start(): Promise<void> {
  const client = host();
  const probe = await client.appInfo({});
  const [api, kind] = probe.ok
    ? [client, 'desktop app or preview server']
    : [createMemoryHost({ 'th-0417.json': demoTh0417, 'th-0093.json': demoTh0093 }, window.localStorage, __APP_VERSION__), 'in-page store (cases stay in this browser)'];
  await workspaceStore.getState().connect(workspaceHostOver(api), kind);
  if (probe.ok) {
    client.onMenuCommand((command) => workspaceStore.getState().hostCommand(command));
    // A case file the app was started to open (a double-click on it, or `preview <case file>`).
    await workspaceStore.getState().openRequested();
  }
}

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
void start();
