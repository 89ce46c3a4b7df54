import { statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fail, issue, ok, type Result } from '../../core/result';
import { ensureDemoWorkspace } from '../host/demoWorkspace';
import { createHostDispatch } from '../host/hostDispatch';
import { createHostServices } from '../host/hostServices';
import { createOpenRequests } from '../host/openRequests';
import { createSettingsStore } from '../host/settingsStore';
import { startPreviewServer, type PreviewServer } from './previewServer';

export interface PreviewSetup {
  readonly appName: string;
  readonly appVersion: string;
  /** The project (or installed app) folder holding dist/renderer and assets/demo. */
  readonly appFolder: string;
  /** The per-user config folder (userFolders.ts): settings.json and the demo workspace. */
  readonly configFolder: string;
  /** --workspace; absent: the demo workspace in the config folder. */
  readonly workspace?: string;
  /** A case file to open in the page (`preview <case.json>`); its folder is the workspace. */
  readonly openFile?: string;
  /** --port; absent or 0: any free port. */
  readonly port?: number;
  /** The built renderer folder; absent: dist/renderer in the app folder (tests build their own copy). */
  readonly rendererFolder?: string;
}

/**
 * Compose the preview: settings in the user's config folder, the workspace
 * (given, or the demo one made on first run), the host services behind the
 * one dispatcher, and the server on 127.0.0.1. The one place the preview is
 * wired (style.md habit 11).
 */
export async function runPreview(setup: PreviewSetup): Promise<Result<PreviewServer>> {
  let workspace: string;
  const openRequests = createOpenRequests();
  if (setup.openFile !== undefined) {
    const request = openRequests.offer(setup.openFile);
    if (!request.ok) return request;
    workspace = request.value.folder;
  } else if (setup.workspace !== undefined) {
    workspace = resolve(setup.workspace);
    let isFolder = false;
    try {
      isFolder = statSync(workspace).isDirectory();
    } catch {
      isFolder = false;
    }
    if (!isFolder) return fail(issue('invalid_file', ['--workspace'], `${setup.workspace} is not a folder; give the folder that holds the case files.`));
  } else {
    const demo = ensureDemoWorkspace(join(setup.configFolder, 'demo-workspace'), join(setup.appFolder, 'assets', 'demo'));
    if (!demo.ok) return demo;
    workspace = demo.value;
  }
  let current: string | null = workspace;
  const dispatch = createHostDispatch(
    createHostServices({
      appName: setup.appName,
      appVersion: setup.appVersion,
      workspace: { get: () => current, set: (folder) => (current = folder) },
      settings: createSettingsStore(join(setup.configFolder, 'settings.json')),
      now: () => new Date(),
      openRequests,
    }),
  );
  try {
    return ok(await startPreviewServer({ rendererRoot: setup.rendererFolder ?? join(setup.appFolder, 'dist', 'renderer'), dispatch, port: setup.port ?? 0 }));
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'EADDRINUSE' ? 'it is in use by another program' : code === 'EACCES' ? 'this user may not open it' : (error as Error).message;
    return fail(issue('invalid_file', ['--port'], `cannot listen on 127.0.0.1:${setup.port ?? 0}: ${why}; choose another port (1024–65535) or leave --port out.`));
  }
}
