// The desktop app's main process: the one place Electron is wired (style.md
// habit 11). Everything it composes is plain Node and tested without Electron:
// the window options, the contents and permission guards, the app:// protocol,
// the IPC registration with its sender check, the menu and the host services.
// Built to dist/main/main.cjs; package.json "main" points there.
import { app, BrowserWindow, dialog, ipcMain, Menu, protocol, session } from 'electron';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { menuChannel } from '../../core/contract/callNames';
import { formatIssues } from '../../core/result';
import { ensureDemoWorkspace } from '../host/demoWorkspace';
import { createHostDispatch } from '../host/hostDispatch';
import { createHostServices } from '../host/hostServices';
import { createOpenRequests } from '../host/openRequests';
import { createSettingsStore } from '../host/settingsStore';
import { appEntryUrl, appScheme, appSchemePrivileges, createAppProtocolHandler } from './appProtocol';
import { denyAllPermissions, guardContents } from './contentsGuards';
import { listenForCaseFiles } from './caseFileEvents';
import { aboutText, applicationMenu } from './menu';
import { registerHostIpc } from './registerHostIpc';
import { mainWindowOptions } from './windowOptions';

// dist/main/main.cjs sits in <app folder>/dist/main.
const appFolder = join(__dirname, '..', '..');

protocol.registerSchemesAsPrivileged(appSchemePrivileges.map((it) => ({ scheme: it.scheme, privileges: { ...it.privileges } })));
app.enableSandbox();
app.on('web-contents-created', (_event, contents) => guardContents(contents));

if (!app.requestSingleInstanceLock()) app.quit();

// Case files the operating system asks the app to open (file association): kept until the page takes them.
const openRequests = createOpenRequests();
let mainWindow: BrowserWindow | null = null;
const refusals: string[] = [];
const showRefusal = (text: string) => {
  if (mainWindow) void dialog.showMessageBox(mainWindow, { type: 'warning', title: 'Case file not opened', message: text });
  else refusals.push(text);
};
listenForCaseFiles(app, openRequests, process.argv, process.cwd(), {
  requested: (request) => {
    if (!request.ok) showRefusal(formatIssues(request.issues));
    else mainWindow?.webContents.send(menuChannel, 'open-requested');
  },
  focus: () => {
    if (!mainWindow) return;
    if (mainWindow.isMinimized()) mainWindow.restore();
    mainWindow.focus();
  },
});

/** The last workspace folder, kept beside the settings so the app reopens it. */
function workspaceMemory(file: string) {
  let folder: string | null = null;
  try {
    const saved = JSON.parse(readFileSync(file, 'utf8')) as { folder?: unknown };
    if (typeof saved.folder === 'string' && existsSync(saved.folder)) folder = saved.folder;
  } catch {
    folder = null;
  }
  return {
    get: () => folder,
    set: (next: string) => {
      folder = next;
      try {
        writeFileSync(file, JSON.stringify({ folder: next }));
      } catch {
        // Remembering the folder is a convenience; the work itself is unaffected.
      }
    },
  };
}

void app.whenReady().then(() => {
  denyAllPermissions(session.defaultSession);
  protocol.handle(appScheme, createAppProtocolHandler(join(appFolder, 'dist', 'renderer')));

  const userData = app.getPath('userData');
  const workspace = workspaceMemory(join(userData, 'workspace.json'));
  if (workspace.get() === null) {
    // First run: open a copy of the invented demo cases.
    const demo = ensureDemoWorkspace(join(userData, 'demo-workspace'), join(appFolder, 'assets', 'demo'));
    if (demo.ok) workspace.set(demo.value);
  }

  const window = new BrowserWindow(mainWindowOptions(join(appFolder, 'dist', 'preload', 'preload.cjs'), app.getName()));
  mainWindow = window;
  const dispatch = createHostDispatch(
    createHostServices({
      appName: app.getName(),
      appVersion: app.getVersion(),
      workspace,
      chooseFolder: async () => {
        const chosen = await dialog.showOpenDialog(window, { title: 'Choose the folder of case files', properties: ['openDirectory', 'createDirectory'] });
        return chosen.canceled ? null : (chosen.filePaths[0] ?? null);
      },
      settings: createSettingsStore(join(userData, 'settings.json')),
      now: () => new Date(),
      openRequests,
    }),
  );
  registerHostIpc(ipcMain, dispatch);

  Menu.setApplicationMenu(
    Menu.buildFromTemplate(
      applicationMenu(
        {
          send: (command) => window.webContents.send(menuChannel, command),
          print: () => window.webContents.print({}),
          about: () => void dialog.showMessageBox(window, { type: 'info', title: `About ${app.getName()}`, message: aboutText(app.getName(), app.getVersion()) }),
        },
        process.platform,
      ).map((item) => ({ ...item }) as Electron.MenuItemConstructorOptions),
    ),
  );
  window.once('ready-to-show', () => {
    window.show();
    for (const text of refusals.splice(0)) showRefusal(text);
  });
  void window.loadURL(appEntryUrl);
});

app.on('window-all-closed', () => app.quit());
